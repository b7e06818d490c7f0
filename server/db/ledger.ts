// The ledger: one append-only sequence across all decisions and everything the record depends on,
// each entry chained to the one before. Relative imports only: the server, the demo seed and the
// ledger scripts (npm run ledger:verify, ledger:rotate-key) all append and read through here.
//
// An entry commits to one record by its hash (a decision event's chained hash, a revision's
// content hash, a ruleset's, a signing key's). Whoever writes such a record calls appendLedgerEntry
// inside the same transaction. Appends take one transaction-scoped advisory lock, so the global
// sequence is gap-free: a missing number always means a removed entry.
import { createHash } from 'node:crypto'
import canonicalize from 'canonicalize'
import { desc, sql } from 'drizzle-orm'
import * as schema from './schema'
import type { DbOrTx } from './types'

export const LEDGER_GENESIS = '0'.repeat(64)

export type LedgerDbOrTx = DbOrTx

// An arbitrary number of our own, the key of the advisory lock that serializes appends.
const LEDGER_LOCK = 4_527_110_351

export function sha256Hex(text: string): string {
  return createHash('sha256').update(text).digest('hex')
}

/** sha256 of the RFC 8785 canonical JSON of a value: the same input gives the same hash whatever its key order. */
export function canonicalHash(value: unknown): string {
  return sha256Hex(canonicalize(value) ?? 'null')
}

/** The kinds of subject an entry belongs to; a new kind of record adds its own. */
export type LedgerSubjectType = 'decision' | 'ruleset' | 'signing-key' | (string & {})

export type LedgerFields = {
  seq: number
  subjectType: string
  subjectId: string
  type: string
  recordTable: string | null
  recordId: number | null
  recordHash: string
  createdAt: Date
}

/** hash = sha256(previous entry's hash + RFC 8785 canonical JSON of the entry's fields); the first entry chains onto 64 zeros. */
export function ledgerEntryHash(prevHash: string, entry: LedgerFields): string {
  return sha256Hex(prevHash + canonicalize({
    seq: entry.seq,
    subjectType: entry.subjectType,
    subjectId: entry.subjectId,
    type: entry.type,
    recordTable: entry.recordTable,
    recordId: entry.recordId,
    recordHash: entry.recordHash,
    createdAt: entry.createdAt.toISOString(),
  }))
}

/** Serializes appends until the caller's transaction ends. */
export async function lockLedger(tx: LedgerDbOrTx) {
  await tx.execute(sql`SELECT pg_advisory_xact_lock(${LEDGER_LOCK})`)
}

/** The last entry's sequence number and hash (0 and the genesis hash for an empty ledger). */
export async function ledgerHead(db: LedgerDbOrTx) {
  const [last] = await db.select({ seq: schema.ledgerEntries.seq, hash: schema.ledgerEntries.hash })
    .from(schema.ledgerEntries).orderBy(desc(schema.ledgerEntries.seq)).limit(1)
  return last ?? { seq: 0, hash: LEDGER_GENESIS }
}

/**
 * Appends one entry inside the caller's transaction (READ COMMITTED, as every transaction of the
 * app: the head is read after the lock is taken, so it is the previous holder's committed entry).
 * The lock is held until the transaction ends, so keep what follows an append short.
 */
export type LedgerEntryInput = {
  subjectType: LedgerSubjectType
  subjectId: string | number
  type: string
  record?: { table: string; id: number }
  recordHash: string
}

export async function appendLedgerEntry(tx: LedgerDbOrTx, input: LedgerEntryInput) {
  const [entry] = await appendLedgerEntries(tx, [input])
  return entry!
}

/** Appends entries in the order given, chained one to the next, in one statement (bulk writers: the scale seed). */
export async function appendLedgerEntries(tx: LedgerDbOrTx, inputs: LedgerEntryInput[]) {
  if (!inputs.length) return []
  await lockLedger(tx)
  let { seq, hash } = await ledgerHead(tx)
  // Millisecond precision, what a JS Date keeps, so the stored time hashes the same on read.
  const createdAt = new Date()
  const rows = inputs.map((input) => {
    const fields: LedgerFields = {
      seq: ++seq,
      subjectType: input.subjectType,
      subjectId: String(input.subjectId),
      type: input.type,
      recordTable: input.record?.table ?? null,
      recordId: input.record?.id ?? null,
      recordHash: input.recordHash,
      createdAt,
    }
    const row = { ...fields, prevHash: hash, hash: ledgerEntryHash(hash, fields) }
    hash = row.hash
    return row
  })
  return tx.insert(schema.ledgerEntries).values(rows).returning()
}
