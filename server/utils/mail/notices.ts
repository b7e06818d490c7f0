import { and, eq, ne } from 'drizzle-orm'
import { notFound } from '../http/errors'
import { APPROACH_LABELS, WALL_TREATMENT_LABELS, type Advice } from '#shared/rules'
import { caseRows } from '#shared/format/case-rows'
import { enteredFromCaseInput } from '#shared/schemas/case-form'
import type { DecisionOverride } from '#shared/types/decisions'
import { UNIT_SYSTEM_LABELS } from '#shared/units'
import { formatEstimate } from '#shared/utils/format'
import { currentRevisionJoin } from '../decisions/queries'
import type { SessionUser } from '#shared/types/session'
import type { DbOrTx } from '../../db/types'
import { MAIL_CAUTIONS, enqueueMail } from './outbox'
import { tables } from '../db'

// Review notices: who hears about a review action, and what the message says. Called by the
// decision actions inside their transaction; delivery follows the commit (kickMailDelivery).

export type DecisionNoticeType = 'submitted' | 'approved' | 'overridden' | 'changes_requested'

const HEADLINES: Record<DecisionNoticeType, string> = {
  submitted: 'Review requested',
  approved: 'Approved',
  overridden: 'Overridden by the reviewer',
  changes_requested: 'Changes requested',
}

function overrideLine(o: DecisionOverride | null) {
  if (!o) return undefined
  const parts = [APPROACH_LABELS[o.approach] ?? o.approach]
  if (o.model) parts.push(o.model)
  if (o.wallTreatment) parts.push(WALL_TREATMENT_LABELS[o.wallTreatment] ?? o.wallTreatment)
  if (o.yPlusTarget != null) parts.push(`y+ target ${o.yPlusTarget}`)
  return `The reviewer's choice: ${parts.join(', ')}.`
}

/** The override's own cost beside the engine's, in the one number format of the product. */
function overrideCostLine(o: DecisionOverride | null, advice: Advice) {
  const engine = advice.approaches.find(a => a.id === advice.recommendation.approach)
  if (!o?.cost || !engine) return undefined
  return `Its cost, recomputed for that choice: about ${formatEstimate(o.cost.coreHours)} core-hours (the engine's recommendation: ${formatEstimate(engine.coreHours)}).`
}

async function recipients(tx: DbOrTx, type: DecisionNoticeType, decision: { projectId: number; authorId: number }, actor: SessionUser) {
  if (type === 'submitted') {
    return tx.select({ id: tables.users.id, email: tables.users.email, name: tables.users.name })
      .from(tables.projectMembers)
      .innerJoin(tables.users, eq(tables.users.id, tables.projectMembers.userId))
      .where(and(
        eq(tables.projectMembers.projectId, decision.projectId),
        eq(tables.users.role, 'reviewer'),
        eq(tables.users.active, true),
        ne(tables.users.id, actor.id),
      ))
  }
  const author = await tx.query.users.findFirst({ where: eq(tables.users.id, decision.authorId) })
  return author && author.active && author.id !== actor.id ? [{ id: author.id, email: author.email, name: author.name }] : []
}

/** Queues the mail for one review action; returns how many messages were queued. */
export async function queueDecisionNotice(tx: DbOrTx, notice: {
  decisionId: number
  type: DecisionNoticeType
  actor: SessionUser
  comment?: string | null
}) {
  const [row] = await tx.select({
    id: tables.decisions.id,
    title: tables.decisions.title,
    projectId: tables.decisions.projectId,
    authorId: tables.decisions.authorId,
    override: tables.decisions.override,
    code: tables.projects.code,
    projectName: tables.projects.name,
    caseInput: tables.decisionRevisions.caseInput,
    entered: tables.decisionRevisions.entered,
    unitSystem: tables.decisionRevisions.unitSystem,
    advice: tables.decisionRevisions.advice,
  }).from(tables.decisions)
    .innerJoin(tables.projects, eq(tables.projects.id, tables.decisions.projectId))
    .innerJoin(tables.decisionRevisions, currentRevisionJoin)
    .where(eq(tables.decisions.id, notice.decisionId))
  if (!row) throw notFound(`Decision ${notice.decisionId} does not exist`)

  const to = await recipients(tx, notice.type, row, notice.actor)
  if (!to.length) return 0

  const link = `${String(useRuntimeConfig().appUrl).replace(/\/$/, '')}/decisions/${row.id}`
  const subject = `[${row.code}] ${HEADLINES[notice.type]}: ${row.title}`
  const what: Record<DecisionNoticeType, string> = {
    submitted: `${notice.actor.name} submitted "${row.title}" for review.`,
    approved: `${notice.actor.name} approved "${row.title}".`,
    overridden: `${notice.actor.name} overrode the recommendation for "${row.title}".`,
    changes_requested: `${notice.actor.name} asked for changes to "${row.title}"; it is back in draft for you.`,
  }
  const comment = notice.comment?.trim()
  // A reviewer asked to review reads the case as the engineer typed it, in its units.
  const entered = row.entered ?? enteredFromCaseInput(row.caseInput, row.unitSystem)
  const inputs = notice.type === 'submitted'
    ? ['', `The case, as typed (${UNIT_SYSTEM_LABELS[row.unitSystem]}):`, ...caseRows(entered, row.caseInput, row.unitSystem).map(r => `  ${r.label}: ${r.text}`)]
    : []
  const costLine = notice.type === 'overridden' ? overrideCostLine(row.override, row.advice) : undefined
  const body = (name: string) => [
    `Hello ${name},`,
    '',
    `${what[notice.type]} (project ${row.code}, ${row.projectName})`,
    ...inputs,
    ...(notice.type === 'overridden' && overrideLine(row.override) ? ['', overrideLine(row.override)!] : []),
    ...(costLine ? [costLine] : []),
    ...(comment ? ['', 'Comment:', comment] : []),
    '',
    `Open the decision: ${link}`,
    '',
    '--',
    MAIL_CAUTIONS,
  ].join('\n')

  for (const person of to) {
    await enqueueMail(tx, { to: person.email, subject, text: body(person.name), kind: notice.type })
  }
  return to.length
}
