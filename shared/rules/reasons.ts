/**
 * The sentences of an approach's reasons: its mesh, time plan and cost with their ranges, the
 * budget, and notes about the flow that apply to every approach.
 */
import { WALL_TREATMENT_LABELS, type WallTreatment } from './approaches'
import type { CaseInput } from './case-input'
import { MIN_CELLS_PER_CORE, type ApproachCost } from './cost-model'
import type { FlowPhysics } from './flow-physics'
import { formatEstimate, formatNumber, roundToBand } from './format'
import { SCHLICHTING_MAX_REYNOLDS } from './skin-friction'

/** The budget as written in the reasons, formatted once per advice. */
export interface BudgetText {
  coreHours: string
  cores: string
  wallClockHours: string
}

export function budgetText(budget: CaseInput['budget']): BudgetText {
  return { coreHours: formatNumber(budget.coreHours), cores: formatNumber(budget.cores), wallClockHours: formatNumber(budget.wallClockHours) }
}

/** The wall-treatment labels in lower case, for the middle of a sentence. */
const LOWER_LABELS = Object.fromEntries(Object.entries(WALL_TREATMENT_LABELS).map(([id, label]) => [id, label.toLowerCase()])) as Record<WallTreatment, string>

/** The time plan in a few words: steps, and the simulated span when unsteady (the figures themselves are fields of the advice). */
function timeWords(cost: ApproachCost): string {
  if (cost.timeStep === null || cost.periods === null && cost.flowThroughs === null) return `${formatNumber(cost.timeSteps)} iterations`
  const span = cost.periods !== null ? `${formatNumber(Math.round(cost.periods))} periods` : `${formatNumber(Math.round(cost.flowThroughs!))} flow-throughs`
  return `${formatNumber(cost.timeSteps)} steps over ${span}`
}

export function costReasons(cost: ApproachCost, input: CaseInput, treatment: WallTreatment, text: BudgetText): string[] {
  const reasons: string[] = []
  if (cost.layers !== null) {
    reasons.push(`Mesh counted with ${LOWER_LABELS[treatment]} at y+ ${formatNumber(cost.yPlusTarget)}: ${cost.layers} layers to the boundary-layer edge${cost.twoDimensional ? ', in two dimensions' : ''}.`)
  }
  reasons.push(
    `About ${formatNumber(roundToBand(cost.cells, cost.uncertainty.cells))} cells and ${timeWords(cost)}: core-hours ${formatEstimate(cost.coreHours, cost.ranges.coreHours, cost.uncertainty.coreHours)}.`,
  )
  if (cost.feasible) {
    reasons.push(`Fits the budget of ${text.coreHours} core-hours and ${text.wallClockHours} h wall-clock on ${text.cores} cores.`)
  } else {
    if (cost.coreHours > input.budget.coreHours) {
      reasons.push(`Needs ${formatNumber(cost.coreHours)} core-hours against a budget of ${text.coreHours}.`)
    }
    if (cost.wallClockHours > input.budget.wallClockHours) {
      reasons.push(`Needs ${formatNumber(cost.wallClockHours)} h wall-clock on ${text.cores} cores against a budget of ${text.wallClockHours} h.`)
    }
  }
  if (cost.cells < MIN_CELLS_PER_CORE * input.budget.cores) {
    reasons.push(
      `Only ${formatNumber(cost.cells / input.budget.cores)} cells per core: below about ${formatNumber(MIN_CELLS_PER_CORE)} parallel efficiency usually drops, so the wall-clock figure is optimistic.`,
    )
  }
  return reasons
}

/** Notes about the flow that apply to every approach. */
export function flowReasons(input: CaseInput, physics: FlowPhysics): string[] {
  const reasons: string[] = []
  if (input.regime === 'external' && physics.reynolds > SCHLICHTING_MAX_REYNOLDS) {
    reasons.push(
      `Re = ${formatNumber(physics.reynolds)} is beyond the stated range of Schlichting's skin-friction formula (Re_x < 1e9); the wall figures are extrapolated.`,
    )
  }
  return reasons
}
