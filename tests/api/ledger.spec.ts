// The ledger's routes on the shared test server: who may use each, its contract, receipts as mailed
// and downloaded, and the chain as anyone can recompute it from the published algorithm.
import { createHash, createPublicKey, verify as verifySignature } from 'node:crypto'
import canonicalize from 'canonicalize'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { type ApiClient, signIn } from '../support/api-client'
import { createDraft, projectIds } from '../support/decisions'
import { sentTo, waitForMail } from '../support/mail'

const KINDS = ['altered', 'broken-link', 'rewritten', 'gap', 'state']
const KEYS = ['engineer', 'reviewer', 'auditor', 'lead', 'admin'] as const
const c = {} as Record<(typeof KEYS)[number], ApiClient>
let owner: pg.Client

beforeAll(async () => {
  for (const key of KEYS) c[key] = await signIn(key)
  owner = new pg.Client({ connectionString: inject('databaseOwnerUrl') })
  await owner.connect()
})

afterAll(async () => {
  await owner?.end()
})

describe('who may use the ledger', () => {
  it.each(['engineer', 'reviewer', 'admin'] as const)('refuses %s the verification with 403', async (role) => {
    for (const [method, path] of [['GET', '/api/ledger/verify'], ['GET', '/api/ledger/verify/full'], ['POST', '/api/ledger/verify/full']]) {
      const res = await c[role].request(method!, path!, method === 'POST' ? {} : undefined)
      expect(res.status, `${method} ${path}`).toBe(403)
      expect(res.body.message).toMatch(/auditor or lead/)
    }
  })

  it.each(['engineer', 'reviewer', 'lead'] as const)('refuses %s a checkpoint on request with 403', async (role) => {
    expect((await c[role].post('/api/ledger/checkpoints')).status).toBe(403)
  })

  it.each(['engineer', 'reviewer'] as const)('refuses %s the checkpoints, keys and receipts with 403', async (role) => {
    expect((await c[role].get('/api/ledger/checkpoints')).status).toBe(403)
    expect((await c[role].get('/api/ledger/keys')).status).toBe(403)
    expect((await c[role].get('/api/ledger/checkpoints/1/receipt')).status).toBe(403)
    expect((await c[role].post('/api/ledger/receipts/verify', { receipt: 'x' })).status).toBe(403)
  })
})

describe('GET /api/ledger/verify', () => {
  it('answers { valid, entries, checkpoints, problems } to auditors and leads', async () => {
    for (const role of ['auditor', 'lead'] as const) {
      const res = await c[role].get('/api/ledger/verify')
      expect(res.status).toBe(200)
      const { rows: [count] } = await owner.query('SELECT count(*)::int AS n FROM ledger_entries')
      expect(res.body).toMatchObject({ valid: expect.any(Boolean), entries: expect.any(Number), checkpoints: expect.any(Number), problems: expect.any(Array) })
      expect(res.body.entries).toBeGreaterThanOrEqual(count.n)
      for (const p of res.body.problems) {
        expect(KINDS).toContain(p.kind)
        expect(typeof p.detail).toBe('string')
      }
    }
  })
})

describe('the ledger as anyone can recompute it', () => {
  it('chains every entry onto the one before: sha256(previous hash + RFC 8785 JSON of the entry), gap-free', async () => {
    await createDraft(c.engineer, (await projectIds(c.engineer))['KB-101']!)
    const { rows } = await owner.query('SELECT * FROM ledger_entries ORDER BY seq')
    let prev = '0'.repeat(64)
    rows.forEach((row, i) => {
      expect(Number(row.seq)).toBe(i + 1)
      expect(row.prev_hash).toBe(prev)
      const canonical = canonicalize({
        seq: Number(row.seq), subjectType: row.subject_type, subjectId: row.subject_id, type: row.type,
        recordTable: row.record_table, recordId: row.record_id === null ? null : Number(row.record_id), recordHash: row.record_hash,
        createdAt: new Date(row.created_at).toISOString(),
      })!
      expect(row.hash, `entry #${row.seq}`).toBe(createHash('sha256').update(prev + canonical).digest('hex'))
      prev = row.hash
    })
    // Every event and revision is held by exactly one entry; an event's entry holds the event's chained hash.
    const { rows: loose } = await owner.query(`
      SELECT 'event' AS what, e.id FROM decision_events e WHERE NOT EXISTS (SELECT 1 FROM ledger_entries l WHERE l.record_table = 'decision_events' AND l.record_id = e.id)
      UNION ALL SELECT 'revision', r.id FROM decision_revisions r WHERE NOT EXISTS (SELECT 1 FROM ledger_entries l WHERE l.record_table = 'decision_revisions' AND l.record_id = r.id)`)
    expect(loose).toEqual([])
    const { rows: differ } = await owner.query(`
      SELECT l.seq FROM ledger_entries l JOIN decision_events e ON l.record_table = 'decision_events' AND e.id = l.record_id WHERE e.hash <> l.record_hash`)
    expect(differ).toEqual([])
    // The ruleset the engine advised under is published in the ledger, and the server's key is listed.
    const { rows: subjects } = await owner.query(`SELECT DISTINCT subject_type FROM ledger_entries ORDER BY 1`)
    expect(subjects.map(s => s.subject_type)).toEqual(expect.arrayContaining(['decision', 'ruleset', 'signing-key']))
  })
})

describe('checkpoints and receipts', () => {
  let checkpoint: { number: number; seq: number; hash: string; signedAt: string; keyId: string; signature: string; reason: string; receipt: string }

  it('signs the head for an auditor, returns the receipt, and mails it to every auditor', async () => {
    const res = await c.auditor.post('/api/ledger/checkpoints')
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    checkpoint = res.body.checkpoint
    const { rows: [head] } = await owner.query('SELECT seq, hash FROM ledger_entries WHERE seq = $1', [checkpoint.seq])
    expect(checkpoint).toMatchObject({ reason: 'request', hash: head.hash, keyId: expect.stringMatching(/^ed25519:[0-9a-f]{16}$/) })
    expect(checkpoint.receipt).toBe([
      'Eddyledger ledger checkpoint', `checkpoint: ${checkpoint.number}`, `seq: ${checkpoint.seq}`, `hash: ${checkpoint.hash}`,
      `signed-at: ${checkpoint.signedAt}`, `key: ${checkpoint.keyId}`, `signature: ${checkpoint.signature}`,
    ].join('\n'))
    const [mail] = await waitForMail(m => sentTo(m, 'auditor@eddyledger.test') && m.subject === `Ledger checkpoint #${checkpoint.number} at entry #${checkpoint.seq}`)
    expect(mail!.text).toContain(checkpoint.receipt)
    expect(mail!.text).toMatch(/Keep this receipt outside Eddyledger/)
  })

  it('signs with the listed public key: Ed25519 over a fixed prefix and the RFC 8785 JSON of the checkpoint', async () => {
    const { body } = await c.lead.get('/api/ledger/keys')
    const active = body.keys.find((k: { active: boolean }) => k.active)
    expect(active).toMatchObject({ keyId: checkpoint.keyId, algorithm: 'ed25519', trusted: true, retiredAt: null })
    expect(body.serverKeyId).toBe(checkpoint.keyId)
    const message = `eddyledger-checkpoint-v1\n${canonicalize({
      number: checkpoint.number, seq: checkpoint.seq, hash: checkpoint.hash, signedAt: checkpoint.signedAt, keyId: checkpoint.keyId,
    })}`
    const key = createPublicKey(active.publicKey)
    expect(verifySignature(null, Buffer.from(message), key, Buffer.from(checkpoint.signature, 'base64'))).toBe(true)
    // The key's name: the first 16 hex digits of the sha256 of its public key (SPKI DER).
    expect(checkpoint.keyId).toBe(`ed25519:${createHash('sha256').update(key.export({ type: 'spki', format: 'der' })).digest('hex').slice(0, 16)}`)
  })

  it('numbers checkpoints without gaps, an administrator\'s too, and lists them newest first with their receipts', async () => {
    const res = await c.admin.post('/api/ledger/checkpoints')
    expect(res.status).toBe(201)
    expect(res.body.checkpoint.number).toBeGreaterThan(checkpoint.number)
    const list = await c.lead.get('/api/ledger/checkpoints?pageSize=100')
    expect(list.status).toBe(200)
    // The server signs on its own schedule too: whatever it signed meanwhile, the numbers run down to 1.
    const numbers = list.body.checkpoints.map((x: { number: number }) => x.number)
    expect(numbers).toEqual(Array.from({ length: list.body.total }, (_, i) => list.body.total - i))
    expect(list.body.checkpoints.find((x: { number: number }) => x.number === checkpoint.number)).toEqual(checkpoint)
    expect(list.body.schedule).toEqual({ everyEntries: 100, everyMinutes: 60 })
    expect(list.body.head.seq).toBeGreaterThanOrEqual(checkpoint.seq)
    expect((await c.lead.get('/api/ledger/checkpoints?pageSize=500')).status).toBe(400)
  })

  it('downloads a receipt as a text file', async () => {
    const res = await c.auditor.get(`/api/ledger/checkpoints/${checkpoint.number}/receipt`)
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/plain/)
    expect(res.headers.get('content-disposition')).toBe(`attachment; filename="eddyledger-checkpoint-${checkpoint.number}.txt"`)
    expect(res.body).toBe(`${checkpoint.receipt}\n`)
    expect((await c.auditor.get('/api/ledger/checkpoints/999999/receipt')).status).toBe(404)
    expect((await c.auditor.get('/api/ledger/checkpoints/abc/receipt')).status).toBe(400)
  })

  it('tells whether today\'s ledger holds a receipt\'s head: as mailed, quoted in a reply, or as JSON', async () => {
    const matches = { matches: true, detail: expect.stringMatching(/^Today's ledger still holds this head: entry #\d+ has the signed hash/) }
    expect((await c.auditor.post('/api/ledger/receipts/verify', { receipt: checkpoint.receipt })).body).toEqual(matches)
    const quoted = `Forwarding the receipt:\n\n${checkpoint.receipt.split('\n').map(l => `> ${l}`).join('\n')}\n\nRegards`
    expect((await c.lead.post('/api/ledger/receipts/verify', { receipt: quoted })).body).toEqual(matches)
    const json = JSON.stringify({ checkpoint: checkpoint.number, seq: checkpoint.seq, hash: checkpoint.hash, signedAt: checkpoint.signedAt, key: checkpoint.keyId, signature: checkpoint.signature })
    expect((await c.admin.post('/api/ledger/receipts/verify', { receipt: json })).body).toEqual(matches)
  })

  it('refuses a receipt changed by hand, or naming another key', async () => {
    const otherHash = checkpoint.receipt.replace(`hash: ${checkpoint.hash}`, `hash: ${'a'.repeat(64)}`)
    expect((await c.auditor.post('/api/ledger/receipts/verify', { receipt: otherHash })).body).toEqual({
      matches: false, detail: 'The signature does not hold for the receipt\'s content: the receipt was altered after it was signed',
    })
    const otherKey = checkpoint.receipt.replace(`key: ${checkpoint.keyId}`, 'key: ed25519:0000000000000000')
    expect((await c.auditor.post('/api/ledger/receipts/verify', { receipt: otherKey })).body).toEqual({
      matches: false, detail: 'The receipt names the key ed25519:0000000000000000, which is not one of this ledger\'s signing keys',
    })
  })

  it.each([
    ['', /Paste or upload a receipt/],
    ['Dear auditor, all is well.', /The receipt lacks checkpoint, seq, hash, signed-at, key, signature/],
    ['checkpoint: 1\nseq: 5\nhash: xyz\nsigned-at: 2026-01-01T00:00:00Z\nkey: k\nsignature: s', /hash is not 64 hexadecimal digits/],
    ['{"seq": ', /does not parse/],
    ['x'.repeat(6000), /far longer/],
  ])('answers 400 with a message for text that is not a receipt (%#)', async (receipt, message) => {
    const res = await c.auditor.post('/api/ledger/receipts/verify', { receipt })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(message)
  })
})

describe('a decision\'s own check', () => {
  it('reports its chain with the ledger\'s findings, none for an intact decision', async () => {
    const draft = await createDraft(c.engineer, (await projectIds(c.engineer))['KB-101']!)
    expect((await c.auditor.get(`/api/decisions/${draft.id}/verify`)).body).toEqual({ valid: true, checked: 1, brokenAt: null, problems: [] })
  })
})
