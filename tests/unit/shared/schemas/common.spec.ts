import { describe, expect, it } from 'vitest'
import { INT32_MAX, findUnstorableText, idParamSchema, isStorableText, passwordSchema, personNameSchema } from '#shared/schemas/common'

describe('isStorableText', () => {
  it('refuses a NUL and a lone surrogate, and keeps proper surrogate pairs', () => {
    expect(isStorableText('plain text, ü, 流体')).toBe(true)
    expect(isStorableText('a wave \u{1F30A}')).toBe(true)
    expect(isStorableText('a\u0000b')).toBe(false)
    expect(isStorableText('\ud800')).toBe(false)
    expect(isStorableText('x\udc00')).toBe(false)
    expect(isStorableText('\udc00\ud800')).toBe(false)
  })
})

describe('findUnstorableText', () => {
  it('gives the path of the first bad string, in values and keys', () => {
    expect(findUnstorableText({ a: [1, 'ok', { b: 'bad\u0000' }] })).toEqual(['a', 2, 'b'])
    expect(findUnstorableText({ a: { ['k\ud800']: 1 } })).toEqual(['a'])
    expect(findUnstorableText({ a: [1, 'ok'], b: null })).toBeUndefined()
  })

  it('walks a very deep body without exhausting the stack', () => {
    let deep: unknown = 'end\u0000'
    for (let i = 0; i < 100_000; i++) deep = [deep]
    expect(findUnstorableText(deep)).toHaveLength(100_000)
  })
})

describe('ids and text fields', () => {
  it('takes ids up to 2^31 - 1 and refuses beyond, 1e21 included', () => {
    expect(idParamSchema.parse({ id: String(INT32_MAX) }).id).toBe(2_147_483_647)
    for (const id of ['2147483648', '1e21', '0', '-3', '1.5', 'x']) expect(idParamSchema.safeParse({ id }).success, id).toBe(false)
  })

  it('refuses a NUL in a name and a password', () => {
    expect(personNameSchema.safeParse('Ada\u0000').success).toBe(false)
    expect(passwordSchema.safeParse('long-enough\u0000').success).toBe(false)
    expect(personNameSchema.parse('  Ada Ferreira ')).toBe('Ada Ferreira')
  })
})
