import { describe, expect, it } from 'vitest'
import { auditFilterSchema } from '#shared/schemas/audit'
import { isAuditSearch } from '#shared/utils/audit-search'

describe('the audit search', () => {
  // Ten digits is past any decision number: it is searched as text, like any three characters.
  it.each(['7', '#7', '123', '#123456789', '1234567890', 'riser', 'Lindqvist', 'K-1'])('runs %s', (q) => {
    expect(isAuditSearch(q)).toBe(true)
    expect(auditFilterSchema.parse({ q }).q).toBe(q)
  })

  it.each(['a', 'ab', '#', '#a'])('holds back %s, and the query says why', (q) => {
    expect(isAuditSearch(q)).toBe(false)
    const parsed = auditFilterSchema.safeParse({ q })
    expect(parsed.success).toBe(false)
    expect(parsed.error?.issues[0]?.message).toMatch(/decision number or at least 3 characters/)
  })

  it('leaves an empty search out, and trims before it judges', () => {
    expect(auditFilterSchema.parse({ q: '   ' }).q).toBeUndefined()
    expect(auditFilterSchema.parse({ q: '  #7 ' }).q).toBe('#7')
    expect(auditFilterSchema.safeParse({ q: ' ab ' }).success).toBe(false)
  })
})
