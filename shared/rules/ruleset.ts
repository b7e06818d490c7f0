/**
 * Eddyledger's ruleset: how the case's facts (facts.ts) choose the wall treatments, move the score
 * of each approach, choose the model and add cautions. It is plain data, checked against
 * ruleset-schema.ts when this module loads.
 *
 * Evaluation: treatment-stage rules (ruleset-treatment.ts) run first, on the physics alone, and
 * choose wall treatments; costs are then counted with those treatments; scoring rules
 * (ruleset-scoring.ts) run on the physics and the costs. Within a stage, rules apply in order, and a
 * later rule's model or wall treatment replaces an earlier one's. Scores start at baseScores, add
 * every fired rule's changes, and are clamped to 0-100. Bump `version` whenever a rule changes, so
 * saved advice names the rules it came from.
 */
import { rulesetSchema, type RulesetSource } from './ruleset-schema'
import { SCORING_RULES } from './ruleset-scoring'
import { TREATMENT_RULES } from './ruleset-treatment'

const source: RulesetSource = {
  id: 'eddyledger-core',
  version: '2.0.0',
  baseScores: { dns: 50, wrles: 50, wmles: 50, hybrid: 50, urans: 50, rans: 50, laminar: 50 },
  baseWhy:
    'Every approach starts level at 50. The rules below raise or lower each score for this case; the total is clamped to 0-100. ' +
    'A laminar solution is weighed only when the flow is laminar or transitional.',
  rules: [...TREATMENT_RULES, ...SCORING_RULES],
}

function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object' && !Object.isFrozen(value)) {
    for (const key of Object.keys(value)) deepFreeze((value as Record<string, unknown>)[key])
    Object.freeze(value)
  }
  return value
}

/** The parsed, validated ruleset the engine runs; frozen, so advice that shares its effects cannot change it. */
export const RULESET = deepFreeze(rulesetSchema.parse(source))
