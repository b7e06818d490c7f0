// Lists of decisions from their summaries (decision_summaries): a project's decisions and the
// review queue, a keyset page at a time, each served by an index in its order.
import { and, asc, desc, eq, ne, sql, type SQL } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import type { DecisionListQuery } from '#shared/schemas/decisions'
import type { ReviewQueueQuery } from '#shared/schemas/review'
import type { SessionUser } from '#shared/types/session'
import type { DbOrTx } from '../../db/types'
import { afterCursor, countRows, keysetPage } from '../pagination/keyset'
import { tables, useDb } from '../db'

const s = tables.decisionSummaries
const author = alias(tables.users, 'author')
const reviewer = alias(tables.users, 'reviewer')
const sentBackBy = alias(tables.users, 'sent_back_by')

/** A decision as lists show it: the summary's typed figures, with author and reviewer by name. */
export function summaryRows(db: DbOrTx = useDb()) {
  return db.select({
    id: s.decisionId,
    projectId: s.projectId,
    projectCode: tables.projects.code,
    title: s.title,
    status: s.status,
    version: s.version,
    revision: s.revision,
    unitSystem: s.unitSystem,
    authorId: s.authorId,
    authorName: author.name,
    reviewerId: s.reviewerId,
    reviewerName: reviewer.name,
    // Quoted: a field of the list, which the import check would take for queries.ts's changesRequestedBy.
    'changesRequestedBy': sentBackBy.name,
    approach: s.approach,
    model: s.model,
    wallTreatment: s.wallTreatment,
    engineApproach: s.engineApproach,
    overridden: s.overridden,
    overrideReason: s.overrideReason,
    reynolds: s.reynolds,
    coreHours: s.coreHours,
    budgetCoreHours: s.budgetCoreHours,
    rulesetVersion: s.rulesetVersion,
    engineVersion: s.engineVersion,
    createdAt: s.createdAt,
    updatedAt: s.updatedAt,
    submittedAt: s.submittedAt,
    reviewedAt: s.reviewedAt,
  }).from(s)
    .innerJoin(tables.projects, eq(tables.projects.id, s.projectId))
    .innerJoin(author, eq(author.id, s.authorId))
    .leftJoin(reviewer, eq(reviewer.id, s.reviewerId))
    .leftJoin(sentBackBy, eq(sentBackBy.id, s.changesRequestedBy))
    .$dynamic()
}

export function toSummary<T extends { authorId: number; authorName: string; reviewerId: number | null; reviewerName: string | null }>(
  { authorId, authorName, reviewerId, reviewerName, ...rest }: T,
) {
  return { ...rest, author: { id: authorId, name: authorName }, reviewer: reviewerId ? { id: reviewerId, name: reviewerName! } : null }
}

/**
 * The filtered rows, for counting: in the list's own order, so that counting up to the cap walks
 * the list's index (a sequential scan might look cheaper to the planner for a common filter).
 */
export function filteredSummaries(where: SQL | undefined, order: SQL[]) {
  return useDb().select({ one: sql`1` }).from(s).where(where).orderBy(...order)
}

export const LATEST_ACTIVITY = [desc(s.updatedAt), desc(s.decisionId)]
const LONGEST_WAITING = [asc(s.submittedAt), asc(s.decisionId)]

/** A project's decisions, the latest activity first. */
export async function listProjectDecisions(projectId: number, query: DecisionListQuery) {
  const where = and(eq(s.projectId, projectId), query.status ? eq(s.status, query.status) : undefined)
  const [rows, totals] = await Promise.all([
    summaryRows().where(and(where, afterCursor(s.updatedAt, s.decisionId, query.cursor, 'desc')))
      .orderBy(...LATEST_ACTIVITY).limit(query.limit + 1),
    countRows(useDb(), filteredSummaries(where, LATEST_ACTIVITY)),
  ])
  const page = keysetPage(rows, query.limit, row => ({ at: row.updatedAt, id: row.id }))
  return { ...page, items: page.items.map(toSummary), ...totals }
}

/** Decisions waiting for this reviewer: in review, in their projects, not their own; the longest-waiting first. */
export async function reviewQueueFor(user: SessionUser, query: ReviewQueueQuery) {
  const mine = sql`${s.projectId} IN (SELECT project_id FROM project_members WHERE user_id = ${user.id})`
  const where = and(eq(s.status, 'in_review'), mine, ne(s.authorId, user.id))
  // Every decision in review has been submitted; the id breaks ties of the same instant.
  const [rows, totals] = await Promise.all([
    summaryRows().where(and(where, afterCursor(s.submittedAt, s.decisionId, query.cursor, 'asc')))
      .orderBy(...LONGEST_WAITING).limit(query.limit + 1),
    countRows(useDb(), filteredSummaries(where, LONGEST_WAITING)),
  ])
  const page = keysetPage(rows, query.limit, row => ({ at: row.submittedAt ?? row.updatedAt, id: row.id }))
  return { ...page, items: page.items.map(toSummary), ...totals }
}
