import { describe, expect, it } from 'vitest'
import { formatDateTime, formatDuration, formatPercent, formatQuantity, formatSci, formatSig } from '#shared/utils/format'

// Presentation rules of our own (common practice, no source): three significant figures,
// scientific notation for the very large and very small, units beside every value.
describe('formatSig', () => {
  it('rounds to significant figures', () => {
    expect(formatSig(3984239.654, 3)).toBe('3.98×10⁶')
    expect(formatSig(0.0870444, 3)).toBe('0.087')
    expect(formatSig(0.0870444, 4)).toBe('0.08704')
    expect(formatSig(2496.666)).toBe('2,500')
    expect(formatSig(9.7526)).toBe('9.75')
  })
  it('uses scientific notation below 1e-3', () => expect(formatSig(1.234e-5)).toBe('1.23×10⁻⁵'))
  it('shows a dash for a missing value and a minus sign for negatives', () => {
    expect(formatSig(undefined)).toBe('—')
    expect(formatSig(Number.NaN)).toBe('—')
    expect(formatSig(-12.34)).toBe('−12.3')
  })
})

describe('formatSci', () => {
  it('writes cells and core-hours with a superscript exponent', () => {
    expect(formatSci(22470000)).toBe('2.25×10⁷')
    expect(formatSci(495569.65)).toBe('4.96×10⁵')
    expect(formatSci(1000)).toBe('1×10³')
  })
  it('keeps small counts plain', () => {
    expect(formatSci(457.5)).toBe('458')
    expect(formatSci(4)).toBe('4')
  })
})

describe('formatQuantity and friends', () => {
  it('puts the unit beside the value', () => {
    expect(formatQuantity(0.01234, 'mm')).toBe('0.0123\u202fmm')
    expect(formatQuantity(undefined, 'mm')).toBe('—')
  })
  it('percent and durations', () => {
    expect(formatPercent(0.01)).toBe('1\u202f%')
    expect(formatDuration(9.7526)).toBe('9.75\u202fh')
    expect(formatDuration(1935.8)).toBe('80.7\u202fd')
  })
})

describe('formatDateTime', () => {
  it('writes UTC to the minute whatever the machine zone', () => {
    expect(formatDateTime('2026-12-01T22:38:12Z')).toBe('1 Dec 2026, 22:38 UTC')
    expect(formatDateTime(null)).toBe('—')
    expect(formatDateTime('not a date')).toBe('—')
  })
})
