// Applies the committed drizzle-kit migrations (server/db/migrations) as the database's owner
// (DATABASE_OWNER_URL; DATABASE_URL when there is no separate owner), then brings history written
// before the ledger existed into it (once).
import { drizzle } from 'drizzle-orm/node-postgres'
import { migrate } from 'drizzle-orm/node-postgres/migrator'
import pg from 'pg'
import { adoptExistingHistory } from '../server/db/ledger-adopt'
import * as schema from '../server/db/schema'

const url = process.env.DATABASE_OWNER_URL || process.env.DATABASE_URL || process.env.NUXT_DATABASE_URL
if (!url) throw new Error('DATABASE_OWNER_URL (or DATABASE_URL) is not set')

const pool = new pg.Pool({ connectionString: url, max: 1 })
await migrate(drizzle(pool), { migrationsFolder: new URL('../server/db/migrations', import.meta.url).pathname })
const adopted = await adoptExistingHistory(drizzle(pool, { schema }))
await pool.end()
console.log(`[eddyledger] database migrated${adopted ? `; ${adopted} earlier history rows entered into the ledger` : ''}`)
