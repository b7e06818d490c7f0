// One decision's part of the ledger, checked on its own (the decision page, the audit list, the PDF
// record): its event chain, its events and revisions against what the ledger recorded, and its row
// against what its events give. A rewrite of the whole ledger needs the signed checkpoints and is
// only found by the ledger verification (ledger-verify.ts).
import { asc, inArray, sql } from 'drizzle-orm'
import { checkChain } from './event-chain'
import { readAll } from './reads'
import type { LedgerDbOrTx } from './ledger'
import { RECORD_SOURCES, revisionHash } from './ledger-records'
import type { LedgerProblem } from '../../shared/schemas/ledger'
import * as schema from './schema'

type RevisionRow = typeof schema.decisionRevisions.$inferSelect

export type DecisionCheck = { valid: boolean; checked: number; brokenAt: number | null; problems: LedgerProblem[] }

// Decisions checked per round trip: the revisions' stored advice is read to be hashed.
const CHUNK = 200

/**
 * `revisionContent: false` (the audit list and its export) checks that each revision is in the
 * ledger but does not read and rehash its stored advice: the decision's own check and the ledger
 * verification do, and a list stays as fast at 100,000 decisions as at ten.
 */
export type DecisionCheckOptions = { revisionContent?: boolean }

/** The end of a decision's history as read for its check: how many events, the last one's time and hash. */
export type HistoryTail = { events: number; lastAt: Date | null; lastHash: string | null }

export async function checkDecisions(db: LedgerDbOrTx, decisionIds: number[], options: DecisionCheckOptions = {}): Promise<Map<number, DecisionCheck>> {
  const result = new Map<number, DecisionCheck>()
  for (const [id, { check }] of await checkDecisionsWithTails(db, decisionIds, options)) result.set(id, check)
  return result
}

/** checkDecisions, with the tail of each history from the same read of its events (the audit's rows show both). */
export async function checkDecisionsWithTails(db: LedgerDbOrTx, decisionIds: number[], options: DecisionCheckOptions = {}) {
  const result = new Map<number, { check: DecisionCheck; tail: HistoryTail }>()
  for (let i = 0; i < decisionIds.length; i += CHUNK) {
    for (const [id, checked] of await checkChunk(db, decisionIds.slice(i, i + CHUNK), options.revisionContent ?? true)) result.set(id, checked)
  }
  return result
}

async function checkChunk(db: LedgerDbOrTx, decisionIds: number[], revisionContent: boolean) {
  const result = new Map<number, { check: DecisionCheck; tail: HistoryTail }>()
  if (!decisionIds.length) return result
  const ids = `{${decisionIds.join(',')}}`
  const e = schema.decisionEvents
  const r = schema.decisionRevisions
  const l = schema.ledgerEntries
  const [events, revisions, entries, states] = await readAll(db, [
    () => db.select().from(e).where(inArray(e.decisionId, decisionIds)).orderBy(asc(e.decisionId), asc(e.seq)),
    () => revisionContent
      ? db.select().from(r).where(inArray(r.decisionId, decisionIds))
      : db.select({ id: r.id, decisionId: r.decisionId, revision: r.revision }).from(r).where(inArray(r.decisionId, decisionIds)),
    () => db.select().from(l).where(sql`${l.subjectType} = 'decision' AND ${l.subjectId} = ANY(${`{${decisionIds.map(String).join(',')}}`}::text[])`),
    () => db.execute<{ decision_id: number; events: number; mismatch: string }>(
      // The function, not the view: it reads only these decisions' events (the view replays them all).
      sql`SELECT decision_id, events, mismatch FROM decision_state_check_of(${ids}::int[]) WHERE mismatch IS NOT NULL`),
  ])
  const group = <T extends { decisionId: number }>(list: T[]) => {
    const map = new Map<number, T[]>()
    for (const item of list) map.set(item.decisionId, [...(map.get(item.decisionId) ?? []), item])
    return map
  }
  const eventsOf = group(events)
  const revisionsOf = group(revisions)
  const entriesOf = group(entries.map(x => ({ ...x, decisionId: Number(x.subjectId) })))
  const mismatchOf = new Map(states.rows.map(s => [s.decision_id, s]))
  // Rows of the other tables the ledger holds for these decisions, loaded by the entries' ids.
  const others = new Map<string, Record<string, unknown>>()
  const otherIds = new Map<string, number[]>()
  for (const x of entries) {
    if (!x.recordTable || x.recordTable === 'decision_events' || x.recordTable === 'decision_revisions' || !RECORD_SOURCES[x.recordTable]) continue
    otherIds.set(x.recordTable, [...(otherIds.get(x.recordTable) ?? []), x.recordId!])
  }
  for (const [table, tableIds] of otherIds) {
    const source = RECORD_SOURCES[table]!
    for (const row of await source.load(db, tableIds)) others.set(`${table}:${source.id(row)}`, row)
  }

  for (const decisionId of decisionIds) {
    const problems: LedgerProblem[] = []
    const own = eventsOf.get(decisionId) ?? []
    const chain = checkChain(own)
    const recorded = new Map((entriesOf.get(decisionId) ?? []).filter(x => x.recordTable).map(x => [`${x.recordTable}:${x.recordId}`, x]))
    for (const event of own) {
      const entry = recorded.get(`decision_events:${event.id}`)
      if (!entry) problems.push({ kind: 'altered', decisionId, detail: `Event #${event.seq} (${event.type}) is not in the ledger: it was added behind its back` })
      else if (entry.recordHash !== event.hash) problems.push({ kind: 'altered', decisionId, seq: entry.seq, detail: `Event #${event.seq} (${event.type}) no longer has the hash ledger entry #${entry.seq} recorded: it was changed and rehashed` })
      recorded.delete(`decision_events:${event.id}`)
    }
    for (const revision of revisionsOf.get(decisionId) ?? []) {
      const entry = recorded.get(`decision_revisions:${revision.id}`)
      if (!entry) problems.push({ kind: 'altered', decisionId, detail: `Revision ${revision.revision} is not in the ledger: it was added behind its back` })
      else if (revisionContent && entry.recordHash !== revisionHash(revision as RevisionRow)) problems.push({ kind: 'altered', decisionId, seq: entry.seq, detail: `Revision ${revision.revision} was changed after ledger entry #${entry.seq} recorded it` })
      recorded.delete(`decision_revisions:${revision.id}`)
    }
    // The decision's other records (verification records): each against the hash its entry holds.
    for (const entry of recorded.values()) {
      const source = RECORD_SOURCES[entry.recordTable!]
      const row = others.get(`${entry.recordTable}:${entry.recordId}`)
      const noun = source ? `${source.noun[0]!.toUpperCase()}${source.noun.slice(1)}` : 'A record'
      if (!row) problems.push({ kind: 'gap', decisionId, seq: entry.seq, detail: `${noun} recorded in ledger entry #${entry.seq} is gone` })
      else if (source!.hash(row) !== entry.recordHash) problems.push({ kind: 'altered', decisionId, seq: entry.seq, detail: `${source!.describe(row)} was changed after ledger entry #${entry.seq} recorded it` })
    }
    const state = mismatchOf.get(decisionId)
    if (state) {
      problems.push(state.events === 0
        ? { kind: 'gap', decisionId, detail: 'It has no events left: its history is gone' }
        : { kind: 'state', decisionId, detail: `Its row disagrees with its history: ${state.mismatch}` })
    }
    const last = own.at(-1)
    result.set(decisionId, {
      check: { ...chain, valid: chain.valid && problems.length === 0, problems },
      tail: { events: own.length, lastAt: last?.createdAt ?? null, lastHash: last?.hash ?? null },
    })
  }
  return result
}
