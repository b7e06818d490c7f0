// A decision's summary row (decision_summaries): rewritten by the database function
// write_decision_summaries from the view decision_summary_source (the one derivation, in
// server/db/migrations/0012_decision_summary_source.sql) inside the transaction of every change,
// and checked against that view. The overview's tallies follow by trigger. Relative imports only,
// so the demo and scale seeds write summaries through the same statement.
import { getTableColumns, sql } from 'drizzle-orm'
import * as schema from '../../db/schema'
import type { DbOrTx } from '../../db/types'

const COLUMN_NAMES = Object.values(getTableColumns(schema.decisionSummaries)).map(column => column.name)

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
  if (!decisionIds.length) return []
  const compared = COLUMN_NAMES.filter(name => name !== 'decision_id')
  const differs = sql.raw(compared.map(name => `CASE WHEN s.${name} IS DISTINCT FROM v.${name} THEN '${name}' END`).join(', '))
  const row = (alias: string) => sql.raw(`ROW(${compared.map(name => `${alias}.${name}`).join(', ')})`)
  const { rows } = await db.execute<{ decision_id: number; columns: string[] }>(sql`
    SELECT v.decision_id,
      CASE WHEN s.decision_id IS NULL THEN ARRAY['decision_id'] ELSE array_remove(ARRAY[${differs}], NULL) END AS columns
    FROM decision_summary_source v
    LEFT JOIN decision_summaries s ON s.decision_id = v.decision_id
    WHERE v.decision_id = ANY(${idArray(decisionIds)}) AND (s.decision_id IS NULL OR ${row('s')} IS DISTINCT FROM ${row('v')})`)
  return rows.map(r => ({ decisionId: Number(r.decision_id), missing: r.columns[0] === 'decision_id', columns: r.columns }))
}
