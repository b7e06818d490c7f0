// Starts the built app (.output) against a fresh, migrated and seeded database of the throwaway
// cluster that scripts/test.sh runs. Used once per API run (global setup) and by Playwright.
import { spawn } from 'node:child_process'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { drizzle } from 'drizzle-orm/node-postgres'
import { migrate } from 'drizzle-orm/node-postgres/migrator'
import pg from 'pg'
import * as schema from '../../server/db/schema'
import { seedDemo } from '../../server/db/seed-demo'
import { serverNodeArgs } from '../../scripts/lib/server-node'

export const DEMO_PASSWORD = process.env.DEMO_PASSWORD || 'ledger-demo-2026'

function required(name: string) {
  const value = process.env[name]
  if (!value) throw new Error(`${name} is not set: run the tests through npm test (scripts/test.sh)`)
  return value
}

/**
 * The owner's connection (eddyledger_owner: migrations, and whatever a test does behind the
 * application's back). The server itself connects as the app role: appDatabaseUrl.
 */
export function databaseUrl(database: string) {
  return `postgres://eddyledger_owner:eddyledger_owner@${required('TEST_PG_HOST_PORT')}/${database}`
}

/** The server's connection: eddyledger, a member of eddyledger_app (migration 0007's grants). */
export function appDatabaseUrl(database: string) {
  return `postgres://eddyledger:eddyledger@${required('TEST_PG_HOST_PORT')}/${database}`
}

export async function freshDatabase(database: string) {
  const admin = new pg.Client({ connectionString: required('TEST_PG_ADMIN_URL') })
  await admin.connect()
  await admin.query(`DROP DATABASE IF EXISTS ${database} WITH (FORCE)`)
  await admin.query(`CREATE DATABASE ${database} OWNER eddyledger_owner`)
  await admin.end()
  const pool = new pg.Pool({ connectionString: databaseUrl(database), max: 1 })
  const db = drizzle(pool, { schema })
  await migrate(db, { migrationsFolder: new URL('../../server/db/migrations', import.meta.url).pathname })
  await seedDemo(db, await new Hash(new Scrypt({})).make(DEMO_PASSWORD))
  await pool.end()
  return databaseUrl(database)
}

export async function startServer(options: { database: string; port: number; env?: Record<string, string>; keepDatabase?: boolean }) {
  // keepDatabase: a restart on the data a previous server left behind.
  const url = options.keepDatabase ? databaseUrl(options.database) : await freshDatabase(options.database)
  const base = `http://127.0.0.1:${options.port}`
  const child = spawn(process.execPath, [...serverNodeArgs(), `${process.env.EDDY_OUTPUT_DIR || '.output'}/server/index.mjs`], {
    stdio: ['ignore', 'inherit', 'inherit'],
    env: {
      ...process.env,
      HOST: '127.0.0.1',
      PORT: String(options.port),
      NUXT_DATABASE_URL: appDatabaseUrl(options.database),
      NUXT_APP_URL: base,
      NUXT_SMTP_PORT: process.env.TEST_SMTP_PORT ?? '1025',
      // Tests give each scenario its own client address through X-Forwarded-For.
      NUXT_LOGIN_LIMIT_TRUST_PROXY: 'true',
      ...options.env,
    },
  })
  const deadline = Date.now() + 30_000
  for (;;) {
    if (child.exitCode !== null) throw new Error(`the test server exited with ${child.exitCode}`)
    try {
      const res = await fetch(`${base}/login`)
      if (res.ok) break
    } catch { /* not listening yet */ }
    if (Date.now() > deadline) throw new Error('the test server did not start within 30 s')
    await new Promise(r => setTimeout(r, 200))
  }
  return {
    url: base,
    // The owner's connection, for tests that reach the database directly.
    databaseUrl: url,
    databaseOwnerUrl: url,
    databaseAppUrl: appDatabaseUrl(options.database),
    stop: () => new Promise<void>((resolve) => {
      if (child.exitCode !== null) return resolve()
      child.once('exit', () => resolve())
      child.kill('SIGTERM')
    }),
  }
}

// Ports this test process has handed out: a port closed before its server binds it could be
// handed out again, and two servers started from one test would then fight over it.
const handedOut = new Set<number>()

export async function freePort(): Promise<number> {
  const net = await import('node:net')
  for (;;) {
    const port = await new Promise<number>((resolve, reject) => {
      const server = net.createServer()
      server.once('error', reject)
      server.listen(0, '127.0.0.1', () => {
        const { port } = server.address() as { port: number }
        server.close(() => resolve(port))
      })
    })
    if (!handedOut.has(port)) {
      handedOut.add(port)
      return port
    }
  }
}
