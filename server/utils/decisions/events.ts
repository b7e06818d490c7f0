// The server's entry points to the decision record's hash chain (server/db/event-chain.ts, which
// plain Node can load too, so the demo seed writes the same chain).
import { asc, eq } from 'drizzle-orm'
import type { SessionUser } from '#shared/types/session'
import { appendChainedEvent, checkChain, type DecisionEventType } from '../../db/event-chain'
import type { DbOrTx } from '../../db/types'
import { tables } from '../db'

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
