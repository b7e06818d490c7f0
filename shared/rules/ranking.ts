/**
 * Ranking and the budget: approaches sorted by score, the recommendation (the best-scored approach
 * that fits the budget), and a plain statement of what the adequate approach would need and what a
 * fallback within the budget gives up.
 */
import { APPROACH_IDS, APPROACH_LABELS, type ApproachId } from './approaches'
import type { ApproachAdvice, BudgetAdvice } from './advice-types'
import type { Quantity } from './case-input'
import { formatNumber } from './format'

/** What a run gives up when it moves down to each approach, in order of resolution (our words). */
const LOSS_ON_REACHING: Readonly<Record<ApproachId, string>> = {
  dns: '',
  wrles: 'the smallest eddies are modelled by a subgrid model',
  wmles: 'the inner tenth of each boundary layer is modelled: wall friction and heat flux come from the wall model',
  hybrid: 'attached boundary layers are modelled by RANS, and resolved turbulence appears late in shear layers leaving them',
  urans: 'no resolved turbulence: only the deterministic, periodic part of the unsteadiness remains',
  rans: 'no unsteadiness at all: mean values only, every eddy modelled',
  laminar: 'turbulence is ignored altogether',
}

const QUANTITY_LOSS: Partial<Record<Quantity, { lostBy: readonly ApproachId[]; text: string }>> = {
  statistics: { lostBy: ['hybrid', 'urans', 'rans', 'laminar'], text: 'no trustworthy turbulence statistics' },
  noise: { lostBy: ['urans', 'rans', 'laminar'], text: 'no broadband noise sources' },
  'unsteady-loads': { lostBy: ['rans', 'laminar'], text: 'no unsteady or peak loads' },
  mixing: { lostBy: ['rans', 'laminar'], text: 'mixing by gradient diffusion only, without the fluctuations' },
}

/** Sorted by score, then by core-hours, then from the most resolved. */
export function sortApproaches(entries: ApproachAdvice[], exactScores: ReadonlyMap<ApproachId, number>): ApproachAdvice[] {
  return [...entries].sort(
    (a, b) =>
      exactScores.get(b.id)! - exactScores.get(a.id)! || a.coreHours - b.coreHours || APPROACH_IDS.indexOf(a.id) - APPROACH_IDS.indexOf(b.id),
  )
}

/** What `fallback` gives up against `adequate`, step by step down the resolution order, and for the quantities wanted. */
export function sacrifices(adequate: ApproachId, fallback: ApproachId, quantities: readonly Quantity[]): string[] {
  const from = APPROACH_IDS.indexOf(adequate)
  const to = APPROACH_IDS.indexOf(fallback)
  const losses: string[] = []
  if (fallback === 'laminar') losses.push(LOSS_ON_REACHING.laminar)
  else if (adequate !== 'laminar') for (let index = from + 1; index <= to; index++) losses.push(LOSS_ON_REACHING[APPROACH_IDS[index]!])
  for (const quantity of quantities) {
    const loss = QUANTITY_LOSS[quantity]
    if (loss && loss.lostBy.includes(fallback) && !loss.lostBy.includes(adequate)) losses.push(loss.text)
  }
  return losses
}

function needs(entry: ApproachAdvice): string {
  return `${formatNumber(entry.coreHours)} core-hours and ${formatNumber(entry.wallClockHours)} h wall-clock (${formatNumber(entry.budgetRatio)} times the budget)`
}

/** The recommendation and the budget statement for approaches already sorted. */
export function chooseWithinBudget(sorted: ApproachAdvice[], quantities: readonly Quantity[]): { chosen: ApproachAdvice; budget: BudgetAdvice } {
  const adequate = sorted[0]!
  const fitting = sorted.find((entry) => entry.feasible)
  if (fitting === adequate) {
    return { chosen: adequate, budget: { status: 'fits', adequate: adequate.id, fallback: null, sacrifices: [], summary: `${APPROACH_LABELS[adequate.id]} scores highest and fits the budget.` } }
  }
  if (fitting) {
    const lost = sacrifices(adequate.id, fitting.id, quantities)
    return {
      chosen: fitting,
      budget: {
        status: 'fallback',
        adequate: adequate.id,
        fallback: fitting.id,
        sacrifices: lost,
        summary:
          `${APPROACH_LABELS[adequate.id]} scores highest but needs ${needs(adequate)}. ` +
          `Within the budget the best is ${APPROACH_LABELS[fitting.id]}${lost.length ? `, which gives up: ${lost.join('; ')}` : ''}.`,
      },
    }
  }
  const cheapest = [...sorted].sort((a, b) => a.budgetRatio - b.budgetRatio)[0]!
  const lost = cheapest.id === adequate.id ? [] : sacrifices(adequate.id, cheapest.id, quantities)
  return {
    chosen: adequate,
    budget: {
      status: 'none-fits',
      adequate: adequate.id,
      fallback: cheapest.id,
      sacrifices: lost,
      summary:
        `No approach fits the budget. ${APPROACH_LABELS[adequate.id]}, the best-scored and recommended, needs ${needs(adequate)}. ` +
        (cheapest.id === adequate.id
          ? 'It is also the cheapest; raise the budget or reduce the scope (a smaller domain, a 2-D or span-periodic section, a shorter record).'
          : `The cheapest, ${APPROACH_LABELS[cheapest.id]}, needs ${needs(cheapest)}${lost.length ? ` and gives up: ${lost.join('; ')}` : ''}.`),
    },
  }
}
