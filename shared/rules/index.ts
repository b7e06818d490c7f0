/**
 * Eddyledger's engine: pure TypeScript with relative imports only, so it runs in the browser, on
 * the server and under plain Node (npx tsx).
 */
export { caseInputSchema, QUANTITIES, type CaseInput, type CaseInputDraft, type Quantity } from './case-input'
export {
  advise,
  wallFor,
  ENGINE_VERSION,
  type Advice,
  type ApproachAdvice,
  type TraceEntry,
  type WallFigures,
} from './advise'
export { costSweep, type CostSweep, type CostSweepOptions } from './cost-sweep'
export {
  APPROACH_IDS,
  APPROACH_LABELS,
  MODELS_BY_APPROACH,
  MODEL_REFERENCES,
  WALL_TREATMENTS,
  WALL_TREATMENT_LABELS,
  WALL_TREATMENTS_BY_APPROACH,
  type ApproachId,
  type WallTreatment,
} from './approaches'
export { RULESET } from './ruleset'
export type { Rule, Ruleset } from './ruleset-schema'
export { GENERAL_CAUTIONS } from './cautions'
