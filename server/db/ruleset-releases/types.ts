import type { Rule, Ruleset } from '../../../shared/rules'

/** A ruleset as data; an earlier version need not fit today's schema. */
export interface ReleasedRulesetData {
  id: string
  version: string
  /** an earlier engine may have had fewer approaches */
  baseScores: Partial<Ruleset['baseScores']>
  baseWhy: string
  rules: Rule[]
}
