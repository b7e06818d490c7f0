import { describe, expect, it } from 'vitest'
import { RULESET } from '#shared/rules/ruleset'
import { logicProblems, rulesetSchema } from '#shared/rules/ruleset-schema'

const minimalRule = {
  id: 'example-rule',
  title: 'Example rule',
  stage: 'scoring' as const,
  when: { '>': [{ var: 'reynolds' }, 1e6] },
  effects: { scores: { rans: 5 } },
  why: 'An example explanation long enough to pass.',
  source: 'common practice, no source',
}

function rulesetWith(rules: unknown[]) {
  return {
    id: 'test-rules',
    version: '0.1.0',
    baseScores: { dns: 50, wrles: 50, wmles: 50, hybrid: 50, urans: 50, rans: 50, laminar: 50 },
    baseWhy: 'Every approach starts level for this test.',
    rules,
  }
}

const messages = (value: unknown) => {
  const result = rulesetSchema.safeParse(value)
  return result.success ? [] : result.error.issues.map((issue) => issue.message)
}

describe('ruleset schema', () => {
  it('accepts the shipped ruleset, with an id, a semantic version and every rule sourced', () => {
    expect(rulesetSchema.safeParse(RULESET).success).toBe(true)
    expect(RULESET.version).toMatch(/^\d+\.\d+\.\d+$/)
    for (const rule of RULESET.rules) {
      expect(rule.source.length).toBeGreaterThan(3)
      expect(rule.why.length).toBeGreaterThan(20)
    }
  })

  it('accepts a minimal valid ruleset', () => {
    expect(messages(rulesetWith([minimalRule]))).toEqual([])
  })

  it('rejects a var that names no fact, so a misspelling cannot silently never fire', () => {
    const rule = { ...minimalRule, when: { '>': [{ var: 'reynold' }, 1e6] } }
    expect(messages(rulesetWith([rule])).join(' ')).toMatch(/Unknown fact "reynold"/)
  })

  it('rejects unknown json-logic operations and multi-key operations', () => {
    expect(logicProblems({ eval: ['x'] })[0]?.message).toMatch(/Unknown or disallowed/)
    expect(logicProblems({ map: [{ var: 'quantities' }, { var: '' }] })[0]?.message).toMatch(/disallowed/)
    expect(logicProblems({ '>': [1, 2], '<': [1, 2] })[0]?.message).toMatch(/exactly one key/)
  })

  it('rejects duplicate ids, models not listed for the approach, and misplaced stages', () => {
    expect(messages(rulesetWith([minimalRule, minimalRule])).join(' ')).toMatch(/Duplicate rule id/)
    const badModel = { ...minimalRule, effects: { models: { rans: 'WALE' } } }
    expect(messages(rulesetWith([badModel])).join(' ')).toMatch(/not among the models listed for rans/)
    const treatmentAfterScoring = {
      ...minimalRule,
      id: 'late-treatment',
      stage: 'treatment',
      effects: { wallTreatment: { rans: 'wall-function' } },
    }
    expect(messages(rulesetWith([minimalRule, treatmentAfterScoring])).join(' ')).toMatch(/Treatment-stage rules come before/)
    const scoresInTreatment = { ...minimalRule, stage: 'treatment' }
    expect(messages(rulesetWith([scoresInTreatment])).join(' ')).toMatch(/wall treatments and cautions only/)
    const impossibleTreatment = { ...minimalRule, stage: 'treatment', effects: { wallTreatment: { dns: 'wall-function' } } }
    expect(messages(rulesetWith([impossibleTreatment])).join(' ')).toMatch(/dns cannot use/)
  })

  it('keeps treatment rules to the physics: a cost fact in a treatment condition is refused', () => {
    const budgetDriven = {
      ...minimalRule,
      id: 'budget-driven-treatment',
      stage: 'treatment',
      when: { '>': [{ var: 'budgetRatio.rans' }, 1] },
      effects: { wallTreatment: { rans: 'wall-function' } },
    }
    expect(messages(rulesetWith([budgetDriven])).join(' ')).toMatch(/is a cost; treatment rules choose from the physics alone/)
    const physicsDriven = { ...budgetDriven, when: { '>': [{ var: 'deltaPlus' }, 1e4] } }
    expect(messages(rulesetWith([physicsDriven]))).toEqual([])
  })

  it('rejects a rule with no effect and a version that is not semantic', () => {
    expect(messages(rulesetWith([{ ...minimalRule, effects: {} }])).join(' ')).toMatch(/at least one effect/)
    expect(messages({ ...rulesetWith([minimalRule]), version: 'v1' }).join(' ')).toMatch(/semantic versions/)
  })
})
