// Canonical cases: inputs with the recommendation the team expects from its rules. A draft whose
// case fails cannot be published. Relative imports only (the demo seed checks its cases too).
import { advise, type Ruleset } from '../../../shared/rules'
import type { ExpectedRecommendation, RecommendationChoice } from '../../../shared/types/rulesets'
import type * as schema from '../../db/schema'

export type RulesetCaseRow = typeof schema.rulesetCases.$inferSelect
type CaseFields = Pick<RulesetCaseRow, 'title' | 'caseInput' | 'expected'>

export function choiceOf(advice: { recommendation: RecommendationChoice }): RecommendationChoice {
  const { approach, model, wallTreatment } = advice.recommendation
  return { approach, model, wallTreatment }
}

/** Where the engine's recommendation differs from what the case expects, in words. */
export function expectationMisses(expected: ExpectedRecommendation, actual: RecommendationChoice): string[] {
  const misses: string[] = []
  if (expected.approach !== actual.approach) misses.push(`approach ${actual.approach}, expected ${expected.approach}`)
  if (expected.model !== undefined && expected.model !== actual.model) misses.push(`model ${actual.model}, expected ${expected.model}`)
  if (expected.wallTreatment !== undefined && expected.wallTreatment !== actual.wallTreatment) {
    misses.push(`wall treatment ${actual.wallTreatment}, expected ${expected.wallTreatment}`)
  }
  return misses
}

/** Each case run through the engine with the ruleset: what it gets and whether that is what it expects. */
export function checkCases<T extends CaseFields>(ruleset: Ruleset, cases: T[]) {
  return cases.map((item) => {
    try {
      const actual = choiceOf(advise(item.caseInput, { ruleset }))
      const misses = expectationMisses(item.expected, actual)
      return { ...item, actual, passes: misses.length === 0, misses }
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error)
      return { ...item, actual: null, passes: false, misses: [`the engine could not evaluate it: ${message}`] }
    }
  })
}
export type CheckedCase<T extends CaseFields = RulesetCaseRow> = ReturnType<typeof checkCases<T>>[number]
