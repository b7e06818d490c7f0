import { createHash } from 'node:crypto'
import canonicalize from 'canonicalize'
import { asc, desc, eq, sql } from 'drizzle-orm'
import type { EVENT_TYPES } from '../db/schema'
import type { SessionUser } from './auth'

// The decision record's chain: each event's hash is sha256(previous hash + canonical event), the
// canonical form being RFC 8785 JSON of the fields below. The first event chains onto GENESIS_HASH.
export const GENESIS_HASH = '0'.repeat(64)
export type DecisionEventType = (typeof EVENT_TYPES)[number]
export type DbOrTx = Db | Parameters<Parameters<Db['transaction']>[0]>[0]

type HashedFields = {
  decisionId: number
  seq: number
  type: DecisionEventType
  actorId: number
  actorRole: string
  payload: unknown
  createdAt: Date
}

export function eventHash(prevHash: string, event: HashedFields): string {
  const canonical = canonicalize({
    decisionId: event.decisionId,
    seq: event.seq,
    type: event.type,
    actorId: event.actorId,
    actorRole: event.actorRole,
    payload: event.payload ?? {},
    createdAt: event.createdAt.toISOString(),
  })
  return createHash('sha256').update(prevHash + canonical).digest('hex')
}

/**
 * Appends one event to a decision's chain inside the caller's transaction. The decision row is
 * locked first so that two writers cannot both take the same sequence number.
 */
export async function appendEvent(tx: DbOrTx, input: {
  decisionId: number
  type: DecisionEventType
  actor: SessionUser
  payload?: Record<string, unknown>
}) {
  await tx.execute(sql`SELECT id FROM decisions WHERE id = ${input.decisionId} FOR UPDATE`)
  const [last] = await tx.select({ seq: tables.decisionEvents.seq, hash: tables.decisionEvents.hash })
    .from(tables.decisionEvents).where(eq(tables.decisionEvents.decisionId, input.decisionId))
    .orderBy(desc(tables.decisionEvents.seq)).limit(1)
  const fields: HashedFields = {
    decisionId: input.decisionId,
    seq: (last?.seq ?? 0) + 1,
    type: input.type,
    actorId: input.actor.id,
    actorRole: input.actor.role,
    // Round-trip through JSON so the hash covers exactly what jsonb will give back.
    payload: JSON.parse(JSON.stringify(input.payload ?? {})),
    // Millisecond precision: what a JS Date keeps, so the stored time hashes the same on read.
    createdAt: new Date(),
  }
  const prevHash = last?.hash ?? GENESIS_HASH
  const [event] = await tx.insert(tables.decisionEvents).values({
    ...fields,
    actorRole: input.actor.role,
    payload: fields.payload as Record<string, unknown>,
    prevHash,
    hash: eventHash(prevHash, fields),
  }).returning()
  return event!
}

/** Recomputes a decision's chain: the first event whose link or hash does not hold is reported. */
export async function verifyChain(db: DbOrTx, decisionId: number) {
  const events = await db.select().from(tables.decisionEvents)
    .where(eq(tables.decisionEvents.decisionId, decisionId)).orderBy(asc(tables.decisionEvents.seq))
  let prevHash = GENESIS_HASH
  let checked = 0
  for (const [index, event] of events.entries()) {
    checked++
    const expected = eventHash(prevHash, event)
    if (event.seq !== index + 1 || event.prevHash !== prevHash || event.hash !== expected) {
      return { valid: false, checked, brokenAt: event.id }
    }
    prevHash = event.hash
  }
  return { valid: true, checked, brokenAt: null as number | null }
}
