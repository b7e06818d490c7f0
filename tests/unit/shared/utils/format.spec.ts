import { describe, expect, it } from 'vitest'
import {
  FIGURES, formatDateTime, formatDuration, formatEstimate, formatInput, formatNumber, formatPercent, formatPlain, formatQuantity, formatSci, formatSig,
} from '#shared/utils/format'

// Presentation rules of our own (common practice, no source): one notation for every figure,
// significant figures by how well a number is known, a unit beside every value.
describe('one rule for every figure', () => {
  it('the same value reads the same whichever function writes it', () => {
    // 250,000 was "2.5e5", "2.51×10⁵" and "250,000" on different screens before.
    expect(formatNumber(251234)).toBe('2.51×10⁵')
    expect(formatSig(251234)).toBe('2.51×10⁵')
    expect(formatSci(251234)).toBe('2.51×10⁵')
    expect(formatEstimate(251234)).toBe('2.5×10⁵')
  })
  it('plain digits with thousands separators below 100,000', () => {
    expect(formatNumber(2496.666)).toBe('2,500')
    expect(formatNumber(25100, 2)).toBe('25,000')
    expect(formatNumber(1000)).toBe('1,000')
    expect(formatNumber(99_999.6)).toBe('1×10⁵') // rounds up into the scientific range
    expect(formatNumber(9.7526)).toBe('9.75')
    expect(formatNumber(0.0870444)).toBe('0.087')
    expect(formatNumber(0.0870444, 4)).toBe('0.08704')
  })
  it('scientific notation below 0.001 and from 100,000, with a superscript power of ten', () => {
    expect(formatNumber(3984239.654)).toBe('3.98×10⁶')
    expect(formatNumber(1.234e-5)).toBe('1.23×10⁻⁵')
    expect(formatNumber(22470000)).toBe('2.25×10⁷')
  })
  it('a dash for a missing value, a minus sign for negatives', () => {
    expect(formatNumber(undefined)).toBe('—')
    expect(formatNumber(Number.NaN)).toBe('—')
    expect(formatNumber(-12.34)).toBe('−12.3')
    expect(formatNumber(0)).toBe('0')
  })
})

describe('significant figures by what a number is', () => {
  it('inputs keep what was typed, estimates two figures, derived figures three', () => {
    expect(FIGURES).toEqual({ input: 6, derived: 3, estimate: 2 })
    expect(formatInput(101.325)).toBe('101.325')
    expect(formatInput(14.69594878)).toBe('14.6959')
    expect(formatEstimate(1935.8)).toBe('1,900')
  })
})

describe('units, percentages and durations', () => {
  it('puts the unit beside the value after a narrow no-break space', () => {
    expect(formatQuantity(0.01234, 'mm')).toBe('0.0123\u202fmm')
    expect(formatQuantity(undefined, 'mm')).toBe('—')
  })
  it('a percentage from a fraction', () => expect(formatPercent(0.01)).toBe('1\u202f%'))
  it('wall-clock in hours everywhere, as the budget is given', () => {
    expect(formatDuration(9.7526)).toBe('9.8\u202fh')
    expect(formatDuration(1935.8)).toBe('1,900\u202fh')
  })
  it('CSV gets machine-readable numbers', () => {
    expect(formatPlain(251234.5, 3)).toBe('251000')
    expect(formatPlain(undefined)).toBe('')
    expect(formatPlain(1.5e-7)).toBe('1.5e-7')
  })
})

describe('formatDateTime', () => {
  it('writes UTC to the minute whatever the machine zone', () => {
    expect(formatDateTime('2026-12-01T22:38:12Z')).toBe('1 Dec 2026, 22:38 UTC')
    expect(formatDateTime(null)).toBe('—')
    expect(formatDateTime('not a date')).toBe('—')
  })
})
