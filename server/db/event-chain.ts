// The decision record's hash chain and the hash of a case input. Relative imports only: used by
// the server (server/utils/decisions/events.ts) and by the demo seed under plain Node.
import canonicalize from 'canonicalize'
import { desc, eq, sql } from 'drizzle-orm'
import type { Role } from '../../shared/utils/roles'
import { appendLedgerEntry, canonicalHash, sha256Hex } from './ledger'
import * as schema from './schema'
import type { DbOrTx } from './types'

export { canonicalHash, sha256Hex }

// Each event's hash is sha256(previous hash + canonical event), the canonical form being RFC 8785
// JSON of the fields below. The first event chains onto GENESIS_HASH.
export const GENESIS_HASH = '0'.repeat(64)

export type DecisionEventType = (typeof schema.EVENT_TYPES)[number]

export type HashedFields = {
  decisionId: number
  seq: number
  type: DecisionEventType
  actorId: number
  actorRole: string
  payload: unknown
  createdAt: Date
}

/**
 * sha256(previous hash + RFC 8785 JSON of an event's fields and the key of the chain it belongs to,
 * e.g. { decisionId }): the one hash of every chained history (decisions, the ruleset history).
 */
export function chainedEventHash(
  prevHash: string,
  chainKey: Record<string, number>,
  event: { seq: number; type: string; actorId: number | null; actorRole: string | null; payload: unknown; createdAt: Date },
): string {
  const canonical = canonicalize({
    ...chainKey,
    seq: event.seq,
    type: event.type,
    actorId: event.actorId,
    actorRole: event.actorRole,
    payload: event.payload ?? {},
    createdAt: event.createdAt.toISOString(),
  })
  return sha256Hex(prevHash + canonical)
}

export function eventHash(prevHash: string, event: HashedFields): string {
  return chainedEventHash(prevHash, { decisionId: event.decisionId }, event)
}

/**
 * Appends one event to a decision's chain inside the caller's transaction, and the event to the
 * ledger. The decision row is locked first so that two writers cannot both take the same sequence
 * number. `at` backdates the event (the demo seed only); the server always records the present,
 * and the ledger entry always carries the moment it was really written.
 */
export async function appendChainedEvent(tx: DbOrTx, input: {
  decisionId: number
  type: DecisionEventType
  actor: { id: number; role: Role }
  payload?: Record<string, unknown>
  at?: Date
}) {
  await tx.execute(sql`SELECT id FROM decisions WHERE id = ${input.decisionId} FOR UPDATE`)
  const [last] = await tx.select({ seq: schema.decisionEvents.seq, hash: schema.decisionEvents.hash })
    .from(schema.decisionEvents).where(eq(schema.decisionEvents.decisionId, input.decisionId))
    .orderBy(desc(schema.decisionEvents.seq)).limit(1)
  const fields: HashedFields = {
    decisionId: input.decisionId,
    seq: (last?.seq ?? 0) + 1,
    type: input.type,
    actorId: input.actor.id,
    actorRole: input.actor.role,
    // Round-trip through JSON so the hash covers exactly what jsonb will give back.
    payload: JSON.parse(JSON.stringify(input.payload ?? {})),
    // Millisecond precision: what a JS Date keeps, so the stored time hashes the same on read.
    createdAt: input.at ?? new Date(),
  }
  const prevHash = last?.hash ?? GENESIS_HASH
  const [event] = await tx.insert(schema.decisionEvents).values({
    ...fields,
    actorRole: input.actor.role,
    payload: fields.payload as Record<string, unknown>,
    prevHash,
    hash: eventHash(prevHash, fields),
  }).returning()
  await appendLedgerEntry(tx, {
    subjectType: 'decision',
    subjectId: input.decisionId,
    type: 'decision-event',
    record: { table: 'decision_events', id: event!.id },
    recordHash: event!.hash,
  })
  return event!
}

/** Checks a decision's events in sequence order: the first whose link or hash does not hold is reported. */
export function checkChain(events: (HashedFields & { id: number; prevHash: string; hash: string })[]) {
  let prevHash = GENESIS_HASH
  let checked = 0
  for (const [index, event] of events.entries()) {
    checked++
    const expected = eventHash(prevHash, event)
    if (event.seq !== index + 1 || event.prevHash !== prevHash || event.hash !== expected) {
      return { valid: false, checked, brokenAt: event.id as number | null }
    }
    prevHash = event.hash
  }
  return { valid: true, checked, brokenAt: null as number | null }
}
