// Keyset pages and their totals. A page is "the next `limit` rows after the cursor" in an index's
// order, so any depth costs one index range scan; the total is exact up to a cap and the planner's
// estimate beyond it, where counting every row would cost more than the page itself.
import { sql, type SQL, type SQLWrapper } from 'drizzle-orm'
import { encodeCursor, type Page, type PageCursor } from '#shared/schemas/pagination'
import type { DbOrTx } from '../../db/types'

// Beyond this many rows a total is estimated.
export const EXACT_COUNT_CAP = 1000

/** `(time, id)` strictly after the cursor in the list's direction: a condition an index (time, id) serves. */
export function afterCursor(time: SQLWrapper, id: SQLWrapper, cursor: PageCursor | undefined, direction: 'asc' | 'desc'): SQL | undefined {
  if (!cursor) return undefined
  const at = cursor.at.toISOString()
  return direction === 'desc'
    ? sql`(${time}, ${id}) < (${at}::timestamptz, ${cursor.id})`
    : sql`(${time}, ${id}) > (${at}::timestamptz, ${cursor.id})`
}

/** The page of rows fetched with `limit + 1` (the extra row says whether another page follows). */
export function keysetPage<Row>(rows: Row[], limit: number, key: (row: Row) => PageCursor) {
  const more = rows.length > limit
  const items = more ? rows.slice(0, limit) : rows
  return { items, nextCursor: more ? encodeCursor(key(items.at(-1)!)) : null }
}

/**
 * How many rows `selection` (a query selecting the filtered rows, no order or limit) gives; past the
 * cap, the planner's estimate for `estimated` (the same rows, when `selection` is capped in parts).
 */
export async function countRows(db: DbOrTx, selection: SQLWrapper, cap = EXACT_COUNT_CAP, estimated: SQLWrapper = selection): Promise<Pick<Page<never>, 'total' | 'totalIsEstimate'>> {
  const { rows } = await db.execute<{ n: number }>(sql`SELECT count(*)::int AS n FROM (${selection} LIMIT ${cap + 1}) AS counted`)
  const exact = rows[0]!.n
  if (exact <= cap) return { total: exact, totalIsEstimate: false }
  const { rows: plan } = await db.execute<{ 'QUERY PLAN': [{ Plan: { 'Plan Rows': number } }] }>(sql`EXPLAIN (FORMAT JSON) ${estimated}`)
  const estimate = Math.round(plan[0]!['QUERY PLAN'][0].Plan['Plan Rows'])
  return { total: Math.max(estimate, cap + 1), totalIsEstimate: true }
}
