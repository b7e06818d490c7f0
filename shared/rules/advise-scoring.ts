/**
 * The scoring stage of advise(): base scores plus every fired rule's changes, the models the rules
 * chose, and a reason line per change.
 */
import { APPROACH_IDS, defaultModels, type ApproachId } from './approaches'
import { pushUnique } from './advise-treatments'
import { evaluateStage, type RuleOutcome } from './evaluate-rules'
import type { Facts } from './facts'
import { formatScoreChange } from './format'
import { RULESET } from './ruleset'
import type { Rule, Ruleset } from './ruleset-schema'

export interface ScoringStage {
  /** unclamped totals */
  totals: Record<ApproachId, number>
  reasons: Record<ApproachId, string[]>
  models: Record<ApproachId, string>
  outcomes: RuleOutcome[]
  cautions: string[]
}

/** A score change as written in the reasons: whole points, to one decimal when smooth terms make it fractional. */
function points(change: number): string {
  return formatScoreChange(Math.round(change * 10) / 10)
}

/** The end of a rule's reason line, written once per rule. */
const reasonTails = new WeakMap<Rule, string>()

function reasonTail(rule: Rule): string {
  let tail = reasonTails.get(rule)
  if (tail === undefined) {
    tail = `: ${rule.title} (rule ${rule.id}).`
    reasonTails.set(rule, tail)
  }
  return tail
}

export function scoringStage(facts: Facts, ruleset: Ruleset = RULESET): ScoringStage {
  const outcomes = evaluateStage(ruleset, 'scoring', facts)
  const models = defaultModels()
  const totals = {} as Record<ApproachId, number>
  const reasons = {} as Record<ApproachId, string[]>
  for (const id of APPROACH_IDS) {
    totals[id] = ruleset.baseScores[id]
    reasons[id] = [`Starts at ${ruleset.baseScores[id]} (the ruleset's base score).`]
  }
  const cautions: string[] = []
  for (const outcome of outcomes) {
    if (!outcome.fired) continue
    const changes = outcome.effects.scores
    for (const id in changes) {
      const change = changes[id as ApproachId]!
      if (change === 0) continue
      totals[id as ApproachId] += change
      reasons[id as ApproachId].push(points(change) + reasonTail(outcome.rule))
    }
    const chosen = outcome.effects.models
    for (const id in chosen) models[id as ApproachId] = chosen[id as ApproachId]!
    pushUnique(cautions, outcome.effects.cautions)
  }
  return { totals, reasons, models, outcomes, cautions }
}
