// Reads that may run side by side. On the pool each takes a connection of its own; in a transaction
// they share one, where node-postgres wants one query at a time (queuing them on a busy client is
// deprecated), so there they run in turn. Relative imports only: scripts load this under plain Node.
import { PgTransaction } from 'drizzle-orm/pg-core'
import type { DbOrTx } from './types'

export async function readAll<T extends readonly unknown[]>(db: DbOrTx, reads: { [K in keyof T]: () => PromiseLike<T[K]> }): Promise<T> {
  if (!(db instanceof PgTransaction)) return Promise.all(reads.map(read => read())) as Promise<unknown> as Promise<T>
  const results: unknown[] = []
  for (const read of reads) results.push(await read())
  return results as unknown as T
}
