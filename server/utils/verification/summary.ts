import { asc, inArray } from 'drizzle-orm'
import type { GridStudyResult, WallCheckResult } from '#shared/verification'
import { readAll } from '../../db/reads'
import type { DbOrTx } from '../../db/types'
import { tables, useDb } from '../db'

// One line of verification per decision, for the audit export: the records that stand (retracted
// ones are counted apart), the latest wall check and grid study, and the runs' compute.

export interface VerificationSummary {
  wallChecks: number
  retracted: number
  latestWallCheck: { fractionInBand: number; verdict: string; review: 'accepted' | 'rejected' | 'pending'; sha256: string } | null
  gridStudies: number
  latestGciFine: number | null
  runs: number
  actualCoreHours: number
  estimatedCoreHours: number | null
}

const empty = (): VerificationSummary => ({
  wallChecks: 0, retracted: 0, latestWallCheck: null, gridStudies: 0, latestGciFine: null, runs: 0, actualCoreHours: 0, estimatedCoreHours: null,
})

export async function verificationSummaries(decisionIds: number[], db: DbOrTx = useDb()) {
  const result = new Map<number, VerificationSummary>()
  for (const id of decisionIds) result.set(id, empty())
  if (!decisionIds.length) return result
  const [checks, studies, runs] = await readAll(db, [
    () => db.select().from(tables.wallChecks).where(inArray(tables.wallChecks.decisionId, decisionIds)).orderBy(asc(tables.wallChecks.id)),
    () => db.select().from(tables.gridStudies).where(inArray(tables.gridStudies.decisionId, decisionIds)).orderBy(asc(tables.gridStudies.id)),
    () => db.select().from(tables.runRecords).where(inArray(tables.runRecords.decisionId, decisionIds)).orderBy(asc(tables.runRecords.id)),
  ])
  for (const c of checks) {
    const s = result.get(c.decisionId)!
    if (c.retractedAt) { s.retracted++; continue }
    s.wallChecks++
    s.latestWallCheck = {
      fractionInBand: (c.result as WallCheckResult).fractionInBand,
      verdict: c.verdict,
      review: c.reviewedAt ? (c.reviewAccepted ? 'accepted' : 'rejected') : 'pending',
      sha256: c.sha256,
    }
  }
  for (const g of studies) {
    const s = result.get(g.decisionId)!
    if (g.retractedAt) { s.retracted++; continue }
    s.gridStudies++
    s.latestGciFine = (g.result as GridStudyResult).gciFine
  }
  for (const r of runs) {
    const s = result.get(r.decisionId)!
    if (r.retractedAt) { s.retracted++; continue }
    // GPU hours are not core-hours: only CPU runs add up here.
    if (r.hardware !== 'cpu') continue
    s.runs++
    s.actualCoreHours += r.coreHours
    if (r.estimated) s.estimatedCoreHours = (s.estimatedCoreHours ?? 0) + r.estimated.coreHours
  }
  return result
}
