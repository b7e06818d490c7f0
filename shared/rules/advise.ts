/**
 * advise(): from a case description to scored approaches, a recommendation, the near-wall mesh,
 * the cost against the budget, cautions and a trace of every rule. Deterministic: the same input
 * gives deep-equal output, so the server can recompute what the browser previewed.
 *
 * The stages live in their own modules: treatment rules (advise-treatments.ts), costs
 * (cost-model.ts), scoring rules (advise-scoring.ts), ranking and the budget (ranking.ts), and the
 * computed cautions (computed-cautions.ts).
 */
import { APPROACH_IDS, APPROACH_LABELS, WALL_TREATMENT_LABELS, type ApproachId, type WallTreatment } from './approaches'
import type { Advice, ApproachAdvice, TraceEntry } from './advice-types'
import { pushUnique, treatmentStage, type TreatmentStage } from './advise-treatments'
import { scoringStage, type ScoringStage } from './advise-scoring'
import { GENERAL_CAUTIONS } from './cautions'
import { parseCaseInput, type CaseInput, type CaseInputDraft } from './case-input'
import { computedCautions } from './computed-cautions'
import { costCaseFor, type CostCase } from './cost-case'
import { approachCost, type ApproachCost } from './cost-model'
import type { RuleOutcome } from './evaluate-rules'
import { buildPhysicsFacts, withCostFacts } from './facts'
import { flowPhysics, type FlowPhysics } from './flow-physics'
import { budgetText, costReasons, flowReasons, type BudgetText } from './reasons'
import { chooseWithinBudget, sortApproaches } from './ranking'
import { regimeAdvice, roughnessAdvice } from './regime-summary'
import { RULESET } from './ruleset'
import type { Ruleset } from './ruleset-schema'
import { wallFigures } from './wall-figures'

/** Semantic version of the engine's code (the ruleset has its own). */
export const ENGINE_VERSION = '2.0.1'

export interface AdviseOptions {
  /** The rules to apply (a team's published version, a draft under review); the built-in RULESET when absent. Compile it once with compileRuleset(). */
  ruleset?: Ruleset
}

/** Costs of every approach with the chosen wall treatments. */
function costsFor(input: CaseInput, flow: CostCase, treatments: Record<ApproachId, WallTreatment>): Record<ApproachId, ApproachCost> {
  const costs = {} as Record<ApproachId, ApproachCost>
  for (const id of APPROACH_IDS) costs[id] = approachCost(id, flow, treatments[id], input.budget)
  return costs
}

/** Trace entries of rules with constant effects are the same for every advice: built once, frozen and shared. */
const sharedEntries = new WeakMap<RuleOutcome['effects'], { fired?: TraceEntry; quiet?: TraceEntry }>()

function traceEntry(outcome: RuleOutcome): TraceEntry {
  const { rule, effects, fired } = outcome
  const shareable = Object.isFrozen(effects)
  const cached = shareable ? sharedEntries.get(effects) : undefined
  const hit = cached && (fired ? cached.fired : cached.quiet)
  if (hit) return hit
  const entry: TraceEntry = { rule: rule.id, title: rule.title, stage: rule.stage, fired, effects, why: rule.why, source: rule.source }
  if (!shareable) return entry
  const slot = cached ?? {}
  if (fired) slot.fired = Object.freeze(entry)
  else slot.quiet = Object.freeze(entry)
  sharedEntries.set(effects, slot)
  return entry
}

interface EntryContext {
  input: CaseInput
  costs: Record<ApproachId, ApproachCost>
  treatment: TreatmentStage
  scoring: ScoringStage
  text: BudgetText
  shared: string[]
}

function approachEntry(id: ApproachId, context: EntryContext): ApproachAdvice {
  const { costs, treatment, scoring } = context
  const cost = costs[id]
  const total = scoring.totals[id]
  const score = Math.round(Math.min(100, Math.max(0, total)) * 10) / 10
  const reasons = scoring.reasons[id]
  if (score !== Math.round(total * 10) / 10) reasons.push(`The total of ${Math.round(total * 10) / 10} is clamped to ${score}.`)
  const rule = treatment.ruleOf[id]
  if (rule) reasons.push(`Wall treatment: ${WALL_TREATMENT_LABELS[treatment.treatments[id]]} (rule ${rule.id}).`)
  reasons.push(...costReasons(cost, context.input, treatment.treatments[id], context.text), ...context.shared)
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
    model: scoring.models[id],
    wallTreatment: treatment.treatments[id],
    reasons,
    yPlusTarget: cost.yPlusTarget,
    timeStep: cost.timeStep,
    simulatedTime: cost.simulatedTime,
    flowThroughs: cost.flowThroughs,
    periods: cost.periods,
    innerIterations: cost.innerIterations,
    budgetRatio: cost.budgetRatio,
    twoDimensional: cost.twoDimensional,
    uncertainty: cost.uncertainty,
    ranges: cost.ranges,
  }
}

/** The six turbulence approaches, and a laminar solution where the flow is laminar or transitional. */
function listedApproaches(physics: FlowPhysics): readonly ApproachId[] {
  return physics.regime.state === 'turbulent' ? APPROACH_IDS.filter((id) => id !== 'laminar') : APPROACH_IDS
}

/** advise() on an input already parsed by caseInputSchema. */
export function adviseParsed(input: CaseInput, options: AdviseOptions = {}): Advice {
  const ruleset = options.ruleset ?? RULESET
  const physics = flowPhysics(input)
  const facts = buildPhysicsFacts(input, physics)
  const treatment = treatmentStage(facts, ruleset)
  const costs = costsFor(input, costCaseFor(input, physics), treatment.treatments)
  const scoring = scoringStage(withCostFacts(facts, input.budget, costs), ruleset)
  const context: EntryContext = { input, costs, treatment, scoring, text: budgetText(input.budget), shared: flowReasons(input, physics) }
  const ids = listedApproaches(physics)
  const approaches = sortApproaches(
    ids.map((id) => approachEntry(id, context)),
    new Map(ids.map((id) => [id, scoring.totals[id]])),
  )
  const { chosen, budget } = chooseWithinBudget(approaches, input.quantities)
  const wall = wallFigures(physics, chosen.wallTreatment, input.growthRatio, input.yPlusTarget, chosen.id)
  const cautions: string[] = [...GENERAL_CAUTIONS]
  pushUnique(cautions, treatment.cautions)
  pushUnique(cautions, scoring.cautions)
  pushUnique(cautions, computedCautions({ input, physics, chosen, wall, budget }))
  return {
    reynolds: physics.reynolds,
    reynoldsTurbulent: physics.reynoldsTurbulent,
    mach: physics.mach,
    kolmogorovLength: physics.kolmogorovLength,
    kolmogorovCells: physics.kolmogorovCells,
    fluid: { density: physics.fluid.density, viscosity: physics.fluid.viscosity, kinematicViscosity: physics.fluid.kinematicViscosity },
    approaches,
    recommendation: { approach: chosen.id, model: chosen.model, wallTreatment: chosen.wallTreatment, yPlusTarget: wall.yPlusTarget },
    wall,
    cautions,
    trace: [...treatment.outcomes, ...scoring.outcomes].map(traceEntry),
    ruleset: { id: ruleset.id, version: ruleset.version },
    engineVersion: ENGINE_VERSION,
    regime: regimeAdvice(physics),
    roughness: roughnessAdvice(physics),
    budget,
    domain: {
      dimensions: physics.domain.dimensions,
      crossSection: physics.domain.crossSection,
      length: physics.domain.length,
      span: physics.domain.span,
      wettedArea: physics.domain.wettedArea,
    },
  }
}

/**
 * Advice for a case. The input is parsed with caseInputSchema first, so defaults apply and an
 * invalid case throws a ZodError with per-field messages.
 */
export function advise(input: CaseInputDraft | CaseInput, options: AdviseOptions = {}): Advice {
  return adviseParsed(parseCaseInput(input), options)
}
