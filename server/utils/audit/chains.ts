// The check of each decision of a page or an export batch (chain, ledger entries, state: verifyChain's
// check but for rehashing the revisions' stored advice, see checkDecisions), plus the tail of its history, from one read per kind for all of them (the
// decisions passed as one array, not a parameter each).
import { sql } from 'drizzle-orm'
import { checkDecisions, type DecisionCheck } from '../../db/ledger-decision-check'
import type { DbOrTx } from '../../db/types'

export type ChainFacts = { chain: DecisionCheck; eventCount: number; lastEventAt: Date | null; lastHash: string | null }

export async function chainFacts(db: DbOrTx, decisionIds: number[]) {
  const result = new Map<number, ChainFacts>()
  if (!decisionIds.length) return result
  const [checks, tails] = await Promise.all([
    checkDecisions(db, decisionIds, { revisionContent: false }),
    // Events are numbered from 1 without gaps (a gap fails the chain check), so the last one's number counts them.
    db.execute<{ decision_id: number; seq: number; created_at: Date | string; hash: string }>(sql`
      SELECT DISTINCT ON (decision_id) decision_id, seq, created_at, hash FROM decision_events
      WHERE decision_id = ANY(${`{${decisionIds.join(',')}}`}::int[]) ORDER BY decision_id, seq DESC`),
  ])
  const tailOf = new Map(tails.rows.map(t => [Number(t.decision_id), t]))
  for (const id of decisionIds) {
    const tail = tailOf.get(id)
    result.set(id, {
      chain: checks.get(id)!,
      eventCount: tail ? Number(tail.seq) : 0,
      lastEventAt: tail ? new Date(tail.created_at) : null,
      lastHash: tail?.hash ?? null,
    })
  }
  return result
}
