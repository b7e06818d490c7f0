import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { advise } from '../../../../shared/rules/advise'
import { compileRuleset, describeProblem, rulesetProblems, RulesetInvalidError } from '../../../../shared/rules/compile-ruleset'
import { RULESET } from '../../../../shared/rules/ruleset'
import { validCase } from './arbitraries'

/** The built-in ruleset as plain, mutable data: what the database stores. */
const data = () => JSON.parse(JSON.stringify(RULESET))

describe('compileRuleset', () => {
  it('gives the same advice as the built-in ruleset when compiled from its data', () => {
    const compiled = compileRuleset(data())
    fc.assert(fc.property(validCase, (draft) => {
      expect(advise(draft, { ruleset: compiled })).toEqual(advise(draft))
    }), { numRuns: 60 })
  }, 60_000)

  it('applies an edited rule and names the ruleset version in the advice', () => {
    const source = data()
    source.version = '1.1.0'
    // Attached external aerodynamics gets Spalart-Allmaras instead of k-omega SST.
    const rule = source.rules.find((r: { id: string }) => r.id === 'attached-aerodynamics-sst')
    rule.effects.models = { rans: 'Spalart-Allmaras', urans: 'Spalart-Allmaras' }
    const wing = {
      regime: 'external', fluid: { medium: 'air' }, velocity: 50, length: 1, geometry: 'streamlined', separation: 'none',
      quantities: ['forces'], budget: { coreHours: 5000, cores: 128, wallClockHours: 48 },
    } as const
    const before = advise(wing)
    const after = advise(wing, { ruleset: compileRuleset(source) })
    expect(before.recommendation).toMatchObject({ approach: 'rans', model: 'k-omega SST' })
    expect(after.recommendation).toMatchObject({ approach: 'rans', model: 'Spalart-Allmaras' })
    expect(after.ruleset).toEqual({ id: RULESET.id, version: '1.1.0' })
  })

  it('freezes its own copy: the caller may go on editing its data', () => {
    const source = data()
    const compiled = compileRuleset(source)
    source.rules[0].title = 'changed afterwards'
    expect(compiled.rules[0]!.title).toBe(RULESET.rules[0]!.title)
    expect(Object.isFrozen(compiled.rules[0]!.when)).toBe(true)
  })

  it('refuses an invalid ruleset, naming each rule and the reason', () => {
    const source = data()
    const scoring = source.rules.findIndex((r: { id: string }) => r.id === 'mild-separation')
    source.rules[2].when = { '>': [{ var: 'physics.heatTransferr' }, 0] }
    source.rules[5].when = { map: [{ var: 'quantities' }, true] }
    source.rules[scoring].effects.models = { rans: 'my own model' }
    const problems = rulesetProblems(source)
    expect(problems.map(p => [p.ruleId, p.ruleIndex])).toEqual([
      [source.rules[2].id, 2], [source.rules[5].id, 5], ['mild-separation', scoring],
    ])
    expect(describeProblem(problems[0]!)).toBe(
      `Rule "${source.rules[2].id}" (rule 3), when.>.0.var: Unknown fact "physics.heatTransferr"; see FACT_PATHS in facts.ts.`,
    )
    expect(problems[1]!.message).toMatch(/disallowed json-logic operation "map"/)
    expect(problems[2]!.message).toMatch(/"my own model" is not among the models listed for rans/)
    expect(() => compileRuleset(source)).toThrow(RulesetInvalidError)
    expect(rulesetProblems(data())).toEqual([])
  })

  it('reports problems of the ruleset as a whole without a rule', () => {
    const source = { ...data(), version: 'two' }
    expect(rulesetProblems(source)).toEqual([
      { ruleIndex: null, ruleId: null, path: ['version'], message: 'Ruleset versions are semantic versions, e.g. 1.0.0.' },
    ])
  })
})
