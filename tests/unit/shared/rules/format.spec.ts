import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { formatNumber, formatScoreChange } from '../../../../shared/rules/format'

describe('formatNumber', () => {
  it.each([
    [0, '0'],
    [1, '1'],
    [0.5, '0.5'],
    [3.04567, '3.05'],
    [23.44, '23.4'],
    [195.2, '195'],
    [999.6, '1000'],
    [2000, '2,000'],
    [12345.6, '12,346'],
    [99999, '99,999'],
    [1e5, '1e5'],
    [3.2e9, '3.2e9'],
    [3.25e9, '3.3e9'],
    [9.96e6, '1e7'],
    [1.17e7, '1.2e7'],
    [4.2e-4, '4.2e-4'],
    [-1.5e6, '-1.5e6'],
    [Number.MAX_VALUE, '1.8e308'],
  ])('writes %d as %s', (value, text) => {
    expect(formatNumber(value)).toBe(text)
  })

  it('keeps three significant figures in the plain range and agrees with toPrecision (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 999.4, noNaN: true }), (value) => {
        expect(Number(formatNumber(value))).toBeCloseTo(Number(value.toPrecision(3)), 12)
      }),
      { numRuns: 300 },
    )
  })

  it('signs score changes', () => {
    expect(formatScoreChange(25)).toBe('+25')
    expect(formatScoreChange(-10)).toBe('-10')
  })
})
