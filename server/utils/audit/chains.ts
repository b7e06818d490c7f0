// The chain check of each decision of a page or an export batch, from one read of their events
// (the decisions passed as one array, not a parameter each): the same check as verifyChain.
import { asc, sql } from 'drizzle-orm'
import { checkChain } from '../../db/event-chain'
import type { DbOrTx } from '../../db/types'
import { tables } from '../db'

const events = tables.decisionEvents

export type ChainFacts = { chain: ReturnType<typeof checkChain>; eventCount: number; lastEventAt: Date | null; lastHash: string | null }

export async function chainFacts(db: DbOrTx, decisionIds: number[]) {
  const result = new Map<number, ChainFacts>()
  if (!decisionIds.length) return result
  const rows = await db.select().from(events)
    .where(sql`${events.decisionId} = ANY(${`{${decisionIds.join(',')}}`}::int[])`)
    .orderBy(asc(events.decisionId), asc(events.seq))
  const byDecision = new Map<number, typeof rows>()
  for (const row of rows) {
    const list = byDecision.get(row.decisionId) ?? []
    list.push(row)
    byDecision.set(row.decisionId, list)
  }
  for (const id of decisionIds) {
    const list = byDecision.get(id) ?? []
    const last = list.at(-1)
    result.set(id, { chain: checkChain(list), eventCount: list.length, lastEventAt: last?.createdAt ?? null, lastHash: last?.hash ?? null })
  }
  return result
}
