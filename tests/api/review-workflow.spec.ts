// Senior review through the real server and PostgreSQL: who may take which action in which
// status, the transitions' results, optimistic concurrency, the queue, and the queued notices.
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { advise, caseInputSchema, costFor, wallFor } from '#shared/rules'
import type { ApiClient } from '../support/api-client'
import { signIn } from '../support/api-client'
import { CONDENSER_CASE, DUCT_CASE, act, createDraft, projectIds, uniqueTitle } from '../support/decisions'
import { allPages } from '../support/pages'

type Decision = { id: number; version: number; status: string; [key: string]: any }

const KEYS = ['engineer', 'engineer2', 'reviewer', 'reviewer2', 'auditor', 'lead', 'admin'] as const
const c = {} as Record<(typeof KEYS)[number], ApiClient>
let project: Record<string, number>
// Projects of this file alone, so membership is exactly what the matrix needs:
// engineerProject: engineer (the author), engineer2, reviewer; reviewer2 is not a member.
// reviewerProject: reviewer (the author, a reviewer) and reviewer2 (who reviews her work).
let engineerProject: number
let reviewerProject: number
let owner: pg.Client
// Memberships this file adds, removed after it so other files see the demo memberships only.
const added: [projectId: number, userId: number][] = []

const OVERRIDE = { approach: 'urans', model: 'k-omega SST', wallTreatment: 'wall-function', comment: 'Unsteady RANS is enough for the pressure drop we report.' }

beforeAll(async () => {
  for (const key of KEYS) c[key] = await signIn(key)
  project = await projectIds(c.admin)
  const users = (await c.admin.get('/api/users')).body.users as { id: number; email: string }[]
  const userId = (key: string) => users.find(u => u.email === `${key}@eddyledger.test`)!.id
  const makeProject = async (name: string, members: string[]) => {
    const created = await c.admin.post('/api/projects', { code: `RV-${Math.floor(Math.random() * 1e6)}`, name })
    expect(created.status).toBe(201)
    for (const key of members) {
      expect((await c.admin.post(`/api/projects/${created.body.project.id}/members`, { userId: userId(key) })).status).toBe(201)
      added.push([created.body.project.id, userId(key)])
    }
    return created.body.project.id as number
  }
  engineerProject = await makeProject('Review matrix: engineer-authored', ['engineer', 'engineer2', 'reviewer'])
  reviewerProject = await makeProject('Review matrix: reviewer-authored', ['reviewer', 'reviewer2'])
  owner = new pg.Client({ connectionString: inject('databaseUrl') })
  await owner.connect()
})

afterAll(async () => {
  for (const [projectId, userId] of added) expect((await c.admin.delete(`/api/projects/${projectId}/members/${userId}`)).status).toBe(200)
  await owner?.end()
})

// ---- the matrix

const STATUSES = ['draft', 'in_review', 'approved', 'overridden', 'superseded'] as const
const ACTIONS = ['submit', 'approve', 'override', 'request-changes', 'supersede', 'comments'] as const
type Status = (typeof STATUSES)[number]
type Action = (typeof ACTIONS)[number]

// Who acts, on whose decision.
const ACTORS = {
  'the author (an engineer)': { key: 'engineer', author: 'engineer' },
  'an engineer member, not the author': { key: 'engineer2', author: 'engineer' },
  'a reviewer member': { key: 'reviewer', author: 'engineer' },
  'a reviewer who is not a member': { key: 'reviewer2', author: 'engineer' },
  'an auditor': { key: 'auditor', author: 'engineer' },
  'a lead': { key: 'lead', author: 'engineer' },
  'an admin': { key: 'admin', author: 'engineer' },
  'the author (a reviewer)': { key: 'reviewer', author: 'reviewer' },
} as const
type Actor = keyof typeof ACTORS

/** The contract, written out: the status code each actor gets for each action in each status. */
function expectedStatus(actor: Actor, action: Action, status: Status): number {
  const works = ['the author (an engineer)', 'an engineer member, not the author', 'a reviewer member', 'the author (a reviewer)'].includes(actor)
  if (!works) return 403 // non-members and read-only roles
  const isAuthor = actor.startsWith('the author')
  switch (action) {
    case 'submit':
      return !isAuthor ? 403 : status === 'draft' ? 200 : 409
    case 'approve':
    case 'override':
    case 'request-changes':
      // Only a reviewer who is not the author; nobody reviews their own decision.
      return actor !== 'a reviewer member' ? 403 : status === 'in_review' ? 200 : 409
    case 'supersede':
      return status === 'approved' || status === 'overridden' ? 201 : 409
    case 'comments':
      return 200
  }
}

const RESULT: Record<Action, string | null> = {
  submit: 'in_review', approve: 'approved', override: 'overridden', 'request-changes': 'draft', supersede: 'draft', comments: null,
}

function bodyFor(action: Action, version: number) {
  switch (action) {
    case 'submit': return { version }
    case 'approve': return { version, comment: 'Agreed with the recommendation.' }
    case 'override': return { version, ...OVERRIDE }
    case 'request-changes': return { version, comment: 'Please add the bend losses before I sign off.' }
    case 'supersede': return { version }
    case 'comments': return { comment: 'A note for the record.' }
  }
}

/** A decision by `author` brought to `status` through the real routes. */
async function decisionIn(status: Status, author: 'engineer' | 'reviewer'): Promise<Decision> {
  const projectId = author === 'engineer' ? engineerProject : reviewerProject
  const reviewer = author === 'engineer' ? c.reviewer : c.reviewer2
  const d = await createDraft(c[author], projectId, { title: uniqueTitle(`Matrix ${status}`) })
  if (status === 'draft') return d
  const submitted = await act(c[author], `/api/decisions/${d.id}/submit`, { version: d.version })
  if (status === 'in_review') return submitted
  if (status === 'overridden') return act(reviewer, `/api/decisions/${d.id}/override`, { version: submitted.version, ...OVERRIDE })
  const approved = await act(reviewer, `/api/decisions/${d.id}/approve`, { version: submitted.version })
  if (status === 'approved') return approved
  await act(c[author], `/api/decisions/${d.id}/supersede`, { version: approved.version }, 201)
  return (await c[author].get(`/api/decisions/${d.id}`)).body.decision
}

describe('role x action x status', () => {
  it.each(STATUSES)('in status %s, every actor gets the contract\'s answer to every action', async (status) => {
    // Refusals share one decision per author (and must leave it as it was); each success gets its own.
    const shared = { engineer: await decisionIn(status, 'engineer'), reviewer: await decisionIn(status, 'reviewer') }
    const eventsBefore = {
      engineer: (await c.engineer.get(`/api/decisions/${shared.engineer.id}/events`)).body.events.length,
      reviewer: (await c.reviewer.get(`/api/decisions/${shared.reviewer.id}/events`)).body.events.length,
    }
    for (const [actor, { key, author }] of Object.entries(ACTORS) as [Actor, (typeof ACTORS)[Actor]][]) {
      for (const action of ACTIONS) {
        const expected = expectedStatus(actor, action, status)
        const succeeds = expected < 300
        const target = succeeds ? await decisionIn(status, author) : shared[author]
        const res = await c[key].post(`/api/decisions/${target.id}/${action}`, bodyFor(action, target.version))
        const label = `${actor} -> ${action} on ${status}`
        expect.soft(res.status, `${label}: ${res.body?.message ?? ""}`).toBe(expected)
        if (!succeeds) {
          expect.soft(res.body.message, label).toMatch(/\w{4,}/)
          continue
        }
        const result = res.body.decision as Decision
        if (action === 'supersede') {
          expect.soft(result.supersedesId, label).toBe(target.id)
          expect.soft(result.status, label).toBe('draft')
        } else {
          expect.soft(result.id, label).toBe(target.id)
          expect.soft(result.status, label).toBe(RESULT[action] ?? status)
          // A comment is not a change of the decision, so its version stays.
          expect.soft(result.version, label).toBe(action === 'comments' ? target.version : target.version + 1)
        }
      }
    }
    for (const author of ['engineer', 'reviewer'] as const) {
      const after = (await c[author].get(`/api/decisions/${shared[author].id}`)).body
      expect(after.decision.version, `refusals left ${author}'s decision unchanged`).toBe(shared[author].version)
      expect(after.decision.status).toBe(status)
      expect(after.events.length).toBe(eventsBefore[author])
    }
  })

  it('shows each reader the permissions the server enforces', async () => {
    const inReview = await decisionIn('in_review', 'engineer')
    const permissions = async (key: (typeof KEYS)[number]) => (await c[key].get(`/api/decisions/${inReview.id}`)).body.permissions
    expect(await permissions('reviewer')).toMatchObject({ canReview: true, canRevise: false, canSubmit: false, canSupersede: false })
    expect(await permissions('engineer')).toMatchObject({ canReview: false, canRevise: false, canSubmit: false })
    expect(await permissions('engineer2')).toMatchObject({ canReview: false })
    const own = await decisionIn('in_review', 'reviewer')
    expect((await c.reviewer.get(`/api/decisions/${own.id}`)).body.permissions.canReview).toBe(false)
    expect((await c.reviewer2.get(`/api/decisions/${own.id}`)).body.permissions.canReview).toBe(true)
  })
})

// ---- transitions in detail

describe('transitions', () => {
  it('refuses the own review of a reviewer with a message that says why', async () => {
    const own = await decisionIn('in_review', 'reviewer')
    const res = await c.reviewer.post(`/api/decisions/${own.id}/approve`, { version: own.version })
    expect(res.status).toBe(403)
    expect(res.body.message).toMatch(/nobody reviews their own decision/i)
  })

  it('answers a wrong status with 409 and a message naming it', async () => {
    const approved = await decisionIn('approved', 'engineer')
    const res = await c.reviewer.post(`/api/decisions/${approved.id}/approve`, { version: approved.version })
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/only a decision in review.*this one is approved/i)
  })

  it('answers a stale version with 409 and changes nothing', async () => {
    const d = await decisionIn('in_review', 'engineer')
    await act(c.engineer, `/api/decisions/${d.id}/comments`, { comment: 'Adding the survey drawing reference.' })
    const res = await c.reviewer.post(`/api/decisions/${d.id}/approve`, { version: d.version - 1 })
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/changed since you loaded it/i)
    expect((await c.reviewer.get(`/api/decisions/${d.id}`)).body.decision).toMatchObject({ status: 'in_review', version: d.version })
  })

  it('keeps both the engine\'s recommendation and the reviewer\'s override, with the wall recomputed', async () => {
    const draft = await createDraft(c.engineer, project['KB-103']!, { caseInput: CONDENSER_CASE, title: uniqueTitle('Condenser wake') })
    const submitted = await act(c.engineer, `/api/decisions/${draft.id}/submit`, { version: draft.version })
    const advice = advise(CONDENSER_CASE)
    const ruleId = advice.trace.find(t => t.fired)!.rule
    const choice = { approach: 'wmles', model: 'WALE', wallTreatment: 'wall-model', yPlusTarget: 60 } as const
    const res = await c.reviewer2.post(`/api/decisions/${draft.id}/override`, {
      version: submitted.version, ...choice,
      comment: '  The shear layers off the casing edges carry the tonal noise; resolve them with wall-modelled LES.  ',
      disagreedRules: [ruleId],
    })
    expect(res.status).toBe(200)
    const decision = res.body.decision
    expect(decision.status).toBe('overridden')
    // The engine's advice is kept as it was; the override sits beside it.
    expect(decision.advice).toEqual(JSON.parse(JSON.stringify(advice)))
    // Expected wall figures: the engine's own wallFor() for the chosen treatment, run here.
    const input = caseInputSchema.parse(CONDENSER_CASE)
    const wall = JSON.parse(JSON.stringify(wallFor(input, 'wall-model', 60, 'wmles')))
    // Expected cost: the engine's cost model for the chosen approach and treatment, run here.
    const full = costFor(input, 'wmles', 'wall-model')
    const cost = {
      cells: full.cells, timeSteps: full.timeSteps, coreHours: full.coreHours, wallClockHours: full.wallClockHours,
      memoryGB: full.memoryGB, feasible: full.feasible, layers: full.layers,
    }
    expect(decision.override).toEqual({
      ...choice,
      requestedYPlus: 60,
      wall,
      cost: JSON.parse(JSON.stringify(cost)),
      comment: 'The shear layers off the casing edges carry the tonal noise; resolve them with wall-modelled LES.',
      disagreedRules: [ruleId],
      reviewer: { id: expect.any(Number), name: 'Jonah Okafor' },
    })
    expect(decision.override.wall.wallTreatment).toBe('wall-model')
    expect(decision.override.wall.firstCellHeight).not.toBeCloseTo(decision.advice.wall.firstCellHeight, 12)

    const events = (await c.engineer.get(`/api/decisions/${draft.id}/events`)).body.events
    expect(events.at(-1)).toMatchObject({
      type: 'overridden', actorRole: 'reviewer', actor: { name: 'Jonah Okafor' },
      payload: { approach: 'wmles', model: 'WALE', comment: expect.stringMatching(/shear layers/), recommended: advice.recommendation },
    })
    // The list shows what the decision now stands for: the reviewer's approach.
    const { rows: list } = await allPages(c.engineer, `/api/projects/${project['KB-103']}/decisions?status=overridden`, 100)
    const wmles = advice.approaches.find(a => a.id === 'wmles')!
    expect(list.find((d: { id: number }) => d.id === draft.id)).toMatchObject({ approach: 'wmles', model: 'WALE' })
    expect(list.find((d: { id: number }) => d.id === draft.id).coreHours).toBeCloseTo(wmles.coreHours, 6)
  })

  it('costs an override of the wall treatment for that treatment, not the engine\'s (cost model of shared/rules/cost-model.ts)', async () => {
    // The supply duct: the engine recommends steady RANS with a resolved wall.
    const advice = advise(DUCT_CASE)
    expect(advice.recommendation).toMatchObject({ approach: 'rans', wallTreatment: 'resolved' })
    const d = await decisionIn('in_review', 'engineer')
    const res = await c.reviewer.post(`/api/decisions/${d.id}/override`, {
      version: d.version, approach: 'rans', model: 'k-omega SST', wallTreatment: 'wall-function', yPlusTarget: 50,
      comment: 'Log-law wall functions are enough for the pressure drop we report.',
    })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    const { override, advice: stored } = res.body.decision
    const engine = stored.approaches.find((a: { id: string }) => a.id === 'rans')
    // The mesh at the reviewer's y+, and a cost of its own: fewer near-wall layers, fewer cells, fewer core-hours.
    expect(override.wall).toMatchObject({ wallTreatment: 'wall-function', yPlusTarget: 50 })
    expect(override.cost.layers).toBeLessThan(stored.wall.layers)
    expect(override.cost.cells).toBeLessThan(engine.cells)
    expect(override.cost.coreHours).toBeLessThan(engine.coreHours)
    expect(override.cost.wallClockHours).toBeCloseTo(override.cost.coreHours / DUCT_CASE.budget.cores, 9)
    const input = caseInputSchema.parse(DUCT_CASE)
    const expected = costFor(input, 'rans', 'wall-function')
    expect(override.cost.coreHours).toBeCloseTo(expected.coreHours, 9)
    expect(override.cost.timeSteps).toBe(expected.timeSteps)
    // The event keeps the recomputed core-hours; lists and the overview count them.
    const events = (await c.auditor.get(`/api/decisions/${d.id}/events`)).body.events
    expect(events.at(-1).payload.coreHours).toBeCloseTo(expected.coreHours, 9)
    const list = (await c.auditor.get(`/api/projects/${engineerProject}/decisions?status=overridden&limit=100`)).body.items
    expect(list.find((x: { id: number }) => x.id === d.id).coreHours).toBeCloseTo(expected.coreHours, 9)
  })

  it('answers a bad override with 400 and per-field messages', async () => {
    const d = await decisionIn('in_review', 'engineer')
    const short = await c.reviewer.post(`/api/decisions/${d.id}/override`, { version: d.version, approach: 'wmles', model: 'k-omega SST', wallTreatment: 'wall-function', comment: 'no' })
    expect(short.status).toBe(400)
    expect(Object.keys(short.body.data.fieldErrors).sort()).toEqual(['comment', 'model', 'wallTreatment'])
    const unknownRule = await c.reviewer.post(`/api/decisions/${d.id}/override`, { version: d.version, ...OVERRIDE, disagreedRules: ['no-such-rule'] })
    expect(unknownRule.status).toBe(400)
    expect(unknownRule.body.data.fieldErrors.disagreedRules[0]).toMatch(/no-such-rule/)
    expect((await c.reviewer.post(`/api/decisions/${d.id}/request-changes`, { version: d.version })).status).toBe(400)
    expect((await c.reviewer.get(`/api/decisions/${d.id}`)).body.decision).toMatchObject({ status: 'in_review', version: d.version })
  })

  it('sends a decision back to its author, who revises and resubmits', async () => {
    const d = await decisionIn('in_review', 'engineer')
    const back = await act(c.reviewer, `/api/decisions/${d.id}/request-changes`, { version: d.version, comment: 'Please add the bend losses before I sign off.' })
    expect(back.status).toBe('draft')
    const revised = (await c.engineer.put(`/api/decisions/${d.id}`, { caseInput: { ...DUCT_CASE, velocity: 7 }, version: back.version, notes: 'Bends added.' })).body.decision
    expect(revised.revision).toBe(2)
    const again = await act(c.engineer, `/api/decisions/${d.id}/submit`, { version: revised.version })
    const approved = await act(c.reviewer, `/api/decisions/${d.id}/approve`, { version: again.version })
    expect(approved).toMatchObject({ status: 'approved', version: d.version + 4 })
    const events = (await c.auditor.get(`/api/decisions/${d.id}/events`)).body.events
    expect(events.map((e: { type: string }) => e.type)).toEqual(['created', 'submitted', 'changes_requested', 'revised', 'submitted', 'approved'])
    expect(events[2].payload.comment).toBe('Please add the bend losses before I sign off.')
  })

  it('supersedes a closed decision by a new draft that links back', async () => {
    const old = await decisionIn('overridden', 'engineer')
    const res = await c.engineer2.post(`/api/decisions/${old.id}/supersede`, { version: old.version, title: 'Supply duct, revised layout' })
    expect(res.status).toBe(201)
    const fresh = res.body.decision
    expect(fresh).toMatchObject({ status: 'draft', version: 1, revision: 1, supersedesId: old.id, title: 'Supply duct, revised layout', author: { name: 'Tomas Lindqvist' } })
    expect(fresh.caseInput).toEqual(old.caseInput)
    expect(fresh.advice).toEqual(JSON.parse(JSON.stringify(advise(fresh.caseInput))))
    // The case as typed and its unit system come along; the reviewer's choice becomes the
    // engineer's requested one, so the new draft starts from what the review asked for.
    expect(fresh.entered).toEqual(old.entered)
    expect(fresh.unitSystem).toBe(old.unitSystem)
    expect(fresh.requested).toMatchObject({
      approach: 'urans', wallTreatment: 'wall-function',
      reason: expect.stringMatching(/^Adopted from Priya Raman's override of decision \d+: Unsteady RANS is enough/),
      adoptedFrom: { decisionId: old.id, reviewer: 'Priya Raman' },
      figures: { approach: 'urans', wallTreatment: 'wall-function' },
    })
    const oldNow = (await c.engineer.get(`/api/decisions/${old.id}`)).body
    expect(oldNow.decision).toMatchObject({ status: 'superseded', supersededById: fresh.id, version: old.version + 1 })
    expect(oldNow.decision.override.approach).toBe('urans')
    expect(oldNow.events.at(-1)).toMatchObject({ type: 'superseded', payload: { supersededBy: fresh.id } })
    const freshEvents = (await c.engineer.get(`/api/decisions/${fresh.id}/events`)).body.events
    expect(freshEvents).toEqual([expect.objectContaining({ type: 'created', payload: expect.objectContaining({ supersedes: old.id }) })])
    const twice = await c.engineer.post(`/api/decisions/${old.id}/supersede`, { version: old.version + 1 })
    expect(twice.status).toBe(409)
    expect(twice.body.message).toMatch(/superseded/i)
  })
})

// ---- concurrency

describe('two people acting at once', () => {
  it('lets exactly one of two reviewers approving together win', async () => {
    const d = await createDraft(c.engineer, project['KB-102']!)
    const submitted = await act(c.engineer, `/api/decisions/${d.id}/submit`, { version: d.version })
    const results = await Promise.all([
      c.reviewer.post(`/api/decisions/${d.id}/approve`, { version: submitted.version }),
      c.reviewer2.post(`/api/decisions/${d.id}/approve`, { version: submitted.version }),
    ])
    expect(results.map(r => r.status).sort()).toEqual([200, 409])
    expect(results.find(r => r.status === 409)!.body.message).toMatch(/changed since you loaded it|this one is approved/i)
    const after = (await c.auditor.get(`/api/decisions/${d.id}`)).body
    expect(after.decision).toMatchObject({ status: 'approved', version: submitted.version + 1 })
    expect(after.events.filter((e: { type: string }) => e.type === 'approved')).toHaveLength(1)
    expect((await c.auditor.get(`/api/decisions/${d.id}/verify`)).body.valid).toBe(true)
  })

  it('lets one reviewer\'s double click count once, even against an override', async () => {
    for (const second of ['approve', 'override'] as const) {
      const d = await createDraft(c.engineer, project['KB-102']!)
      const submitted = await act(c.engineer, `/api/decisions/${d.id}/submit`, { version: d.version })
      const results = await Promise.all([
        c.reviewer.post(`/api/decisions/${d.id}/approve`, { version: submitted.version }),
        c.reviewer.post(`/api/decisions/${d.id}/${second}`, bodyFor(second, submitted.version)),
      ])
      expect(results.map(r => r.status).sort(), second).toEqual([200, 409])
      const events = (await c.auditor.get(`/api/decisions/${d.id}/events`)).body.events
      expect(events.filter((e: { type: string }) => e.type === 'approved' || e.type === 'overridden')).toHaveLength(1)
    }
  })
})

// ---- the queue and the notices

describe('review queue', () => {
  it('lists a reviewer\'s waiting decisions in their projects, oldest submission first, never their own', async () => {
    const first = await decisionIn('in_review', 'engineer')
    const second = await decisionIn('in_review', 'engineer')
    const own = await decisionIn('in_review', 'reviewer')
    const draft = await decisionIn('draft', 'engineer')
    const { rows: queue, first: page } = await allPages<{ id: number; submittedAt: string; status: string }>(c.reviewer, '/api/review/queue', 2)
    expect(page).toMatchObject({ total: queue.length, totalIsEstimate: false })
    const ids = queue.map(d => d.id)
    expect(ids).toContain(first.id)
    expect(ids.indexOf(first.id)).toBeLessThan(ids.indexOf(second.id))
    expect(ids).not.toContain(own.id)
    expect(ids).not.toContain(draft.id)
    expect(queue.every(d => d.status === 'in_review')).toBe(true)
    const times = queue.map(d => Date.parse(d.submittedAt))
    expect(times).toEqual([...times].sort((a, b) => a - b))
    expect(queue.find(d => d.id === first.id)).toMatchObject({ author: { name: 'Ada Ferreira' }, budgetCoreHours: 5000, projectCode: expect.any(String) })

    // reviewer2 is not a member of the engineer-authored project, but reviews the reviewer's one.
    const other = (await allPages<{ id: number }>(c.reviewer2, '/api/review/queue', 100)).rows.map(d => d.id)
    expect(other).toContain(own.id)
    expect(other).not.toContain(first.id)
  })

  it('is for reviewers only', async () => {
    for (const key of ['engineer', 'auditor', 'lead', 'admin'] as const) {
      expect((await c[key].get('/api/review/queue')).status, key).toBe(403)
    }
  })
})

describe('notices', () => {
  it('queues mail for the reviewers on submit and for the author on a review, in the same transaction', async () => {
    const title = uniqueTitle('Noticed duct')
    const d = await createDraft(c.engineer, engineerProject, { title })
    const submitted = await act(c.engineer, `/api/decisions/${d.id}/submit`, { version: d.version })
    const mailFor = async () => (await owner.query(
      'SELECT to_address, kind FROM mail_outbox WHERE subject LIKE $1 ORDER BY id', [`%${title}%`],
    )).rows
    // The project's reviewers, not the author: here only reviewer@.
    expect(await mailFor()).toEqual([{ to_address: 'reviewer@eddyledger.test', kind: 'submitted' }])
    await act(c.reviewer, `/api/decisions/${d.id}/request-changes`, { version: submitted.version, comment: 'Add the fittings, please.' })
    expect(await mailFor()).toEqual([
      { to_address: 'reviewer@eddyledger.test', kind: 'submitted' },
      { to_address: 'engineer@eddyledger.test', kind: 'changes_requested' },
    ])
    // A refused action queues nothing.
    expect((await c.reviewer2.post(`/api/decisions/${d.id}/approve`, { version: submitted.version + 1 })).status).toBe(403)
    expect(await mailFor()).toHaveLength(2)
  })
})
