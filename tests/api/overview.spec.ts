// The team lead's overview: every figure is recomputed here from the decisions read one by one
// through the decision API (the engine's advice and the reviewer's override as stored), not from
// the overview's own SQL.
import { beforeAll, describe, expect, it } from 'vitest'
import { MODELS_BY_APPROACH, RULESET, WALL_TREATMENTS_BY_APPROACH, type ApproachId } from '#shared/rules'
import { type ApiClient, signIn } from '../support/api-client'
import { CONDENSER_CASE, DUCT_CASE, act, createDraft, projectIds, uniqueTitle } from '../support/decisions'
import { allPages } from '../support/pages'

type Detail = {
  decision: {
    id: number; projectId: number; status: string; createdAt: string
    caseInput: { budget: { coreHours: number } }
    advice: { recommendation: { approach: string; model: string }; approaches: { id: string; model: string; coreHours: number }[]; trace: { rule: string; fired: boolean }[] }
    override: { approach: string; model: string; disagreedRules: string[]; cost?: { coreHours: number } } | null
    requested: { figures: { approach: string; cost: { coreHours: number } } } | null
  }
}
type Row = {
  id: number; projectId: number; status: string; createdDay: string; overridden: boolean
  approach: string; model: string; engineApproach: string; coreHours: number; budget: number; disagreedRules: string[]
}

let lead: ApiClient
let auditor: ApiClient
let engineer: ApiClient
let reviewer: ApiClient
let project: Record<string, number>

/** Every decision in the database, read through the project lists and each decision's page. */
async function readAllDecisions(): Promise<Row[]> {
  const rows: Row[] = []
  for (const id of Object.values(project)) {
    const { rows: list } = await allPages<{ id: number }>(lead, `/api/projects/${id}/decisions`, 100)
    for (const { id: decisionId } of list) {
      const { decision: d } = (await lead.get(`/api/decisions/${decisionId}`)).body as Detail
      // The approach a decision stands for: the reviewer's when overridden, else the engineer's
      // own when requested, else the engine's; its cost recomputed for that choice.
      const approach = d.override?.approach ?? d.requested?.figures.approach ?? d.advice.recommendation.approach
      const engineEntry = d.advice.approaches.find(a => a.id === approach)!
      rows.push({
        id: d.id, projectId: d.projectId, status: d.status, createdDay: d.createdAt.slice(0, 10),
        overridden: d.override !== null,
        approach,
        model: d.override?.model ?? engineEntry.model,
        engineApproach: d.advice.recommendation.approach,
        coreHours: d.override ? (d.override.cost?.coreHours ?? engineEntry.coreHours) : (d.requested?.figures.cost.coreHours ?? engineEntry.coreHours),
        budget: d.caseInput.budget.coreHours,
        disagreedRules: d.override?.disagreedRules ?? [],
      })
    }
  }
  return rows
}

function tally<T>(items: T[], key: (item: T) => string) {
  const counts = new Map<string, number>()
  for (const item of items) counts.set(key(item), (counts.get(key(item)) ?? 0) + 1)
  return counts
}

const closeTo = (actual: number, expected: number) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(expected)))

/** The overview as it must be for these decisions, in the shape the route answers. */
function expectOverview(body: any, rows: Row[], projectsInScope: number[]) {
  const byStatus = tally(rows, r => r.status)
  expect(body.decisions.total).toBe(rows.length)
  for (const status of ['draft', 'in_review', 'approved', 'overridden', 'superseded']) {
    expect(body.decisions.byStatus[status], status).toBe(byStatus.get(status) ?? 0)
  }

  const approaches = tally(rows, r => r.approach)
  expect(Object.fromEntries(body.methods.byApproach.map((m: any) => [m.approach, m.count]))).toEqual(Object.fromEntries(approaches))
  const models = tally(rows, r => `${r.approach} / ${r.model}`)
  expect(Object.fromEntries(body.methods.byModel.map((m: any) => [`${m.approach} / ${m.model}`, m.count]))).toEqual(Object.fromEntries(models))
  // Most used first.
  const counts = body.methods.byApproach.map((m: any) => m.count)
  expect(counts).toEqual([...counts].sort((a, b) => b - a))

  // An override stays counted after its decision is superseded: the review happened.
  const overridden = rows.filter(r => r.overridden)
  // Only approved or overridden decisions can be superseded, so every superseded one was reviewed.
  const reviewed = rows.filter(r => r.status === 'approved' || r.status === 'overridden' || r.status === 'superseded').length
  expect(body.overrides.overridden).toBe(overridden.length)
  expect(body.overrides.reviewed).toBe(reviewed)
  if (reviewed) closeTo(body.overrides.rate, overridden.length / reviewed)
  else expect(body.overrides.rate).toBeNull()

  const pairs = tally(overridden, r => `${r.engineApproach} -> ${r.approach}`)
  const top = [...pairs.values()].sort((a, b) => b - a).slice(0, 10)
  expect(body.overrides.pairs.map((p: any) => p.count)).toEqual(top)
  for (const p of body.overrides.pairs) expect(pairs.get(`${p.engineApproach} -> ${p.reviewerApproach}`)).toBe(p.count)
  const rules = tally(overridden.flatMap(r => r.disagreedRules), rule => rule)
  expect(body.overrides.disagreedRules.map((r: any) => r.count)).toEqual([...rules.values()].sort((a, b) => b - a).slice(0, 10))
  for (const r of body.overrides.disagreedRules) {
    expect(rules.get(r.rule)).toBe(r.count)
    // Named by the ruleset's title, so the page needs no ruleset of its own.
    expect(r.title).toBe(RULESET.rules.find(rule => rule.id === r.rule)?.title ?? null)
  }

  const sum = (list: Row[], value: (r: Row) => number) => list.reduce((s, r) => s + value(r), 0)
  // Compute counts the decisions that stand; a superseded one is counted through its successor.
  const standing = rows.filter(r => r.status !== 'superseded')
  closeTo(body.compute.coreHours, sum(standing, r => r.coreHours))
  closeTo(body.compute.budgetCoreHours, sum(standing, r => r.budget))
  expect(body.compute.overBudget).toBe(standing.filter(r => r.coreHours > r.budget).length)
  expect(body.compute.projects.map((p: any) => p.id).sort()).toEqual([...projectsInScope].sort())
  for (const p of body.compute.projects) {
    const mine = rows.filter(r => r.projectId === p.id)
    const mineStanding = standing.filter(r => r.projectId === p.id)
    expect(p.decisions, p.code).toBe(mine.length)
    expect(p.overridden, p.code).toBe(mine.filter(r => r.overridden).length)
    expect(p.overBudget, p.code).toBe(mineStanding.filter(r => r.coreHours > r.budget).length)
    closeTo(p.coreHours, sum(mineStanding, r => r.coreHours))
    closeTo(p.budgetCoreHours, sum(mineStanding, r => r.budget))
  }
}

/** A reviewer's choice other than the engine's, valid for its approach. */
function otherChoice(recommended: string) {
  const approach: ApproachId = recommended === 'urans' ? 'rans' : 'urans'
  return { approach, model: MODELS_BY_APPROACH[approach][0]!, wallTreatment: WALL_TREATMENTS_BY_APPROACH[approach][0]! }
}

beforeAll(async () => {
  ;[lead, auditor, engineer, reviewer] = await Promise.all(['lead', 'auditor', 'engineer', 'reviewer'].map(signIn))
  project = await projectIds(lead)

  // Beside the demo decisions: an approval, two overrides (one disagreeing with two rules) and a
  // draft whose budget is far below what any approach costs.
  const approved = await createDraft(engineer, project['KB-102']!, { title: uniqueTitle('Overview approved') })
  const submitted = await act(engineer, `/api/decisions/${approved.id}/submit`, { version: approved.version })
  const signedOff = await act(reviewer, `/api/decisions/${approved.id}/approve`, { version: submitted.version })
  // And one superseded by a new draft, so that compute must leave the replaced one out.
  const superseded = await createDraft(engineer, project['KB-102']!, { title: uniqueTitle('Overview superseded') })
  const supersededSubmitted = await act(engineer, `/api/decisions/${superseded.id}/submit`, { version: superseded.version })
  const supersededApproved = await act(reviewer, `/api/decisions/${superseded.id}/approve`, { version: supersededSubmitted.version })
  await act(engineer, `/api/decisions/${superseded.id}/supersede`, { version: supersededApproved.version }, 201)
  expect(signedOff.status).toBe('approved')
  for (const caseInput of [CONDENSER_CASE, DUCT_CASE]) {
    const draft = await createDraft(engineer, project['KB-103']!, { caseInput, title: uniqueTitle('Overview override') })
    const inReview = await act(engineer, `/api/decisions/${draft.id}/submit`, { version: draft.version })
    const fired = (draft.advice.trace as { rule: string; fired: boolean }[]).filter(t => t.fired).map(t => t.rule)
    await act(reviewer, `/api/decisions/${draft.id}/override`, {
      version: inReview.version, ...otherChoice(draft.advice.recommendation.approach),
      comment: 'The unsteady wake matters for this client; the steady answer hides it.',
      disagreedRules: fired.slice(0, 2),
    })
  }
  await createDraft(engineer, project['KB-101']!, {
    title: uniqueTitle('Overview tight budget'), caseInput: { ...DUCT_CASE, budget: { ...DUCT_CASE.budget, coreHours: 0.01 } },
  })
})

/** A decision overridden by the reviewer: the id and the version it is at. */
async function overridden(title: string) {
  const draft = await createDraft(engineer, project['KB-102']!, { title: uniqueTitle(title) })
  const inReview = await act(engineer, `/api/decisions/${draft.id}/submit`, { version: draft.version })
  return act(reviewer, `/api/decisions/${draft.id}/override`, {
    version: inReview.version, ...otherChoice(draft.advice.recommendation.approach),
    comment: 'The duct bends shed eddies that a steady answer misses.', disagreedRules: [],
  })
}

describe('an overridden decision that is superseded', () => {
  it('still counts as an override, in the rate, the pairs and its project; its successor starts from the override', async () => {
    const decision = await overridden('Overview superseded override')
    const before = (await lead.get('/api/overview')).body
    const res = await engineer.post(`/api/decisions/${decision.id}/supersede`, { version: decision.version })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const after = (await lead.get('/api/overview')).body
    // The review happened: the override is counted as before, and the decision is still reviewed.
    expect(after.overrides.overridden).toBe(before.overrides.overridden)
    expect(after.overrides.reviewed).toBe(before.overrides.reviewed)
    expect(after.overrides.rate).toBe(before.overrides.rate)
    expect(after.overrides.pairs).toEqual(before.overrides.pairs)
    const kb102 = (body: any) => body.compute.projects.find((p: { id: number }) => p.id === project['KB-102'])
    expect(kb102(after).overridden).toBe(kb102(before).overridden)
    // The new draft adopts the reviewer's approach as the engineer's requested choice, so method
    // usage counts the same approach for it.
    expect(res.body.decision.requested).toMatchObject({ approach: decision.override.approach, adoptedFrom: { decisionId: decision.id } })
    const byApproach = (body: any) => Object.fromEntries(body.methods.byApproach.map((m: any) => [m.approach, m.count]))
    expect(byApproach(after)[decision.override.approach]).toBe(byApproach(before)[decision.override.approach] + 1)
    expectOverview(after, await readAllDecisions(), Object.values(project))
  })
})

describe('GET /api/overview', () => {
  it('sums every project: statuses, methods, overrides and compute as the decisions say', async () => {
    const rows = await readAllDecisions()
    // The data can show what is counted: overrides with rules, and at least one over budget.
    expect(rows.filter(r => r.status === 'overridden').length).toBeGreaterThanOrEqual(3)
    expect(rows.some(r => r.coreHours > r.budget)).toBe(true)
    expect(rows.some(r => r.status === 'superseded')).toBe(true)
    const res = await lead.get('/api/overview')
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expectOverview(res.body, rows, Object.values(project))
    expect(res.body.overrides.disagreedRules.length).toBeGreaterThan(0)
    // The auditor reads the same overview.
    expect((await auditor.get('/api/overview')).body).toEqual(res.body)
  })

  it('narrows to one project', async () => {
    const rows = (await readAllDecisions()).filter(r => r.projectId === project['KB-103'])
    const res = await lead.get(`/api/overview?projectId=${project['KB-103']}`)
    expect(res.status).toBe(200)
    expectOverview(res.body, rows, [project['KB-103']!])
  })

  it('narrows to a range of creation dates, both ends inclusive (UTC days)', async () => {
    const all = await readAllDecisions()
    // The demo decisions are dated over the fortnight before; the range leaves out the oldest day.
    const days = [...new Set(all.map(r => r.createdDay))].sort()
    expect(days.length).toBeGreaterThan(2)
    const from = days[1]!
    const to = days.at(-2)!
    const rows = all.filter(r => r.createdDay >= from && r.createdDay <= to)
    const res = await lead.get(`/api/overview?from=${from}&to=${to}`)
    expect(res.status).toBe(200)
    expect(rows.length).toBeLessThan(all.length)
    expectOverview(res.body, rows, Object.values(project))
    // One day, from and to the same.
    const single = await lead.get(`/api/overview?from=${from}&to=${from}`)
    expectOverview(single.body, all.filter(r => r.createdDay === from), Object.values(project))
    // An empty range answers zeros, not an error.
    const empty = await lead.get('/api/overview?from=2001-01-01&to=2001-01-31')
    expect(empty.status).toBe(200)
    expect(empty.body.decisions.total).toBe(0)
    expect(empty.body.overrides.rate).toBeNull()
    expect(empty.body.compute.projects.every((p: any) => p.decisions === 0 && p.coreHours === 0)).toBe(true)
  })

  it.each(['engineer', 'reviewer', 'admin'])('refuses %s with 403', async (role) => {
    const res = await (await signIn(role)).get('/api/overview')
    expect(res.status).toBe(403)
    expect(res.body.message).toMatch(/lead or auditor/)
  })

  it.each([
    ['from=not-a-date', /From must be a date written YYYY-MM-DD/],
    ['to=2026-02-30', /To is not a calendar date/],
    ['from=2026-03-10&to=2026-03-01', /To must be on or after From/],
    ['projectId=abc', /project must be given by its id/],
  ])('answers 400 with a message for %s', async (query, message) => {
    const res = await lead.get(`/api/overview?${query}`)
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(message)
  })

  it('answers 404 for a project that does not exist', async () => {
    const res = await lead.get('/api/overview?projectId=999999')
    expect(res.status).toBe(404)
  })
})
