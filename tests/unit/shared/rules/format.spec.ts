import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { formatEstimate, formatNumber, formatScoreChange, roundToBand } from '#shared/rules/format'

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

describe('estimates rounded to their band (our convention, no source)', () => {
  it('keeps one significant figure when uncertain by a factor of 3 or more, two otherwise', () => {
    expect(roundToBand(4.87e6, 4.9)).toBe(5e6)
    expect(roundToBand(4.87e6, 2)).toBeCloseTo(4.9e6, 0)
    expect(roundToBand(1234, 3)).toBe(1000)
    expect(roundToBand(0, 3)).toBe(0)
  })

  it('writes the value with its range', () => {
    expect(formatEstimate(4.87e6, { low: 1e6, high: 2.4e7 }, 4.9)).toBe('about 5e6 (1e6 to 2e7)')
    expect(formatEstimate(1234, { low: 617, high: 2468 }, 2)).toBe('about 1,200 (620 to 2,500)')
  })
})
