/**
 * The sentences of an approach's reasons: its mesh, time plan and cost with their ranges, the
 * budget, and notes about the flow that apply to every approach.
 */
import { WALL_TREATMENT_LABELS, type ApproachId, type WallTreatment } from './approaches'
import type { CaseInput } from './case-input'
import { MIN_CELLS_PER_CORE, type ApproachCost } from './cost-model'
import type { FlowPhysics } from './flow-physics'
import { formatEstimate, formatNumber } from './format'
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

/** Seconds as a short duration: "2.4e-5 s", "3.1 s", "45 min", "2.5 h". */
export function formatSeconds(seconds: number): string {
  if (seconds < 60) return `${formatNumber(seconds)} s`
  if (seconds < 7200) return `${formatNumber(seconds / 60)} min`
  return `${formatNumber(seconds / 3600)} h`
}

function timeSentence(id: ApproachId, cost: ApproachCost): string {
  if (cost.timeStep === null || cost.simulatedTime === null) {
    return `Steady solution: ${formatEstimate(cost.timeSteps, cost.ranges.timeSteps, cost.uncertainty.timeSteps)} iterations.`
  }
  const span = cost.periods !== null ? `${formatNumber(Math.round(cost.periods))} periods` : `${formatNumber(Math.round(cost.flowThroughs ?? 0))} flow-throughs`
  const acoustic = cost.acousticFactor > 1 ? `, including the acoustic factor 1 + 1/M = ${formatNumber(cost.acousticFactor)}` : ''
  const inner = cost.innerIterations > 1 ? ` with ${cost.innerIterations} inner iterations each` : ''
  const start = id === 'urans' ? ', started from a converged steady solution' : ''
  return (
    `Time step ${formatSeconds(cost.timeStep)} (CFL ${formatNumber(cost.cfl ?? 0)} on the finest cell of ${formatNumber(cost.finestCell)} m${acoustic}); ` +
    `${formatSeconds(cost.simulatedTime)} simulated, ${span}: ${formatEstimate(cost.timeSteps, cost.ranges.timeSteps, cost.uncertainty.timeSteps)} steps${inner}${start}.`
  )
}

export function costReasons(id: ApproachId, cost: ApproachCost, input: CaseInput, treatment: WallTreatment, text: BudgetText): string[] {
  const reasons: string[] = []
  if (cost.layers !== null) {
    reasons.push(`Mesh counted with ${WALL_TREATMENT_LABELS[treatment].toLowerCase()} at y+ ${formatNumber(cost.yPlusTarget)}: ${cost.layers} layers to the boundary-layer edge${cost.twoDimensional ? ', in two dimensions' : ''}.`)
  }
  reasons.push(
    `Cells ${formatEstimate(cost.cells, cost.ranges.cells, cost.uncertainty.cells)}; core-hours ${formatEstimate(cost.coreHours, cost.ranges.coreHours, cost.uncertainty.coreHours)}; ` +
      `wall-clock ${formatEstimate(cost.wallClockHours, cost.ranges.wallClockHours, cost.uncertainty.coreHours)} h on ${text.cores} cores; memory ${formatEstimate(cost.memoryGB, cost.ranges.memoryGB, cost.uncertainty.memoryGB)} GB.`,
    timeSentence(id, cost),
  )
  if (cost.feasible) {
    reasons.push(`Fits the budget of ${text.coreHours} core-hours and ${text.wallClockHours} h wall-clock.`)
  } else {
    if (cost.coreHours > input.budget.coreHours) {
      reasons.push(`Needs ${formatNumber(cost.coreHours)} core-hours against a budget of ${text.coreHours}.`)
    }
    if (cost.wallClockHours > input.budget.wallClockHours) {
      reasons.push(`Needs ${formatNumber(cost.wallClockHours)} h wall-clock on ${text.cores} cores against a budget of ${text.wallClockHours} h.`)
    }
  }
  if (cost.cells / input.budget.cores < MIN_CELLS_PER_CORE) {
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
