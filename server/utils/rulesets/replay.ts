// Replaying past decisions under two rulesets (the published one and a draft, both under today's
// engine) to find those whose recommended approach, model or wall treatment would change, and the
// rules responsible. Pure and relative imports only: the impact job runs it over the database,
// the benchmark over 100,000 generated decisions.
import canonicalize from 'canonicalize'
import { ENGINE_VERSION, adviseParsed, caseInputSchema, type Advice, type CaseInput, type Rule, type Ruleset, type TraceEntry } from '../../../shared/rules'
import type { RecommendationChoice } from '../../../shared/types/rulesets'
import { choiceOf } from './cases'

/** A decision's latest revision as stored. */
export interface StoredRevision {
  decisionId: number
  caseInput: unknown
  inputHash: string
  rulesetId: string
  rulesetVersion: string
  engineVersion: string
  recommendation: RecommendationChoice
}

export interface ImpactChange {
  decisionId: number
  from: RecommendationChoice
  to: RecommendationChoice
  /** rules that fired under either ruleset and were changed, or fired or applied differently */
  rules: string[]
}

export interface ImpactProblem {
  decisionId: number
  message: string
}

export function sameChoice(a: RecommendationChoice, b: RecommendationChoice) {
  return a.approach === b.approach && a.model === b.model && a.wallTreatment === b.wallTreatment
}

/** Rule ids whose definition (or presence) differs between the two rulesets. */
export function changedRuleIds(from: { rules: readonly Rule[] }, to: { rules: readonly Rule[] }): Set<string> {
  const before = new Map(from.rules.map(rule => [rule.id, canonicalize(rule)]))
  const after = new Map(to.rules.map(rule => [rule.id, canonicalize(rule)]))
  const changed = new Set<string>()
  for (const [id, text] of after) if (before.get(id) !== text) changed.add(id)
  for (const id of before.keys()) if (!after.has(id)) changed.add(id)
  return changed
}

// Canonical JSON: stored advice comes back from jsonb with its keys reordered.
function sameEffects(a: TraceEntry, b: TraceEntry) {
  return canonicalize(a.effects) === canonicalize(b.effects)
}

/** The rules behind a difference: fired under either ruleset and changed, or fired or applied differently. */
export function responsibleRules(fromAdvice: Pick<Advice, 'trace'>, toAdvice: Pick<Advice, 'trace'>, changed: ReadonlySet<string>): string[] {
  const before = new Map(fromAdvice.trace.map(entry => [entry.rule, entry]))
  const after = new Map(toAdvice.trace.map(entry => [entry.rule, entry]))
  const ids = [...after.keys(), ...[...before.keys()].filter(id => !after.has(id))]
  return ids.filter((id) => {
    const a = before.get(id)
    const b = after.get(id)
    if (!a?.fired && !b?.fired) return false
    if (changed.has(id) || !a || !b || a.fired !== b.fired) return true
    return !sameEffects(a, b)
  })
}

/**
 * A replayer for one pair of compiled rulesets. Stored advice stands in for the published side
 * when it was made with that very version under this engine (advise() is deterministic), a stored
 * input made under this engine is already parsed, and identical inputs are evaluated once.
 */
export function createReplay(from: Ruleset, to: Ruleset) {
  const changed = changedRuleIds(from, to)
  const byInput = new Map<string, { from: RecommendationChoice; to: RecommendationChoice; rules: string[] } | null>()

  function inputOf(stored: StoredRevision): CaseInput {
    return stored.engineVersion === ENGINE_VERSION ? (stored.caseInput as CaseInput) : caseInputSchema.parse(stored.caseInput)
  }

  function outcome(stored: StoredRevision) {
    const input = inputOf(stored)
    const madeWithFrom = stored.engineVersion === ENGINE_VERSION && stored.rulesetId === from.id && stored.rulesetVersion === from.version
    let fromAdvice = madeWithFrom ? undefined : adviseParsed(input, { ruleset: from })
    const fromChoice = choiceOf({ recommendation: fromAdvice?.recommendation ?? stored.recommendation })
    const toAdvice = adviseParsed(input, { ruleset: to })
    const toChoice = choiceOf(toAdvice)
    if (sameChoice(fromChoice, toChoice)) return null
    fromAdvice ??= adviseParsed(input, { ruleset: from })
    return { from: fromChoice, to: toChoice, rules: responsibleRules(fromAdvice, toAdvice, changed) }
  }

  return {
    changed,
    /** The change for one decision, null when none; throws when its input does not fit today's engine. */
    replay(stored: StoredRevision): ImpactChange | null {
      let result = byInput.get(stored.inputHash)
      if (result === undefined) {
        result = outcome(stored)
        byInput.set(stored.inputHash, result)
      }
      return result && { decisionId: stored.decisionId, ...result }
    },
  }
}
