import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import * as schema from '../db/schema'
import type { Db } from '../db/types'

export { schema as tables }
export type { Db, DbOrTx } from '../db/types'

let db: Db | undefined

export function useDb(): Db {
  if (!db) {
    const url = useRuntimeConfig().databaseUrl || process.env.DATABASE_URL
    if (!url) throw new Error('No database configured: set DATABASE_URL or NUXT_DATABASE_URL')
    db = drizzle(new pg.Pool({ connectionString: url, max: 10 }), { schema })
  }
  return db
}
