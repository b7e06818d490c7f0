// Decision summaries against their one derivation (the view decision_summary_source, migration
// 0012), column by column: for some decisions (the summaries' own check) or for every one (the
// ledger verification). Relative imports only: the server, the seeds and the ledger scripts use it.
import { getTableColumns, sql } from 'drizzle-orm'
import * as schema from './schema'
import type { DbOrTx } from './types'

const COMPARED = Object.values(getTableColumns(schema.decisionSummaries)).map(column => column.name).filter(name => name !== 'decision_id')

/**
 * A summary that differs from what its decision's record gives: `missing` when the decision has no
 * summary row (`columns` is then ['decision_id']), `orphan` when a summary row outlived its decision.
 */
export type SummaryDrift = { decisionId: number; missing: boolean; orphan: boolean; columns: string[] }

/** The drifted summaries among these decisions, or among all of them when `decisionIds` is null. */
export async function summaryDrift(db: DbOrTx, decisionIds: number[] | null): Promise<SummaryDrift[]> {
  if (decisionIds?.length === 0) return []
  // Filtered on each side, so that for a few decisions the view is read for those alone.
  const only = decisionIds ? sql`WHERE decision_id = ANY(${`{${decisionIds.map(id => Math.trunc(id)).join(',')}}`}::int[])` : sql``
  const differs = sql.raw(COMPARED.map(name => `CASE WHEN s.${name} IS DISTINCT FROM v.${name} THEN '${name}' END`).join(', '))
  const row = (alias: string) => sql.raw(`ROW(${COMPARED.map(name => `${alias}.${name}`).join(', ')})`)
  const { rows } = await db.execute<{ decision_id: number; missing: boolean; orphan: boolean; columns: string[] }>(sql`
    SELECT coalesce(v.decision_id, s.decision_id) AS decision_id, s.decision_id IS NULL AS missing, v.decision_id IS NULL AS orphan,
      CASE WHEN s.decision_id IS NULL THEN ARRAY['decision_id'] ELSE array_remove(ARRAY[${differs}], NULL) END AS columns
    FROM (SELECT * FROM decision_summary_source ${only}) v
    FULL JOIN (SELECT * FROM decision_summaries ${only}) s ON s.decision_id = v.decision_id
    WHERE s.decision_id IS NULL OR v.decision_id IS NULL OR ${row('s')} IS DISTINCT FROM ${row('v')}
    ORDER BY 1`)
  return rows.map(r => ({ decisionId: Number(r.decision_id), missing: r.missing, orphan: r.orphan, columns: r.columns }))
}
