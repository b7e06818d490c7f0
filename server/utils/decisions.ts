import { and, asc, count, desc, eq, inArray, ne, sql, type SQL } from 'drizzle-orm'
import type { Advice, CaseInput } from '#shared/rules'
import {
  DECISION_STATUS_LABELS,
  type DecisionCreateBody,
  type DecisionListQuery,
  type DecisionReviseBody,
  type DecisionStatus,
} from '#shared/schemas/decisions'
import { MEMBER_ROLES, ROLE_LABELS, type Role } from '#shared/utils/roles'
import { insertDecision, reviseDecisionRecord, type DecisionRow } from '../db/decision-record'
import type { SessionUser } from './auth'
import type { DbOrTx } from './decision-events'

export type DecisionAction = 'revise' | 'submit' | 'approve' | 'override' | 'request-changes' | 'supersede' | 'comment'
type Refusal = { statusCode: 403 | 409; message: string }

// Auditors and leads read every project's decisions; administrators manage accounts and projects
// but are not given decision contents.
const READS_ALL_DECISIONS: readonly Role[] = ['auditor', 'lead']

const statusWord = (status: DecisionStatus) => DECISION_STATUS_LABELS[status].toLowerCase()

export function readsDecisions(user: SessionUser, isMember: boolean) {
  return READS_ALL_DECISIONS.includes(user.role) || (MEMBER_ROLES.includes(user.role) && isMember)
}

export function decisionReadRefusal(user: SessionUser, isMember: boolean): Refusal | null {
  if (readsDecisions(user, isMember)) return null
  if (user.role === 'admin') {
    return { statusCode: 403, message: 'Administrators manage accounts and projects; decisions are read by project members, auditors and leads' }
  }
  return { statusCode: 403, message: 'You are not a member of this project' }
}

const REVIEW_VERBS: Partial<Record<DecisionAction, string>> = {
  approve: 'approved',
  override: 'overridden',
  'request-changes': 'sent back for changes',
}

/**
 * Why a user may not take an action on a decision (403 for who they are, 409 for the state the
 * decision is in), or null when they may. The route guards and the permissions shown on the
 * decision page both come from here.
 */
export function decisionRefusal(
  user: SessionUser,
  decision: Pick<DecisionRow, 'authorId' | 'status'>,
  isMember: boolean,
  action: DecisionAction,
): Refusal | null {
  const read = decisionReadRefusal(user, isMember)
  if (read) return read
  if (!MEMBER_ROLES.includes(user.role) || !isMember) {
    return { statusCode: 403, message: `${ROLE_LABELS[user.role]}s read decisions; only engineers and reviewers of the project act on them` }
  }
  const own = decision.authorId === user.id
  const status = decision.status
  switch (action) {
    case 'revise':
    case 'submit': {
      const doing = action === 'revise' ? 'revise' : 'submit'
      if (!own) return { statusCode: 403, message: `Only the author may ${doing} this decision` }
      if (status !== 'draft') {
        return { statusCode: 409, message: `Only a draft can be ${doing === 'revise' ? 'revised' : 'submitted'}; this decision is ${statusWord(status)}` }
      }
      return null
    }
    case 'approve':
    case 'override':
    case 'request-changes':
      if (user.role !== 'reviewer') return { statusCode: 403, message: 'Only a senior reviewer can approve, override or send back a decision' }
      if (own) return { statusCode: 403, message: 'Nobody reviews their own decision: another reviewer of the project must' }
      if (status !== 'in_review') {
        return { statusCode: 409, message: `Only a decision in review can be ${REVIEW_VERBS[action]}; this one is ${statusWord(status)}` }
      }
      return null
    case 'supersede':
      if (status !== 'approved' && status !== 'overridden') {
        return { statusCode: 409, message: `Only an approved or overridden decision can be superseded; this one is ${statusWord(status)}` }
      }
      return null
    case 'comment':
      return null
  }
}

export function decisionPermissions(user: SessionUser, decision: Pick<DecisionRow, 'authorId' | 'status'>, isMember: boolean) {
  const may = (action: DecisionAction) => decisionRefusal(user, decision, isMember, action) === null
  return {
    canRevise: may('revise'),
    canSubmit: may('submit'),
    canReview: may('approve'),
    canSupersede: may('supersede'),
    canComment: may('comment'),
  }
}

export function findDecision(id: number, db: DbOrTx = useDb()) {
  return db.query.decisions.findFirst({ where: eq(tables.decisions.id, id) })
}

/**
 * After a conditional update matched nothing: say why, from the decision as it is now. A stale
 * version is the usual reason (someone acted first); else its status no longer allows the action.
 */
export async function throwConflict(db: DbOrTx, decisionId: number, version: number, allowed: readonly DecisionStatus[], doing: string): Promise<never> {
  const row = await findDecision(decisionId, db)
  if (!row) throw createError({ statusCode: 404, message: `Decision ${decisionId} does not exist` })
  if (row.version !== version) {
    throw createError({
      statusCode: 409,
      message: `This decision has changed since you loaded it (it is at version ${row.version}, you sent ${version}); reload it and try again`,
    })
  }
  throw createError({
    statusCode: 409,
    message: `Only a decision that is ${allowed.map(statusWord).join(' or ')} can be ${doing}; this one is ${statusWord(row.status)}`,
  })
}

// ---- reading

const revisions = tables.decisionRevisions
const decisions = tables.decisions
export const currentRevisionJoin = and(eq(revisions.decisionId, decisions.id), eq(revisions.revision, decisions.currentRevision))

export type DecisionOverride = {
  approach: string
  model: string
  wallTreatment: string
  yPlusTarget: number
  wall: Advice['wall']
  comment: string
  disagreedRules: string[]
  reviewer: { id: number; name: string }
}

export async function readDecision(id: number, db: DbOrTx = useDb()) {
  const [row] = await db.select({
    decision: decisions,
    revision: revisions,
    author: { id: tables.users.id, name: tables.users.name, email: tables.users.email },
  }).from(decisions)
    .innerJoin(revisions, currentRevisionJoin)
    .innerJoin(tables.users, eq(tables.users.id, decisions.authorId))
    .where(eq(decisions.id, id))
  if (!row) throw createError({ statusCode: 404, message: `Decision ${id} does not exist` })
  const { decision: d, revision: r } = row
  return {
    id: d.id,
    projectId: d.projectId,
    title: d.title,
    status: d.status,
    version: d.version,
    revision: d.currentRevision,
    caseInput: r.caseInput as CaseInput,
    advice: r.advice as Advice,
    notes: r.notes,
    author: row.author,
    override: (d.override ?? null) as DecisionOverride | null,
    supersedesId: d.supersedesId,
    supersededById: d.supersededById,
    createdAt: d.createdAt,
    updatedAt: d.updatedAt,
  }
}
export type DecisionDto = Awaited<ReturnType<typeof readDecision>>

// The approach a decision stands for: the reviewer's when overridden, else the engine's; its
// model and the engine's core-hours for it. Shared with the overview and the audit.
export const chosenApproach = sql<string>`coalesce(${decisions.override}->>'approach', ${revisions.advice}->'recommendation'->>'approach')`
export const chosenModel = sql<string>`coalesce(${decisions.override}->>'model', ${revisions.advice}->'recommendation'->>'model')`
export const chosenCoreHours = sql<number | null>`(SELECT (a->>'coreHours')::float8 FROM jsonb_array_elements(${revisions.advice}->'approaches') a WHERE a->>'id' = ${chosenApproach} LIMIT 1)`
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
  if (!row) throw createError({ statusCode: 404, message: `Decision ${decisionId} has no revision ${n}` })
  const r = row.revision
  return {
    revision: r.revision,
    caseInput: r.caseInput as CaseInput,
    advice: r.advice as Advice,
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

// ---- writing

export async function createDecision(project: { id: number; code: string; archived: boolean }, body: DecisionCreateBody, user: SessionUser) {
  if (project.archived) throw createError({ statusCode: 409, message: `Project ${project.code} is archived; it takes no new decisions` })
  return useDb().transaction(async (tx) => {
    const decision = await insertDecision(tx, {
      projectId: project.id, title: body.title, caseInput: body.caseInput, notes: body.notes, author: user,
    })
    return readDecision(decision.id, tx)
  })
}

export async function reviseDecision(decisionId: number, body: DecisionReviseBody, user: SessionUser) {
  return useDb().transaction(async (tx) => {
    const row = await reviseDecisionRecord(tx, {
      decisionId, version: body.version, caseInput: body.caseInput, notes: body.notes, title: body.title, actor: user,
    })
    if (!row) await throwConflict(tx, decisionId, body.version, ['draft'], 'revised')
    return readDecision(decisionId, tx)
  })
}
