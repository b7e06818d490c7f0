import { describe, expect, it } from 'vitest'
import { parseNumber } from '#shared/format/parse'

// Strict reading of typed numbers (our own rules, common practice, no source).
describe('parseNumber', () => {
  it('reads decimals and exponents', () => {
    for (const [text, value] of [['12', 12], ['0.5', 0.5], ['.5', 0.5], ['1e5', 1e5], ['2.5E-3', 2.5e-3], ['-4', -4], [' 7 ', 7], ['\u22123', -3]] as const) {
      expect(parseNumber(text)).toEqual({ ok: true, value })
    }
  })
  it('empty is "not given", never zero', () => expect(parseNumber('  ')).toEqual({ ok: true, value: undefined }))
  it('refuses what Number() would read as something else', () => {
    const refused = (text: string) => {
      const result = parseNumber(text)
      expect(result.ok, text).toBe(false)
      return result.ok ? '' : result.message
    }
    expect(refused('0x10')).toMatch(/hexadecimal/) // Number('0x10') is 16
    expect(refused('1 000')).toBe('Enter the digits without separators: 1000.')
    expect(refused('20,000')).toBe('Enter the digits without separators: 20000.')
    expect(refused('1_000')).toBe('Enter the digits without separators: 1000.')
    expect(refused('1,5')).toBe('Use a point for decimals: 1.5.')
    expect(refused('12 m/s')).toMatch(/Enter a number/)
    expect(refused('Infinity')).toMatch(/Enter a number/)
    expect(refused('1e999')).toMatch(/too large/)
  })
  it('a whole number where one is needed', () => {
    expect(parseNumber('12', { integer: true })).toEqual({ ok: true, value: 12 })
    expect(parseNumber('1.5', { integer: true }).ok).toBe(false)
  })
})
