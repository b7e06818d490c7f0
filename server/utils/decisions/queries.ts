// Reading the decision record: one decision, its revisions and events (lists: lists.ts).
import { and, asc, eq, sql } from 'drizzle-orm'
import { enteredFromCaseInput, type EnteredCase } from '#shared/schemas/case-form'
import type { SessionUser } from '#shared/types/session'
import type { UnitSystem } from '#shared/units'
import type { DbOrTx } from '../../db/types'
import { notFound } from '../http/errors'
import { decisionPermissions } from './policy'
import { tables, useDb } from '../db'

export function findDecision(id: number, db: DbOrTx = useDb()) {
  return db.query.decisions.findFirst({ where: eq(tables.decisions.id, id) })
}

/**
 * The decision row and whether `userId` is a member of its project, in one query (the guards' read).
 * The outer column is written out: drizzle leaves a lone table's columns unqualified, which inside
 * the subquery would name the member row's own project_id.
 */
export async function findDecisionForMember(id: number, userId: number) {
  const [row] = await useDb().select({
    decision: tables.decisions,
    isMember: sql<boolean>`EXISTS (SELECT 1 FROM project_members m WHERE m.project_id = "decisions"."project_id" AND m.user_id = ${userId})`,
  }).from(tables.decisions).where(eq(tables.decisions.id, id))
  return row
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
  return decisionDto(row)
}

function decisionDto({ decision: d, revision: r, author, changesRequestedBy }: {
  decision: typeof decisions.$inferSelect
  revision: typeof revisions.$inferSelect
  author: { id: number; name: string; email: string }
  changesRequestedBy: string | null
}) {
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
    author,
    changesRequestedBy,
    override: d.override ?? null,
    supersedesId: d.supersedesId,
    supersededById: d.supersededById,
    createdAt: d.createdAt,
    updatedAt: d.updatedAt,
  }
}
export type DecisionDto = Awaited<ReturnType<typeof readDecision>>

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

/**
 * What the decision page shows first, in one query: the decision, its current revision, author and
 * project, and whether `userId` is a member of the project (for the guard). 404 when it does not exist.
 */
export async function readDecisionForReader(id: number, userId: number, db: DbOrTx = useDb()) {
  const [row] = await db.select({
    decision: decisions,
    revision: revisions,
    author: { id: tables.users.id, name: tables.users.name, email: tables.users.email },
    changesRequestedBy,
    project: { id: tables.projects.id, code: tables.projects.code, name: tables.projects.name },
    isMember: sql<boolean>`EXISTS (SELECT 1 FROM project_members m WHERE m.project_id = "decisions"."project_id" AND m.user_id = ${userId})`,
  }).from(decisions)
    .innerJoin(revisions, currentRevisionJoin)
    .innerJoin(tables.users, eq(tables.users.id, decisions.authorId))
    .innerJoin(tables.projects, eq(tables.projects.id, decisions.projectId))
    .where(eq(decisions.id, id))
  if (!row) throw notFound(`Decision ${id} does not exist`)
  return { decision: decisionDto(row), project: row.project, isMember: row.isMember }
}

type HistoryRow = {
  calibrationInForce: number | null
  events: (Omit<Awaited<ReturnType<typeof listEvents>>[number], 'createdAt'> & { createdAt: string })[]
  revisions: (Omit<Awaited<ReturnType<typeof listRevisions>>[number], 'createdAt'> & { createdAt: string })[]
}

/**
 * A decision's events and revisions (with who made them), in one query; with the version of the
 * team calibration in force, so the page's calibrated estimate needs no query of its own.
 */
export async function readHistory(decisionId: number, db: DbOrTx = useDb()) {
  const { rows } = await db.execute<HistoryRow>(sql`SELECT
    (SELECT max(version) FROM calibration_adoptions) AS "calibrationInForce",
    (SELECT coalesce(json_agg(json_build_object(
        'id', e.id, 'seq', e.seq, 'type', e.type, 'actorRole', e.actor_role, 'payload', e.payload,
        'createdAt', e.created_at, 'hash', e.hash, 'prevHash', e.prev_hash, 'actor', json_build_object('id', u.id, 'name', u.name)
      ) ORDER BY e.seq), '[]'::json)
      FROM decision_events e JOIN users u ON u.id = e.actor_id WHERE e.decision_id = ${decisionId}) AS events,
    (SELECT coalesce(json_agg(json_build_object(
        'revision', r.revision, 'createdAt', r.created_at, 'inputHash', r.input_hash, 'notes', r.notes,
        'createdBy', json_build_object('id', u.id, 'name', u.name)
      ) ORDER BY r.revision), '[]'::json)
      FROM decision_revisions r JOIN users u ON u.id = r.created_by WHERE r.decision_id = ${decisionId}) AS revisions`)
  const history = rows[0]!
  return {
    calibrationInForce: history.calibrationInForce,
    events: history.events.map(e => ({ ...e, id: Number(e.id), createdAt: new Date(e.createdAt) })),
    revisions: history.revisions.map(r => ({ ...r, createdAt: new Date(r.createdAt) })),
  }
}

/**
 * Everything the decision page shows, with what the signed-in user may do: the guard's read plus
 * one query; and the calibration version in force, for the calibrated estimate beside the advice.
 */
export async function decisionDetail(found: Awaited<ReturnType<typeof readDecisionForReader>>, user: SessionUser) {
  const { events, revisions: revisionList, calibrationInForce } = await readHistory(found.decision.id)
  return {
    calibrationInForce,
    detail: {
      decision: found.decision,
      project: found.project,
      revisions: revisionList,
      events,
      permissions: decisionPermissions(user, { authorId: found.decision.author.id, status: found.decision.status }, found.isMember),
    },
  }
}
