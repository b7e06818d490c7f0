// What only someone holding the database owner's credentials could do to the ledger: switch the
// triggers off, change rows, and recompute hashes with the published algorithms (the product's own
// functions, as an attacker who read the code would). Used by the ledger tamper tests.
import type pg from 'pg'
import { eventHash } from '../../server/db/event-chain'
import { ledgerEntryHash } from '../../server/db/ledger'

/** The change, with the tables' triggers off, in one transaction; the triggers are on again after. */
export async function withoutTriggers(owner: pg.Client, tables: string[], change: () => Promise<unknown>) {
  await owner.query('BEGIN')
  try {
    for (const t of tables) await owner.query(`ALTER TABLE ${t} DISABLE TRIGGER USER`)
    await change()
    for (const t of tables) await owner.query(`ALTER TABLE ${t} ENABLE TRIGGER USER`)
    await owner.query('COMMIT')
  } catch (error) {
    await owner.query('ROLLBACK')
    throw error
  }
}

type EventRow = {
  id: string; decision_id: number; seq: number; type: string; actor_id: number; actor_role: string
  payload: unknown; created_at: Date; prev_hash: string; hash: string
}

/**
 * Recomputes a decision's event chain from `fromSeq` on (after its payloads were changed), so the
 * decision's own chain is consistent again. Returns the new hash of each rewritten event, by id.
 * Call inside withoutTriggers(['decision_events', ...]).
 */
export async function rehashDecisionEvents(owner: pg.Client, decisionId: number, fromSeq: number) {
  const { rows } = await owner.query<EventRow>('SELECT * FROM decision_events WHERE decision_id = $1 ORDER BY seq', [decisionId])
  const rewritten = new Map<number, string>()
  let prev = fromSeq === 1 ? '0'.repeat(64) : rows.find(r => r.seq === fromSeq - 1)!.hash
  for (const row of rows.filter(r => r.seq >= fromSeq)) {
    const hash = eventHash(prev, {
      decisionId: row.decision_id, seq: row.seq, type: row.type as never, actorId: row.actor_id, actorRole: row.actor_role,
      payload: row.payload, createdAt: row.created_at,
    })
    await owner.query('UPDATE decision_events SET prev_hash = $2, hash = $3 WHERE id = $1', [row.id, prev, hash])
    rewritten.set(Number(row.id), hash)
    prev = hash
  }
  return rewritten
}

type EntryRow = {
  seq: string; subject_type: string; subject_id: string; type: string; record_table: string | null; record_id: string | null
  record_hash: string; created_at: Date; prev_hash: string; hash: string
}

/**
 * Recomputes the ledger from entry `fromSeq` to its head: each decision event's entry takes the
 * event's current hash, each entry chains onto the (recomputed) one before. The consistent rewrite:
 * no link or hash is left that does not recompute. Call inside withoutTriggers(['ledger_entries', ...]).
 */
export async function rehashLedgerFrom(owner: pg.Client, fromSeq: number) {
  const { rows } = await owner.query<EntryRow>('SELECT * FROM ledger_entries WHERE seq >= $1 - 1 ORDER BY seq', [fromSeq])
  const { rows: events } = await owner.query<{ id: string; hash: string }>('SELECT id, hash FROM decision_events')
  const eventHashes = new Map(events.map(e => [e.id, e.hash]))
  let prev = rows[0] && Number(rows[0].seq) === fromSeq - 1 ? rows.shift()!.hash : '0'.repeat(64)
  for (const row of rows) {
    const recordHash = row.record_table === 'decision_events' ? eventHashes.get(row.record_id!) ?? row.record_hash : row.record_hash
    const hash = ledgerEntryHash(prev, {
      seq: Number(row.seq), subjectType: row.subject_type, subjectId: row.subject_id, type: row.type,
      recordTable: row.record_table, recordId: row.record_id === null ? null : Number(row.record_id), recordHash, createdAt: row.created_at,
    })
    await owner.query('UPDATE ledger_entries SET record_hash = $2, prev_hash = $3, hash = $4 WHERE seq = $1', [row.seq, recordHash, prev, hash])
    prev = hash
  }
  return prev
}

/** The ledger entries that hold a decision's events and revisions, first to last. */
export async function entriesOf(owner: pg.Client, decisionId: number) {
  const { rows } = await owner.query<{ seq: string; record_table: string; record_id: string }>(
    `SELECT seq, record_table, record_id FROM ledger_entries WHERE subject_type = 'decision' AND subject_id = $1 ORDER BY seq`, [String(decisionId)])
  return rows.map(r => ({ seq: Number(r.seq), table: r.record_table, id: Number(r.record_id) }))
}

export type LedgerReport = {
  valid: boolean; entries: number; checkpoints: number; recomputed: number
  problems: { kind: string; decisionId?: number; seq?: number; detail: string }[]
  from: { run: number; seq: number; at: string } | null
  head: { seq: number; hash: string }
}

/** Points one entry at another previous hash and recomputes its own hash: a broken link, nothing else. */
export async function relinkEntry(owner: pg.Client, seq: number, prevHash: string) {
  const { rows: [row] } = await owner.query<EntryRow>('SELECT * FROM ledger_entries WHERE seq = $1', [seq])
  const hash = ledgerEntryHash(prevHash, {
    seq, subjectType: row!.subject_type, subjectId: row!.subject_id, type: row!.type, recordTable: row!.record_table,
    recordId: row!.record_id === null ? null : Number(row!.record_id), recordHash: row!.record_hash, createdAt: row!.created_at,
  })
  await owner.query('UPDATE ledger_entries SET prev_hash = $2, hash = $3 WHERE seq = $1', [seq, prevHash, hash])
}
