// The ledger on its own schedule, on a server of this file's own with a signing key in a file and
// short intervals: checkpoints by count and by time, each mailed to the auditors; a key rotation
// that keeps old receipts verifiable; the scheduled verification mailing what it finds.
import { generateKeyPairSync } from 'node:crypto'
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, demoEmail } from '../support/api-client'
import { act, createDraft, projectIds } from '../support/decisions'
import { withoutTriggers } from '../support/ledger'
import { runScript } from '../support/scripts'
import { sentTo, until, waitForMail } from '../support/mail'
import { freePort, startServer } from '../support/test-server'

type Checkpoint = { number: number; seq: number; keyId: string; reason: string; receipt: string }

const dir = mkdtempSync(join(process.env.TEST_TMP_DIR || tmpdir(), 'ledger-keys-'))
const keyFile = join(dir, 'ledger-signing-key')
const keyring = join(dir, 'ledger-public-keys')
const AUDITOR = demoEmail('auditor')
let server: Awaited<ReturnType<typeof startServer>>
let auditor: ApiClient
let engineer: ApiClient
let reviewer: ApiClient
let kb101: number
let owner: pg.Client

async function checkpoints(): Promise<Checkpoint[]> {
  return (await auditor.get('/api/ledger/checkpoints?pageSize=100')).body.checkpoints
}
const newCheckpoint = (after: number) => until(`a checkpoint after #${after}`, async () => (await checkpoints()).find(c => c.number > after), 30_000)
const receiptMail = (c: Checkpoint) => waitForMail(m => sentTo(m, AUDITOR) && m.subject === `Ledger checkpoint #${c.number} at entry #${c.seq}`)

beforeAll(async () => {
  writeFileSync(keyFile, String(generateKeyPairSync('ed25519').privateKey.export({ type: 'pkcs8', format: 'pem' })), { mode: 0o600 })
  server = await startServer({
    database: 'eddyledger_ledger_schedule', port: await freePort(),
    env: {
      NUXT_LEDGER_SIGNING_KEY: '', NUXT_LEDGER_KEY_FILE: keyFile, NUXT_LEDGER_KEYRING_FILE: keyring,
      NUXT_LEDGER_CHECKPOINT_EVERY: '6', NUXT_LEDGER_CHECKPOINT_MINUTES: '0.2', NUXT_LEDGER_POLL_SECONDS: '1', NUXT_LEDGER_VERIFY_MINUTES: '0.05',
    },
  })
  auditor = new ApiClient(server.url)
  engineer = new ApiClient(server.url)
  reviewer = new ApiClient(server.url)
  await Promise.all([auditor.login(AUDITOR), engineer.login(demoEmail('engineer')), reviewer.login(demoEmail('reviewer'))])
  kb101 = (await projectIds(auditor))['KB-101']!
  owner = new pg.Client({ connectionString: server.databaseOwnerUrl })
  await owner.connect()
})

afterAll(async () => {
  await owner?.end()
  await server?.stop()
})

describe('scheduled checkpoints', () => {
  let last: Checkpoint

  it('signs once the set number of entries has been written, and mails the receipt to the auditors', async () => {
    // The demo data alone is more than six entries.
    last = await newCheckpoint(0)
    expect(last).toMatchObject({ number: 1, reason: 'count' })
    expect((await receiptMail(last))[0]!.text).toContain(last.receipt)
  })

  it('signs by count again as soon as six more entries are in, before the set time is up', async () => {
    for (let i = 0; i < 3; i++) await createDraft(engineer, kb101)
    const byCount = await newCheckpoint(last.number)
    expect(byCount).toMatchObject({ number: last.number + 1, reason: 'count' })
    expect(byCount.seq).toBe(last.seq + 6)
    last = byCount
  })

  it('signs after the set time when anything was written, and not when nothing was', { timeout: 60_000 }, async () => {
    const draft = await createDraft(engineer, kb101)
    await act(engineer, `/api/decisions/${draft.id}/comments`, { comment: 'Inlet profile from the tank test.' })
    const byTime = await newCheckpoint(last.number)
    expect(byTime).toMatchObject({ number: last.number + 1, reason: 'time' })
    // Fewer than the six entries the count asks for: the time made it (three entries at most).
    expect(byTime.seq - last.seq).toBeGreaterThan(0)
    expect(byTime.seq - last.seq).toBeLessThanOrEqual(3)
    await receiptMail(byTime)
    const head = (await auditor.get('/api/ledger/checkpoints')).body.head.seq
    last = (await until('the head signed', async () => (await checkpoints()).find(c => c.seq === head), 30_000))
    // Nothing new: no checkpoint for longer than the interval.
    await new Promise(r => setTimeout(r, 14_000))
    expect((await checkpoints())[0]!.number).toBe(last.number)
  })
})

describe('npm run ledger:rotate-key', () => {
  it('retires the key, keeps its public half so old receipts still verify, and signs on with the new one', { timeout: 60_000 }, async () => {
    const before = (await auditor.get('/api/ledger/keys')).body
    const oldReceipt = (await checkpoints()).at(-1)!.receipt
    const run = await runScript('node_modules/.bin/tsx', ['scripts/ledger-rotate-key.ts'], {
      ...process.env, DATABASE_URL: server.databaseAppUrl, NUXT_LEDGER_SIGNING_KEY: '', NUXT_LEDGER_KEY_FILE: keyFile, NUXT_LEDGER_KEYRING_FILE: keyring, NUXT_APP_URL: server.url,
    })
    expect(run.status, run.stderr).toBe(0)
    expect(run.stdout).toMatch(/the signing key is now ed25519:[0-9a-f]{16}; ed25519:[0-9a-f]{16} is retired/)
    expect(readFileSync(keyring, 'utf8')).toContain(before.keys[0].publicKey)

    const after = (await auditor.get('/api/ledger/keys')).body
    expect(after.keys).toHaveLength(2)
    expect(after.keys[1]).toMatchObject({ keyId: before.serverKeyId, active: false, trusted: true, retiredAt: after.keys[0].createdAt })
    expect(after.keys[0]).toMatchObject({ active: true, trusted: true, retiredAt: null })
    expect(after.serverKeyId).toBe(after.keys[0].keyId)
    // The last checkpoint of the old key, then the first of the new one.
    const [newest, lastOfOld] = await checkpoints()
    expect(lastOfOld).toMatchObject({ reason: 'rotation', keyId: before.serverKeyId })
    expect(newest).toMatchObject({ reason: 'rotation', keyId: after.keys[0].keyId, number: lastOfOld!.number + 1 })

    expect((await auditor.post('/api/ledger/receipts/verify', { receipt: oldReceipt })).body.matches).toBe(true)
    const signed = await auditor.post('/api/ledger/checkpoints')
    expect(signed.status).toBe(201)
    expect(signed.body.checkpoint.keyId).toBe(after.keys[0].keyId)
    expect((await auditor.get('/api/ledger/verify')).body).toMatchObject({ valid: true, problems: [] })
  })
})

describe('the scheduled verification', () => {
  it('mails the auditors what it finds', async () => {
    const draft = await createDraft(engineer, kb101)
    const submitted = await act(engineer, `/api/decisions/${draft.id}/submit`, { version: draft.version })
    await act(reviewer, `/api/decisions/${draft.id}/approve`, { version: submitted.version })
    await withoutTriggers(owner, ['decisions'], () => owner.query(`UPDATE decisions SET status = 'in_review' WHERE id = $1`, [draft.id]))
    const [mail] = await waitForMail(m => sentTo(m, AUDITOR) && /^Ledger verification found \d+ problems?$/.test(m.subject) && m.text.includes(`Decision ${draft.id}:`), { timeout: 20_000 })
    expect(mail!.text).toContain('- State that disagrees with the events: 1')
    expect(mail!.text).toContain(`- [state] Decision ${draft.id}: its status is in_review but its history says approved`)
  })
})
