import { describe, expect, it } from 'vitest'
import { decodeCursor, encodeCursor, pageQuerySchema } from '#shared/schemas/pagination'

describe('keyset cursors', () => {
  it('give back the time and id they were made from, in URL-safe text', () => {
    const cursor = { at: new Date('2026-03-01T12:34:56.789Z'), id: 123456 }
    const text = encodeCursor(cursor)
    expect(text).toMatch(/^[A-Za-z0-9_-]+$/)
    expect(decodeCursor(text)).toEqual(cursor)
  })

  it.each(['', 'abc', encodeCursor({ at: new Date(0), id: 1 }).slice(0, -3), btoa('2026-03-01T12:34:56.789Z|-1'), btoa('yesterday|5'), btoa('2026-03-01|5')])(
    'refuse text no server gave: %j', (text) => {
      expect(decodeCursor(text)).toBeNull()
    })

  it('validate ?cursor=&limit= with messages, a blank cursor meaning the first page', () => {
    const schema = pageQuerySchema(50, 20)
    expect(schema.parse({})).toEqual({ cursor: undefined, limit: 20 })
    expect(schema.parse({ cursor: '', limit: '7' })).toEqual({ cursor: undefined, limit: 7 })
    const at = new Date('2026-01-02T03:04:05.006Z')
    expect(schema.parse({ cursor: encodeCursor({ at, id: 9 }) }).cursor).toEqual({ at, id: 9 })
    const bad = schema.safeParse({ cursor: 'nonsense', limit: '51' })
    expect(bad.success).toBe(false)
    const messages = bad.error!.flatten().fieldErrors
    expect(messages.cursor![0]).toMatch(/not one this server gave/)
    expect(messages.limit![0]).toMatch(/at most 50/)
  })
})
