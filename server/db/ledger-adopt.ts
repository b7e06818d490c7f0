// Brings history written before the ledger existed into it, once: when the ledger is still empty
// and the record's tables hold rows, every row gets its entry in the order they were written (a
// revision before the event recorded with it). Never again after that: a row missing from a ledger
// that has entries is reported by the verification, not adopted. Run by scripts/migrate.ts.
import { sql } from 'drizzle-orm'
import { lockLedger } from './ledger'
import { RECORD_SOURCES, recordInLedger, recordRuleset, rulesetSubject } from './ledger-records'
import type { Db } from './types'

// Within one moment, the order a write of the record takes: revision, event, then its other rows.
const ORDER = ['decision_revisions', 'decision_events']

export async function adoptExistingHistory(db: Db) {
  return db.transaction(async (tx) => {
    await lockLedger(tx)
    const [{ n }] = (await tx.execute<{ n: number }>(sql`SELECT count(*)::int AS n FROM ledger_entries`)).rows as [{ n: number }]
    if (n > 0) return 0
    const rows: { table: string; at: number; id: number; row: Record<string, unknown> }[] = []
    for (const [table, source] of Object.entries(RECORD_SOURCES)) {
      if (table === 'ledger_keys') continue
      const ids = (await tx.execute<{ id: number }>(sql`SELECT ${sql.raw(source.idColumn ?? 'id')}::bigint AS id FROM ${sql.raw(table)}`)).rows.map(r => Number(r.id))
      for (const row of ids.length ? await source.load(tx, ids) : []) {
        rows.push({ table, at: (row.createdAt as Date).getTime(), id: source.id(row), row })
      }
    }
    if (!rows.length) return 0
    const revisions = rows.filter(r => r.table === 'decision_revisions').map(r => r.row)
    if (revisions.some(r => `${r.rulesetId}@${r.rulesetVersion}` === rulesetSubject())) await recordRuleset(tx)
    const rank = (table: string) => (ORDER.includes(table) ? ORDER.indexOf(table) : ORDER.length)
    rows.sort((a, b) => a.at - b.at || rank(a.table) - rank(b.table) || a.id - b.id)
    for (const { table, row } of rows) await recordInLedger(tx, table, row)
    return rows.length
  })
}
