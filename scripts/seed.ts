// Seeds the demo scenario when the database is empty; `--force` wipes and reseeds.
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { sql } from 'drizzle-orm'
import { drizzle } from 'drizzle-orm/node-postgres'
import { migrate } from 'drizzle-orm/node-postgres/migrator'
import pg from 'pg'
import * as schema from '../server/db/schema'
import { seedDemo } from '../server/db/seed-demo'

// As the owner: a reseed drops and recreates the schema.
const url = process.env.DATABASE_OWNER_URL || process.env.DATABASE_URL || process.env.NUXT_DATABASE_URL
if (!url) throw new Error('DATABASE_OWNER_URL (or DATABASE_URL) is not set')
const force = process.argv.includes('--force')
const password = process.env.DEMO_PASSWORD || 'ledger-demo-2026'

const pool = new pg.Pool({ connectionString: url, max: 1 })
const db = drizzle(pool, { schema })

if (force) {
  // History is append-only by trigger, so a reseed starts from an empty schema instead of deleting rows.
  await db.execute(sql`DROP SCHEMA IF EXISTS drizzle CASCADE`)
  await db.execute(sql`DROP SCHEMA public CASCADE`)
  await db.execute(sql`CREATE SCHEMA public`)
  await migrate(drizzle(pool), { migrationsFolder: new URL('../server/db/migrations', import.meta.url).pathname })
}

const [{ count }] = (await db.execute<{ count: number }>(sql`SELECT count(*)::int AS count FROM users`)).rows
if (count > 0) {
  console.log('[eddyledger] database already has data; not seeding (npm run db:seed reseeds)')
} else {
  // Same scrypt defaults as nuxt-auth-utils' hashPassword, so verifyPassword accepts these hashes.
  const hasher = new Hash(new Scrypt({}))
  await seedDemo(db, await hasher.make(password))
  console.log('[eddyledger] demo data seeded')
}
await pool.end()
