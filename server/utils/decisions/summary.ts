// A decision's summary row (decision_summaries): rewritten by the database function
// write_decision_summaries from the view decision_summary_source (the one derivation, in
// server/db/migrations/0012_decision_summary_source.sql) inside the transaction of every change,
// and checked against that view. The overview's tallies follow by trigger. Relative imports only,
// so the demo and scale seeds write summaries through the same statement.
import { sql } from 'drizzle-orm'
import { summaryDrift as driftOf } from '../../db/summary-drift'
import type { DbOrTx } from '../../db/types'

const idArray = (ids: number[]) => sql`${`{${ids.map(id => Math.trunc(id)).join(',')}}`}::int[]`

/** Rewrites the summaries of these decisions from their record. */
export async function writeSummaries(db: DbOrTx, decisionIds: number[]) {
  if (decisionIds.length) await db.execute(sql`SELECT write_decision_summaries(${idArray(decisionIds)})`)
}

/** Rewrites one decision's summary: the last step of every change to the decision record. */
export function writeDecisionSummary(tx: DbOrTx, decisionId: number) {
  return writeSummaries(tx, [decisionId])
}

/**
 * Decisions whose stored summary differs from what their record gives (or is missing), with the
 * columns that differ: a summary row altered behind the application's back shows here.
 */
export async function summaryDrift(db: DbOrTx, decisionIds: number[]) {
  // These decisions exist: a summary outliving its decision is the ledger verification's to report.
  return (await driftOf(db, decisionIds)).filter(d => !d.orphan).map(({ decisionId, missing, columns }) => ({ decisionId, missing, columns }))
}
