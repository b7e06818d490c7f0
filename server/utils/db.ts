import { appendFileSync } from 'node:fs'
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import * as schema from '../db/schema'
import type { Db } from '../db/types'

export { schema as tables }
export type { Db, DbOrTx } from '../db/types'

let db: Db | undefined

// EDDY_SQL_LOG=<file>: every statement and its parameters, one JSON line each, so that the
// benchmark (npm run bench:api) can EXPLAIN what each route really runs. Off unless set.
function sqlLogger(file: string | undefined) {
  if (!file) return undefined
  return { logQuery: (query: string, params: unknown[]) => appendFileSync(file, `${JSON.stringify({ query, params })}\n`) }
}

export function useDb(): Db {
  if (!db) {
    const url = useRuntimeConfig().databaseUrl || process.env.DATABASE_URL
    if (!url) throw new Error('No database configured: set DATABASE_URL or NUXT_DATABASE_URL')
    db = drizzle(new pg.Pool({ connectionString: url, max: 10 }), { schema, logger: sqlLogger(process.env.EDDY_SQL_LOG) })
  }
  return db
}
