// The ruleset history: one append-only hash chain over every version's installation and
// publication, hashed like the decision record (server/db/event-chain.ts). Relative imports only:
// the demo seed writes the same chain under plain Node.
import { asc, desc, sql } from 'drizzle-orm'
import type { Role } from '../../../shared/utils/roles'
import { GENESIS_HASH, chainedEventHash } from '../../db/event-chain'
import { recordInLedger } from '../../db/ledger-records'
import * as schema from '../../db/schema'
import type { DbOrTx } from '../../db/types'

export type RulesetEventType = (typeof schema.RULESET_EVENT_TYPES)[number]

export type RulesetHashedFields = {
  seq: number
  rulesetId: number
  type: RulesetEventType
  actorId: number | null
  actorRole: string | null
  payload: unknown
  createdAt: Date
}

// Serialises writers of the catalogue (publication, installation): one chain, one published version.
const CATALOGUE_LOCK = 7_420_013

/** Holds the catalogue's lock until the transaction ends. */
export async function lockRulesetCatalogue(tx: DbOrTx) {
  await tx.execute(sql`SELECT pg_advisory_xact_lock(${CATALOGUE_LOCK})`)
}

export function rulesetEventHash(prevHash: string, event: RulesetHashedFields): string {
  return chainedEventHash(prevHash, { rulesetId: event.rulesetId }, event)
}

/** Appends one event inside the caller's transaction, which must hold the catalogue's lock. */
export async function appendRulesetEvent(tx: DbOrTx, input: {
  rulesetId: number
  type: RulesetEventType
  actor: { id: number; role: Role } | null
  payload?: Record<string, unknown>
  at?: Date
}) {
  const [last] = await tx.select({ seq: schema.rulesetEvents.seq, hash: schema.rulesetEvents.hash })
    .from(schema.rulesetEvents).orderBy(desc(schema.rulesetEvents.seq)).limit(1)
  const fields: RulesetHashedFields = {
    seq: (last?.seq ?? 0) + 1,
    rulesetId: input.rulesetId,
    type: input.type,
    actorId: input.actor?.id ?? null,
    actorRole: input.actor?.role ?? null,
    // Round-trip through JSON so the hash covers exactly what jsonb gives back.
    payload: JSON.parse(JSON.stringify(input.payload ?? {})),
    createdAt: input.at ?? new Date(),
  }
  const prevHash = last?.hash ?? GENESIS_HASH
  const [event] = await tx.insert(schema.rulesetEvents).values({
    ...fields,
    actorRole: input.actor?.role ?? null,
    payload: fields.payload as Record<string, unknown>,
    prevHash,
    hash: rulesetEventHash(prevHash, fields),
  }).returning()
  await recordInLedger(tx, 'ruleset_events', event!)
  return event!
}

/** Recomputes the chain in sequence order; the first event whose link or hash fails is reported. */
export function checkRulesetChain(events: (RulesetHashedFields & { id: number; prevHash: string; hash: string })[]) {
  let prevHash = GENESIS_HASH
  for (const [index, event] of events.entries()) {
    if (event.seq !== index + 1 || event.prevHash !== prevHash || event.hash !== rulesetEventHash(prevHash, event)) {
      return { valid: false, checked: index + 1, brokenAt: event.id as number | null }
    }
    prevHash = event.hash
  }
  return { valid: true, checked: events.length, brokenAt: null as number | null }
}

export async function readRulesetHistory(db: DbOrTx) {
  return db.select().from(schema.rulesetEvents).orderBy(asc(schema.rulesetEvents.seq))
}
