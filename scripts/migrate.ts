// Applies the committed drizzle-kit migrations (server/db/migrations) to DATABASE_URL.
import { drizzle } from 'drizzle-orm/node-postgres'
import { migrate } from 'drizzle-orm/node-postgres/migrator'
import pg from 'pg'

const url = process.env.DATABASE_URL ?? process.env.NUXT_DATABASE_URL
if (!url) throw new Error('DATABASE_URL is not set')

const pool = new pg.Pool({ connectionString: url, max: 1 })
await migrate(drizzle(pool), { migrationsFolder: new URL('../server/db/migrations', import.meta.url).pathname })
await pool.end()
console.log('[eddyledger] database migrated')
