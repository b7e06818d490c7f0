import { asc, eq } from 'drizzle-orm'
import {
  GENESIS_HASH, appendChainedEvent, checkChain, eventHash, type DbOrTx, type DecisionEventType,
} from '../db/event-chain'
import type { SessionUser } from './auth'

// The chain itself lives in server/db/event-chain.ts (plain Node can load it, so the demo seed
// writes the same chain); these are the server's entry points.
export { GENESIS_HASH, eventHash }
export type { DbOrTx, DecisionEventType }

/** Appends one event to a decision's chain inside the caller's transaction. */
export function appendEvent(tx: DbOrTx, input: {
  decisionId: number
  type: DecisionEventType
  actor: SessionUser
  payload?: Record<string, unknown>
}) {
  return appendChainedEvent(tx, input)
}

/** Recomputes a decision's chain: the first event whose link or hash does not hold is reported. */
export async function verifyChain(db: DbOrTx, decisionId: number) {
  const events = await db.select().from(tables.decisionEvents)
    .where(eq(tables.decisionEvents.decisionId, decisionId)).orderBy(asc(tables.decisionEvents.seq))
  return checkChain(events)
}
