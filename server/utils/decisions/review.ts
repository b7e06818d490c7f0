import { and, eq, sql } from 'drizzle-orm'
import { conflict, notFound } from '../http/errors'
import type { OverrideBody } from '#shared/schemas/decisions'
import type { CaseInput } from '#shared/rules'
import { enteredFromCaseInput, type EnteredCase } from '#shared/schemas/case-form'
import { impliedTreatment, yPlusConflict } from '#shared/schemas/requested-choice'
import type { DecisionOverride } from '#shared/types/decisions'
import type { UnitSystem } from '#shared/units'
import type { DecisionStatus } from '#shared/utils/decision-status'
import { changeDecision, insertDecision, overrideRecord, type CaseSubmission } from './record'
import { readDecision, findDecision } from './queries'
import { throwConflict } from './workflow'
import { appendEvent } from './events'
import { queueDecisionNotice } from '../mail/notices'
import { kickMailDelivery } from '../mail/outbox'
import type { SessionUser } from '#shared/types/session'
import type { DbOrTx } from '../../db/types'
import type { DecisionNoticeType } from '../mail/notices'
import { tables, useDb } from '../db'
import { publishedRuleset } from '../rulesets/rulesets'

// The review workflow's transitions. Each one is a conditional UPDATE (the version the client saw
// and an allowed status) plus its chained event and its mail, in one transaction; the mail is
// delivered after the commit.

type Transition = {
  decisionId: number
  version: number
  from: readonly DecisionStatus[]
  doing: string
  set: Parameters<typeof changeDecision>[1]['set']
  type: 'submitted' | 'approved' | 'overridden' | 'changes_requested'
  payload: Record<string, unknown>
  comment?: string
}

async function transition(user: SessionUser, t: Transition) {
  const decision = await useDb().transaction(async (tx) => {
    const row = await changeDecision(tx, {
      decisionId: t.decisionId,
      version: t.version,
      from: t.from,
      set: t.set,
      event: { type: t.type, actor: user, payload: t.payload },
    })
    if (!row) await throwConflict(tx, t.decisionId, t.version, t.from, t.doing)
    await queueDecisionNotice(tx, { decisionId: t.decisionId, type: t.type satisfies DecisionNoticeType, actor: user, comment: t.comment })
    return readDecision(t.decisionId, tx)
  })
  kickMailDelivery()
  return decision
}

export function submitDecision(decisionId: number, version: number, user: SessionUser) {
  return transition(user, {
    decisionId, version, from: ['draft'], doing: 'submitted',
    set: { status: 'in_review' }, type: 'submitted', payload: {},
  })
}

export function approveDecision(decisionId: number, body: { version: number; comment?: string }, user: SessionUser) {
  return transition(user, {
    decisionId, version: body.version, from: ['in_review'], doing: 'approved',
    set: { status: 'approved' }, type: 'approved',
    payload: body.comment ? { comment: body.comment } : {}, comment: body.comment,
  })
}

export function requestChanges(decisionId: number, body: { version: number; comment: string }, user: SessionUser) {
  return transition(user, {
    decisionId, version: body.version, from: ['in_review'], doing: 'sent back for changes',
    set: { status: 'draft' }, type: 'changes_requested', payload: { comment: body.comment }, comment: body.comment,
  })
}

async function currentRevision(db: DbOrTx, decisionId: number) {
  const r = tables.decisionRevisions
  const [row] = await db.select({ caseInput: r.caseInput, advice: r.advice, notes: r.notes, unitSystem: r.unitSystem, entered: r.entered, requested: r.requested })
    .from(tables.decisionRevisions)
    .innerJoin(tables.decisions, and(
      eq(tables.decisions.id, tables.decisionRevisions.decisionId),
      eq(tables.decisions.currentRevision, tables.decisionRevisions.revision),
    ))
    .where(eq(tables.decisions.id, decisionId))
  if (!row) throw notFound(`Decision ${decisionId} does not exist`)
  return row
}

/**
 * The case of a superseded decision for its successor: the same values as typed and, when the
 * reviewer overrode it, the reviewer's approach and treatment as the engineer's requested choice,
 * so the new draft starts from what the review asked for. A y+ target the reviewer typed comes
 * along; one that would contradict the adopted treatment is left out.
 */
export function successorCase(
  current: { caseInput: CaseInput; unitSystem: UnitSystem; entered: EnteredCase | null; requested: unknown },
  override: DecisionOverride | null,
  decisionId: number,
): CaseSubmission {
  const entered = structuredClone(current.entered ?? enteredFromCaseInput(current.caseInput, current.unitSystem))
  const caseInput = { ...current.caseInput }
  if (!override) {
    const requested = current.requested as CaseSubmission['requested']
    return { caseInput, unitSystem: current.unitSystem, entered, requested: requested ? { approach: requested.approach, wallTreatment: requested.wallTreatment, reason: requested.reason, adoptedFrom: requested.adoptedFrom } : null }
  }
  const treatment = impliedTreatment(override)
  const reviewerYPlus = override.requestedYPlus
  if (reviewerYPlus !== undefined && !yPlusConflict(reviewerYPlus, treatment)) {
    caseInput.yPlusTarget = reviewerYPlus
    entered.yPlusTarget = reviewerYPlus
  } else if (yPlusConflict(caseInput.yPlusTarget, treatment)) {
    delete caseInput.yPlusTarget
    entered.yPlusTarget = undefined
  }
  return {
    caseInput,
    unitSystem: current.unitSystem,
    entered,
    requested: {
      approach: override.approach,
      wallTreatment: override.wallTreatment,
      reason: `Adopted from ${override.reviewer.name}'s override of decision ${decisionId}: ${override.comment}`,
      adoptedFrom: { decisionId, reviewer: override.reviewer.name },
    },
  }
}

/**
 * The reviewer's own choice instead of the engine's: the near-wall figures are recomputed for the
 * chosen treatment, and the record keeps both what the engine recommended and what was chosen.
 */
export async function overrideDecision(decisionId: number, body: OverrideBody, user: SessionUser) {
  const { caseInput, advice } = await currentRevision(useDb(), decisionId)
  const known = new Set(advice.trace.map(entry => entry.rule))
  const unknown = body.disagreedRules.filter(rule => !known.has(rule))
  if (unknown.length) {
    const message = `Not rules of this advice: ${unknown.join(', ')}`
    throw createError({ statusCode: 400, message, data: { fieldErrors: { disagreedRules: [message] } } })
  }
  const { override, payload } = overrideRecord({ caseInput, advice }, body, { id: user.id, name: user.name })
  return transition(user, {
    decisionId, version: body.version, from: ['in_review'], doing: 'overridden',
    set: { status: 'overridden', override }, type: 'overridden',
    payload, comment: body.comment,
  })
}

/**
 * A closed decision changes only through a new one: a draft copying the current input (advice
 * recomputed by today's engine) that links back, while the old one becomes superseded.
 */
export async function supersedeDecision(decisionId: number, body: { version: number; title?: string }, user: SessionUser) {
  return useDb().transaction(async (tx) => {
    // The old decision's row first: every writer takes a decision's row before the ledger's lock.
    await tx.execute(sql`SELECT id FROM decisions WHERE id = ${decisionId} FOR UPDATE`)
    const old = await findDecision(decisionId, tx)
    if (!old) throw notFound(`Decision ${decisionId} does not exist`)
    const project = await tx.query.projects.findFirst({ where: eq(tables.projects.id, old.projectId) })
    if (project?.archived) throw conflict(`Project ${project.code} is archived; it takes no new decisions`)
    const current = await currentRevision(tx, decisionId)
    const created = await insertDecision(tx, {
      projectId: old.projectId, title: body.title ?? old.title, notes: current.notes, author: user, supersedesId: old.id,
      ...successorCase(current, old.override ?? null, old.id),
      ruleset: await publishedRuleset(tx),
    })
    const row = await changeDecision(tx, {
      decisionId, version: body.version, from: ['approved', 'overridden'],
      set: { status: 'superseded', supersededById: created.id },
      event: { type: 'superseded', actor: user, payload: { supersededBy: created.id } },
    })
    if (!row) await throwConflict(tx, decisionId, body.version, ['approved', 'overridden'], 'superseded')
    return readDecision(created.id, tx)
  })
}

/** A comment on the record; it changes nothing else, so the version stays. */
export async function commentOnDecision(decisionId: number, comment: string, user: SessionUser) {
  return useDb().transaction(async (tx) => {
    await appendEvent(tx, { decisionId, type: 'commented', actor: user, payload: { comment } })
    return readDecision(decisionId, tx)
  })
}
