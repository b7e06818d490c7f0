// Walks a keyset list (?cursor=&limit= -> { items, nextCursor, total, totalIsEstimate }) through
// the real route, page after page, checking the contract on the way.
import { expect } from 'vitest'
import type { ApiClient } from './api-client'

export type KeysetPage<T> = { items: T[]; nextCursor: string | null; total: number; totalIsEstimate: boolean }

/** Every row of the list at `path` (its own query included), in the list's order. */
export async function allPages<T = any>(client: ApiClient, path: string, limit = 50): Promise<{ rows: T[]; first: KeysetPage<T> }> {
  const rows: T[] = []
  let first: KeysetPage<T> | undefined
  let cursor: string | null = null
  const join = path.includes('?') ? '&' : '?'
  do {
    const res = await client.get(`${path}${join}limit=${limit}${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ''}`)
    expect(res.status, `${path}: ${JSON.stringify(res.body)}`).toBe(200)
    const page = res.body as KeysetPage<T>
    expect(page.items.length).toBeLessThanOrEqual(limit)
    if (page.nextCursor) expect(page.items).toHaveLength(limit)
    first ??= page
    rows.push(...page.items)
    cursor = page.nextCursor
  } while (cursor)
  return { rows, first: first! }
}
