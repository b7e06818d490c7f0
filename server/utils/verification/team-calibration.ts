import { desc, eq, isNull, max } from 'drizzle-orm'
import {
  MIN_RUNS_TO_ADOPT, calibrate, calibratedEstimates, costPerCellStep,
  type AdoptedCalibration, type CalibrationBlock, type RunFigures,
} from '#shared/verification'
import type { ApproachId } from '#shared/rules'
import type { SessionUser } from '#shared/types/session'
import { recordInLedger } from '../../db/ledger-records'
import type { DbOrTx } from '../../db/types'
import { versionedCache } from '../cache/versioned'
import { tables, useDb } from '../db'
import { currentPassFraction } from './wall-checks'

// The team's cost calibration: measured from every run record that stands (retracted ones are
// left out), adopted by a lead as a new version, applied to advice beside the engine's estimate.

async function standingRuns() {
  const r = tables.runRecords
  return useDb().select({
    id: r.id, decisionId: r.decisionId, approach: r.approach, hardware: r.hardware, cells: r.cells, timeSteps: r.timeSteps,
    innerIterations: r.innerIterations, coreHours: r.coreHours, wallClockHours: r.wallClockHours, cores: r.cores,
    estimated: r.estimated, createdAt: r.createdAt, title: tables.decisions.title, projectCode: tables.projects.code, projectId: tables.projects.id,
  }).from(r)
    .innerJoin(tables.decisions, eq(tables.decisions.id, r.decisionId))
    .innerJoin(tables.projects, eq(tables.projects.id, tables.decisions.projectId))
    .where(isNull(r.retractedAt)).orderBy(r.id)
}

// Adoptions are appended, never changed: a version's calibration is read once per process.
const adoptions = versionedCache<Promise<AdoptedCalibration | null>>(8)

/** The version of the calibration in force (null when none was adopted): one index probe. */
export async function calibrationVersion(db: DbOrTx = useDb()): Promise<number | null> {
  const [row] = await db.select({ version: max(tables.calibrationAdoptions.version) }).from(tables.calibrationAdoptions)
  return row?.version ?? null
}

async function loadAdoption(version: number): Promise<AdoptedCalibration | null> {
  const [row] = await useDb().select({ a: tables.calibrationAdoptions, by: tables.users.name })
    .from(tables.calibrationAdoptions).innerJoin(tables.users, eq(tables.users.id, tables.calibrationAdoptions.adoptedBy))
    .where(eq(tables.calibrationAdoptions.version, version))
  if (!row) return null
  return { version: row.a.version, adoptedAt: row.a.createdAt.toISOString(), adoptedBy: row.by, entries: row.a.entries }
}

/** The calibration in force; `version` when the caller already read it (calibrationVersion or the same subquery). */
export async function adoptedCalibration(version?: number | null): Promise<AdoptedCalibration | null> {
  const current = version === undefined ? await calibrationVersion() : version
  if (current === null) return null
  const key = String(current)
  return adoptions.get(key, '', () => loadAdoption(current).catch((error: unknown) => {
    adoptions.forget(key, '')
    throw error
  }))
}

/** The lead's calibration page: measured figures per approach and hardware, the runs, the adoptions. */
export async function calibrationOverview() {
  const runs = await standingRuns()
  const approaches = calibrate(runs.map(toFigures))
  const adoptions = await useDb().select({ version: tables.calibrationAdoptions.version, createdAt: tables.calibrationAdoptions.createdAt, entries: tables.calibrationAdoptions.entries, note: tables.calibrationAdoptions.note, by: tables.users.name })
    .from(tables.calibrationAdoptions).innerJoin(tables.users, eq(tables.users.id, tables.calibrationAdoptions.adoptedBy))
    .orderBy(desc(tables.calibrationAdoptions.version))
  return {
    minRunsToAdopt: MIN_RUNS_TO_ADOPT,
    approaches,
    runs: runs.map(run => ({
      ...run,
      coreSecondsPerCellStep: costPerCellStep(run),
      estimatedCoreHours: run.estimated?.coreHours ?? null,
      estimateFactor: run.hardware === 'cpu' && run.estimated ? run.coreHours / run.estimated.coreHours : null,
    })),
    adopted: await adoptedCalibration(),
    adoptions,
  }
}

function toFigures(run: Awaited<ReturnType<typeof standingRuns>>[number]): RunFigures {
  return { approach: run.approach, hardware: run.hardware, cells: run.cells, timeSteps: run.timeSteps, coreHours: run.coreHours, estimated: run.estimated }
}

/** A lead adopts what has at least MIN_RUNS_TO_ADOPT runs per approach and hardware: a new version. */
export async function adoptCalibration(note: string, user: SessionUser) {
  const runs = await standingRuns()
  const entries = calibrate(runs.map(toFigures)).filter(e => e.adoptable)
  if (!entries.length) {
    throw createError({ statusCode: 409, message: `Nothing to adopt yet: a calibration needs at least ${MIN_RUNS_TO_ADOPT} recorded runs of one approach on one kind of hardware` })
  }
  const used = new Set(entries.map(e => `${e.approach}|${e.hardware}`))
  const row = await useDb().transaction(async (tx) => {
    const [adopted] = await tx.insert(tables.calibrationAdoptions).values({
      adoptedBy: user.id,
      entries: entries.map(e => ({ approach: e.approach, hardware: e.hardware, runs: e.runs, coreSecondsPerCellStep: e.coreSecondsPerCellStep, spread: e.spread })),
      runIds: runs.filter(r => used.has(`${r.approach}|${r.hardware}`)).map(r => r.id),
      note,
    }).returning()
    await recordInLedger(tx, 'calibration_adoptions', adopted!)
    return adopted
  })
  return { version: row!.version, adoptedAt: row!.createdAt.toISOString(), adoptedBy: user.name, entries: row!.entries, runIds: row!.runIds, note: row!.note }
}

/** The calibration block shown beside an advice: both estimates, and which one leads. */
export async function calibrationFor(advice: Parameters<typeof calibratedEstimates>[0], focus?: ApproachId, version?: number | null): Promise<CalibrationBlock> {
  return calibratedEstimates(advice, await adoptedCalibration(version), focus)
}

export async function setPassFraction(value: number, note: string, user: SessionUser) {
  const row = await useDb().transaction(async (tx) => {
    const [setting] = await tx.insert(tables.teamSettings).values({ wallCheckPassFraction: value, note, setBy: user.id }).returning()
    await recordInLedger(tx, 'team_settings', setting!)
    return setting
  })
  return { wallCheckPassFraction: row!.wallCheckPassFraction, note: row!.note, setAt: row!.createdAt, setBy: user.name }
}

export async function verificationSettings() {
  const [row] = await useDb().select({ s: tables.teamSettings, by: tables.users.name }).from(tables.teamSettings)
    .innerJoin(tables.users, eq(tables.users.id, tables.teamSettings.setBy)).orderBy(desc(tables.teamSettings.id)).limit(1)
  return row
    ? { wallCheckPassFraction: row.s.wallCheckPassFraction, note: row.s.note, setAt: row.s.createdAt, setBy: row.by }
    : { wallCheckPassFraction: (await currentPassFraction()), note: '', setAt: null, setBy: null }
}
