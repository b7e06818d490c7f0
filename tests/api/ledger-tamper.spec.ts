// The ledger against an attacker holding the database owner's credentials: every tamper QA tried,
// each reported by GET /api/ledger/verify under its kind, on a server and database of this file's
// own (the tampers cannot be undone). The tests run in order; each tampers with decisions of its own.
import { execFileSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, demoEmail } from '../support/api-client'
import { act, createDraft, projectIds, tamperWithEvent } from '../support/decisions'
import { entriesOf, rehashDecisionEvents, rehashLedgerFrom, relinkEntry, withoutTriggers, type LedgerReport } from '../support/ledger'
import { freePort, startServer } from '../support/test-server'

const KEYS = ['engineer', 'reviewer', 'auditor', 'admin'] as const
const c = {} as Record<(typeof KEYS)[number], ApiClient>
let server: Awaited<ReturnType<typeof startServer>>
let owner: pg.Client
let kb102: number

async function verify(): Promise<LedgerReport> {
  const res = await c.auditor.get('/api/ledger/verify')
  expect(res.status, JSON.stringify(res.body)).toBe(200)
  return res.body
}
const about = (report: LedgerReport, decisionId: number) => report.problems.filter(p => p.decisionId === decisionId)
const kinds = (report: LedgerReport) => [...new Set(report.problems.map(p => p.kind))].sort()

async function approvedDecision() {
  const draft = await createDraft(c.engineer, kb102)
  const submitted = await act(c.engineer, `/api/decisions/${draft.id}/submit`, { version: draft.version })
  await act(c.reviewer, `/api/decisions/${draft.id}/approve`, { version: submitted.version, comment: 'Agreed.' })
  return draft.id
}

async function deleteDecision(id: number, withLedger: boolean) {
  await withoutTriggers(owner, ['decision_summaries', 'decision_events', 'decision_revisions', 'decisions', 'ledger_entries'], async () => {
    // Its summary row must go first (it references the decision); the tallies follow it by trigger.
    await owner.query('DELETE FROM decision_summaries WHERE decision_id = $1', [id])
    await owner.query('DELETE FROM decision_events WHERE decision_id = $1', [id])
    await owner.query('DELETE FROM decision_revisions WHERE decision_id = $1', [id])
    await owner.query('DELETE FROM decisions WHERE id = $1', [id])
    if (withLedger) await owner.query(`DELETE FROM ledger_entries WHERE subject_type = 'decision' AND subject_id = $1`, [String(id)])
  })
}

let firstDecision: number
let receipt: string
let checkpointSeq: number

beforeAll(async () => {
  // No checkpoint or verification on a timer: this file decides when each happens.
  server = await startServer({
    database: 'eddyledger_ledger_tamper', port: await freePort(),
    env: { NUXT_LEDGER_CHECKPOINT_EVERY: '0', NUXT_LEDGER_CHECKPOINT_MINUTES: '0', NUXT_LEDGER_VERIFY_MINUTES: '0' },
  })
  for (const key of KEYS) {
    c[key] = new ApiClient(server.url)
    await c[key].login(demoEmail(key))
  }
  owner = new pg.Client({ connectionString: server.databaseOwnerUrl })
  await owner.connect()
  kb102 = (await projectIds(c.auditor))['KB-102']!
})

afterAll(async () => {
  await owner?.end()
  await server?.stop()
})

describe('an untouched ledger', () => {
  it('verifies as valid, and the next run recomputes only what was written since the last clean one', async () => {
    const first = await verify()
    expect(first).toMatchObject({ valid: true, problems: [], checkpoints: 0 })
    expect(first.entries).toBe(first.head.seq)
    expect(first.entries).toBeGreaterThan(10)

    firstDecision = await approvedDecision()
    const second = await verify()
    expect(second).toMatchObject({ valid: true, problems: [] })
    // A revision and three events (created, submitted, approved) were appended: only they are recomputed.
    expect(second.entries).toBe(first.entries + 4)
    expect(second.from?.seq).toBe(first.head.seq)
    expect(second.recomputed).toBe(4)
  })

  it('signs a checkpoint on request, whose receipt matches today\'s ledger', async () => {
    const res = await c.auditor.post('/api/ledger/checkpoints')
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.checkpoint).toMatchObject({ number: 1, reason: 'request' })
    receipt = res.body.checkpoint.receipt
    checkpointSeq = res.body.checkpoint.seq
    const check = await c.auditor.post('/api/ledger/receipts/verify', { receipt })
    expect(check.body).toEqual({ matches: true, detail: expect.stringMatching(/still holds this head/) })
    expect((await verify()).checkpoints).toBe(1)
  })
})

describe('tampering as the table owner, triggers off', () => {
  it('one event\'s payload edited: altered, found incrementally, and by the decision\'s own /verify', async () => {
    const id = await approvedDecision()
    expect((await verify()).valid).toBe(true)
    const eventId = await tamperWithEvent(owner, id, 3, { comment: 'Looks fine.' })
    const report = await verify()
    expect(report.valid).toBe(false)
    // The edited row was written after the last clean run: recomputed without recomputing everything.
    expect(report.recomputed).toBeLessThan(report.entries)
    expect(about(report, id)).toEqual([
      expect.objectContaining({ kind: 'altered', detail: expect.stringMatching(/Event #3 \(approved\) of decision \d+ no longer hashes to its stored hash/) }),
    ])
    expect((await c.auditor.get(`/api/decisions/${id}/verify`)).body).toMatchObject({ valid: false, checked: 3, brokenAt: eventId })
  })

  it('a payload edited and every later hash of the decision recomputed: altered, the ledger kept the old hashes', async () => {
    const id = await approvedDecision()
    await withoutTriggers(owner, ['decision_events'], async () => {
      await owner.query(`UPDATE decision_events SET payload = '{"note":"submitted after the site visit"}' WHERE decision_id = $1 AND seq = 2`, [id])
      await rehashDecisionEvents(owner, id, 2)
    })
    // The decision's chain recomputes by itself: only the ledger gives it away.
    const own = (await c.auditor.get(`/api/decisions/${id}/verify`)).body
    expect(own).toMatchObject({ valid: false, checked: 3, brokenAt: null })
    expect(own.problems.map((p: { kind: string }) => p.kind)).toEqual(['altered', 'altered'])
    const problems = about(await verify(), id)
    expect(problems.map(p => p.kind)).toEqual(['altered', 'altered'])
    expect(problems.map(p => p.detail)).toEqual([
      expect.stringMatching(/Event #2 \(submitted\).*no longer has the hash ledger entry #\d+ recorded: it was changed and rehashed/),
      expect.stringMatching(/Event #3 \(approved\).*no longer has the hash ledger entry #\d+ recorded/),
    ])
  })

  it('a whole decision deleted with its events and revisions: the totals drop by one, and the gap is reported', async () => {
    const id = await approvedDecision()
    const total = async () => (await c.auditor.get('/api/audit/decisions?limit=1')).body.total as number
    const before = await total()
    await deleteDecision(id, false)
    expect(await total()).toBe(before - 1)
    expect(about(await verify(), id)).toEqual([
      expect.objectContaining({ kind: 'gap', detail: `Decision ${id} is gone, though 4 ledger entries from #${(await entriesOf(owner, id))[0]!.seq} hold its history` }),
    ])
  })

  it('a whole decision deleted with its ledger entries too: the global sequence has a gap', async () => {
    const id = await approvedDecision()
    const seqs = (await entriesOf(owner, id)).map(e => e.seq)
    await approvedDecision() // so that its entries are not the last ones
    await deleteDecision(id, true)
    expect((await verify()).problems).toContainEqual({ kind: 'gap', seq: seqs[0], detail: `Entries #${seqs[0]}–#${seqs.at(-1)} are missing from the ledger` })
  })

  it('all events of a decision deleted: no longer "valid, 0 checked" but a gap', async () => {
    const id = await approvedDecision()
    await withoutTriggers(owner, ['decision_events'], () => owner.query('DELETE FROM decision_events WHERE decision_id = $1', [id]))
    const own = (await c.auditor.get(`/api/decisions/${id}/verify`)).body
    expect(own).toMatchObject({ valid: false, checked: 0, brokenAt: null })
    expect(own.problems).toContainEqual(expect.objectContaining({ kind: 'gap', detail: 'It has no events left: its history is gone' }))
    const problems = about(await verify(), id)
    expect(problems).toContainEqual(expect.objectContaining({ kind: 'gap', detail: `Decision ${id} has no events left: its history is gone` }))
    expect(problems).toContainEqual(expect.objectContaining({ kind: 'gap', detail: expect.stringMatching(/^3 events of decision \d+ recorded in the ledger .* are gone$/) }))
  })

  it('the last event ("approved") deleted with its entry, the status left approved: the state disagrees', async () => {
    const id = await approvedDecision()
    const entries = await entriesOf(owner, id)
    const approval = entries.at(-1)!
    // The approval is the ledger's last entry, so removing it leaves no gap in the sequence.
    expect((await owner.query('SELECT max(seq)::int AS head FROM ledger_entries')).rows[0].head).toBe(approval.seq)
    await withoutTriggers(owner, ['decision_events', 'ledger_entries'], async () => {
      await owner.query('DELETE FROM ledger_entries WHERE seq = $1', [approval.seq])
      await owner.query('DELETE FROM decision_events WHERE id = $1', [approval.id])
    })
    expect((await c.auditor.get(`/api/decisions/${id}`)).body.decision.status).toBe('approved')
    expect(about(await verify(), id)).toEqual([
      { kind: 'state', decisionId: id, detail: `Decision ${id}: its status is approved but its history says in_review` },
    ])
  })

  it('a forged override and a forged status: the state disagrees, and the PDF record says so instead of "chain intact"', async () => {
    const draft = await createDraft(c.engineer, kb102)
    const submitted = await act(c.engineer, `/api/decisions/${draft.id}/submit`, { version: draft.version })
    await act(c.reviewer, `/api/decisions/${draft.id}/override`, {
      version: submitted.version, approach: 'urans', model: 'k-omega SST', wallTreatment: 'wall-function',
      comment: 'Unsteady RANS is enough for the pressure drop we report.',
    })
    const other = await createDraft(c.engineer, kb102)
    await withoutTriggers(owner, ['decisions'], async () => {
      await owner.query(`UPDATE decisions SET override = jsonb_set(override, '{approach}', '"dns"') WHERE id = $1`, [draft.id])
      await owner.query(`UPDATE decisions SET status = 'approved' WHERE id = $1`, [other.id])
    })
    expect((await c.auditor.get(`/api/decisions/${draft.id}`)).body.decision.override.approach).toBe('dns')
    const report = await verify()
    expect(about(report, draft.id)).toEqual([
      { kind: 'state', decisionId: draft.id, detail: `Decision ${draft.id}: its override differs from the one its history recorded` },
    ])
    expect(about(report, other.id)).toEqual([
      { kind: 'state', decisionId: other.id, detail: `Decision ${other.id}: its status is approved but its history says draft` },
    ])

    const pdf = await fetch(`${server.url}/api/decisions/${draft.id}/report.pdf`, { headers: { cookie: c.auditor.cookie, 'x-forwarded-for': c.auditor.address } })
    expect(pdf.status).toBe(200)
    const file = join(mkdtempSync(join(tmpdir(), 'eddyledger-ledger-')), 'record.pdf')
    writeFileSync(file, Buffer.from(await pdf.arrayBuffer()))
    const text = execFileSync('/usr/bin/pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ')
    expect(text).not.toContain('Chain intact')
    expect(text).toContain('Ledger check failed (state): Its row disagrees with its history: its override differs from the one its history recorded')
  })

  it('a verification record\'s facts edited (a run\'s core-hours): altered, by the ledger and the decision\'s /verify', async () => {
    const id = await approvedDecision()
    const run = await c.engineer.post(`/api/decisions/${id}/runs`, {
      approach: 'rans', cells: 2.4e6, timeSteps: 3000, innerIterations: 1, coreHours: 150, wallClockHours: 2, cores: 128,
      hardware: 'cpu', hardwareNote: 'one 128-core node', solverFamily: 'finite-volume',
    })
    expect(run.status, JSON.stringify(run.body)).toBe(201)
    const { rows: [record] } = await owner.query('SELECT id FROM run_records WHERE decision_id = $1', [id])
    await withoutTriggers(owner, ['run_records'], () => owner.query('UPDATE run_records SET core_hours = 15 WHERE id = $1', [record.id]))
    const altered = expect.objectContaining({ kind: 'altered', detail: expect.stringMatching(new RegExp(`^Run record ${record.id} of decision ${id} was changed after ledger entry #\\d+ recorded it$`)) })
    expect(about(await verify(), id)).toEqual([altered])
    expect((await c.auditor.get(`/api/decisions/${id}/verify`)).body).toMatchObject({ valid: false, brokenAt: null, problems: [altered] })
  })

  it('a decision\'s summary row rewritten (the lists and overview read it): the state disagrees, naming the column', async () => {
    const id = await approvedDecision()
    await withoutTriggers(owner, ['decision_summaries'], () => owner.query(`UPDATE decision_summaries SET approach = 'dns' WHERE decision_id = $1`, [id]))
    expect(about(await verify(), id)).toEqual([expect.objectContaining({
      kind: 'state', detail: `Decision ${id}: its summary row disagrees with its record (approach)`,
    })])
  })

  it('an entry pointed at another previous hash (its own hash recomputed): a broken link', async () => {
    const id = await approvedDecision()
    const [, second] = await entriesOf(owner, id)
    await withoutTriggers(owner, ['ledger_entries'], () => relinkEntry(owner, second!.seq, 'f'.repeat(64)))
    const problems = (await verify()).problems.filter(p => p.kind === 'broken-link')
    expect(problems.map(p => p.seq)).toEqual([second!.seq, second!.seq + 1])
    expect(problems[0]!.detail).toBe(`Entry #${second!.seq} does not link to entry #${second!.seq - 1}: the hash it chains on is not entry #${second!.seq - 1}'s`)
  })

  it('a full run in the background finds the same problems as the incremental one', async () => {
    const started = await c.auditor.post('/api/ledger/verify/full')
    expect(started.status).toBe(202)
    let status = started.body
    for (let i = 0; i < 100 && status.run.state === 'running'; i++) {
      await new Promise(r => setTimeout(r, 200))
      status = (await c.auditor.get('/api/ledger/verify/full')).body
    }
    expect(status.run).toMatchObject({ state: 'done', startedBy: 'Mei Tanaka' })
    const full = status.run.report as LedgerReport
    expect(full.recomputed).toBe(full.entries)
    const incremental = await verify()
    expect(incremental.recomputed).toBeLessThan(incremental.entries)
    const key = (r: LedgerReport) => r.problems.map(p => JSON.stringify(p)).sort()
    expect(key(incremental)).toEqual(key(full))
    expect(kinds(full)).toEqual(['altered', 'broken-link', 'gap', 'state'])
    expect(status.lastFullRun).toMatchObject({ entries: full.entries, problemCount: full.problems.length })
  })

  it('a consistent rewrite recomputing every hash with our own algorithm: rewritten, and the earlier receipt no longer matches', async () => {
    expect((await c.auditor.post('/api/ledger/receipts/verify', { receipt })).body.matches).toBe(true)
    // The first decision's approval, which checkpoint #1 covers, reworded; its chain and the ledger recomputed from there.
    const approval = (await entriesOf(owner, firstDecision)).filter(e => e.table === 'decision_events').at(-1)!
    expect(approval.seq).toBeLessThanOrEqual(checkpointSeq)
    const { rows: [event] } = await owner.query('SELECT seq, type FROM decision_events WHERE id = $1', [approval.id])
    expect(event.type).toBe('approved')
    await withoutTriggers(owner, ['decision_events', 'ledger_entries'], async () => {
      await owner.query(`UPDATE decision_events SET payload = '{"comment":"Approved without reservation."}' WHERE id = $1`, [approval.id])
      await rehashDecisionEvents(owner, firstDecision, event.seq)
      await rehashLedgerFrom(owner, approval.seq)
    })
    const report = await verify()
    // Nothing about the rewritten decision recomputes wrong any more: only the signature gives it away.
    expect(about(report, firstDecision)).toEqual([])
    const rewritten = report.problems.filter(p => p.kind === 'rewritten')
    expect(rewritten).toContainEqual({
      kind: 'rewritten', seq: checkpointSeq,
      detail: expect.stringMatching(/^Entry #\d+ holds a hash other than the one checkpoint #1 \(signed .*\) signed: the history up to it was rewritten$/),
    })
    // The clean verifications signed before the rewrite say the same of the heads they saw.
    expect(rewritten.every(p => p.detail.endsWith('the history up to it was rewritten'))).toBe(true)
    const check = await c.auditor.post('/api/ledger/receipts/verify', { receipt })
    expect(check.body).toEqual({ matches: false, detail: expect.stringMatching(new RegExp(`^Entry #${checkpointSeq} now holds the hash .* the history up to it was rewritten$`)) })
    // Nothing is signed over a rewritten history.
    const refused = await c.admin.post('/api/ledger/checkpoints')
    expect(refused.status).toBe(409)
    expect(refused.body.message).toMatch(/no longer extends checkpoint #1/)
  })

  it('with the checkpoints and signed runs deleted as well, the receipt kept outside still gives the rewrite away', async () => {
    await withoutTriggers(owner, ['ledger_checkpoints', 'ledger_verifications'], async () => {
      await owner.query('DELETE FROM ledger_checkpoints')
      await owner.query('DELETE FROM ledger_verifications')
    })
    const report = await verify()
    expect(report.checkpoints).toBe(0)
    expect(report.problems.filter(p => p.kind === 'rewritten')).toEqual([])
    expect((await c.auditor.post('/api/ledger/receipts/verify', { receipt })).body).toMatchObject({ matches: false })
  })
})
