/**
 * Eddyledger's engine: pure TypeScript with relative imports only, so it runs in the browser, on
 * the server and under plain Node (npx tsx).
 */
export {
  APPLICATIONS,
  QUANTITIES,
  caseInputSchema,
  type Application,
  type CaseInput,
  type CaseInputDraft,
  type DomainInput,
  type Quantity,
} from './case-input'
export { advise, adviseParsed, ENGINE_VERSION, type AdviseOptions } from './advise'
export type {
  Advice,
  ApproachAdvice,
  BudgetAdvice,
  DomainAdvice,
  Range,
  RegimeAdvice,
  RoughnessAdvice,
  TraceEntry,
  WallFigures,
} from './advice-types'
export { wallFor } from './wall-figures'
export { costFor, type ApproachCostFigures } from './cost-for'
export { costSweep, type CostSweep, type CostSweepOptions } from './cost-sweep'
export { classifyRegime, sheddingStrouhal, type FlowRegime, type FlowState, type MachRegime, type WakeState } from './regime'
export { formatEstimate, roundToBand, significantFiguresFor } from './format'
export {
  APPROACH_IDS,
  APPROACH_LABELS,
  MODELS_BY_APPROACH,
  MODEL_REFERENCES,
  TURBULENCE_APPROACH_IDS,
  WALL_TREATMENTS,
  WALL_TREATMENT_LABELS,
  WALL_TREATMENTS_BY_APPROACH,
  type ApproachId,
  type WallTreatment,
} from './approaches'
export { RULESET } from './ruleset'
export type { Rule, Ruleset, RulesetSource } from './ruleset-schema'
export { compileRuleset, describeProblem, rulesetProblems, RulesetInvalidError, type RulesetProblem } from './compile-ruleset'
export { CAUTION_SUMMARY, GENERAL_CAUTIONS } from './cautions'
