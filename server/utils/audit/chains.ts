// The check of each decision of a page or an export batch (chain, ledger entries, state: verifyChain's
// check but for rehashing the revisions' stored advice, see checkDecisions), with the tail of its
// history from the same read of its events, for all of them at once (the decisions passed as one
// array, not a parameter each).
import { checkDecisionsWithTails, type DecisionCheck } from '../../db/ledger-decision-check'
import type { DbOrTx } from '../../db/types'

export type ChainFacts = { chain: DecisionCheck; eventCount: number; lastEventAt: Date | null; lastHash: string | null }

export async function chainFacts(db: DbOrTx, decisionIds: number[]) {
  const result = new Map<number, ChainFacts>()
  for (const [id, { check, tail }] of await checkDecisionsWithTails(db, decisionIds, { revisionContent: false })) {
    result.set(id, { chain: check, eventCount: tail.events, lastEventAt: tail.lastAt, lastHash: tail.lastHash })
  }
  return result
}
