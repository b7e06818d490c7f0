// The QA audit of the decision record: every decision across projects with its history and the
// check of its hash chain, a keyset page at a time, filtered and searched from the summaries.
import { and, eq, ilike, or, sql, type SQL } from 'drizzle-orm'
import type { AuditFilter, AuditListQuery } from '#shared/schemas/audit'
import { AUDIT_MIN_TEXT_SEARCH, DECISION_NUMBER_SEARCH } from '#shared/utils/audit-search'
import type { DbOrTx } from '../../db/types'
import { LATEST_ACTIVITY, filteredSummaries, summaryRows, toSummary } from '../decisions/lists'
import { EXACT_COUNT_CAP, afterCursor, countRows, keysetPage } from '../pagination/keyset'
import { tables, useDb } from '../db'
import { chainFacts } from './chains'

const s = tables.decisionSummaries

// Trigram indexes serve substrings of three characters or more.

/**
 * A decision number (#123 or 123), or words of the title or of the author's name: the ways a row can
 * match, each served by an index of its own (none: nothing matches).
 */
async function searchAlternatives(q: string): Promise<SQL[]> {
  const number = DECISION_NUMBER_SEARCH.exec(q)
  if (q.length < AUDIT_MIN_TEXT_SEARCH) return number ? [eq(s.decisionId, Number(number[1]))] : []
  const pattern = `%${q.replace(/[\\%_]/g, c => `\\${c}`)}%`
  // Authors first (a short table), so the search is an index lookup per part.
  const authors = await useDb().select({ id: tables.users.id }).from(tables.users).where(ilike(tables.users.name, pattern))
  return [
    ...(number ? [eq(s.decisionId, Number(number[1]))] : []),
    ilike(s.title, pattern),
    ...(authors.length ? [sql`${s.authorId} = ANY(${`{${authors.map(a => a.id).join(',')}}`}::int[])`] : []),
  ]
}

type AuditConditions = { filters: SQL | undefined; alternatives?: SQL[] }

async function auditConditions(filter: AuditFilter): Promise<AuditConditions> {
  return {
    filters: and(
      filter.projectId ? eq(s.projectId, filter.projectId) : undefined,
      filter.status ? eq(s.status, filter.status) : undefined,
    ),
    alternatives: filter.q ? await searchAlternatives(filter.q) : undefined,
  }
}

const whereOf = ({ filters, alternatives }: AuditConditions) =>
  and(filters, alternatives && (alternatives.length ? or(...alternatives) : sql`false`))

export async function auditWhere(filter: AuditFilter) {
  return whereOf(await auditConditions(filter))
}

/**
 * What the count of a search walks (undefined: the filtered rows themselves). A search counted in
 * the list's order tests every row's title until the cap (an author's thousand decisions meant some
 * 20,000 titles); counted as a union of its alternatives, each part is an index lookup, capped on
 * its own (a union of capped parts reaches the cap exactly when the whole would).
 */
function searchCountedInParts({ filters, alternatives }: AuditConditions) {
  if (!alternatives || alternatives.length < 2) return undefined
  const part = (alternative: SQL) => useDb().select({ id: s.decisionId }).from(s).where(and(filters, alternative)).limit(EXACT_COUNT_CAP + 1)
  return sql.join(alternatives.map(alternative => sql`(${part(alternative)})`), sql` UNION `)
}

/** The rows of the audit in its order (latest activity first), for a page or the export. */
export function auditRows(where: SQL | undefined, db: DbOrTx = useDb()) {
  return summaryRows(db).where(where).orderBy(...LATEST_ACTIVITY)
}

export async function listAuditDecisions(query: AuditListQuery) {
  const conditions = await auditConditions(query)
  const where = whereOf(conditions)
  const filtered = filteredSummaries(where, LATEST_ACTIVITY)
  const [rows, totals] = await Promise.all([
    auditRows(and(where, afterCursor(s.updatedAt, s.decisionId, query.cursor, 'desc'))).limit(query.limit + 1),
    countRows(useDb(), searchCountedInParts(conditions) ?? filtered, EXACT_COUNT_CAP, filtered),
  ])
  const page = keysetPage(rows, query.limit, row => ({ at: row.updatedAt, id: row.id }))
  const facts = await chainFacts(useDb(), page.items.map(r => r.id))
  return { ...page, items: page.items.map(row => ({ ...toSummary(row), ...facts.get(row.id)! })), ...totals }
}
