// The Drizzle client's type and a transaction's, for code that works either way. Relative imports
// only: the demo seed and scripts load this under plain Node.
import type { NodePgDatabase } from 'drizzle-orm/node-postgres'
import type * as schema from './schema'

export type Db = NodePgDatabase<typeof schema>
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]
export type DbOrTx = Db | Tx
