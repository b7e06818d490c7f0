/**
 * The treatment stage of advise(): each approach's default wall treatment, then the treatment rules'
 * choices, made from the physics alone.
 */
import { defaultWallTreatments, type ApproachId, type WallTreatment } from './approaches'
import { evaluateStage, type RuleOutcome } from './evaluate-rules'
import type { PhysicsFacts } from './facts'
import { RULESET } from './ruleset'
import type { Rule, Ruleset } from './ruleset-schema'

export interface TreatmentStage {
  treatments: Record<ApproachId, WallTreatment>
  /** the rule that set each approach's treatment, where one did */
  ruleOf: Partial<Record<ApproachId, Rule>>
  outcomes: RuleOutcome[]
  cautions: string[]
}

export function pushUnique(list: string[], items: readonly string[] | undefined): void {
  if (!items) return
  for (const item of items) if (!list.includes(item)) list.push(item)
}

export function treatmentStage(facts: PhysicsFacts, ruleset: Ruleset = RULESET): TreatmentStage {
  const outcomes = evaluateStage(ruleset, 'treatment', facts)
  const treatments = defaultWallTreatments()
  const ruleOf: Partial<Record<ApproachId, Rule>> = {}
  const cautions: string[] = []
  for (const outcome of outcomes) {
    if (!outcome.fired) continue
    const chosen = outcome.effects.wallTreatment
    for (const id in chosen) {
      treatments[id as ApproachId] = chosen[id as ApproachId]!
      ruleOf[id as ApproachId] = outcome.rule
    }
    pushUnique(cautions, outcome.effects.cautions)
  }
  return { treatments, ruleOf, outcomes, cautions }
}
