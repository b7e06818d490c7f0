import { and, asc, eq, isNull } from 'drizzle-orm'
import { bandFor, gridConvergence, type GridStudyRecord, type GridStudyResult, type RunRecordView } from '#shared/verification'
import type { GridStudyBody, RunRecordBody } from '#shared/schemas/verification'
import type { SessionUser } from '#shared/types/session'
import { recordInLedger } from '../../db/ledger-records'
import { tables, useDb } from '../db'
import { appendEvent } from '../decisions/events'
import { signedOffChoice } from './signed-off'
import { currentPassFraction, toWallCheckDto } from './wall-checks'

// Grid-convergence studies and run records of a decision, their retraction, and the whole
// verification section as the decision page reads it.

export async function createGridStudy(decisionId: number, body: GridStudyBody, user: SessionUser) {
  let result: GridStudyResult
  try {
    result = gridConvergence(body.grids, body.dimensions)
  } catch (error) {
    throw createError({ statusCode: 400, message: error instanceof Error ? error.message : 'The grids cannot be studied' })
  }
  const row = await useDb().transaction(async (tx) => {
    const [study] = await tx.insert(tables.gridStudies).values({
      decisionId, createdBy: user.id, quantity: body.quantity, unit: body.unit, dimensions: body.dimensions, grids: body.grids, result,
    }).returning()
    await appendEvent(tx, {
      decisionId,
      type: 'grid_study_recorded',
      actor: user,
      payload: {
        gridStudyId: study!.id, quantity: body.quantity, unit: body.unit, dimensions: body.dimensions, grids: body.grids,
        order: result.order, extrapolated: result.extrapolated, gciFine: result.gciFine, convergence: result.convergence,
      },
    })
    await recordInLedger(tx, 'grid_studies', study!)
    return study!
  })
  return toGridStudyDto(row)
}

export function toGridStudyDto(row: typeof tables.gridStudies.$inferSelect): GridStudyRecord {
  const r = row.result as GridStudyResult
  return {
    id: row.id,
    quantity: row.quantity,
    unit: row.unit,
    ...r,
    createdBy: row.createdBy,
    createdAt: row.createdAt,
    retraction: row.retractedAt ? { reason: row.retractionReason ?? '', byId: row.retractedBy!, at: row.retractedAt } : null,
  }
}

/** A run record with the engine's estimate for the same approach (from the signed-off advice) beside it. */
export async function createRunRecord(decisionId: number, body: RunRecordBody, user: SessionUser) {
  const { decision, choice } = await signedOffChoice(decisionId)
  const entry = decision.advice.approaches.find(a => a.id === body.approach)
  const estimated = entry ? { cells: entry.cells, timeSteps: entry.timeSteps, coreHours: entry.coreHours } : null
  const row = await useDb().transaction(async (tx) => {
    const [run] = await tx.insert(tables.runRecords).values({ decisionId, createdBy: user.id, ...body, estimated }).returning()
    await appendEvent(tx, {
      decisionId,
      type: 'run_recorded',
      actor: user,
      payload: {
        runId: run!.id, approach: body.approach, signedOffApproach: choice.approach, cells: body.cells, timeSteps: body.timeSteps,
        innerIterations: body.innerIterations ?? null, coreHours: body.coreHours, wallClockHours: body.wallClockHours,
        cores: body.cores, hardware: body.hardware, hardwareNote: body.hardwareNote, solverFamily: body.solverFamily,
        estimatedCoreHours: estimated?.coreHours ?? null,
      },
    })
    await recordInLedger(tx, 'run_records', run!)
    return run!
  })
  return toRunDto(row, choice.approach)
}

export function toRunDto(row: typeof tables.runRecords.$inferSelect, signedOffApproach?: string): RunRecordView {
  const cautions: string[] = []
  if (signedOffApproach && row.approach !== signedOffApproach) {
    cautions.push('This run used another approach than the one signed off; it is compared with the engine\'s estimate for the approach it used.')
  }
  if (row.hardware === 'gpu') cautions.push('GPU hours are not compared with the engine\'s CPU core-hour estimate.')
  return {
    id: row.id,
    approach: row.approach,
    cells: row.cells,
    timeSteps: row.timeSteps,
    innerIterations: row.innerIterations,
    coreHours: row.coreHours,
    wallClockHours: row.wallClockHours,
    cores: row.cores,
    hardware: row.hardware,
    hardwareNote: row.hardwareNote,
    solverFamily: row.solverFamily,
    estimated: row.estimated,
    coreSecondsPerCellStep: (row.coreHours * 3600) / (row.cells * row.timeSteps),
    estimateFactor: row.hardware === 'cpu' && row.estimated ? row.coreHours / row.estimated.coreHours : null,
    cautions,
    createdBy: row.createdBy,
    createdAt: row.createdAt,
    retraction: row.retractedAt ? { reason: row.retractionReason ?? '', byId: row.retractedBy!, at: row.retractedAt } : null,
  }
}

const RETRACTABLE = {
  'wall-check': { table: () => tables.wallChecks, key: 'wallCheckId' },
  'grid-study': { table: () => tables.gridStudies, key: 'gridStudyId' },
  run: { table: () => tables.runRecords, key: 'runId' },
} as const
export type RetractableKind = keyof typeof RETRACTABLE

/** A wrong upload or record is withdrawn with a reason: kept, marked, and an event in the history. */
export async function retractRecord(kind: RetractableKind, decisionId: number, recordId: number, reason: string, user: SessionUser) {
  const { table: tableOf, key } = RETRACTABLE[kind]
  const table = tableOf()
  await useDb().transaction(async (tx) => {
    const [updated] = await tx.update(table).set({ retractedAt: new Date(), retractedBy: user.id, retractionReason: reason })
      .where(and(eq(table.id, recordId), eq(table.decisionId, decisionId), isNull(table.retractedAt)))
      .returning({ id: table.id })
    if (!updated) {
      const [exists] = await tx.select({ id: table.id }).from(table).where(and(eq(table.id, recordId), eq(table.decisionId, decisionId)))
      if (!exists) throw createError({ statusCode: 404, message: `Decision ${decisionId} has no such record (${kind} ${recordId})` })
      throw createError({ statusCode: 409, message: 'This record was already retracted' })
    }
    await appendEvent(tx, { decisionId, type: 'verification_retracted', actor: user, payload: { kind, [key]: recordId, reason } })
  })
  return verificationSection(decisionId)
}

/** Everything the decision page's verification section shows. */
export async function verificationSection(decisionId: number) {
  const db = useDb()
  const [{ choice }, checks, studies, runs, passFraction] = await Promise.all([
    signedOffChoice(decisionId),
    db.select().from(tables.wallChecks).where(eq(tables.wallChecks.decisionId, decisionId)).orderBy(asc(tables.wallChecks.id)),
    db.select().from(tables.gridStudies).where(eq(tables.gridStudies.decisionId, decisionId)).orderBy(asc(tables.gridStudies.id)),
    db.select().from(tables.runRecords).where(eq(tables.runRecords.decisionId, decisionId)).orderBy(asc(tables.runRecords.id)),
    currentPassFraction(),
  ])
  const people = new Map((await db.select({ id: tables.users.id, name: tables.users.name }).from(tables.users)).map(u => [u.id, u.name]))
  const name = (id: number | null | undefined) => (id ? people.get(id) ?? `user ${id}` : null)
  return {
    signedOff: { ...choice, band: bandFor(choice) },
    passFraction,
    wallChecks: checks.map(toWallCheckDto).map(c => ({
      ...c, uploadedByName: name(c.uploadedBy), reviewerName: name(c.review?.reviewerId), retractedByName: name(c.retraction?.byId),
    })),
    gridStudies: studies.map(toGridStudyDto).map(s => ({ ...s, createdByName: name(s.createdBy), retractedByName: name(s.retraction?.byId) })),
    runs: runs.map(r => toRunDto(r, choice.approach)).map(r => ({ ...r, createdByName: name(r.createdBy), retractedByName: name(r.retraction?.byId) })),
  }
}
