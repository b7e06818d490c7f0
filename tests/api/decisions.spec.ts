// The saved decision record through the real server and PostgreSQL: preview, save, revise, list,
// read, and who may do which.
import { createHash } from 'node:crypto'
import canonicalize from 'canonicalize'
import { beforeAll, describe, expect, it } from 'vitest'
import { advise, caseInputSchema, ENGINE_VERSION, RULESET } from '#shared/rules'
import type { ApiClient} from '../support/api-client';
import { signIn } from '../support/api-client'
import { CONDENSER_CASE, DUCT_CASE, createDraft, projectIds, uniqueTitle } from '../support/decisions'
import { allPages } from '../support/pages'

// RFC 8785 canonical JSON hashed with SHA-256 (FIPS 180-4), computed here independently of the server.
const sha256OfCanonical = (value: unknown) => createHash('sha256').update(canonicalize(value)!).digest('hex')

let engineer: ApiClient
let engineer2: ApiClient
let reviewer: ApiClient
let auditor: ApiClient
let lead: ApiClient
let admin: ApiClient
let project: Record<string, number>

beforeAll(async () => {
  ;[engineer, engineer2, reviewer, auditor, lead, admin] = await Promise.all(
    ['engineer', 'engineer2', 'reviewer', 'auditor', 'lead', 'admin'].map(signIn),
  )
  project = await projectIds(admin)
})

describe('POST /api/advice', () => {
  it('previews the engine\'s advice for any signed-in user, and saves nothing', async () => {
    const before = (await auditor.get(`/api/projects/${project['KB-102']}/decisions?limit=1`)).body.total
    const res = await auditor.post('/api/advice', { caseInput: DUCT_CASE })
    expect(res.status).toBe(200)
    // Expected: the engine itself, run in this process (advise() is deterministic).
    expect(res.body.advice).toEqual(JSON.parse(JSON.stringify(advise(DUCT_CASE))))
    expect(res.body.advice.cautions.length).toBeGreaterThan(0)
    expect((await auditor.get(`/api/projects/${project['KB-102']}/decisions?limit=1`)).body.total).toBe(before)
  })

  it('answers a bad case with 400 and messages keyed by the field path', async () => {
    const res = await engineer.post('/api/advice', {
      caseInput: { ...DUCT_CASE, fluid: { medium: 'custom', viscosity: 1e-3 }, velocity: -3 },
    })
    expect(res.status).toBe(400)
    const errors = res.body.data.fieldErrors
    expect(errors['caseInput.fluid.density'][0]).toMatch(/density is required for a custom fluid/i)
    expect(errors['caseInput.velocity'][0]).toMatch(/greater than zero/i)
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.mjs/)
  })

  it('answers a missing case with 400', async () => {
    const res = await engineer.post('/api/advice', {})
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.data.fieldErrors)).toEqual(['caseInput'])
  })

  it('answers a case sent again the same, and a bad body sent again with 400 again (answers kept by version)', async () => {
    const body = { caseInput: { ...DUCT_CASE, velocity: 6.25 } }
    const first = await engineer.post('/api/advice', body)
    const again = await reviewer.post('/api/advice', body)
    expect(first.status).toBe(200)
    expect(first.headers.get('content-type')).toMatch(/^application\/json/)
    expect(again.body).toEqual(first.body)
    // The same case with its keys in another order is the same case.
    const reordered = { caseInput: Object.fromEntries(Object.entries(body.caseInput).reverse()) }
    expect((await engineer.post('/api/advice', reordered)).body).toEqual(first.body)
    const bad = { caseInput: { ...DUCT_CASE, velocity: -1 } }
    for (let i = 0; i < 2; i++) expect((await engineer.post('/api/advice', bad)).status).toBe(400)
  })
})

describe('saving a decision', () => {
  it('stores revision 1 as a draft with the server\'s own advice, whatever the client sends', async () => {
    const res = await engineer.post(`/api/projects/${project['KB-102']}/decisions`, {
      title: '  Supply duct, main run  ',
      caseInput: DUCT_CASE,
      notes: 'First pass.',
      // A client's advice is never trusted: it is not part of the payload and must be ignored.
      advice: { recommendation: { approach: 'dns' } },
      status: 'approved',
    })
    expect(res.status).toBe(201)
    const { decision } = res.body
    expect(decision).toMatchObject({
      projectId: project['KB-102'], title: 'Supply duct, main run', status: 'draft', version: 1, revision: 1,
      notes: 'First pass.', override: null, supersedesId: null, supersededById: null,
      author: { name: 'Ada Ferreira', email: 'engineer@eddyledger.test' },
    })
    // The stored input is the parsed one (defaults applied), and the advice is advise() of it.
    expect(decision.caseInput).toEqual(caseInputSchema.parse(DUCT_CASE))
    expect(decision.advice).toEqual(JSON.parse(JSON.stringify(advise(decision.caseInput))))
    expect(decision.advice.recommendation.approach).not.toBe('dns')

    const revision = (await engineer.get(`/api/decisions/${decision.id}/revisions/1`)).body.revision
    expect(revision).toMatchObject({
      revision: 1,
      notes: 'First pass.',
      inputHash: sha256OfCanonical(decision.caseInput),
      rulesetId: RULESET.id,
      rulesetVersion: RULESET.version,
      engineVersion: ENGINE_VERSION,
      createdBy: { name: 'Ada Ferreira' },
    })
    expect(revision.advice).toEqual(decision.advice)

    const events = (await engineer.get(`/api/decisions/${decision.id}/events`)).body.events
    expect(events.map((e: { type: string }) => e.type)).toEqual(['created'])
    expect(events[0]).toMatchObject({ seq: 1, actor: { name: 'Ada Ferreira' }, actorRole: 'engineer' })
    expect(events[0].payload).toMatchObject({ revision: 1, inputHash: revision.inputHash, approach: decision.advice.recommendation.approach })
  })

  it('gives the same input hash whatever the key order of the input', async () => {
    const reordered = Object.fromEntries(Object.entries(DUCT_CASE).reverse())
    const a = await createDraft(engineer, project['KB-102']!)
    const b = await createDraft(engineer, project['KB-102']!, { caseInput: reordered as typeof DUCT_CASE })
    const hashOf = async (id: number) => (await engineer.get(`/api/decisions/${id}/revisions/1`)).body.revision.inputHash
    expect(await hashOf(a.id)).toBe(await hashOf(b.id))
  })

  it('answers a malformed body with 400 and per-field messages, saving nothing', async () => {
    const before = (await engineer.get(`/api/projects/${project['KB-102']}/decisions?limit=1`)).body.total
    const res = await engineer.post(`/api/projects/${project['KB-102']}/decisions`, {
      title: '',
      caseInput: { ...DUCT_CASE, velocity: 'fast', quantities: [] },
    })
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.data.fieldErrors).sort()).toEqual(['caseInput.quantities', 'caseInput.velocity', 'title'])
    expect(res.body.data.fieldErrors['caseInput.velocity'][0]).toMatch(/must be a number/i)
    expect((await engineer.get(`/api/projects/${project['KB-102']}/decisions?limit=1`)).body.total).toBe(before)
  })

  it('lets only engineer and reviewer members create decisions', async () => {
    // engineer is not a member of KB-104; auditors, leads and admins never create.
    for (const [client, projectCode] of [[engineer, 'KB-104'], [auditor, 'KB-102'], [lead, 'KB-102'], [admin, 'KB-102']] as const) {
      const res = await client.post(`/api/projects/${project[projectCode]}/decisions`, { title: 'Not allowed', caseInput: DUCT_CASE })
      expect(res.status).toBe(403)
      expect(res.body.message).toBeTruthy()
    }
    await createDraft(reviewer, project['KB-102']!)
    expect((await engineer.post('/api/projects/999999/decisions', { title: 'Nowhere', caseInput: DUCT_CASE })).status).toBe(404)
  })
})

describe('revising a draft', () => {
  it('stores a new revision, keeps the earlier one readable, and refuses a stale version', async () => {
    const draft = await createDraft(engineer, project['KB-102']!, { notes: 'Main run only.' })
    const faster = { ...DUCT_CASE, velocity: 12 }
    const res = await engineer.put(`/api/decisions/${draft.id}`, { caseInput: faster, version: draft.version, title: 'Supply duct at peak flow' })
    expect(res.status).toBe(200)
    const revised = res.body.decision
    expect(revised).toMatchObject({ version: 2, revision: 2, title: 'Supply duct at peak flow', status: 'draft', notes: 'Main run only.' })
    expect(revised.caseInput.velocity).toBe(12)
    expect(revised.advice).toEqual(JSON.parse(JSON.stringify(advise(revised.caseInput))))

    const first = (await engineer.get(`/api/decisions/${draft.id}/revisions/1`)).body.revision
    expect(first.caseInput.velocity).toBe(8)
    expect(first.advice.reynolds).toBeLessThan(revised.advice.reynolds)
    expect((await engineer.get(`/api/decisions/${draft.id}/revisions/3`)).status).toBe(404)

    // The same client sending the version it had before: someone (here, itself) changed it since.
    const stale = await engineer.put(`/api/decisions/${draft.id}`, { caseInput: DUCT_CASE, version: draft.version })
    expect(stale.status).toBe(409)
    expect(stale.body.message).toMatch(/changed since you loaded it.*version 2.*sent 1/i)
    const after = (await engineer.get(`/api/decisions/${draft.id}`)).body
    expect(after.decision.version).toBe(2)
    expect(after.revisions.map((r: { revision: number }) => r.revision)).toEqual([1, 2])
    expect(after.events.map((e: { type: string }) => e.type)).toEqual(['created', 'revised'])
    expect(after.events[1].payload).toMatchObject({ revision: 2, inputHash: sha256OfCanonical(revised.caseInput) })
  })

  it('lets only the author revise, and only a draft', async () => {
    const draft = await createDraft(engineer, project['KB-102']!)
    for (const client of [engineer2, reviewer, auditor, lead, admin]) {
      expect((await client.put(`/api/decisions/${draft.id}`, { caseInput: DUCT_CASE, version: 1 })).status).toBe(403)
    }
    expect((await engineer.post(`/api/decisions/${draft.id}/submit`, { version: 1 })).status).toBe(200)
    const res = await engineer.put(`/api/decisions/${draft.id}`, { caseInput: DUCT_CASE, version: 2 })
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/only a draft can be revised.*in review/i)
  })

  it('answers a revision without a version with 400', async () => {
    const draft = await createDraft(engineer, project['KB-102']!)
    const res = await engineer.put(`/api/decisions/${draft.id}`, { caseInput: DUCT_CASE })
    expect(res.status).toBe(400)
    expect(res.body.data.fieldErrors.version[0]).toMatch(/version/i)
  })
})

describe('listing and reading', () => {
  it('lists a project\'s decisions newest first, paginated and filtered by status', async () => {
    const older = await createDraft(engineer, project['KB-103']!, { title: uniqueTitle('Older'), caseInput: CONDENSER_CASE })
    const newer = await createDraft(engineer, project['KB-103']!, { title: uniqueTitle('Newer'), caseInput: CONDENSER_CASE })
    const list = (await engineer.get(`/api/projects/${project['KB-103']}/decisions?limit=2`)).body
    expect(list).toMatchObject({ totalIsEstimate: false })
    expect(list.nextCursor).toEqual(expect.any(String))
    expect(list.items.map((d: { id: number }) => d.id)).toEqual([newer.id, older.id])
    const summary = list.items[0]
    const advice = advise(CONDENSER_CASE)
    const chosen = advice.approaches.find(a => a.id === advice.recommendation.approach)!
    expect(summary).toMatchObject({
      id: newer.id, projectId: project['KB-103'], projectCode: 'KB-103', status: 'draft', version: 1, revision: 1,
      author: { name: 'Ada Ferreira' }, reviewer: null,
      approach: advice.recommendation.approach,
      model: advice.recommendation.model,
      wallTreatment: advice.recommendation.wallTreatment,
      overridden: false,
      budgetCoreHours: 200_000,
    })
    expect(summary.reynolds).toBeCloseTo(advice.reynolds, 6)
    expect(summary.coreHours).toBeCloseTo(chosen.coreHours, 6)
    expect(summary).not.toHaveProperty('advice')

    // The next page starts after the last row of this one.
    const page2 = (await engineer.get(`/api/projects/${project['KB-103']}/decisions?limit=1&cursor=${list.nextCursor}`)).body
    const all = (await allPages(engineer, `/api/projects/${project['KB-103']}/decisions`, 1)).rows.map((d: { id: number }) => d.id)
    expect(page2.items.map((d: { id: number }) => d.id)).toEqual(all.slice(2, 3))
    expect(page2.total).toBe(list.total)
    expect(all).toHaveLength(list.total)
    expect(new Set(all).size).toBe(all.length)
    expect(list.total).toBeGreaterThanOrEqual(2)

    expect((await engineer.post(`/api/decisions/${older.id}/submit`, { version: 1 })).status).toBe(200)
    const inReview = (await engineer.get(`/api/projects/${project['KB-103']}/decisions?status=in_review&limit=100`)).body
    expect(inReview.items.map((d: { id: number }) => d.id)).toContain(older.id)
    expect(inReview.items.every((d: { status: string }) => d.status === 'in_review')).toBe(true)
    expect(inReview.total).toBe(inReview.items.length)
    // The submission moved it to the top: the latest activity first.
    expect((await engineer.get(`/api/projects/${project['KB-103']}/decisions?limit=1`)).body.items[0]).toMatchObject({ id: older.id, version: 2, status: 'in_review' })
  })

  it('answers a bad list query with 400 and per-field messages', async () => {
    const res = await engineer.get(`/api/projects/${project['KB-102']}/decisions?status=finished&cursor=abc&limit=1000`)
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.data.fieldErrors).sort()).toEqual(['cursor', 'limit', 'status'])
    expect(res.body.data.fieldErrors.status[0]).toMatch(/draft, in_review/)
  })

  it('reads one decision with its project, revisions, events and the reader\'s permissions', async () => {
    const draft = await createDraft(engineer, project['KB-102']!)
    const mine = (await engineer.get(`/api/decisions/${draft.id}`)).body
    expect(mine.project).toEqual({ id: project['KB-102'], code: 'KB-102', name: 'Data-hall cooling air ducts' })
    expect(mine.decision.id).toBe(draft.id)
    expect(mine.revisions).toEqual([expect.objectContaining({ revision: 1, createdBy: { id: draft.author.id, name: 'Ada Ferreira' } })])
    expect(mine.events).toHaveLength(1)
    expect(mine.permissions).toMatchObject({ canRevise: true, canSubmit: true, canReview: false, canSupersede: false })
    const theirs = (await reviewer.get(`/api/decisions/${draft.id}`)).body
    expect(theirs.permissions).toMatchObject({ canRevise: false, canSubmit: false, canReview: false, canSupersede: false })
  })

  it('lets members, auditors and leads read; refuses non-members and admins', async () => {
    const engineer2Draft = await createDraft(engineer2, project['KB-104']!)
    const paths = [
      `/api/decisions/${engineer2Draft.id}`,
      `/api/decisions/${engineer2Draft.id}/revisions/1`,
      `/api/decisions/${engineer2Draft.id}/events`,
      `/api/decisions/${engineer2Draft.id}/verify`,
      `/api/projects/${project['KB-104']}/decisions`,
    ]
    for (const path of paths) {
      expect((await engineer.get(path)).status, `non-member ${path}`).toBe(403)
      expect((await reviewer.get(path)).status, `non-member reviewer ${path}`).toBe(403)
      expect((await admin.get(path)).status, `admin ${path}`).toBe(403)
      expect((await auditor.get(path)).status, `auditor ${path}`).toBe(200)
      expect((await lead.get(path)).status, `lead ${path}`).toBe(200)
      expect((await engineer2.get(path)).status, `member ${path}`).toBe(200)
    }
    const refused = await engineer.get(`/api/decisions/${engineer2Draft.id}`)
    expect(refused.body.message).toMatch(/not a member/i)
    expect(JSON.stringify(refused.body)).not.toContain('caseInput')
    const auditorView = (await auditor.get(`/api/decisions/${engineer2Draft.id}`)).body
    expect(auditorView.permissions).toEqual({ canRevise: false, canSubmit: false, canReview: false, canSupersede: false, canComment: false })
  })

  it('answers 404 for a decision that does not exist and 400 for a malformed id, on every route', async () => {
    const gets = ['', '/revisions/1', '/events', '/verify']
    for (const suffix of gets) {
      expect((await auditor.get(`/api/decisions/999999${suffix}`)).status, suffix).toBe(404)
      const bad = await auditor.get(`/api/decisions/abc${suffix}`)
      expect(bad.status, suffix).toBe(400)
      expect(bad.body.message).toMatch(/number/i)
    }
    expect((await auditor.get('/api/decisions/1/revisions/x')).status).toBe(400)
    const writes: [string, string, Record<string, unknown>][] = [
      ['PUT', '', { caseInput: DUCT_CASE, version: 1 }],
      ['POST', '/submit', { version: 1 }],
      ['POST', '/approve', { version: 1 }],
      ['POST', '/override', { version: 1, approach: 'rans', model: 'k-omega SST', wallTreatment: 'wall-function', comment: 'A full sentence of reasons here.' }],
      ['POST', '/request-changes', { version: 1, comment: 'Please check the inlet profile.' }],
      ['POST', '/supersede', { version: 1 }],
      ['POST', '/comments', { comment: 'A note.' }],
    ]
    for (const [method, suffix, body] of writes) {
      expect((await engineer.request(method, `/api/decisions/999999${suffix}`, body)).status, `${method} ${suffix}`).toBe(404)
      expect((await engineer.request(method, `/api/decisions/0${suffix}`, body)).status, `${method} ${suffix}`).toBe(400)
    }
    expect((await engineer.get('/api/projects/999999/decisions')).status).toBe(404)
  })
})
