// The compiled json-logic must give exactly what json-logic-js gives: the rules' meaning is
// json-logic-js's, and decisions already saved were computed with it.
import fc from 'fast-check'
import jsonLogic, { type RulesLogic } from 'json-logic-js'
import { describe, expect, it } from 'vitest'
import { applyLogic, compileLogic } from '../../../../shared/rules/compile-logic'
import { RULESET } from '../../../../shared/rules/ruleset'
import { ALLOWED_OPERATIONS } from '../../../../shared/rules/ruleset-schema'
import { APPROACH_IDS, defaultWallTreatments } from '../../../../shared/rules/approaches'
import { caseInputSchema } from '../../../../shared/rules/case-input'
import { costCaseFor } from '../../../../shared/rules/cost-case'
import { approachCost, type ApproachCost } from '../../../../shared/rules/cost-model'
import { buildPhysicsFacts, withCostFacts } from '../../../../shared/rules/facts'
import { flowPhysics } from '../../../../shared/rules/flow-physics'
import { validCase } from './arbitraries'

// Facts with awkward values on purpose: nulls, strings that look like numbers, empty arrays.
const factValue = fc.oneof(
  fc.double({ noNaN: false }), fc.integer({ min: -5, max: 5 }), fc.boolean(), fc.constant(null),
  fc.constantFrom('', '0', '1', '2.5', 'external', 'noise', 'abc'),
  fc.constantFrom([], ['noise'], ['forces', 'noise'], [0], [1, 2]),
)
const facts = fc.record({ a: factValue, b: factValue, c: factValue, nested: fc.record({ x: factValue, y: factValue }) })
const varNames = fc.constantFrom('a', 'b', 'c', 'nested.x', 'nested.y', 'missing', 'nested.missing.deeper', 'a.b')

const operators = [...ALLOWED_OPERATIONS].filter(op => op !== 'var')

const { expression } = fc.letrec(tie => ({
  expression: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    factValue,
    fc.record({ var: varNames }),
    fc.record({ var: fc.tuple(varNames, factValue) }),
    fc.tuple(fc.constantFrom(...operators), fc.array(tie('expression'), { maxLength: 4 }))
      .map(([op, args]) => ({ [op]: args })),
    fc.tuple(fc.constantFrom('!', '!!', '-'), tie('expression')).map(([op, arg]) => ({ [op]: arg })),
  ),
}))

/** What a function returns or throws, comparable with toEqual (NaN included). */
function outcome(run: () => unknown) {
  try {
    return { value: run() }
  } catch (error) {
    return { threw: (error as Error).constructor.name }
  }
}

describe('compiled json-logic', () => {
  it('gives what json-logic-js gives on random expressions over the allowed operations and random facts', () => {
    fc.assert(fc.property(expression, facts, (logic, data) => {
      expect(outcome(() => compileLogic(logic)(data))).toEqual(outcome(() => jsonLogic.apply(logic as RulesLogic, data)))
    }), { numRuns: 3000 })
  }, 60_000)

  it('gives what json-logic-js gives for every expression of the built-in ruleset on the facts of random cases', () => {
    const expressions = RULESET.rules.flatMap(rule => [rule.when, ...Object.values(rule.effects.scores ?? {})])
    fc.assert(fc.property(validCase, (draft) => {
      // The facts the engine builds for the case, costs with each approach's default wall treatment.
      const input = caseInputSchema.parse(draft)
      const physics = flowPhysics(input)
      const flow = costCaseFor(input, physics)
      const treatments = defaultWallTreatments()
      const costs = Object.fromEntries(APPROACH_IDS.map(id => [id, approachCost(id, flow, treatments[id], input.budget)])) as Record<(typeof APPROACH_IDS)[number], ApproachCost>
      const data = withCostFacts(buildPhysicsFacts(input, physics), input.budget, costs)
      for (const logic of expressions) {
        expect(compileLogic(logic)(data)).toEqual(jsonLogic.apply(logic as RulesLogic, data))
      }
    }), { numRuns: 200 })
  }, 60_000)

  it('compiles a frozen expression once and interprets a mutable one, so a later edit is seen', () => {
    const mutable: { '>': unknown[] } = { '>': [{ var: 'a' }, 1] }
    expect(applyLogic(mutable, { a: 2 })).toBe(true)
    mutable['>'][1] = 5
    expect(applyLogic(mutable, { a: 2 })).toBe(false)
    const frozen = Object.freeze({ '<': Object.freeze([{ var: 'a' }, 1]) })
    expect(applyLogic(frozen, { a: 0 })).toBe(true)
    expect(applyLogic(frozen, { a: 3 })).toBe(false)
  })
})
