import { describe, expect, it } from 'vitest'
import { advise } from '#shared/rules/index'
import { CANONICAL_CASES } from './canonical-cases'

// Each case names the approach its published study used and the citation (see canonical-cases.ts).
describe('published canonical cases: the engine recommends what the published study used', () => {
  it('holds at least twenty cases, each with a citation', () => {
    expect(CANONICAL_CASES.length).toBeGreaterThanOrEqual(20)
    for (const entry of CANONICAL_CASES) expect(entry.citation.length).toBeGreaterThan(10)
  })

  it.each(CANONICAL_CASES.map((entry) => [entry.name, entry] as const))('%s', (_name, entry) => {
    const advice = advise(entry.input)
    const summary = `${advice.recommendation.approach} (${advice.recommendation.model}, ${advice.recommendation.wallTreatment}); source: ${entry.citation}`
    expect(advice.recommendation.approach, summary).toBe(entry.approach)
    if (entry.model) expect(advice.recommendation.model, summary).toMatch(entry.model)
    if (entry.wallTreatment) expect(advice.recommendation.wallTreatment, summary).toBe(entry.wallTreatment)
  })
})
