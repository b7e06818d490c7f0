// The team's rulesets end to end, on a server and database of this file's own (publishing changes
// the advice every other test would get): a lead drafts, edits a rule, previews which past
// decisions would change, cannot publish while a canonical case fails, publishes; new advice names
// the new version while saved decisions keep theirs.
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { advise, compileRuleset, RULESET, type CaseInputDraft, type Ruleset } from '#shared/rules'
import { ApiClient, demoEmail } from '../support/api-client'
import { createDraft, uniqueTitle } from '../support/decisions'
import { freePort, startServer } from '../support/test-server'

type Server = Awaited<ReturnType<typeof startServer>>
type Choice = { approach: string; model: string; wallTreatment: string }
type RulesetBody = { id: number; key: string; version: string; status: string; rules: any[]; baseScores: Record<string, number>; baseWhy: string }

let server: Server
let owner: pg.Client
const roles = ['engineer', 'reviewer', 'auditor', 'lead', 'admin'] as const
const as = {} as Record<(typeof roles)[number], ApiClient>

const RULE = 'attached-aerodynamics-sst'

/** Attached flow over streamlined bodies: the edited rule decides their RANS model. */
function streamlined(velocity: number, length: number, medium: 'air' | 'water' = 'air'): CaseInputDraft {
  return {
    regime: 'external', fluid: { medium }, velocity, length, geometry: 'streamlined', separation: 'none',
    quantities: ['forces', 'pressure'], budget: { coreHours: 5_000, cores: 128, wallClockHours: 48 },
  }
}
// A spread of past cases: some that the edit flips, some it leaves alone (bluff, separated, ducts).
const PAST_CASES: CaseInputDraft[] = [
  streamlined(50, 1), streamlined(30, 2.5), streamlined(6, 36, 'water'), streamlined(0.5, 0.2, 'water'),
  { ...streamlined(20, 1), separation: 'mild' },
  { ...streamlined(10, 2), geometry: 'bluff', separation: 'massive', quantities: ['unsteady-loads'] },
  {
    regime: 'internal', fluid: { medium: 'air' }, velocity: 8, length: 0.6, geometry: 'duct', separation: 'none',
    quantities: ['pressure'], budget: { coreHours: 5_000, cores: 128, wallClockHours: 48 },
  },
]

function engineForm(ruleset: RulesetBody) {
  return { id: ruleset.key, version: ruleset.version, baseScores: ruleset.baseScores, baseWhy: ruleset.baseWhy, rules: ruleset.rules }
}

const choice = (recommendation: Choice): Choice => ({ approach: recommendation.approach, model: recommendation.model, wallTreatment: recommendation.wallTreatment })

/** Every decision's latest revision, read straight from the database. */
async function latestRevisions() {
  const { rows } = await owner.query(`SELECT d.id, r.case_input, r.ruleset_version FROM decisions d
    JOIN decision_revisions r ON r.decision_id = d.id AND r.revision = d.current_revision ORDER BY d.id`)
  return rows as { id: number; case_input: CaseInputDraft; ruleset_version: string }[]
}

/** The test's own replay: which decisions change under `to` against `from`, computed here. */
async function expectedChanges(from: Ruleset, to: Ruleset) {
  const changes: { decisionId: number; from: Choice; to: Choice }[] = []
  for (const row of await latestRevisions()) {
    const before = choice(advise(row.case_input, { ruleset: from }).recommendation)
    const after = choice(advise(row.case_input, { ruleset: to }).recommendation)
    if (JSON.stringify(before) !== JSON.stringify(after)) changes.push({ decisionId: row.id, from: before, to: after })
  }
  return changes
}

beforeAll(async () => {
  server = await startServer({ database: 'eddyledger_rulesets', port: await freePort() })
  owner = new pg.Client({ connectionString: server.databaseUrl })
  await owner.connect()
  for (const role of roles) {
    as[role] = new ApiClient(server.url)
    await as[role].login(demoEmail(role))
  }
}, 120_000)

afterAll(async () => {
  await owner?.end()
  await server?.stop()
})

describe('the seeded catalogue', () => {
  it('holds the engine\'s version as the published one, readable by every role, with its publication in the chained history', async () => {
    for (const role of roles) {
      const res = await as[role].get('/api/rulesets/published')
      expect(res.status, role).toBe(200)
      expect(res.body.ruleset).toMatchObject({ key: RULESET.id, version: RULESET.version, status: 'published' })
      expect(res.body.ruleset.rules).toEqual(JSON.parse(JSON.stringify(RULESET.rules)))
    }
    const list = (await as.auditor.get('/api/rulesets')).body.rulesets as RulesetBody[]
    // Every version a saved decision names is in the catalogue.
    const named = new Set((await latestRevisions()).map(row => row.ruleset_version))
    for (const version of named) expect(list.map(r => r.version)).toContain(version)
    const history = (await as.auditor.get('/api/rulesets/history')).body
    expect(history.chain).toMatchObject({ valid: true })
    expect(history.events.at(-1)).toMatchObject({ type: 'published', version: RULESET.version, actor: { name: 'Ruth Calder' } })
  })
})

describe('drafting, impact and publication', () => {
  let published: RulesetBody
  let draft: RulesetBody
  let inReview: { id: number; version: number }

  beforeAll(async () => {
    for (const caseInput of PAST_CASES) await createDraft(as.engineer, await projectId('KB-101'), { caseInput, title: uniqueTitle('Past case') })
    // One waiting for review when the new version is published.
    const waiting = await createDraft(as.engineer, await projectId('KB-101'), { caseInput: streamlined(40, 1.2), title: uniqueTitle('In review') })
    const submitted = await as.engineer.post(`/api/decisions/${waiting.id}/submit`, { version: waiting.version })
    expect(submitted.status).toBe(200)
    inReview = submitted.body.decision
    published = (await as.lead.get('/api/rulesets/published')).body.ruleset
  })

  async function projectId(code: string) {
    const projects = (await as.lead.get('/api/projects')).body.projects as { id: number; code: string }[]
    return projects.find(p => p.code === code)!.id
  }

  it('refuses drafting, editing, previewing and publishing to engineers, reviewers and auditors (403)', async () => {
    for (const role of ['engineer', 'reviewer', 'auditor'] as const) {
      expect((await as[role].post('/api/rulesets', {})).status, role).toBe(403)
      expect((await as[role].put(`/api/rulesets/${published.id}`, { rules: published.rules })).status, role).toBe(403)
      expect((await as[role].post(`/api/rulesets/${published.id}/publish`, { note: 'Not theirs to publish.' })).status, role).toBe(403)
      expect((await as[role].post(`/api/rulesets/${published.id}/impact`, {})).status, role).toBe(403)
      expect((await as[role].put(`/api/rulesets/${published.id}/cases`, { cases: [] })).status, role).toBe(403)
    }
  })

  it('lets a lead draft a copy of the published version, hidden from the other roles', async () => {
    const res = await as.lead.post('/api/rulesets', {})
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    draft = res.body.ruleset
    expect(draft).toMatchObject({ status: 'draft', key: published.key, rules: published.rules, basedOnId: published.id })
    expect(draft.version).toBe(`${published.version.split('.')[0]}.${Number(published.version.split('.')[1]) + 1}.0`)
    expect((await as.engineer.get(`/api/rulesets/${draft.id}`)).status).toBe(404)
    expect((await as.lead.get(`/api/rulesets/${draft.id}`)).body.ruleset.id).toBe(draft.id)
    // Its canonical cases are copied from the published version.
    const cases = (await as.lead.get(`/api/rulesets/${draft.id}/cases`)).body
    expect(cases.cases.length).toBeGreaterThan(0)
    expect(cases.passing).toBe(true)
  })

  it('refuses an invalid condition or effect with 400, naming the rule and the reason', async () => {
    const rules = structuredClone(draft.rules)
    const index = rules.findIndex(r => r.id === 'buoyancy')
    rules[index].when = { '==': [{ var: 'physics.buoyant' }, true] }
    const unknownFact = await as.lead.put(`/api/rulesets/${draft.id}`, { rules })
    expect(unknownFact.status).toBe(400)
    expect(unknownFact.body.message).toContain('Rule "buoyancy"')
    expect(unknownFact.body.message).toContain('Unknown fact "physics.buoyant"')
    expect(unknownFact.body.data.problems).toEqual([
      { rule: 'buoyancy', ruleIndex: index, path: 'when.==.0.var', message: 'Unknown fact "physics.buoyant"; see FACT_PATHS in facts.ts.' },
    ])

    const operation = structuredClone(draft.rules)
    operation[index].when = { some: [{ var: 'quantities' }, { '==': [{ var: '' }, 'noise'] }] }
    const refused = await as.lead.put(`/api/rulesets/${draft.id}`, { rules: operation })
    expect(refused.status).toBe(400)
    expect(refused.body.message).toMatch(/Rule "buoyancy".*disallowed json-logic operation "some"/)

    const model = structuredClone(draft.rules)
    const rule = model.findIndex(r => r.id === RULE)
    model[rule].effects.models.rans = 'a model of our own'
    const badModel = await as.lead.put(`/api/rulesets/${draft.id}`, { rules: model })
    expect(badModel.status).toBe(400)
    expect(badModel.body.message).toContain(`Rule "${RULE}"`)
    expect(badModel.body.message).toContain('"a model of our own" is not among the models listed for rans')
    // Nothing was saved.
    expect((await as.lead.get(`/api/rulesets/${draft.id}`)).body.ruleset.rules).toEqual(draft.rules)
  })

  it('previews exactly the past decisions the edit flips, with the rule responsible (recomputed here)', async () => {
    const rules = structuredClone(draft.rules)
    // The team's experience: attached streamlined bodies get Spalart-Allmaras rather than k-omega SST.
    rules.find(r => r.id === RULE)!.effects.models = { rans: 'Spalart-Allmaras', urans: 'Spalart-Allmaras' }
    const saved = await as.lead.put(`/api/rulesets/${draft.id}`, { rules })
    expect(saved.status, JSON.stringify(saved.body)).toBe(200)
    draft = saved.body.ruleset

    const res = await as.lead.post(`/api/rulesets/${draft.id}/impact`, {})
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    const expected = await expectedChanges(compileRuleset(engineForm(published)), compileRuleset(engineForm(draft)))
    const total = (await latestRevisions()).length
    expect(expected.length).toBeGreaterThan(0)
    expect(expected.length).toBeLessThan(total)
    expect(res.body.evaluated).toBe(total)
    expect(res.body.changes.map(({ rules: _rules, ...change }: { rules: string[] }) => change)).toEqual(expected)
    for (const change of res.body.changes) {
      expect(change.from.model).toBe('k-omega SST')
      expect(change.to.model).toBe('Spalart-Allmaras')
      expect(change.rules).toEqual([RULE])
    }
  })

  it('filters the preview by project and status', async () => {
    const kb101 = await projectId('KB-101')
    const all = (await as.lead.post(`/api/rulesets/${draft.id}/impact`, {})).body
    const { rows } = await owner.query('SELECT id FROM decisions WHERE project_id = $1 AND status = $2', [kb101, 'in_review'])
    const ids = new Set(rows.map(r => Number(r.id)))
    const filtered = await as.lead.post(`/api/rulesets/${draft.id}/impact`, { filter: { projectId: kb101, status: 'in_review' } })
    expect(filtered.status).toBe(200)
    expect(filtered.body.evaluated).toBe(ids.size)
    expect(filtered.body.changes).toEqual(all.changes.filter((c: { decisionId: number }) => ids.has(c.decisionId)))
    expect(filtered.body.changes.map((c: { decisionId: number }) => c.decisionId)).toContain(inReview.id)
    const bad = await as.lead.post(`/api/rulesets/${draft.id}/impact`, { filter: { status: 'lost' } })
    expect(bad.status).toBe(400)
  })

  it('runs the preview as a job with progress on request, with the same result', async () => {
    const started = await as.lead.post(`/api/rulesets/${draft.id}/impact`, { background: true })
    expect(started.status).toBe(202)
    expect(started.body.job).toMatchObject({ status: 'running', evaluated: 0 })
    let job = started.body.job
    for (let attempt = 0; job.status === 'running' && attempt < 100; attempt++) {
      await new Promise(resolve => setTimeout(resolve, 100))
      job = (await as.lead.get(`/api/rulesets/impact-jobs/${job.id}`)).body.job
    }
    expect(job.status).toBe('done')
    expect(job.evaluated).toBe(job.total)
    const direct = (await as.lead.post(`/api/rulesets/${draft.id}/impact`, {})).body
    expect(job.changes).toEqual(direct.changes)
  })

  it('cannot publish while a canonical case fails (409), and can once it passes', async () => {
    const current = (await as.lead.get(`/api/rulesets/${draft.id}/cases`)).body.cases as { title: string; caseInput: unknown; expected: unknown }[]
    const keep = current.map(({ title, caseInput, expected }) => ({ title, caseInput, expected }))
    const wing = { title: 'Attached wing section at 50 m/s', caseInput: streamlined(50, 1), expected: { approach: 'rans', model: 'k-omega SST' } }
    const put = await as.lead.put(`/api/rulesets/${draft.id}/cases`, { cases: [...keep, wing] })
    expect(put.status, JSON.stringify(put.body)).toBe(200)
    expect(put.body.passing).toBe(false)
    expect(put.body.cases.at(-1)).toMatchObject({ passes: false, actual: { approach: 'rans', model: 'Spalart-Allmaras' } })

    const refused = await as.lead.post(`/api/rulesets/${draft.id}/publish`, { note: 'Attached streamlined bodies get Spalart-Allmaras.' })
    expect(refused.status).toBe(409)
    expect(refused.body.message).toContain('Attached wing section at 50 m/s')
    expect((await as.lead.get('/api/rulesets/published')).body.ruleset.id).toBe(published.id)

    const fixed = await as.lead.put(`/api/rulesets/${draft.id}/cases`, { cases: [...keep, { ...wing, expected: { approach: 'rans', model: 'Spalart-Allmaras' } }] })
    expect(fixed.body.passing).toBe(true)
    const res = await as.lead.post(`/api/rulesets/${draft.id}/publish`, { note: 'Attached streamlined bodies get Spalart-Allmaras.' })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.ruleset).toMatchObject({ id: draft.id, status: 'published', version: draft.version, publishedBy: { name: 'Ruth Calder' } })
    const list = (await as.lead.get('/api/rulesets')).body.rulesets as RulesetBody[]
    expect(list.find(r => r.id === published.id)!.status).toBe('retired')
    expect(list.filter(r => r.status === 'published').map(r => r.id)).toEqual([draft.id])
    const history = (await as.auditor.get('/api/rulesets/history')).body
    expect(history.chain).toMatchObject({ valid: true })
    expect(history.events.at(-1)).toMatchObject({
      type: 'published', rulesetId: draft.id, actor: { name: 'Ruth Calder' }, actorRole: 'lead',
      payload: { version: draft.version, note: 'Attached streamlined bodies get Spalart-Allmaras.', replaces: { id: published.id, version: published.version } },
    })
  })

  it('gives new advice with the new version while saved decisions, the one in review too, keep theirs', async () => {
    const advice = (await as.engineer.post('/api/advice', { caseInput: streamlined(50, 1) })).body.advice
    expect(advice.ruleset).toEqual({ id: draft.key, version: draft.version })
    expect(advice.recommendation.model).toBe('Spalart-Allmaras')

    const fresh = await createDraft(as.engineer, await projectId('KB-101'), { caseInput: streamlined(50, 1) })
    expect(fresh.advice.ruleset.version).toBe(draft.version)
    expect((await as.engineer.get(`/api/decisions/${fresh.id}/revisions/1`)).body.revision.rulesetVersion).toBe(draft.version)

    const kept = (await as.reviewer.get(`/api/decisions/${inReview.id}`)).body.decision
    expect(kept.status).toBe('in_review')
    expect(kept.advice.ruleset.version).toBe(published.version)
    expect(kept.advice.recommendation.model).toBe('k-omega SST')
    const { rows } = await owner.query('SELECT DISTINCT ruleset_version FROM decision_revisions WHERE created_at < (SELECT published_at FROM rulesets WHERE id = $1)', [draft.id])
    expect(rows.map(r => r.ruleset_version)).not.toContain(draft.version)
  })

  it('re-evaluates a saved decision under the current ruleset, showing what differs and changing nothing', async () => {
    const before = (await as.reviewer.get(`/api/decisions/${inReview.id}`)).body
    const res = await as.reviewer.get(`/api/decisions/${inReview.id}/reevaluation`)
    expect(res.status).toBe(200)
    expect(res.body.reevaluation).toMatchObject({
      made: { rulesetVersion: published.version, recommendation: { model: 'k-omega SST' } },
      current: { rulesetVersion: draft.version, recommendation: { model: 'Spalart-Allmaras' } },
      newerRuleset: true,
      recommendationChanged: true,
      differs: { approach: false, model: true, wallTreatment: false },
      rules: [RULE],
    })
    const after = (await as.reviewer.get(`/api/decisions/${inReview.id}`)).body
    expect(after.decision).toEqual(before.decision)
    expect(after.events).toEqual(before.events)
  })

  it('keeps a published version immutable: 409 from the API, refused by the database', async () => {
    expect((await as.lead.put(`/api/rulesets/${draft.id}`, { rules: published.rules })).status).toBe(409)
    expect((await as.lead.put(`/api/rulesets/${published.id}/cases`, { cases: [] })).status).toBe(409)
    expect((await as.lead.post(`/api/rulesets/${published.id}/publish`, { note: 'Again' })).status).toBe(409)
    expect((await as.lead.delete(`/api/rulesets/${draft.id}`)).status).toBe(409)
    await expect(owner.query(`UPDATE rulesets SET rules = '[]' WHERE id = $1`, [draft.id])).rejects.toThrow(/immutable/)
    await expect(owner.query(`UPDATE rulesets SET version = '9.9.9' WHERE id = $1`, [published.id])).rejects.toThrow(/immutable/)
    await expect(owner.query(`UPDATE rulesets SET status = 'draft' WHERE id = $1`, [draft.id])).rejects.toThrow(/cannot go from published to draft/)
    await expect(owner.query('DELETE FROM rulesets WHERE id = $1', [published.id])).rejects.toThrow(/kept for good/)
    await expect(owner.query('DELETE FROM ruleset_cases WHERE ruleset_id = $1', [draft.id])).rejects.toThrow(/kept as published/)
    await expect(owner.query('UPDATE ruleset_events SET payload = \'{}\'')).rejects.toThrow(/append-only/)
  })

  it('rolls back by publishing the earlier version\'s rules as a new version', async () => {
    const res = await as.lead.post('/api/rulesets', { from: published.id })
    expect(res.status).toBe(201)
    const rollback = res.body.ruleset as RulesetBody
    expect(rollback.rules).toEqual(published.rules)
    expect(rollback.version).toBe(`${draft.version.split('.')[0]}.${Number(draft.version.split('.')[1]) + 1}.0`)
    const impact = (await as.lead.post(`/api/rulesets/${rollback.id}/impact`, {})).body
    expect(impact.changes.length).toBeGreaterThan(0)
    expect(impact.changes.every((c: { to: Choice }) => c.to.model === 'k-omega SST')).toBe(true)
    // The draft carries the earlier version's canonical cases, which its rules pass.
    expect((await as.lead.get(`/api/rulesets/${rollback.id}/cases`)).body.passing).toBe(true)
    const done = await as.lead.post(`/api/rulesets/${rollback.id}/publish`, { note: 'Back to the engine\'s rules.' })
    expect(done.status, JSON.stringify(done.body)).toBe(200)
    expect((await as.engineer.post('/api/advice', { caseInput: streamlined(50, 1) })).body.advice).toMatchObject({
      ruleset: { version: rollback.version }, recommendation: { model: 'k-omega SST' },
    })
  })

  it('exports a version and imports it as a draft, checked like any draft', async () => {
    const exported = await as.auditor.get(`/api/rulesets/${draft.id}/export`)
    expect(exported.status).toBe(200)
    expect(exported.headers.get('content-disposition')).toContain(`ruleset-${draft.key}-${draft.version}.json`)
    const imported = await as.lead.post('/api/rulesets', { import: exported.body })
    expect(imported.status, JSON.stringify(imported.body)).toBe(201)
    expect(imported.body.ruleset.rules).toEqual(draft.rules)
    expect((await as.lead.get(`/api/rulesets/${imported.body.ruleset.id}/cases`)).body.cases.length).toBe(exported.body.cases.length)
    const broken = structuredClone(exported.body)
    broken.ruleset.rules[0].effects = { wallTreatment: { dns: 'wall-function' } }
    const refused = await as.lead.post('/api/rulesets', { import: broken })
    expect(refused.status).toBe(400)
    expect(refused.body.message).toContain(`Rule "${broken.ruleset.rules[0].id}"`)
    expect((await as.lead.delete(`/api/rulesets/${imported.body.ruleset.id}`)).status).toBe(200)
  })

  it('shows the lead decisions by ruleset version', async () => {
    const overview = (await as.lead.get('/api/overview')).body
    const { rows } = await owner.query(`SELECT r.ruleset_version AS version, count(*)::int AS count FROM decisions d
      JOIN decision_revisions r ON r.decision_id = d.id AND r.revision = d.current_revision GROUP BY 1`)
    expect(Object.fromEntries(overview.rulesets.byVersion.map((v: { version: string; count: number }) => [v.version, v.count])))
      .toEqual(Object.fromEntries(rows.map(r => [r.version, r.count])))
    expect(rows.length).toBeGreaterThan(1)
  })
})
