/**
 * Runs the rules of one stage over the facts with json-logic and reports, per rule, whether it
 * fired and what it applies. The caller (advise.ts) merges the outcomes into scores, models,
 * wall treatments and cautions.
 */
import jsonLogic from 'json-logic-js'
import type { ApproachId, WallTreatment } from './approaches'
import type { Facts, PhysicsFacts } from './facts'
import type { Rule, Ruleset } from './ruleset-schema'
import { applyLogic } from './compile-logic'

export interface AppliedEffects {
  readonly scores?: Readonly<Partial<Record<ApproachId, number>>>
  readonly models?: Readonly<Partial<Record<ApproachId, string>>>
  readonly wallTreatment?: Readonly<Partial<Record<ApproachId, WallTreatment>>>
  readonly cautions?: readonly string[]
}

export interface RuleOutcome {
  rule: Rule
  fired: boolean
  /**
   * For a fired rule, what it applied; for one that did not fire, what it would have applied on
   * these facts, except that score changes computed from the facts are worked out only when the
   * rule fires. Frozen and possibly shared between calls when the rule comes from the frozen RULESET.
   */
  effects: AppliedEffects
}

/** Truthiness as json-logic defines it (an empty array is false). */
export function conditionHolds(when: unknown, facts: PhysicsFacts | Facts): boolean {
  return jsonLogic.truthy(applyLogic(when, facts))
}

function scoreChange(rule: Rule, approach: ApproachId, change: unknown, facts: PhysicsFacts | Facts): number {
  const value = typeof change === 'number' ? change : applyLogic(change, facts)
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new Error(`Rule "${rule.id}" gave a score change for ${approach} that is not a finite number.`)
  }
  return value
}

/**
 * Effects of rules whose score changes are all constants: the same on any facts, computed once and
 * frozen. `null` marks a frozen rule with computed score changes, evaluated on every call.
 */
const constantEffects = new WeakMap<Rule, AppliedEffects | null>()

function hasComputedScores(rule: Rule): boolean {
  for (const approach in rule.effects.scores) {
    if (typeof rule.effects.scores[approach as ApproachId] !== 'number') return true
  }
  return false
}

function appliedEffects(rule: Rule, facts: PhysicsFacts | Facts, withScores = true): AppliedEffects {
  const declared = rule.effects
  const effects: { -readonly [K in keyof AppliedEffects]: AppliedEffects[K] } = {}
  if (declared.scores && withScores) {
    const scores: Partial<Record<ApproachId, number>> = {}
    for (const approach in declared.scores) {
      const change = declared.scores[approach as ApproachId]
      if (change !== undefined) scores[approach as ApproachId] = scoreChange(rule, approach as ApproachId, change, facts)
    }
    effects.scores = scores
  }
  if (declared.models) effects.models = declared.models
  if (declared.wallTreatment) effects.wallTreatment = declared.wallTreatment
  if (declared.cautions) effects.cautions = declared.cautions
  return effects
}

export function evaluateRule(rule: Rule, facts: PhysicsFacts | Facts): RuleOutcome {
  const fired = conditionHolds(rule.when, facts)
  let cached = constantEffects.get(rule)
  if (cached === undefined && Object.isFrozen(rule)) {
    cached = hasComputedScores(rule) ? null : Object.freeze(appliedEffects(rule, facts))
    constantEffects.set(rule, cached)
  }
  if (cached) return { rule, fired, effects: cached }
  // A frozen rule with computed scores works them out only when it fires; others always.
  return { rule, fired, effects: appliedEffects(rule, facts, fired || cached === undefined) }
}

/** Outcomes of every rule of a stage, in ruleset order. */
export function evaluateStage(ruleset: Ruleset, stage: Rule['stage'], facts: PhysicsFacts | Facts): RuleOutcome[] {
  const outcomes: RuleOutcome[] = []
  for (const rule of ruleset.rules) {
    if (rule.stage === stage) outcomes.push(evaluateRule(rule, facts))
  }
  return outcomes
}
