// The server's entry points to the decision record's hash chain (server/db/event-chain.ts, which
// plain Node can load too, so the demo seed writes the same chain) and to a decision's part of the
// ledger (server/db/ledger-decision-check.ts).
import type { SessionUser } from '#shared/types/session'
import { appendChainedEvent, type DecisionEventType } from '../../db/event-chain'
import { checkDecisions } from '../../db/ledger-decision-check'
import type { DbOrTx } from '../../db/types'

/** Appends one event to a decision's chain inside the caller's transaction. */
export function appendEvent(tx: DbOrTx, input: {
  decisionId: number
  type: DecisionEventType
  actor: SessionUser
  payload?: Record<string, unknown>
}) {
  return appendChainedEvent(tx, input)
}

/**
 * Recomputes a decision's chain (the first event whose link or hash does not hold is reported) and
 * checks its events, revisions and row against the ledger (server/db/ledger-decision-check.ts).
 */
export async function verifyChain(db: DbOrTx, decisionId: number) {
  return (await checkDecisions(db, [decisionId])).get(decisionId)!
}
