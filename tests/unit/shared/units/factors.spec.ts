// The questionnaire's conversion factors against an independent reference: mathjs's own unit
// definitions (mathjs 15; knot and poise defined here as NIST SP 811 B.8 gives them), for every
// unit of the catalogue.
import { create, createUnitDependencies, unitDependencies } from 'mathjs'
import { describe, expect, it } from 'vitest'
import { QUANTITY_KINDS, UNIT_CATALOGUE } from '#shared/units/catalogue'
import { fromSI, toSI } from '#shared/units/convert'

const math = create({ unitDependencies: unitDependencies!, createUnitDependencies: createUnitDependencies! })
math.createUnit('nauticalMile', { definition: '1852 m' })
math.createUnit('knot', { definition: '1 nauticalMile/hour' })
math.createUnit('poise', { definition: '0.1 Pa s', prefixes: 'long' })
math.createUnit('P', { definition: '1 poise', prefixes: 'short' })

// mathjs's psi (6894.75729276459 Pa) is rounded at the eleventh figure; ours is the exact
// lbf/in² (0.45359237 kg × 9.80665 m/s² / 0.0254² m²), hence a part in 1e9.
const close = (actual: number, expected: number) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(Math.abs(expected) * 1e-9 + 1e-300)

describe('unit factors', () => {
  for (const kind of QUANTITY_KINDS) {
    const { si, units } = UNIT_CATALOGUE[kind]
    for (const unit of units) {
      it(`${kind}: ${unit.id} to and from ${si} as mathjs converts it`, () => {
        for (const value of [-40, 0.5, 12.5, 1234]) {
          close(toSI(kind, value, unit.id), math.unit(value, unit.expr).toNumber(si))
          close(fromSI(kind, value, unit.id), math.unit(value, si).toNumber(unit.expr))
        }
      })
    }
  }
})
