// The writes of the decision record: a decision with its first revision, a revision, a status
// change. Each step is a row change plus its chained event (and ledger entries), inside the
// caller's transaction. The events carry everything the decision row's status, override, title and
// current revision are derived from: the database checks at commit that the row agrees with them
// (migration 0006), and the ledger verification replays them.
// Relative imports only, so the demo seed writes its decisions through the same steps. Guards
// (who may do what) and error messages are the server's (policy.ts, workflow.ts, review.ts beside it).
import { and, eq, inArray, sql } from 'drizzle-orm'
import { advise, caseInputSchema, costFor, wallFor, APPROACH_LABELS, WALL_TREATMENT_LABELS, WALL_TREATMENTS_BY_APPROACH, type Advice, type ApproachId, type CaseInput, type CaseInputDraft, type Ruleset, type WallTreatment } from '../../../shared/rules'
import { enteredFromCaseInput, type EnteredCase } from '../../../shared/schemas/case-form'
import type { RequestedChoiceBody } from '../../../shared/schemas/requested-choice'
import type { ChoiceFigures, DecisionOverride, RequestedChoice } from '../../../shared/types/decisions'
import type { UnitSystem } from '../../../shared/units/catalogue'
import type { DecisionStatus } from '../../../shared/utils/decision-status'
import type { Role } from '../../../shared/utils/roles'
import { appendChainedEvent, canonicalHash, type DecisionEventType } from '../../db/event-chain'
import { insertRevision } from '../../db/ledger-records'
import * as schema from '../../db/schema'
import type { DbOrTx } from '../../db/types'
import { writeDecisionSummary } from './summary'

export type RecordActor = { id: number; role: Role }
export type DecisionRow = typeof schema.decisions.$inferSelect

/**
 * The near-wall mesh and the cost of one approach with one wall treatment for a case: what a
 * reviewer's override or an engineer's own choice stands for, beside the engine's figures. The
 * mesh is at `yPlusTarget` when given (else the treatment's own target); the cost counts the
 * treatment's near-wall layers at the treatment's own target, as the engine counts every approach.
 * The one place a choice is costed, so a finer cost model replaces it here alone.
 */
export function choiceFigures(caseInput: CaseInput, choice: { approach: ApproachId; wallTreatment: WallTreatment; yPlusTarget?: number }): ChoiceFigures {
  const wall = wallFor(caseInput, choice.wallTreatment, choice.yPlusTarget, choice.approach)
  const { cells, timeSteps, coreHours, wallClockHours, memoryGB, feasible, layers } = costFor(
    caseInput, choice.approach, choice.wallTreatment,
  )
  return {
    approach: choice.approach,
    wallTreatment: choice.wallTreatment,
    wall,
    cost: { cells, timeSteps, coreHours, wallClockHours, memoryGB, feasible, layers },
  }
}

/** An engineer's choice the engine's advice cannot take: the field and why. */
export class RequestedChoiceError extends Error {
  constructor(readonly field: 'approach' | 'wallTreatment', message: string) {
    super(message)
  }
}

/**
 * The engineer's requested approach or treatment, completed with the engine's where one is left
 * open (the engine's approach, or the treatment the engine counted for the requested approach),
 * and costed. Throws RequestedChoiceError when the pair does not go together.
 */
export function requestedRecord(
  caseInput: CaseInput,
  advice: Advice,
  requested: (RequestedChoiceBody & { adoptedFrom?: RequestedChoice['adoptedFrom'] }) | null | undefined,
): RequestedChoice | null {
  if (!requested || (!requested.approach && !requested.wallTreatment)) return null
  const approach = requested.approach ?? advice.recommendation.approach
  const engineEntry = advice.approaches.find(a => a.id === approach)
  const wallTreatment = requested.wallTreatment ?? engineEntry?.wallTreatment ?? WALL_TREATMENTS_BY_APPROACH[approach][0]!
  if (!WALL_TREATMENTS_BY_APPROACH[approach].includes(wallTreatment)) {
    throw new RequestedChoiceError(
      requested.approach ? 'wallTreatment' : 'approach',
      `${APPROACH_LABELS[approach]}${requested.approach ? '' : ' (the engine\'s recommendation)'} does not go with ${WALL_TREATMENT_LABELS[wallTreatment].toLowerCase()}; choose an approach that does.`,
    )
  }
  return {
    ...(requested.approach ? { approach: requested.approach } : {}),
    ...(requested.wallTreatment ? { wallTreatment: requested.wallTreatment } : {}),
    reason: requested.reason,
    figures: choiceFigures(caseInput, { approach, wallTreatment, yPlusTarget: caseInput.yPlusTarget }),
    ...(requested.adoptedFrom ? { adoptedFrom: requested.adoptedFrom } : {}),
  }
}

/** A case as the record receives it: the SI case, and how it was typed. */
export type CaseSubmission = {
  caseInput: CaseInputDraft
  unitSystem?: UnitSystem
  entered?: EnteredCase
  requested?: (RequestedChoiceBody & { adoptedFrom?: RequestedChoice['adoptedFrom'] }) | null
  /** the published ruleset (the built-in one when absent, e.g. in unit tests) */
  ruleset?: Ruleset
}

/**
 * The stored form of a case: parsed (defaults applied), the advice the engine gives for it (never
 * a client's), the hash of its RFC 8785 canonical JSON, the versions that produced the advice, and
 * the values as typed in their unit system (derived from SI when only SI was sent).
 */
export function adviceRecord(submission: CaseSubmission) {
  const caseInput = caseInputSchema.parse(submission.caseInput)
  const advice = advise(caseInput, { ruleset: submission.ruleset })
  const unitSystem = submission.unitSystem ?? 'si'
  return {
    caseInput,
    advice,
    unitSystem,
    entered: submission.entered ?? enteredFromCaseInput(caseInput, unitSystem),
    requested: requestedRecord(caseInput, advice, submission.requested),
    inputHash: canonicalHash(caseInput),
    rulesetId: advice.ruleset.id,
    rulesetVersion: advice.ruleset.version,
    engineVersion: advice.engineVersion,
  }
}

// Round-trips through JSON so the ledger's hash covers exactly what jsonb will give back.
const asStored = <T>(value: T): T => (value === undefined ? value : JSON.parse(JSON.stringify(value)))

export function revisionValues(decisionId: number, revision: number, record: ReturnType<typeof adviceRecord>, notes: string, actor: RecordActor, at: Date) {
  return {
    decisionId,
    revision,
    caseInput: asStored(record.caseInput),
    unitSystem: record.unitSystem,
    entered: asStored(record.entered),
    requested: asStored(record.requested),
    advice: asStored(record.advice),
    notes,
    inputHash: record.inputHash,
    rulesetId: record.rulesetId,
    rulesetVersion: record.rulesetVersion,
    engineVersion: record.engineVersion,
    createdBy: actor.id,
    createdAt: at,
  }
}

export function revisionPayload(revision: number, record: ReturnType<typeof adviceRecord>, title: string) {
  const { approach, model, wallTreatment } = record.advice.recommendation
  const requested = record.requested
    ? { requested: { approach: record.requested.figures.approach, wallTreatment: record.requested.figures.wallTreatment, reason: record.requested.reason } }
    : {}
  return {
    revision, title, inputHash: record.inputHash, approach, model, wallTreatment, rulesetVersion: record.rulesetVersion,
    unitSystem: record.unitSystem, ...requested,
  }
}

/** A new draft decision with revision 1 and its 'created' event. `at` backdates (demo seed only). */
export async function insertDecision(tx: DbOrTx, input: CaseSubmission & {
  projectId: number
  title: string
  notes?: string
  author: RecordActor
  supersedesId?: number
  at?: Date
}) {
  const record = adviceRecord(input)
  const at = input.at ?? new Date()
  const [decision] = await tx.insert(schema.decisions).values({
    projectId: input.projectId,
    title: input.title,
    unitSystem: record.unitSystem,
    authorId: input.author.id,
    supersedesId: input.supersedesId ?? null,
    createdAt: at,
    updatedAt: at,
  }).returning()
  await insertRevision(tx, revisionValues(decision!.id, 1, record, input.notes ?? '', input.author, at))
  await appendChainedEvent(tx, {
    decisionId: decision!.id,
    type: 'created',
    actor: input.author,
    payload: { ...revisionPayload(1, record, input.title), ...(input.supersedesId ? { supersedes: input.supersedesId } : {}) },
    at,
  })
  await writeDecisionSummary(tx, decision!.id)
  return decision!
}

/**
 * A status change (or any change of the decision row) under optimistic concurrency: the row changes
 * only if it still has the version the client saw and one of the expected statuses; the version
 * goes up by one and the event is chained. Null when nothing matched (stale or wrong status).
 */
export async function changeDecision(tx: DbOrTx, input: DecisionChange): Promise<DecisionRow | null> {
  const row = await changeDecisionRow(tx, input)
  if (row) await writeDecisionSummary(tx, row.id)
  return row
}

type DecisionChange = {
  decisionId: number
  version: number
  from: readonly DecisionStatus[]
  set: Partial<Pick<DecisionRow, 'status' | 'title' | 'override' | 'supersededById' | 'unitSystem'>> & { nextRevision?: boolean }
  // The payload may depend on the changed row (e.g. the new revision number).
  event: { type: DecisionEventType; actor: RecordActor; payload?: Record<string, unknown> | ((row: DecisionRow) => Record<string, unknown>) }
  at?: Date
}

// The row change and its event, without the summary (a revision writes it after its new revision row).
async function changeDecisionRow(tx: DbOrTx, input: DecisionChange): Promise<DecisionRow | null> {
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
export async function reviseDecisionRecord(tx: DbOrTx, input: CaseSubmission & {
  decisionId: number
  version: number
  notes?: string
  title?: string
  actor: RecordActor
  at?: Date
}) {
  const record = adviceRecord(input)
  const at = input.at ?? new Date()
  const row = await changeDecisionRow(tx, {
    decisionId: input.decisionId,
    version: input.version,
    from: ['draft'],
    set: { nextRevision: true, unitSystem: record.unitSystem, ...(input.title ? { title: input.title } : {}) },
    event: { type: 'revised', actor: input.actor, payload: changed => revisionPayload(changed.currentRevision, record, changed.title) },
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
  await insertRevision(tx, revisionValues(row.id, row.currentRevision, record, notes, input.actor, at))
  await writeDecisionSummary(tx, row.id)
  return row
}

/**
 * What a decision's override holds: the reviewer's choice with the near-wall figures and the cost
 * recomputed for the chosen approach and treatment, the reason, and the rules disagreed with; plus
 * the event payload, which keeps the choice, what the engine had recommended, and the whole
 * override as stored (so that the decision's override is derived from its history).
 */
export function overrideRecord(
  current: { caseInput: CaseInput; advice: Advice },
  choice: { approach: ApproachId; model: string; wallTreatment: WallTreatment; yPlusTarget?: number; comment: string; disagreedRules: string[] },
  reviewer: { id: number; name: string },
): { override: DecisionOverride; payload: Record<string, unknown> } {
  const { wall, cost } = choiceFigures(current.caseInput, choice)
  const chosen = {
    approach: choice.approach,
    model: choice.model,
    wallTreatment: choice.wallTreatment,
    yPlusTarget: wall.yPlusTarget,
    comment: choice.comment,
    disagreedRules: choice.disagreedRules,
  }
  const override = asStored<DecisionOverride>({ ...chosen, wall, cost, reviewer, ...(choice.yPlusTarget !== undefined ? { requestedYPlus: choice.yPlusTarget } : {}) })
  return {
    override,
    payload: { ...chosen, coreHours: cost.coreHours, recommended: current.advice.recommendation, override },
  }
}
