// After the run, through the real server, PostgreSQL and the local object store: wall y+ checks
// (uploads, statistics, review, retraction), grid studies, run records and the calibration.
import { execFileSync } from 'node:child_process'
import { createHash } from 'node:crypto'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { gzipSync } from 'node:zlib'
import { ListObjectsV2Command, GetObjectCommand, S3Client } from '@aws-sdk/client-s3'
import pg from 'pg'
import Papa from 'papaparse'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { signIn, type ApiClient } from '../support/api-client'
import { DUCT_CASE, act, createDraft } from '../support/decisions'
import { uploadFile, uploadStreamed } from '../support/uploads'
import { EXPECTED, wallCsv } from '../support/wall-files'

const KEYS = ['engineer', 'engineer2', 'reviewer', 'reviewer2', 'auditor', 'lead', 'admin'] as const
const c = {} as Record<(typeof KEYS)[number], ApiClient>
const added: [number, number][] = []
let projectId: number
// An overridden decision whose signed-off treatment is log-law wall functions at their own
// target, so its band is 30 <= y+ <= 300 (Launder & Spalding 1974; common practice).
let decisionId: number
let draftId: number

const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex')
const bytesOf = (text: string) => new TextEncoder().encode(text)
const wallPath = (id = decisionId) => `/api/decisions/${id}/wall-checks`

const MAILDEV = process.env.TEST_MAILDEV_URL!
const s3 = new S3Client({
  endpoint: process.env.TEST_S3_URL, region: 'us-east-1', forcePathStyle: true,
  credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' }, requestChecksumCalculation: 'WHEN_REQUIRED', responseChecksumValidation: 'WHEN_REQUIRED',
})

beforeAll(async () => {
  for (const key of KEYS) c[key] = await signIn(key)
  const users = (await c.admin.get('/api/users')).body.users as { id: number; email: string }[]
  const userId = (key: string) => users.find(u => u.email === `${key}@eddyledger.test`)!.id
  const created = await c.admin.post('/api/projects', { code: `VF-${Math.floor(Math.random() * 1e6)}`, name: 'Verification after the run' })
  projectId = created.body.project.id
  for (const key of ['engineer', 'engineer2', 'reviewer']) {
    expect((await c.admin.post(`/api/projects/${projectId}/members`, { userId: userId(key) })).status).toBe(201)
    added.push([projectId, userId(key)])
  }
  const draft = await createDraft(c.engineer, projectId, { caseInput: DUCT_CASE })
  const submitted = await act(c.engineer, `/api/decisions/${draft.id}/submit`, { version: draft.version })
  await act(c.reviewer, `/api/decisions/${draft.id}/override`, {
    version: submitted.version, approach: 'rans', model: 'k-omega SST', wallTreatment: 'wall-function',
    comment: 'Wall functions are enough for the pressure drop this duct is sized on.',
  })
  decisionId = draft.id
  draftId = (await createDraft(c.engineer, projectId)).id
})

afterAll(async () => {
  for (const [p, u] of added) await c.admin.delete(`/api/projects/${p}/members/${u}`)
})

describe('wall y+ check', () => {
  it('reports the exact area-weighted fractions of a generated wall', async () => {
    const csv = bytesOf(wallCsv({ faces: 1000 }))
    const res = await uploadFile(c.engineer, wallPath(), { bytes: csv, name: 'duct-wall.csv' })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const w = res.body.wallCheck
    expect(w.band).toMatchObject({ min: 30, max: 300, basis: 'wall-function' })
    expect(w.rows).toBe(1000)
    expect(w.areaWeighted).toBe(true)
    // Arithmetic on the generated file (tests/support/wall-files.ts): 125 : 312.5 : 62.5 m² of 500 m².
    expect([w.fractionBelow, w.fractionInBand, w.fractionAbove]).toEqual([EXPECTED.byArea.below, EXPECTED.byArea.inside, EXPECTED.byArea.above])
    expect(w.patches.map((p: { patch: string }) => p.patch)).toEqual(['hull', 'rudder'])
    const hull = w.patches.find((p: { patch: string }) => p.patch === 'hull')
    // Even faces are kinds 0 and 2: 0.5 m² below and 0.25 m² inside per pair.
    expect([hull.faces, hull.area, hull.fractionBelow, hull.fractionInBand]).toEqual([500, 187.5, 2 / 3, 1 / 3])
    expect(w.histogram.fractions.reduce((a: number, b: number) => a + b, 0)).toBeCloseTo(1, 12)
    // The default threshold is 0.9 of the wall (common practice, no source): 0.625 fails it.
    expect(w.verdict).toBe('fail')
    expect(w.fileSha256).toBe(sha256(csv))
  })

  it('falls back to face counts, with a caution, when the file has no areas; reads TSV too', async () => {
    const tsv = bytesOf(wallCsv({ faces: 400, area: false, delimiter: '\t' }))
    const res = await uploadFile(c.engineer2, wallPath(), { bytes: tsv, name: 'no-areas.tsv', type: 'text/tab-separated-values' })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const w = res.body.wallCheck
    expect(w.areaWeighted).toBe(false)
    expect([w.fractionBelow, w.fractionInBand, w.fractionAbove]).toEqual([EXPECTED.byCount.below, EXPECTED.byCount.inside, EXPECTED.byCount.above])
    expect(w.cautions.join(' ')).toMatch(/no face areas/i)
  })

  it('stores exactly the uploaded bytes (gzip kept as sent) and records their sha256 in the history', async () => {
    const gz = gzipSync(Buffer.from(wallCsv({ faces: 2000 })))
    const res = await uploadFile(c.engineer, wallPath(), { bytes: gz, name: 'duct-wall.csv.gz', type: 'application/gzip' })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const w = res.body.wallCheck
    expect(w.fractionInBand).toBe(EXPECTED.byArea.inside)
    expect(w.fileSha256).toBe(sha256(gz))

    const file = await fetch(`${c.auditor.baseUrl}${wallPath()}/${w.id}/file`, { headers: { cookie: c.auditor.cookie, 'x-forwarded-for': c.auditor.address } })
    expect(file.status).toBe(200)
    const served = new Uint8Array(await file.arrayBuffer())
    expect(sha256(served)).toBe(sha256(gz))
    expect(served.length).toBe(gz.length)

    // The object itself in the store, read without the server.
    const listed = await s3.send(new ListObjectsV2Command({ Bucket: 'eddyledger-uploads', Prefix: `decisions/${decisionId}/wall-checks/` }))
    const key = listed.Contents!.map(o => o.Key!).find(k => k.endsWith('duct-wall.csv.gz'))!
    const object = await s3.send(new GetObjectCommand({ Bucket: 'eddyledger-uploads', Key: key }))
    const stored = await object.Body!.transformToByteArray()
    expect(sha256(stored)).toBe(sha256(gz))
    expect(object.Metadata?.sha256).toBe(sha256(gz))

    const events = (await c.auditor.get(`/api/decisions/${decisionId}/events`)).body.events as { type: string; payload: any }[]
    const uploaded = events.filter(e => e.type === 'wall_check_uploaded').at(-1)!
    expect(uploaded.payload).toMatchObject({ wallCheckId: w.id, sha256: sha256(gz), fractionInBand: 0.625, verdict: 'fail' })
  })

  it('refuses a 60 MB file with 413, whether its length is declared or streamed', async () => {
    const big = new Uint8Array(60 * 1024 * 1024).fill(0x31)
    const declared = await uploadFile(c.engineer, wallPath(), { bytes: big, name: 'huge.csv' })
    expect(declared.status).toBe(413)
    expect(declared.body.message).toMatch(/50 MB/)
    const streamed = await uploadStreamed(c.engineer, wallPath(), { name: 'huge.csv', size: 60 * 1024 * 1024, chunk: new Uint8Array(1024 * 1024).fill(0x31) })
    expect(streamed.status).toBe(413)
  })

  it('answers a malformed file with the line numbers of its bad rows', async () => {
    const lines = ['patch,y+,area']
    for (let i = 0; i < 30; i++) lines.push(i % 3 === 0 ? `hull,${50 + i},1` : `hull,n/a,1`)
    const res = await uploadFile(c.engineer, wallPath(), { bytes: bytesOf(lines.join('\n')), name: 'broken.csv' })
    expect(res.status).toBe(400)
    // Line 1 is the header; data line k (0-based) is line k + 2; the first bad ones are 3 and 4.
    expect(res.body.message).toMatch(/line 3: y\+ "n\/a" is not a number; line 4:/)
    expect(res.body.data.badRowSamples[0]).toEqual({ line: 3, reason: 'y+ "n/a" is not a number' })

    // A few bad rows are left out and listed, the rest judged.
    const some = ['patch,y+,area', 'hull,50,1', 'hull,-3,1', 'hull,60', 'hull,70,0', 'hull,80,1', 'hull,90,1', 'hull,100,1']
    const ok = await uploadFile(c.engineer, wallPath(), { bytes: bytesOf(some.join('\r\n')), name: 'some-bad.csv' })
    expect(ok.status, JSON.stringify(ok.body)).toBe(201)
    expect(ok.body.wallCheck.rows).toBe(4)
    expect(ok.body.wallCheck.badRows).toBe(3)
    expect(ok.body.wallCheck.badRowSamples.map((b: { line: number }) => b.line)).toEqual([3, 4, 5])
  })

  it('refuses what is not a text table: 415 for a zip or binary, and asks for the column when unsure', async () => {
    const zip = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2, 3])
    expect((await uploadFile(c.engineer, wallPath(), { bytes: zip, name: 'wall.csv' })).status).toBe(415)
    expect((await uploadFile(c.engineer, wallPath(), { bytes: bytesOf('a,b\n1,2\n'), name: 'wall.xlsx' })).status).toBe(415)
    expect((await uploadFile(c.engineer, wallPath(), { bytes: bytesOf('y+\n1\n'), name: 'fake.csv.gz' })).status).toBe(415)
    const binary = new Uint8Array([0x79, 0x2b, 0x0a, 0x00, 0x01, 0x02])
    expect((await uploadFile(c.engineer, wallPath(), { bytes: binary, name: 'wall.csv' })).status).toBe(415)

    const unclear = bytesOf('first,second\n40,1\n50,2\n')
    const ask = await uploadFile(c.engineer, wallPath(), { bytes: unclear, name: 'unclear.csv' })
    expect(ask.status).toBe(400)
    expect(ask.body.data.columns).toEqual(['first', 'second'])
    const mapped = await uploadFile(c.engineer, wallPath(), { bytes: unclear, name: 'unclear.csv' }, { yPlusColumn: 'first', areaColumn: 'second' })
    expect(mapped.status, JSON.stringify(mapped.body)).toBe(201)
    // By area: 40 (1 m²) and 50 (2 m²) are both inside 30-300.
    expect(mapped.body.wallCheck.fractionInBand).toBe(1)
    expect(mapped.body.wallCheck.verdict).toBe('pass')
  })

  it('lets only the author and engineer members upload, and only on a signed-off decision', async () => {
    const file = { bytes: bytesOf(wallCsv({ faces: 8 })), name: 'w.csv' }
    for (const key of ['reviewer', 'reviewer2', 'auditor', 'lead', 'admin'] as const) {
      expect((await uploadFile(c[key], wallPath(), file)).status, key).toBe(403)
    }
    expect((await uploadFile(c.engineer, wallPath(draftId), file)).status).toBe(409)
  })

  it('notifies the signing reviewer, who accepts with a comment; nobody else may, and only once', async () => {
    const res = await uploadFile(c.engineer, wallPath(), { bytes: bytesOf(wallCsv({ faces: 40 })), name: 'for-review.csv' })
    const id = res.body.wallCheck.id
    const deadline = Date.now() + 15_000
    let mail: { subject: string; text: string } | undefined
    while (!mail && Date.now() < deadline) {
      const inbox = (await (await fetch(`${MAILDEV}/api/email`)).json()) as { subject: string; text: string; to: { address: string }[] }[]
      mail = inbox.find(m => m.to.some(t => t.address === 'reviewer@eddyledger.test') && m.text.includes(res.body.wallCheck.fileSha256))
      if (!mail) await new Promise(r => setTimeout(r, 250))
    }
    expect(mail?.subject).toMatch(/Wall y\+ check to review/)

    const review = `${wallPath()}/${id}/review`
    for (const key of ['engineer', 'engineer2', 'auditor', 'lead', 'reviewer2', 'admin'] as const) {
      expect((await c[key].post(review, { accepted: true, comment: 'Looks right to me.' })).status, key).toBe(403)
    }
    expect((await c.reviewer.post(review, { accepted: false, comment: 'No.' })).status).toBe(400)
    const accepted = await c.reviewer.post(review, { accepted: true, comment: 'Inside the band where the friction matters.' })
    expect(accepted.status).toBe(200)
    expect(accepted.body.wallCheck.review).toMatchObject({ accepted: true, comment: 'Inside the band where the friction matters.' })
    expect((await c.reviewer.post(review, { accepted: false, comment: 'Changed my mind about this one.' })).status).toBe(409)
    const events = (await c.engineer.get(`/api/decisions/${decisionId}/events`)).body.events as { type: string; payload: any }[]
    expect(events.at(-1)).toMatchObject({ type: 'wall_check_reviewed', payload: { wallCheckId: id, accepted: true } })
  })

  it('retracts a wrong upload with a reason, keeping it', async () => {
    const res = await uploadFile(c.engineer, wallPath(), { bytes: bytesOf(wallCsv({ faces: 8 })), name: 'wrong-case.csv' })
    const id = res.body.wallCheck.id
    const retract = `${wallPath()}/${id}/retract`
    expect((await c.auditor.post(retract, { reason: 'Uploaded the export of another case.' })).status).toBe(403)
    expect((await c.engineer2.post(retract, { reason: 'short' })).status).toBe(400)
    const done = await c.engineer2.post(retract, { reason: 'Uploaded the export of another case.' })
    expect(done.status).toBe(200)
    const kept = done.body.verification.wallChecks.find((w: { id: number }) => w.id === id)
    expect(kept.retraction.reason).toBe('Uploaded the export of another case.')
    expect((await c.engineer2.post(retract, { reason: 'Uploaded the export of another case.' })).status).toBe(409)
    expect((await c.reviewer.post(`${wallPath()}/${id}/review`, { accepted: true, comment: 'fine' })).status).toBe(409)
  })

  it('keeps every record at the database: no delete, the facts unchanged, a review set once', async () => {
    const owner = new pg.Client({ connectionString: inject('databaseUrl') })
    await owner.connect()
    try {
      const { rows } = await owner.query('SELECT id FROM wall_checks WHERE decision_id = $1 AND reviewed_at IS NOT NULL LIMIT 1', [decisionId])
      const id = rows[0].id
      await expect(owner.query('DELETE FROM wall_checks WHERE id = $1', [id])).rejects.toThrow(/keeps every record/)
      await expect(owner.query("UPDATE wall_checks SET sha256 = 'forged' WHERE id = $1", [id])).rejects.toThrow(/keeps its recorded facts/)
      await expect(owner.query('UPDATE wall_checks SET review_accepted = NOT review_accepted WHERE id = $1', [id])).rejects.toThrow(/set once/)
      await expect(owner.query('TRUNCATE calibration_adoptions')).rejects.toThrow(/append-only/)
      await expect(owner.query('TRUNCATE wall_checks')).rejects.toThrow(/append-only/)
    } finally {
      await owner.end()
    }
  })

  it('judges against the pass fraction the lead sets', async () => {
    expect((await c.engineer.put('/api/verification/settings', { wallCheckPassFraction: 0.6 })).status).toBe(403)
    expect((await c.lead.put('/api/verification/settings', { wallCheckPassFraction: 1.5 })).status).toBe(400)
    expect((await c.lead.put('/api/verification/settings', { wallCheckPassFraction: 0.6, note: 'Ducts: 60 % of the wall is enough.' })).status).toBe(200)
    try {
      const res = await uploadFile(c.engineer, wallPath(), { bytes: bytesOf(wallCsv({ faces: 100 })), name: 'duct-wall.csv' })
      expect(res.body.wallCheck.passFraction).toBe(0.6)
      expect(res.body.wallCheck.verdict).toBe('pass')
    } finally {
      await c.lead.put('/api/verification/settings', { wallCheckPassFraction: 0.9 })
    }
  })
})

describe('grid-convergence study', () => {
  it('reproduces the worked example of Celik et al. 2008', async () => {
    // Celik et al. 2008, ASME J. Fluids Eng. 130, 078001, Table 1: p = 1.53, phi_ext = 6.1685, GCI_fine = 2.2 %.
    const res = await c.engineer.post(`/api/decisions/${decisionId}/grid-studies`, {
      quantity: 'Reattachment length x/H', dimensions: 2,
      grids: [{ cells: 18000, value: 6.063 }, { cells: 8000, value: 5.972 }, { cells: 4500, value: 5.863 }],
    })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const g = res.body.gridStudy
    expect(g.order).toBeCloseTo(1.53, 2)
    expect(g.extrapolated).toBeCloseTo(6.1685, 4)
    expect(g.gciFine).toBeCloseTo(0.022, 3)
    const events = (await c.auditor.get(`/api/decisions/${decisionId}/events`)).body.events as { type: string; payload: any }[]
    expect(events.at(-1)).toMatchObject({ type: 'grid_study_recorded', payload: { gridStudyId: g.id } })
  })

  it('refuses two grids, repeated cell counts, and readers', async () => {
    const two = await c.engineer.post(`/api/decisions/${decisionId}/grid-studies`, { quantity: 'Cd', dimensions: 3, grids: [{ cells: 8e6, value: 1 }, { cells: 1e6, value: 1.1 }] })
    expect(two.status).toBe(400)
    expect(two.body.data.fieldErrors.grids[0]).toMatch(/three grids/)
    const same = await c.engineer.post(`/api/decisions/${decisionId}/grid-studies`, { quantity: 'Cd', dimensions: 3, grids: [{ cells: 8e6, value: 1 }, { cells: 8e6, value: 1.1 }, { cells: 1e6, value: 1.2 }] })
    expect(same.status).toBe(400)
    expect((await c.auditor.post(`/api/decisions/${decisionId}/grid-studies`, { quantity: 'Cd', dimensions: 3, grids: [{ cells: 8e6, value: 1 }, { cells: 2e6, value: 1.1 }, { cells: 5e5, value: 1.2 }] })).status).toBe(403)
  })
})

describe('run records and calibration', () => {
  // Core-seconds per cell-step = core-hours x 3600 / (cells x steps) (the engine's own cost
  // definition, shared/rules/cost-model.ts); runs built with k = 7.5e-5 must give k back.
  const K = 7.5e-5
  const runs = [
    { cells: 2.4e6, timeSteps: 12_000 },
    { cells: 6.1e6, timeSteps: 20_000 },
    { cells: 1.5e7, timeSteps: 8_000 },
  ].map(r => ({ approach: 'hybrid', ...r, innerIterations: 5, coreHours: (K * r.cells * r.timeSteps) / 3600, wallClockHours: 30, cores: 512, hardware: 'cpu', hardwareNote: '2 x 64-core nodes', solverFamily: 'finite-volume, pressure-based' }))

  it('measures the cost per cell-step of three runs and lets a lead adopt it', async () => {
    expect((await c.reviewer.post(`/api/decisions/${decisionId}/runs`, runs[0])).status).toBe(403)
    expect((await c.engineer.post(`/api/decisions/${decisionId}/runs`, { ...runs[0], hardware: 'tpu' })).status).toBe(400)
    for (const run of runs.slice(0, 2)) expect((await c.engineer.post(`/api/decisions/${decisionId}/runs`, run)).status).toBe(201)
    // Two runs are not enough to adopt (our rule: at least three).
    expect((await c.lead.post('/api/calibration/adopt', {})).status).toBe(409)
    const third = await c.engineer2.post(`/api/decisions/${decisionId}/runs`, runs[2])
    expect(third.status).toBe(201)
    expect(third.body.run.estimated.coreHours).toBeGreaterThan(0)

    expect((await c.engineer.get('/api/calibration')).status).toBe(403)
    const cal = await c.lead.get('/api/calibration')
    expect(cal.status).toBe(200)
    const hybrid = cal.body.approaches.find((a: { approach: string; hardware: string }) => a.approach === 'hybrid' && a.hardware === 'cpu')
    expect(hybrid.runs).toBe(3)
    expect(hybrid.coreSecondsPerCellStep).toBeCloseTo(K, 15)
    expect(hybrid.spread).toBeCloseTo(1, 9)
    expect(hybrid.adoptable).toBe(true)

    expect((await c.engineer.post('/api/calibration/adopt', {})).status).toBe(403)
    const adopted = await c.lead.post('/api/calibration/adopt', { note: 'First calibration from the duct runs.' })
    expect(adopted.status).toBe(201)
    expect(adopted.body.adoption.entries).toEqual([expect.objectContaining({ approach: 'hybrid', hardware: 'cpu', runs: 3 })])

    // From now on advice carries both estimates; the calibrated one at K per cell-step.
    const advice = await c.engineer.post('/api/advice', { caseInput: DUCT_CASE })
    const entry = advice.body.calibration.approaches.find((a: { approach: string }) => a.approach === 'hybrid')
    const engine = advice.body.advice.approaches.find((a: { id: string }) => a.id === 'hybrid')
    expect(entry.used).toBe('team')
    expect(entry.runs).toBe(3)
    expect(entry.publishedCoreHours).toBe(engine.coreHours)
    expect(entry.teamCoreHours).toBeCloseTo((engine.cells * engine.timeSteps * K) / 3600, 6)
    const other = advice.body.calibration.approaches.find((a: { approach: string }) => a.approach === 'rans')
    expect(other.used).toBe('published')
    expect((await c.auditor.get('/api/calibration/adopted')).body.adopted.version).toBe(adopted.body.adoption.version)
  })

  it('leaves a retracted run out of the calibration', async () => {
    const extra = await c.engineer.post(`/api/decisions/${decisionId}/runs`, { ...runs[0], coreHours: runs[0]!.coreHours * 100 })
    expect(extra.status).toBe(201)
    const retracted = await c.engineer.post(`/api/decisions/${decisionId}/runs/${extra.body.run.id}/retract`, { reason: 'The core-hours were typed in core-minutes.' })
    expect(retracted.status).toBe(200)
    const cal = await c.lead.get('/api/calibration')
    const hybrid = cal.body.approaches.find((a: { approach: string; hardware: string }) => a.approach === 'hybrid' && a.hardware === 'cpu')
    expect(hybrid.runs).toBe(3)
    expect(hybrid.coreSecondsPerCellStep).toBeCloseTo(K, 15)
  })

  it('shows the section to readers with what each may do', async () => {
    const asAuditor = await c.auditor.get(`/api/decisions/${decisionId}/verification`)
    expect(asAuditor.status).toBe(200)
    expect(asAuditor.body.permissions).toEqual({ canRecord: false, canRetract: false, canReview: false })
    expect(asAuditor.body.signedOff.band).toMatchObject({ min: 30, max: 300 })
    expect(asAuditor.body.runs.length).toBeGreaterThanOrEqual(3)
    const asEngineer = await c.engineer.get(`/api/decisions/${decisionId}/verification`)
    expect(asEngineer.body.permissions).toEqual({ canRecord: true, canRetract: true, canReview: false })
    expect((await c.reviewer2.get(`/api/decisions/${decisionId}/verification`)).status).toBe(403)
    const decision = await c.engineer.get(`/api/decisions/${decisionId}`)
    expect(decision.body.calibration.approach).toBe('rans')
  })
})

describe('the record and the export', () => {
  it('prints the verification in the PDF record', async () => {
    const res = await fetch(`${c.auditor.baseUrl}/api/decisions/${decisionId}/report.pdf`, { headers: { cookie: c.auditor.cookie, 'x-forwarded-for': c.auditor.address } })
    expect(res.status).toBe(200)
    const dir = mkdtempSync(join(tmpdir(), 'eddyledger-verification-'))
    const file = join(dir, 'record.pdf')
    writeFileSync(file, Buffer.from(await res.arrayBuffer()))
    const text = execFileSync('/usr/bin/pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, '')
    expect(text).toContain('Aftertherun:verification')
    expect(text).toContain('duct-wall.csv.gz')
    // The Celik et al. 2008 study as recorded above: GCI_fine 2.2 %, order 1.53.
    expect(text).toContain('2.17%')
    expect(text).toContain('1.53')
    expect(text).toContain('retracted')
  })

  it('adds the verification columns to the audit CSV', async () => {
    const csv = (await c.auditor.get('/api/audit/decisions.csv')).body as string
    const lines = Papa.parse<string[]>(csv.replace(/^\uFEFF/, '').trim()).data
    const header = lines[0]!
    const row = lines.find(l => Number(l[header.indexOf('decision')]) === decisionId)!
    const col = (name: string) => row[header.indexOf(name)]
    expect(Number(col('wall checks'))).toBeGreaterThanOrEqual(5)
    expect(col('latest wall check verdict')).toMatch(/^(pass|fail)$/)
    expect(Number(col('grid studies'))).toBe(1)
    expect(Number(col('latest fine-grid GCI'))).toBeCloseTo(0.0217, 4)
    expect(Number(col('CPU runs'))).toBe(3)
    expect(Number(col('retracted records'))).toBe(2)
  })
})
