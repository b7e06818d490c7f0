// Signed checkpoints of the ledger and their receipts. A checkpoint signs the head (sequence number,
// hash, time) with the Ed25519 key that never enters the database; its receipt leaves the database
// by mail and download. Whoever rewrites the history and recomputes every hash changes the hash at
// a checkpointed sequence number, which then no longer matches the signature, nor the receipts the
// auditors keep. Relative imports only (the ledger scripts use it too).
import type { KeyObject } from 'node:crypto'
import canonicalize from 'canonicalize'
import { asc, desc, eq, sql } from 'drizzle-orm'
import { LEDGER_GENESIS, ledgerEntryHash, ledgerHead, type LedgerDbOrTx } from './ledger'
import { recordSigningKey } from './ledger-records'
import { signText, verifyText, type SigningKey } from './ledger-keys'
import * as schema from './schema'
import type { Db } from './types'

export type Checkpoint = typeof schema.ledgerCheckpoints.$inferSelect
export type CheckpointReason = 'count' | 'time' | 'request' | 'rotation'
type SignedFields = Pick<Checkpoint, 'number' | 'seq' | 'hash' | 'signedAt' | 'keyId'>

// Any number of our own: checkpoints are numbered under this lock, so their numbers have no gaps.
const CHECKPOINT_LOCK = 4_527_110_352

/** What is signed: a fixed prefix and the RFC 8785 JSON of the checkpoint's fields. */
export function checkpointMessage(c: SignedFields) {
  return `eddyledger-checkpoint-v1\n${canonicalize({
    number: c.number, seq: c.seq, hash: c.hash, signedAt: c.signedAt.toISOString(), keyId: c.keyId,
  })}`
}

export function checkpointSignatureHolds(c: SignedFields & { signature: string }, trusted: Map<string, KeyObject>) {
  const key = trusted.get(c.keyId)
  return Boolean(key && verifyText(key, checkpointMessage(c), c.signature))
}

/**
 * The key is listed (with its ledger entry) the first time it signs; a key that is listed but no
 * longer the newest is retired and signs nothing more.
 */
export async function activateSigningKey(tx: LedgerDbOrTx, key: SigningKey): Promise<string | null> {
  await recordSigningKey(tx, { keyId: key.keyId, publicKey: key.publicPem })
  const [newest] = await tx.select({ keyId: schema.ledgerKeys.keyId }).from(schema.ledgerKeys)
    .orderBy(desc(schema.ledgerKeys.id)).limit(1)
  return newest?.keyId === key.keyId
    ? null
    : `The signing key ${key.keyId} was retired (the ledger's active key is ${newest?.keyId}); configure the active key`
}

/**
 * Checks that the ledger still extends a checkpoint: the entry at its sequence number holds the
 * signed hash, and every later entry up to `toSeq` links to the one before and hashes to itself.
 * Null when it does, else what broke.
 */
export async function checkExtends(db: LedgerDbOrTx, from: { seq: number; hash: string; number?: number }, toSeq: number) {
  const name = from.number ? `checkpoint #${from.number}` : `entry #${from.seq}`
  let prev = from.seq === 0 ? { seq: 0, hash: LEDGER_GENESIS } : null
  if (!prev) {
    const [at] = await db.select({ seq: schema.ledgerEntries.seq, hash: schema.ledgerEntries.hash })
      .from(schema.ledgerEntries).where(eq(schema.ledgerEntries.seq, from.seq))
    if (!at) return `entry #${from.seq}, signed by ${name}, is gone`
    prev = at
  }
  if (prev.hash !== from.hash) return `entry #${from.seq} no longer holds the hash ${name} signed`
  const BATCH = 5000
  while (prev.seq < toSeq) {
    const rows = await db.select().from(schema.ledgerEntries)
      .where(sql`${schema.ledgerEntries.seq} > ${prev.seq} AND ${schema.ledgerEntries.seq} <= ${toSeq}`)
      .orderBy(asc(schema.ledgerEntries.seq)).limit(BATCH)
    if (!rows.length) return `entries after #${prev.seq} are gone`
    for (const row of rows) {
      if (row.seq !== prev.seq + 1) return `entries #${prev.seq + 1}–#${row.seq - 1} are missing`
      if (row.prevHash !== prev.hash) return `entry #${row.seq} does not link to entry #${prev.seq}`
      if (ledgerEntryHash(row.prevHash, row) !== row.hash) return `entry #${row.seq} no longer hashes to its stored hash`
      prev = row
    }
  }
  return null
}


/**
 * Signs the ledger's head. Refused (with the reason) when the key is retired, the ledger is empty,
 * or the head no longer extends the last checkpoint: a rewritten history is never signed over.
 * `onlyIfMoved` skips signing when nothing was appended since the last checkpoint.
 */
export async function createCheckpoint(db: Db, key: SigningKey, reason: CheckpointReason, options: {
  onlyIfMoved?: boolean
  /** Runs in the checkpoint's transaction: the receipt's mail is written with it or not at all. */
  onSigned?: (tx: LedgerDbOrTx, checkpoint: Checkpoint) => Promise<void>
} = {}) {
  return db.transaction(async (tx): Promise<{ checkpoint: Checkpoint } | { refused: string } | { skipped: true }> => {
    await tx.execute(sql`SELECT pg_advisory_xact_lock(${CHECKPOINT_LOCK})`)
    const retired = await activateSigningKey(tx, key)
    if (retired) return { refused: retired }
    const head = await ledgerHead(tx)
    if (head.seq === 0) return { refused: 'The ledger is empty: there is nothing to sign yet' }
    const [last] = await tx.select().from(schema.ledgerCheckpoints).orderBy(desc(schema.ledgerCheckpoints.number)).limit(1)
    if (options.onlyIfMoved && last && last.seq >= head.seq) return { skipped: true }
    if (last) {
      const broken = await checkExtends(tx, last, head.seq)
      if (broken) return { refused: `The ledger no longer extends checkpoint #${last.number}: ${broken}. Nothing was signed; run the ledger verification` }
    }
    const fields: SignedFields = { number: (last?.number ?? 0) + 1, seq: head.seq, hash: head.hash, signedAt: new Date(), keyId: key.keyId }
    const [checkpoint] = await tx.insert(schema.ledgerCheckpoints)
      .values({ ...fields, signature: signText(key, checkpointMessage(fields)), reason }).returning()
    await options.onSigned?.(tx, checkpoint!)
    return { checkpoint: checkpoint! }
  })
}

/** The last checkpoint and how far the ledger has moved past it, for the timer's count and time rules. */
export async function checkpointLag(db: LedgerDbOrTx) {
  const [last] = await db.select().from(schema.ledgerCheckpoints).orderBy(desc(schema.ledgerCheckpoints.number)).limit(1)
  const head = await ledgerHead(db)
  return { last: last ?? null, head, entriesSince: head.seq - (last?.seq ?? 0) }
}

// ---- receipts

export const RECEIPT_TITLE = 'Eddyledger ledger checkpoint'

export function receiptText(c: Checkpoint) {
  return [
    RECEIPT_TITLE,
    `checkpoint: ${c.number}`,
    `seq: ${c.seq}`,
    `hash: ${c.hash}`,
    `signed-at: ${c.signedAt.toISOString()}`,
    `key: ${c.keyId}`,
    `signature: ${c.signature}`,
  ].join('\n')
}

const REASON_WORDS: Record<CheckpointReason, string> = {
  count: 'after its scheduled number of new entries',
  time: 'on its scheduled interval',
  request: 'on request',
  rotation: 'at a change of signing key',
}

/** The auditors' mail for a checkpoint: the receipt to keep, and where to check it later. */
export function receiptMail(c: Checkpoint, appUrl: string) {
  return {
    subject: `Ledger checkpoint #${c.number} at entry #${c.seq}`,
    text: [
      `Eddyledger signed its ledger at entry #${c.seq} (checkpoint #${c.number}, ${REASON_WORDS[c.reason as CheckpointReason] ?? c.reason}).`,
      '',
      'Keep this receipt outside Eddyledger. To check later that the ledger still holds this history,',
      `paste it under Ledger, "Check a receipt" (${appUrl}/ledger).`,
      '',
      receiptText(c),
    ].join('\n'),
  }
}

export const receiptFilename = (c: Pick<Checkpoint, 'number'>) => `eddyledger-checkpoint-${c.number}.txt`

export type Receipt = SignedFields & { signature: string }

/**
 * Reads a receipt as mailed or downloaded, also when quoted in a reply ("> " before each line) or
 * given as JSON with the same fields. An error message when it is not a whole receipt.
 */
export function parseReceipt(text: string): Receipt | { error: string } {
  let fields: Record<string, string> = {}
  const trimmed = text.trim()
  if (trimmed.startsWith('{')) {
    try {
      const json = JSON.parse(trimmed) as Record<string, unknown>
      fields = Object.fromEntries(Object.entries(json).map(([k, v]) => [k.toLowerCase().replace(/[-_]/g, ''), String(v)]))
    } catch {
      return { error: 'The receipt looks like JSON but does not parse' }
    }
  } else {
    for (const raw of trimmed.split(/\r?\n/)) {
      const line = raw.replace(/^[>\s]+/, '')
      const match = line.match(/^([A-Za-z-]+):\s*(\S+)\s*$/)
      if (match) fields[match[1]!.toLowerCase().replace(/-/g, '')] = match[2]!
    }
  }
  const names: Record<string, string> = { checkpoint: 'checkpoint', seq: 'seq', hash: 'hash', signedat: 'signed-at', key: 'key', signature: 'signature' }
  const missing = Object.keys(names).filter(f => !fields[f] && !(f === 'key' && fields.keyid))
  if (missing.length) return { error: `The receipt lacks ${missing.map(f => names[f]).join(', ')}: paste the whole receipt as it was mailed or downloaded` }
  const number = Number(fields.checkpoint ?? fields.number)
  const seq = Number(fields.seq)
  const signedAt = new Date(fields.signedat!)
  if (!Number.isInteger(number) || number < 1) return { error: 'The receipt\'s checkpoint number is not a positive whole number' }
  if (!Number.isInteger(seq) || seq < 1) return { error: 'The receipt\'s seq is not a positive whole number' }
  if (!/^[0-9a-f]{64}$/.test(fields.hash!)) return { error: 'The receipt\'s hash is not 64 hexadecimal digits' }
  if (Number.isNaN(signedAt.getTime())) return { error: 'The receipt\'s signed-at is not a date and time' }
  return { number, seq, hash: fields.hash!, signedAt, keyId: (fields.key ?? fields.keyid)!, signature: fields.signature! }
}

/** Whether today's ledger still holds the head a receipt signed. */
export async function checkReceipt(db: LedgerDbOrTx, receipt: Receipt, trusted: Map<string, KeyObject>): Promise<{ matches: boolean; detail: string }> {
  const signed = `checkpoint #${receipt.number} of ${receipt.signedAt.toISOString()}`
  if (!trusted.has(receipt.keyId)) {
    return { matches: false, detail: `The receipt names the key ${receipt.keyId}, which is not one of this ledger's signing keys` }
  }
  if (!checkpointSignatureHolds(receipt, trusted)) {
    return { matches: false, detail: `The signature does not hold for the receipt's content: the receipt was altered after it was signed` }
  }
  const head = await ledgerHead(db)
  if (head.seq < receipt.seq) {
    return { matches: false, detail: `Today's ledger ends at entry #${head.seq}: entries up to #${receipt.seq}, which ${signed} signed, are gone` }
  }
  const [entry] = await db.select({ hash: schema.ledgerEntries.hash }).from(schema.ledgerEntries).where(eq(schema.ledgerEntries.seq, receipt.seq))
  if (entry && entry.hash !== receipt.hash) {
    return { matches: false, detail: `Entry #${receipt.seq} now holds the hash ${entry.hash.slice(0, 12)}…, not ${receipt.hash.slice(0, 12)}… as ${signed} signed: the history up to it was rewritten` }
  }
  // The stored hash alone proves nothing: the chain up to it must recompute from the first entry.
  const broken = await checkExtends(db, { seq: 0, hash: LEDGER_GENESIS }, receipt.seq)
  if (broken) return { matches: false, detail: `The history up to entry #${receipt.seq} no longer holds: ${broken}` }
  const [own] = await db.select().from(schema.ledgerCheckpoints).where(eq(schema.ledgerCheckpoints.number, receipt.number))
  const note = !own
    ? ` (the ledger's own copy of checkpoint #${receipt.number} is missing)`
    : own.signature !== receipt.signature || own.seq !== receipt.seq ? ` (the ledger's own copy of checkpoint #${receipt.number} differs from this receipt)` : ''
  return { matches: true, detail: `Today's ledger still holds this head: entry #${receipt.seq} has the signed hash and every entry up to it recomputes${note}` }
}

export async function listCheckpoints(db: LedgerDbOrTx, page: number, pageSize: number) {
  const rows = await db.select().from(schema.ledgerCheckpoints).orderBy(desc(schema.ledgerCheckpoints.number))
    .limit(pageSize).offset((page - 1) * pageSize)
  const [count] = await db.select({ n: sql<number>`count(*)::int` }).from(schema.ledgerCheckpoints)
  return { rows, total: count?.n ?? 0 }
}
