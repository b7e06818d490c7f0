// Reading the decision record: one decision, its revisions and events, lists and the review queue.
import { and, asc, count, desc, eq, inArray, ne, sql, type SQL } from 'drizzle-orm'
import { enteredFromCaseInput, type EnteredCase } from '#shared/schemas/case-form'
import type { DecisionListQuery } from '#shared/schemas/decisions'
import type { SessionUser } from '#shared/types/session'
import type { UnitSystem } from '#shared/units'
import type { DbOrTx } from '../../db/types'
import { notFound } from '../http/errors'
import { decisionPermissions } from './policy'
import { tables, useDb } from '../db'

export function findDecision(id: number, db: DbOrTx = useDb()) {
  return db.query.decisions.findFirst({ where: eq(tables.decisions.id, id) })
}

// ---- reading

const revisions = tables.decisionRevisions
const decisions = tables.decisions
export const currentRevisionJoin = and(eq(revisions.decisionId, decisions.id), eq(revisions.revision, decisions.currentRevision))

/**
 * The reviewer who sent a draft back, when that is the last thing that happened to it (comments
 * aside): a draft with changes requested reads differently from a fresh one, its status stays draft.
 */
export const changesRequestedBy = sql<string | null>`(SELECT CASE WHEN e.type = 'changes_requested' THEN u.name END
  FROM decision_events e JOIN users u ON u.id = e.actor_id
  WHERE e.decision_id = ${decisions.id} AND e.type <> 'commented' ORDER BY e.seq DESC LIMIT 1)`

/** The typed values of a revision; revisions stored before they were kept are shown converted from SI. */
function enteredOf(r: { entered: EnteredCase | null; caseInput: typeof revisions.$inferSelect['caseInput']; unitSystem: UnitSystem }): EnteredCase {
  return r.entered ?? enteredFromCaseInput(r.caseInput, r.unitSystem)
}

export async function readDecision(id: number, db: DbOrTx = useDb()) {
  const [row] = await db.select({
    decision: decisions,
    revision: revisions,
    author: { id: tables.users.id, name: tables.users.name, email: tables.users.email },
    changesRequestedBy,
  }).from(decisions)
    .innerJoin(revisions, currentRevisionJoin)
    .innerJoin(tables.users, eq(tables.users.id, decisions.authorId))
    .where(eq(decisions.id, id))
  if (!row) throw notFound(`Decision ${id} does not exist`)
  const { decision: d, revision: r } = row
  return {
    id: d.id,
    projectId: d.projectId,
    title: d.title,
    status: d.status,
    version: d.version,
    revision: d.currentRevision,
    caseInput: r.caseInput,
    unitSystem: r.unitSystem,
    entered: enteredOf(r),
    requested: r.requested ?? null,
    advice: r.advice,
    notes: r.notes,
    author: row.author,
    changesRequestedBy: row.changesRequestedBy,
    override: d.override ?? null,
    supersedesId: d.supersedesId,
    supersededById: d.supersededById,
    createdAt: d.createdAt,
    updatedAt: d.updatedAt,
  }
}
export type DecisionDto = Awaited<ReturnType<typeof readDecision>>

// The approach a decision stands for: the reviewer's when overridden, else the engineer's own
// choice when they requested one, else the engine's; its model (the engine's for that approach
// unless the reviewer named one) and its core-hours (the recomputed cost of an override or a
// requested choice, else the engine's for that approach). Shared with the overview and the audit.
export const chosenApproach = sql<string>`coalesce(${decisions.override}->>'approach', ${revisions.requested}->'figures'->>'approach', ${revisions.advice}->'recommendation'->>'approach')`
const engineEntryOf = (field: string) => sql`(SELECT a->>${field} FROM jsonb_array_elements(${revisions.advice}->'approaches') a WHERE a->>'id' = ${chosenApproach} LIMIT 1)`
export const chosenModel = sql<string>`coalesce(${decisions.override}->>'model', ${engineEntryOf('model')}, ${revisions.advice}->'recommendation'->>'model')`
export const chosenCoreHours = sql<number | null>`(CASE
  WHEN ${decisions.override} IS NOT NULL THEN coalesce((${decisions.override}->'cost'->>'coreHours')::float8, ${engineEntryOf('coreHours')}::float8)
  WHEN ${revisions.requested} IS NOT NULL THEN (${revisions.requested}->'figures'->'cost'->>'coreHours')::float8
  ELSE ${engineEntryOf('coreHours')}::float8 END)`
export const budgetCoreHours = sql<number>`(${revisions.caseInput}->'budget'->>'coreHours')::float8`

export function summaryQuery<Extra extends Record<string, SQL.Aliased | SQL> = Record<never, never>>(extra: Extra = {} as Extra) {
  return useDb().select({
    ...extra,
    id: decisions.id,
    projectId: decisions.projectId,
    title: decisions.title,
    status: decisions.status,
    version: decisions.version,
    revision: decisions.currentRevision,
    authorId: tables.users.id,
    authorName: tables.users.name,
    approach: chosenApproach,
    model: chosenModel,
    reynolds: sql<number>`(${revisions.advice}->>'reynolds')::float8`.mapWith(Number),
    coreHours: chosenCoreHours.mapWith(Number),
    budgetCoreHours: budgetCoreHours.mapWith(Number),
    unitSystem: decisions.unitSystem,
    changesRequestedBy,
    updatedAt: decisions.updatedAt,
    createdAt: decisions.createdAt,
  }).from(decisions)
    .innerJoin(revisions, currentRevisionJoin)
    .innerJoin(tables.users, eq(tables.users.id, decisions.authorId))
}

export function toSummary<T extends { authorId: number; authorName: string }>({ authorId, authorName, ...rest }: T) {
  return { ...rest, author: { id: authorId, name: authorName } }
}

export async function listProjectDecisions(projectId: number, query: DecisionListQuery) {
  const where = and(eq(decisions.projectId, projectId), query.status ? eq(decisions.status, query.status) : undefined)
  const [rows, [totals]] = await Promise.all([
    summaryQuery().where(where).orderBy(desc(decisions.updatedAt), desc(decisions.id))
      .limit(query.pageSize).offset((query.page - 1) * query.pageSize),
    useDb().select({ total: count() }).from(decisions).where(where),
  ])
  return { decisions: rows.map(toSummary), page: query.page, pageSize: query.pageSize, total: totals?.total ?? 0 }
}

/** Decisions waiting for this reviewer: in review, in their projects, not their own; oldest submission first. */
export async function reviewQueueFor(user: SessionUser) {
  const submittedAt = sql<Date>`(SELECT max(e.created_at) FROM decision_events e WHERE e.decision_id = ${decisions.id} AND e.type = 'submitted')`
    .mapWith(tables.decisionEvents.createdAt)
  const mine = useDb().select({ id: tables.projectMembers.projectId }).from(tables.projectMembers)
    .where(eq(tables.projectMembers.userId, user.id))
  const rows = await summaryQuery({ submittedAt }).where(and(
    eq(decisions.status, 'in_review'),
    inArray(decisions.projectId, mine),
    ne(decisions.authorId, user.id),
  )).orderBy(asc(submittedAt), asc(decisions.id))
  return rows.map(toSummary)
}

export async function listEvents(decisionId: number, db: DbOrTx = useDb()) {
  const e = tables.decisionEvents
  const rows = await db.select({
    id: e.id, seq: e.seq, type: e.type, actorId: tables.users.id, actorName: tables.users.name, actorRole: e.actorRole,
    payload: e.payload, createdAt: e.createdAt, hash: e.hash, prevHash: e.prevHash,
  }).from(e).innerJoin(tables.users, eq(tables.users.id, e.actorId))
    .where(eq(e.decisionId, decisionId)).orderBy(asc(e.seq))
  return rows.map(({ actorId, actorName, ...rest }) => ({ ...rest, actor: { id: actorId, name: actorName } }))
}

export async function listRevisions(decisionId: number) {
  const rows = await useDb().select({
    revision: revisions.revision, createdAt: revisions.createdAt, inputHash: revisions.inputHash, notes: revisions.notes,
    createdById: tables.users.id, createdByName: tables.users.name,
  }).from(revisions).innerJoin(tables.users, eq(tables.users.id, revisions.createdBy))
    .where(eq(revisions.decisionId, decisionId)).orderBy(asc(revisions.revision))
  return rows.map(({ createdById, createdByName, ...rest }) => ({ ...rest, createdBy: { id: createdById, name: createdByName } }))
}

export async function readRevision(decisionId: number, n: number) {
  const [row] = await useDb().select({ revision: revisions, createdById: tables.users.id, createdByName: tables.users.name })
    .from(revisions).innerJoin(tables.users, eq(tables.users.id, revisions.createdBy))
    .where(and(eq(revisions.decisionId, decisionId), eq(revisions.revision, n)))
  if (!row) throw notFound(`Decision ${decisionId} has no revision ${n}`)
  const r = row.revision
  return {
    revision: r.revision,
    caseInput: r.caseInput,
    unitSystem: r.unitSystem,
    entered: enteredOf(r),
    requested: r.requested ?? null,
    advice: r.advice,
    notes: r.notes,
    inputHash: r.inputHash,
    rulesetId: r.rulesetId,
    rulesetVersion: r.rulesetVersion,
    engineVersion: r.engineVersion,
    createdAt: r.createdAt,
    createdBy: { id: row.createdById, name: row.createdByName },
  }
}

/** The project line above a decision: id, code and name (the row exists: a foreign key). */
export async function projectHeading(projectId: number) {
  const project = await useDb().query.projects.findFirst({
    where: eq(tables.projects.id, projectId), columns: { id: true, code: true, name: true },
  })
  return project!
}

/** Everything the decision page shows, with what the signed-in user may do. */
export async function decisionDetail(decisionId: number, user: SessionUser, isMember: boolean) {
  const decision = await readDecision(decisionId)
  const [project, revisionList, events] = await Promise.all([
    projectHeading(decision.projectId),
    listRevisions(decisionId),
    listEvents(decisionId),
  ])
  return {
    decision,
    project: project!,
    revisions: revisionList,
    events,
    permissions: decisionPermissions(user, { authorId: decision.author.id, status: decision.status }, isMember),
  }
}

