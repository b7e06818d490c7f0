// npm run db:backup and npm run db:restore on a database of this file's own: the restored copy
// verifies in full (the script exits 0), holds the same ledger and its stored files, and carries no
// private key; the ledger check of a tampered copy exits non-zero and says what it found.
import { createHash } from 'node:crypto'
import { existsSync, mkdtempSync, readFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3'
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createCheckpoint } from '../../server/db/ledger-checkpoint'
import { keySettingsFromEnv, loadSigningKey } from '../../server/db/ledger-keys'
import { recordInLedger } from '../../server/db/ledger-records'
import * as schema from '../../server/db/schema'
import { withoutTriggers } from '../support/ledger'
import { runScript } from '../support/scripts'
import { appDatabaseUrl, databaseUrl, freshDatabase } from '../support/test-server'

const SOURCE = 'eddyledger_backup_source'
const RESTORED = 'eddyledger_backup_restored'
const dir = join(mkdtempSync(join(process.env.TEST_TMP_DIR || tmpdir(), 'backup-')), 'nightly')
const env = { ...process.env, DATABASE_URL: appDatabaseUrl(SOURCE), DATABASE_OWNER_URL: databaseUrl(SOURCE) }
const clients: pg.Client[] = []
const WALL_FILE = { key: `decisions/backup-test/${Date.now()}/wall.csv`, bytes: Buffer.from('x,y,z,yplus\n0,0,0,41.5\n1,0,0,57.2\n') }
// The run's object store (scripts/test.sh starts a local fake and exports NUXT_STORAGE_*).
const s3 = new S3Client({
  region: 'us-east-1', endpoint: process.env.NUXT_STORAGE_ENDPOINT, forcePathStyle: true,
  credentials: { accessKeyId: process.env.NUXT_STORAGE_ACCESS_KEY_ID!, secretAccessKey: process.env.NUXT_STORAGE_SECRET_ACCESS_KEY! },
})

async function connect(database: string) {
  const client = new pg.Client({ connectionString: databaseUrl(database) })
  await client.connect()
  clients.push(client)
  return client
}

const head = (client: pg.Client) => client.query('SELECT seq, hash FROM ledger_entries ORDER BY seq DESC LIMIT 1').then(r => r.rows[0])

beforeAll(async () => {
  await freshDatabase(SOURCE)
  const admin = new pg.Client({ connectionString: process.env.TEST_PG_ADMIN_URL })
  await admin.connect()
  await admin.query(`DROP DATABASE IF EXISTS ${RESTORED} WITH (FORCE)`)
  await admin.end()
  const pool = new pg.Pool({ connectionString: databaseUrl(SOURCE), max: 1 })
  const db = drizzle(pool, { schema })
  // A stored file the database names (a wall export), written as the product writes one: the object,
  // then its row with its ledger entry.
  await s3.send(new PutObjectCommand({ Bucket: process.env.NUXT_STORAGE_BUCKET, Key: WALL_FILE.key, Body: WALL_FILE.bytes, ContentType: 'text/csv' }))
  const [decision] = await db.select().from(schema.decisions).limit(1)
  await db.transaction(async (tx) => {
    const [check] = await tx.insert(schema.wallChecks).values({
      decisionId: decision!.id, uploadedBy: decision!.authorId, fileName: 'wall.csv', contentType: 'text/csv', compressed: false,
      storageKey: WALL_FILE.key, sizeBytes: WALL_FILE.bytes.length, sha256: createHash('sha256').update(WALL_FILE.bytes).digest('hex'),
      columns: { yPlus: 'yplus' } as never, band: { min: 30, max: 300 } as never, result: { rows: 2 } as never, passFraction: 0.9, verdict: 'pass',
    }).returning()
    await recordInLedger(tx, 'wall_checks', check!)
  })
  // A signed checkpoint, so the restored copy has a signature to check.
  const signed = await createCheckpoint(db, loadSigningKey(keySettingsFromEnv())!, 'request')
  expect(signed).toHaveProperty('checkpoint')
  await pool.end()
})

afterAll(async () => {
  await Promise.all(clients.map(c => c.end()))
})

describe('backup and restore', () => {
  // Three scripts in a row, each starting Node and tsx: slow on a loaded machine, hence the timeout.
  it('backs up, restores into a new database and verifies its ledger there in full', { timeout: 120_000 }, async () => {
    const backup = await runScript('bash', ['scripts/db-backup.sh', dir], env)
    expect(backup.status, backup.stderr).toBe(0)
    for (const file of ['database.dump', 'files.json', 'ledger-public-keys', 'SHA256SUMS']) expect(existsSync(join(dir, file)), file).toBe(true)
    expect(readFileSync(join(dir, 'files', ...WALL_FILE.key.split('/')))).toEqual(WALL_FILE.bytes)
    // The stored file lost from the object store: the restore puts it back.
    await s3.send(new DeleteObjectCommand({ Bucket: process.env.NUXT_STORAGE_BUCKET, Key: WALL_FILE.key }))

    const restore = await runScript('bash', ['scripts/db-restore.sh', dir, '--database', RESTORED], env)
    expect(restore.status, `${restore.stdout}\n${restore.stderr}`).toBe(0)
    expect(restore.stdout).toMatch(/\[ledger\] full verification: \d+ entries .* 1 checkpoints/)
    expect(restore.stdout).toContain('[ledger] valid: no problem found')

    expect(restore.stdout).toContain('1 stored file put back')
    const object = await s3.send(new GetObjectCommand({ Bucket: process.env.NUXT_STORAGE_BUCKET, Key: WALL_FILE.key }))
    expect(Buffer.from(await object.Body!.transformToByteArray())).toEqual(WALL_FILE.bytes)
    const [source, restored] = await Promise.all([connect(SOURCE), connect(RESTORED)])
    expect(await head(restored)).toEqual(await head(source))
    // The server's role has its rights in the restored copy too, and none it did not have.
    const { rows: [rights] } = await restored.query(`SELECT has_table_privilege('eddyledger', 'ledger_entries', 'INSERT') AS append,
      has_table_privilege('eddyledger', 'ledger_entries', 'UPDATE') AS "update"`)
    expect(rights).toEqual({ append: true, update: false })
  })

  it('keeps the signing key out of the dump', async () => {
    const pem = process.env.NUXT_LEDGER_SIGNING_KEY!
    const body = pem.replace(/-----[A-Z ]+-----/g, '').replace(/\s+/g, '')
    const sql = await runScript(join(process.env.TEST_PG_BIN!, 'pg_restore'), ['--file=-', join(dir, 'database.dump')])
    expect(sql.status, sql.stderr).toBe(0)
    expect(sql.stdout).toContain('ledger_checkpoints')
    expect(sql.stdout.replace(/\s+/g, '')).not.toContain(body)
  })

  it('refuses to restore over an existing database without --replace', async () => {
    const again = await runScript('bash', ['scripts/db-restore.sh', dir, '--database', RESTORED], env)
    expect(again.status).toBe(2)
    expect(again.stdout).toMatch(/exists already/)
  })

  it('npm run ledger:verify exits non-zero on a tampered copy and lists what it found by kind', { timeout: 60_000 }, async () => {
    const restored = await connect(RESTORED)
    const { rows: [decision] } = await restored.query(`SELECT id FROM decisions WHERE status = 'draft' ORDER BY id LIMIT 1`)
    await withoutTriggers(restored, ['decisions'], () => restored.query(`UPDATE decisions SET status = 'approved' WHERE id = $1`, [decision.id]))
    const run = await runScript('node_modules/.bin/tsx', ['scripts/ledger-verify.ts'], { ...env, DATABASE_URL: appDatabaseUrl(RESTORED) })
    expect(run.status).toBe(1)
    expect(run.stdout).toContain('State that disagrees with the events (state): 1')
    expect(run.stdout).toContain(`  - Decision ${decision.id}: its status is approved but its history says draft`)
  })
})
