/**
 * advise(): from a case description to scored approaches, a recommendation, the near-wall mesh,
 * the cost against the budget, cautions and a trace of every rule. Deterministic: the same input
 * gives deep-equal output, so the server can recompute what the browser previewed.
 */
import {
  APPROACH_IDS,
  APPROACH_LABELS,
  WALL_TREATMENT_LABELS,
  defaultModels,
  defaultWallTreatments,
  type ApproachId,
  type WallTreatment,
} from './approaches'
import { GENERAL_CAUTIONS } from './cautions'
import { caseInputSchema, type CaseInput, type CaseInputDraft } from './case-input'
import { MIN_CELLS_PER_CORE, approachCost, type ApproachCost, type CostCase } from './cost-model'
import { buildFacts } from './facts'
import { flowPhysics, type FlowPhysics } from './flow-physics'
import { formatNumber, formatScoreChange } from './format'
import { layersToThickness, wallDistance, yPlusTargetFor, WALL_FUNCTION_Y_PLUS_BAND, RESOLVED_Y_PLUS } from './near-wall'
import { RULESET } from './ruleset'
import type { Rule } from './ruleset-schema'
import { evaluateStage, type AppliedEffects, type RuleOutcome } from './evaluate-rules'
import { PLATE_TRANSITION_REYNOLDS, SCHLICHTING_MAX_REYNOLDS } from './skin-friction'

/** Semantic version of the engine's code (the ruleset has its own). */
export const ENGINE_VERSION = '1.0.0'

export interface WallFigures {
  wallTreatment: WallTreatment
  skinFriction: number
  /** Pa */
  wallShearStress: number
  /** m/s */
  frictionVelocity: number
  yPlusTarget: number
  /** wall distance of the first cell centre at the target y+, m */
  firstCellCentre: number
  /** 2 x firstCellCentre for a cell-centred mesh, m */
  firstCellHeight: number
  /** m */
  boundaryLayerThickness: number
  /** boundary-layer thickness in wall units */
  deltaPlus: number
  growthRatio: number
  /** cells from the wall to the boundary-layer edge at the growth ratio */
  layers: number
}

export interface ApproachAdvice {
  id: ApproachId
  label: string
  score: number
  cells: number
  timeSteps: number
  coreHours: number
  wallClockHours: number
  memoryGB: number
  feasible: boolean
  /** the model this approach would use for this case */
  model: string
  /** the wall treatment its cost was counted with */
  wallTreatment: WallTreatment
  reasons: string[]
}

export interface TraceEntry {
  rule: string
  title: string
  stage: Rule['stage']
  fired: boolean
  effects: AppliedEffects
  why: string
  source: string
}

export interface Advice {
  reynolds: number
  reynoldsTurbulent: number
  mach: number | null
  kolmogorovLength: number
  kolmogorovCells: number
  fluid: { density: number; viscosity: number; kinematicViscosity: number }
  approaches: ApproachAdvice[]
  recommendation: { approach: ApproachId; model: string; wallTreatment: WallTreatment; yPlusTarget: number }
  wall: WallFigures
  cautions: string[]
  trace: TraceEntry[]
  ruleset: { id: string; version: string }
  engineVersion: string
}

export function costCaseFor(input: CaseInput, physics: FlowPhysics, velocity = input.velocity): CostCase {
  return {
    regime: input.regime,
    geometry: input.geometry,
    separation: input.separation,
    reynolds: physics.reynolds,
    length: input.length,
    velocity,
    wall: physics.wall,
    growthRatio: input.growthRatio,
  }
}

/** Near-wall figures of a computed flow for one wall treatment. */
export function wallFigures(
  physics: FlowPhysics,
  wallTreatment: WallTreatment,
  growthRatio: number,
  yPlusTarget?: number,
): WallFigures {
  const { wall } = physics
  const target = yPlusTarget ?? yPlusTargetFor(wallTreatment, wall.deltaPlus)
  const firstCellCentre = wallDistance(target, physics.fluid.kinematicViscosity, wall.frictionVelocity)
  const firstCellHeight = 2 * firstCellCentre
  return {
    wallTreatment,
    skinFriction: wall.skinFriction,
    wallShearStress: wall.wallShearStress,
    frictionVelocity: wall.frictionVelocity,
    yPlusTarget: target,
    firstCellCentre,
    firstCellHeight,
    boundaryLayerThickness: wall.boundaryLayerThickness,
    deltaPlus: wall.deltaPlus,
    growthRatio,
    layers: layersToThickness(firstCellHeight, wall.boundaryLayerThickness, growthRatio),
  }
}

/**
 * The near-wall figures of a case recomputed for a given wall treatment, e.g. for a reviewer's
 * override: at `yPlusTarget` when given, otherwise at the treatment's own target (the case's
 * yPlusTarget belongs to the treatment advise() chose, so it is not carried over).
 */
export function wallFor(input: CaseInput | CaseInputDraft, wallTreatment: WallTreatment, yPlusTarget?: number): WallFigures {
  const parsed = caseInputSchema.parse(input)
  return wallFigures(flowPhysics(parsed), wallTreatment, parsed.growthRatio, yPlusTarget)
}

function costs(
  input: CaseInput,
  costCase: CostCase,
  treatments: Record<ApproachId, WallTreatment>,
  reuse?: { treatments: Record<ApproachId, WallTreatment>; costs: Record<ApproachId, ApproachCost> },
): Record<ApproachId, ApproachCost> {
  const result = {} as Record<ApproachId, ApproachCost>
  for (const id of APPROACH_IDS) {
    result[id] =
      reuse && reuse.treatments[id] === treatments[id]
        ? reuse.costs[id]
        : approachCost(id, costCase, treatments[id], input.budget)
  }
  return result
}

function pushUnique(list: string[], items: readonly string[] | undefined): void {
  if (!items) return
  for (const item of items) if (!list.includes(item)) list.push(item)
}

/** The budget as written in the reasons, formatted once per advice. */
interface BudgetText {
  coreHours: string
  cores: string
  wallClockHours: string
}

function costReasons(id: ApproachId, cost: ApproachCost, input: CaseInput, treatment: WallTreatment, text: BudgetText): string[] {
  const steps = id === 'rans' ? 'iterations' : 'time steps'
  const coreHours = formatNumber(cost.coreHours)
  const wallClock = formatNumber(cost.wallClockHours)
  const reasons: string[] = []
  if (cost.layers !== null) {
    reasons.push(`Mesh counted with ${WALL_TREATMENT_LABELS[treatment].toLowerCase()}: ${cost.layers} layers to the boundary-layer edge.`)
  }
  reasons.push(
    `About ${formatNumber(cost.cells)} cells and ${formatNumber(cost.timeSteps)} ${steps}: ${coreHours} core-hours, ` +
      `${wallClock} h wall-clock on ${text.cores} cores, ${formatNumber(cost.memoryGB)} GB of memory.`,
  )
  if (cost.feasible) {
    reasons.push(`Fits the budget of ${text.coreHours} core-hours and ${text.wallClockHours} h wall-clock.`)
  } else {
    if (cost.coreHours > input.budget.coreHours) {
      reasons.push(`Needs ${coreHours} core-hours against a budget of ${text.coreHours}.`)
    }
    if (cost.wallClockHours > input.budget.wallClockHours) {
      reasons.push(`Needs ${wallClock} h wall-clock on ${text.cores} cores against a budget of ${text.wallClockHours} h.`)
    }
  }
  if (cost.cells / input.budget.cores < MIN_CELLS_PER_CORE) {
    reasons.push(
      `Only ${formatNumber(cost.cells / input.budget.cores)} cells per core: below about ${formatNumber(MIN_CELLS_PER_CORE)} parallel efficiency usually drops, so the wall-clock figure is optimistic.`,
    )
  }
  return reasons
}

function flowReasons(input: CaseInput, physics: FlowPhysics): string[] {
  const reasons: string[] = []
  if (input.regime === 'external' && physics.reynolds < PLATE_TRANSITION_REYNOLDS) {
    reasons.push(
      `At Re = ${formatNumber(physics.reynolds)} the boundary layer may still be laminar (transition is commonly near Re_x = 5e5); the turbulent skin friction used here then gives a finer wall spacing than needed.`,
    )
  }
  if (input.regime === 'external' && physics.reynolds > SCHLICHTING_MAX_REYNOLDS) {
    reasons.push(
      `Re = ${formatNumber(physics.reynolds)} is beyond the stated range of Schlichting's skin-friction formula (Re_x < 1e9); the wall figures are extrapolated.`,
    )
  }
  return reasons
}

function sortApproaches(entries: ApproachAdvice[]): ApproachAdvice[] {
  return [...entries].sort(
    (a, b) => b.score - a.score || a.coreHours - b.coreHours || APPROACH_IDS.indexOf(a.id) - APPROACH_IDS.indexOf(b.id),
  )
}

function traceEntry(outcome: RuleOutcome): TraceEntry {
  const { rule } = outcome
  return {
    rule: rule.id,
    title: rule.title,
    stage: rule.stage,
    fired: outcome.fired,
    effects: outcome.effects,
    why: rule.why,
    source: rule.source,
  }
}

/** advise() on an input already parsed by caseInputSchema. */
export function adviseParsed(input: CaseInput): Advice {
  const physics = flowPhysics(input)
  const costCase = costCaseFor(input, physics)

  // Treatment stage: default wall treatments and their costs, then the rules' choices.
  const defaultTreatments = defaultWallTreatments()
  const defaultCosts = costs(input, costCase, defaultTreatments)
  const treatmentFacts = buildFacts(input, physics, defaultCosts)
  const treatmentOutcomes = evaluateStage(RULESET, 'treatment', treatmentFacts)
  const treatments = { ...defaultTreatments }
  const treatmentRuleOf: Partial<Record<ApproachId, Rule>> = {}
  const ruleCautions: string[] = []
  for (const outcome of treatmentOutcomes) {
    if (!outcome.fired) continue
    const chosenTreatments = outcome.effects.wallTreatment
    for (const id in chosenTreatments) {
      treatments[id as ApproachId] = chosenTreatments[id as ApproachId]!
      treatmentRuleOf[id as ApproachId] = outcome.rule
    }
    pushUnique(ruleCautions, outcome.effects.cautions)
  }

  // Scoring stage: costs with the chosen treatments.
  const finalCosts = costs(input, costCase, treatments, { treatments: defaultTreatments, costs: defaultCosts })
  const treatmentsChanged = APPROACH_IDS.some((id) => treatments[id] !== defaultTreatments[id])
  const scoringFacts = treatmentsChanged ? buildFacts(input, physics, finalCosts) : treatmentFacts
  const scoringOutcomes = evaluateStage(RULESET, 'scoring', scoringFacts)
  const models = defaultModels()
  const totals = { ...RULESET.baseScores } as Record<ApproachId, number>
  const scoreReasons = {} as Record<ApproachId, string[]>
  for (const id of APPROACH_IDS) scoreReasons[id] = [`Starts at ${RULESET.baseScores[id]} (the ruleset's base score).`]
  for (const outcome of scoringOutcomes) {
    if (!outcome.fired) continue
    const changes = outcome.effects.scores
    for (const id in changes) {
      const change = changes[id as ApproachId]!
      if (change === 0) continue
      totals[id as ApproachId] += change
      scoreReasons[id as ApproachId].push(`${formatScoreChange(change)}: ${outcome.rule.title} (rule ${outcome.rule.id}).`)
    }
    const chosenModels = outcome.effects.models
    for (const id in chosenModels) models[id as ApproachId] = chosenModels[id as ApproachId]!
    pushUnique(ruleCautions, outcome.effects.cautions)
  }

  const sharedReasons = flowReasons(input, physics)
  const budgetText: BudgetText = {
    coreHours: formatNumber(input.budget.coreHours),
    cores: formatNumber(input.budget.cores),
    wallClockHours: formatNumber(input.budget.wallClockHours),
  }
  const entries: ApproachAdvice[] = APPROACH_IDS.map((id) => {
    const cost = finalCosts[id]
    const score = Math.min(100, Math.max(0, totals[id]))
    const reasons = [...scoreReasons[id]]
    if (score !== totals[id]) reasons.push(`The total of ${totals[id]} is clamped to ${score}.`)
    const treatmentRule = treatmentRuleOf[id]
    if (treatmentRule && treatments[id] !== defaultTreatments[id]) {
      reasons.push(`Wall treatment: ${WALL_TREATMENT_LABELS[treatments[id]]} (rule ${treatmentRule.id}).`)
    }
    reasons.push(...costReasons(id, cost, input, treatments[id], budgetText), ...sharedReasons)
    return {
      id,
      label: APPROACH_LABELS[id],
      score,
      cells: cost.cells,
      timeSteps: cost.timeSteps,
      coreHours: cost.coreHours,
      wallClockHours: cost.wallClockHours,
      memoryGB: cost.memoryGB,
      feasible: cost.feasible,
      model: models[id],
      wallTreatment: treatments[id],
      reasons,
    }
  })
  const approaches = sortApproaches(entries)

  const computedCautions: string[] = []
  const chosen = approaches.find((entry) => entry.feasible) ?? approaches[0]!
  if (!approaches.some((entry) => entry.feasible)) {
    const cheapest = [...approaches].sort((a, b) => a.coreHours - b.coreHours)[0]!
    computedCautions.push(
      `No approach fits the budget. The top-scored one is shown; the cheapest, ${APPROACH_LABELS[cheapest.id]}, needs ${formatNumber(cheapest.coreHours)} core-hours and ${formatNumber(cheapest.wallClockHours)} h wall-clock.`,
    )
  } else if (chosen !== approaches[0]) {
    computedCautions.push(
      `${APPROACH_LABELS[approaches[0]!.id]} scores highest but does not fit the budget; the recommendation is the best-scored approach that does.`,
    )
  }

  const wall = wallFigures(physics, chosen.wallTreatment, input.growthRatio, input.yPlusTarget)
  if (input.yPlusTarget !== undefined) {
    const ownTarget = yPlusTargetFor(chosen.wallTreatment, physics.wall.deltaPlus)
    const outOfBand =
      (chosen.wallTreatment === 'resolved' && input.yPlusTarget > RESOLVED_Y_PLUS) ||
      (chosen.wallTreatment === 'wall-function' &&
        (input.yPlusTarget < WALL_FUNCTION_Y_PLUS_BAND.min || input.yPlusTarget > WALL_FUNCTION_Y_PLUS_BAND.max))
    computedCautions.push(
      `The y+ target of ${formatNumber(input.yPlusTarget)} you set replaces the treatment's own ${formatNumber(ownTarget)} in the wall figures; the approach costs keep each treatment's own target.`,
    )
    if (outOfBand) {
      computedCautions.push(
        `A y+ of ${formatNumber(input.yPlusTarget)} does not suit ${WALL_TREATMENT_LABELS[chosen.wallTreatment].toLowerCase()}: ` +
          (chosen.wallTreatment === 'resolved'
            ? 'a resolved wall wants the first cell centre at y+ ≤ 1.'
            : 'wall functions want the first cell centre between y+ = 30 and 300.'),
      )
    }
  }
  if (chosen.wallTreatment === 'wall-model' && physics.wall.deltaPlus < 300) {
    computedCautions.push(
      'The boundary layer is under 300 wall units thick, so it has no log layer for a wall model to match; resolve the wall instead.',
    )
  }
  if (wall.firstCellHeight >= wall.boundaryLayerThickness) {
    computedCautions.push('The first cell at this y+ would be as tall as the boundary layer itself; resolve the wall or check the inputs.')
  }
  if (input.regime === 'internal' && physics.relativeRoughness > 0 && wall.firstCellCentre < (input.roughness ?? 0)) {
    computedCautions.push(
      'The first cell centre lies below the roughness height; use a roughness-aware wall treatment and keep the first cell above the roughness elements, or model the roughness geometry.',
    )
  }
  if (input.fluid.medium !== 'custom' && (input.fluid.density !== undefined || input.fluid.viscosity !== undefined)) {
    computedCautions.push(
      `The density or viscosity you gave is not used: ${input.fluid.medium} properties are computed from temperature${input.fluid.medium === 'air' ? ' and pressure' : ''}. Choose a custom fluid to use your own.`,
    )
  }

  const cautions: string[] = [...GENERAL_CAUTIONS]
  pushUnique(cautions, ruleCautions)
  pushUnique(cautions, computedCautions)

  return {
    reynolds: physics.reynolds,
    reynoldsTurbulent: physics.reynoldsTurbulent,
    mach: physics.mach,
    kolmogorovLength: physics.kolmogorovLength,
    kolmogorovCells: physics.kolmogorovCells,
    fluid: {
      density: physics.fluid.density,
      viscosity: physics.fluid.viscosity,
      kinematicViscosity: physics.fluid.kinematicViscosity,
    },
    approaches,
    recommendation: {
      approach: chosen.id,
      model: chosen.model,
      wallTreatment: chosen.wallTreatment,
      yPlusTarget: wall.yPlusTarget,
    },
    wall,
    cautions,
    trace: [...treatmentOutcomes, ...scoringOutcomes].map(traceEntry),
    ruleset: { id: RULESET.id, version: RULESET.version },
    engineVersion: ENGINE_VERSION,
  }
}

/**
 * Advice for a case. The input is parsed with caseInputSchema first, so defaults apply and an
 * invalid case throws a ZodError with per-field messages.
 */
export function advise(input: CaseInputDraft | CaseInput): Advice {
  return adviseParsed(caseInputSchema.parse(input))
}
