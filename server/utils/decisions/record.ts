// The writes of the decision record: a decision with its first revision, a revision, a status
// change. Each step is a row change plus its chained event, inside the caller's transaction.
// Relative imports only, so the demo seed writes its decisions through the same steps. Guards
// (who may do what) and error messages are the server's (policy.ts, workflow.ts, review.ts beside it).
import { and, eq, inArray, sql } from 'drizzle-orm'
import { advise, caseInputSchema, wallFor, type Advice, type ApproachId, type CaseInput, type CaseInputDraft, type WallTreatment } from '../../../shared/rules'
import type { Role } from '../../../shared/utils/roles'
import type { DecisionStatus } from '../../../shared/utils/decision-status'
import { appendChainedEvent, canonicalHash, type DecisionEventType } from '../../db/event-chain'
import * as schema from '../../db/schema'
import type { DbOrTx } from '../../db/types'

export type RecordActor = { id: number; role: Role }
export type DecisionRow = typeof schema.decisions.$inferSelect

/**
 * The stored form of a case: parsed (defaults applied), the advice the engine gives for it (never
 * a client's), the hash of its RFC 8785 canonical JSON, and the versions that produced the advice.
 */
export function adviceRecord(raw: CaseInputDraft) {
  const caseInput = caseInputSchema.parse(raw)
  const advice = advise(caseInput)
  return {
    caseInput,
    advice,
    inputHash: canonicalHash(caseInput),
    rulesetId: advice.ruleset.id,
    rulesetVersion: advice.ruleset.version,
    engineVersion: advice.engineVersion,
  }
}

function revisionValues(decisionId: number, revision: number, record: ReturnType<typeof adviceRecord>, notes: string, actor: RecordActor, at: Date) {
  return {
    decisionId,
    revision,
    caseInput: record.caseInput,
    advice: record.advice,
    notes,
    inputHash: record.inputHash,
    rulesetId: record.rulesetId,
    rulesetVersion: record.rulesetVersion,
    engineVersion: record.engineVersion,
    createdBy: actor.id,
    createdAt: at,
  }
}

function revisionPayload(revision: number, record: ReturnType<typeof adviceRecord>) {
  const { approach, model, wallTreatment } = record.advice.recommendation
  return { revision, inputHash: record.inputHash, approach, model, wallTreatment, rulesetVersion: record.rulesetVersion }
}

/** A new draft decision with revision 1 and its 'created' event. `at` backdates (demo seed only). */
export async function insertDecision(tx: DbOrTx, input: {
  projectId: number
  title: string
  caseInput: CaseInputDraft
  notes?: string
  author: RecordActor
  supersedesId?: number
  at?: Date
}) {
  const record = adviceRecord(input.caseInput)
  const at = input.at ?? new Date()
  const [decision] = await tx.insert(schema.decisions).values({
    projectId: input.projectId,
    title: input.title,
    authorId: input.author.id,
    supersedesId: input.supersedesId ?? null,
    createdAt: at,
    updatedAt: at,
  }).returning()
  await tx.insert(schema.decisionRevisions).values(revisionValues(decision!.id, 1, record, input.notes ?? '', input.author, at))
  await appendChainedEvent(tx, {
    decisionId: decision!.id,
    type: 'created',
    actor: input.author,
    payload: { ...revisionPayload(1, record), ...(input.supersedesId ? { supersedes: input.supersedesId } : {}) },
    at,
  })
  return decision!
}

/**
 * A status change (or any change of the decision row) under optimistic concurrency: the row changes
 * only if it still has the version the client saw and one of the expected statuses; the version
 * goes up by one and the event is chained. Null when nothing matched (stale or wrong status).
 */
export async function changeDecision(tx: DbOrTx, input: {
  decisionId: number
  version: number
  from: readonly DecisionStatus[]
  set: Partial<Pick<DecisionRow, 'status' | 'title' | 'override' | 'supersededById'>> & { nextRevision?: boolean }
  // The payload may depend on the changed row (e.g. the new revision number).
  event: { type: DecisionEventType; actor: RecordActor; payload?: Record<string, unknown> | ((row: DecisionRow) => Record<string, unknown>) }
  at?: Date
}): Promise<DecisionRow | null> {
  const at = input.at ?? new Date()
  const { nextRevision, ...set } = input.set
  const [row] = await tx.update(schema.decisions).set({
    ...set,
    version: sql`${schema.decisions.version} + 1`,
    ...(nextRevision ? { currentRevision: sql`${schema.decisions.currentRevision} + 1` } : {}),
    updatedAt: at,
  }).where(and(
    eq(schema.decisions.id, input.decisionId),
    eq(schema.decisions.version, input.version),
    inArray(schema.decisions.status, [...input.from]),
  )).returning()
  if (!row) return null
  const { payload } = input.event
  await appendChainedEvent(tx, {
    decisionId: row.id,
    type: input.event.type,
    actor: input.event.actor,
    payload: typeof payload === 'function' ? payload(row) : payload,
    at,
  })
  return row
}

/** A new revision of a draft: the engine's advice for the new input, the 'revised' event. Null when stale or not a draft. */
export async function reviseDecisionRecord(tx: DbOrTx, input: {
  decisionId: number
  version: number
  caseInput: CaseInputDraft
  notes?: string
  title?: string
  actor: RecordActor
  at?: Date
}) {
  const record = adviceRecord(input.caseInput)
  const at = input.at ?? new Date()
  const row = await changeDecision(tx, {
    decisionId: input.decisionId,
    version: input.version,
    from: ['draft'],
    set: { nextRevision: true, ...(input.title ? { title: input.title } : {}) },
    event: { type: 'revised', actor: input.actor, payload: changed => revisionPayload(changed.currentRevision, record) },
    at,
  })
  if (!row) return null
  // Notes carry over from the previous revision unless the author gives new ones.
  let notes = input.notes
  if (notes === undefined) {
    const [previous] = await tx.select({ notes: schema.decisionRevisions.notes }).from(schema.decisionRevisions)
      .where(and(eq(schema.decisionRevisions.decisionId, row.id), eq(schema.decisionRevisions.revision, row.currentRevision - 1)))
    notes = previous?.notes ?? ''
  }
  await tx.insert(schema.decisionRevisions).values(revisionValues(row.id, row.currentRevision, record, notes, input.actor, at))
  return row
}

/**
 * What a decision's override holds: the reviewer's choice with the near-wall figures recomputed for
 * the chosen treatment, the reason, and the rules disagreed with; plus the event payload, which
 * also keeps what the engine had recommended.
 */
export function overrideRecord(
  current: { caseInput: CaseInput; advice: Advice },
  choice: { approach: ApproachId; model: string; wallTreatment: WallTreatment; yPlusTarget?: number; comment: string; disagreedRules: string[] },
  reviewer: { id: number; name: string },
) {
  const wall = wallFor(current.caseInput, choice.wallTreatment, choice.yPlusTarget)
  const chosen = {
    approach: choice.approach,
    model: choice.model,
    wallTreatment: choice.wallTreatment,
    yPlusTarget: wall.yPlusTarget,
    comment: choice.comment,
    disagreedRules: choice.disagreedRules,
  }
  return {
    override: { ...chosen, wall, reviewer },
    payload: { ...chosen, recommended: current.advice.recommendation },
  }
}
