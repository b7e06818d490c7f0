// The decision history is append-only at the database and tamper-evident through its hash chain.
// The database is reached directly, as its owner, only to try what the application never does.
import { createHash } from 'node:crypto'
import canonicalize from 'canonicalize'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { advise, compileRuleset, type Ruleset } from '#shared/rules'
import type { ApiClient} from '../support/api-client';
import { signIn } from '../support/api-client'
import { CONDENSER_CASE, DUCT_CASE, act, createDraft, projectIds, tamperWithEvent } from '../support/decisions'
import { allPages } from '../support/pages'

type ApiEvent = {
  id: number; seq: number; type: string; actor: { id: number; name: string }; actorRole: string
  payload: unknown; createdAt: string; hash: string; prevHash: string
}

// The chain as the contract defines it, recomputed here without the server's code:
// hash = sha256(prevHash + RFC 8785 canonical JSON of the event), the first link on 64 zeros.
const GENESIS = '0'.repeat(64)
function expectedHash(prevHash: string, decisionId: number, e: ApiEvent) {
  const canonical = canonicalize({
    decisionId, seq: e.seq, type: e.type, actorId: e.actor.id, actorRole: e.actorRole, payload: e.payload,
    createdAt: new Date(e.createdAt).toISOString(),
  })!
  return createHash('sha256').update(prevHash + canonical).digest('hex')
}

let engineer: ApiClient
let reviewer: ApiClient
let auditor: ApiClient
let project: Record<string, number>
let owner: pg.Client
let decisionId: number
let untouchedId: number

beforeAll(async () => {
  ;[engineer, reviewer, auditor] = await Promise.all(['engineer', 'reviewer', 'auditor'].map(signIn))
  project = await projectIds(auditor)
  owner = new pg.Client({ connectionString: inject('databaseOwnerUrl') })
  await owner.connect()

  // A decision with a few events: created, revised, submitted, commented, approved.
  const draft = await createDraft(engineer, project['KB-102']!)
  const revised = (await engineer.put(`/api/decisions/${draft.id}`, { caseInput: { ...DUCT_CASE, velocity: 9 }, version: draft.version })).body.decision
  const submitted = await act(engineer, `/api/decisions/${draft.id}/submit`, { version: revised.version })
  await act(reviewer, `/api/decisions/${draft.id}/comments`, { comment: 'Which inlet profile did you assume?' })
  await act(reviewer, `/api/decisions/${draft.id}/approve`, { version: submitted.version, comment: 'Fine for the pressure-drop estimate.' })
  decisionId = draft.id
  untouchedId = (await createDraft(engineer, project['KB-103']!, { caseInput: CONDENSER_CASE })).id
})

afterAll(async () => {
  await owner?.end()
})

describe('the hash chain', () => {
  it('links every event to the one before, with hashes anyone can recompute', async () => {
    const { events } = (await auditor.get(`/api/decisions/${decisionId}/events`)).body as { events: ApiEvent[] }
    expect(events.map(e => e.type)).toEqual(['created', 'revised', 'submitted', 'commented', 'approved'])
    expect(events.map(e => e.seq)).toEqual([1, 2, 3, 4, 5])
    let prev = GENESIS
    for (const event of events) {
      expect(event.prevHash).toBe(prev)
      expect(event.hash).toBe(expectedHash(prev, decisionId, event))
      prev = event.hash
    }
    expect(events[3]).toMatchObject({ actorRole: 'reviewer', actor: { name: 'Priya Raman' }, payload: { comment: 'Which inlet profile did you assume?' } })
  })

  it('verifies as intact', async () => {
    const res = await auditor.get(`/api/decisions/${decisionId}/verify`)
    expect(res.status).toBe(200)
    expect(res.body).toEqual({ valid: true, checked: 5, brokenAt: null, problems: [] })
  })

  it('holds the demo decisions the seed wrote: every stage of review, engine advice, intact chains', async () => {
    const statuses: string[] = []
    // Each decision was advised with the ruleset version it names, read from the catalogue.
    const catalogue = (await auditor.get('/api/rulesets')).body.rulesets as { key: string; version: string; baseScores: Ruleset['baseScores']; baseWhy: string; rules: unknown[] }[]
    const rulesetNamed = (version: string) => {
      const r = catalogue.find(entry => entry.version === version)!
      return compileRuleset({ id: r.key, version: r.version, baseScores: r.baseScores, baseWhy: r.baseWhy, rules: r.rules })
    }
    for (const code of ['KB-101', 'KB-102', 'KB-103', 'KB-104']) {
      const { rows: decisions } = await allPages(auditor, `/api/projects/${project[code]}/decisions`, 100)
      for (const d of decisions as { id: number; status: string; createdAt: string }[]) {
        // The seed dates its decisions over the fortnight before; anything newer was made by a test.
        if (Date.parse(d.createdAt) > Date.now() - 12 * 3600_000) continue
        statuses.push(d.status)
        const detail = (await auditor.get(`/api/decisions/${d.id}`)).body
        // Expected: the engine run here on the stored input (the seed never writes advice of its own).
        const ruleset = rulesetNamed(detail.decision.advice.ruleset.version)
        expect(detail.decision.advice, `decision ${d.id}`).toEqual(JSON.parse(JSON.stringify(advise(detail.decision.caseInput, { ruleset }))))
        expect((await auditor.get(`/api/decisions/${d.id}/verify`)).body, `decision ${d.id}`).toEqual({
          valid: true, checked: detail.events.length, brokenAt: null, problems: [],
        })
        if (d.status === 'overridden') {
          expect(detail.decision.override.comment.length).toBeGreaterThan(15)
          expect(detail.decision.override.approach).not.toBe(detail.decision.advice.recommendation.approach)
        }
      }
    }
    expect(statuses).toEqual(expect.arrayContaining(['draft', 'in_review', 'approved', 'overridden']))
  })
})

describe('append-only at the database', () => {
  for (const table of ['decision_events', 'decision_revisions']) {
    it(`refuses UPDATE, DELETE and TRUNCATE on ${table}, even to the database owner`, async () => {
      await expect(owner.query(`UPDATE ${table} SET created_at = now() WHERE decision_id = $1`, [decisionId]))
        .rejects.toThrow(/append-only: UPDATE refused/)
      await expect(owner.query(`DELETE FROM ${table} WHERE decision_id = $1`, [decisionId]))
        .rejects.toThrow(/append-only: DELETE refused/)
      await expect(owner.query(`TRUNCATE ${table} CASCADE`)).rejects.toThrow(/append-only: TRUNCATE refused/)
      const { rows } = await owner.query(`SELECT count(*)::int AS n FROM ${table} WHERE decision_id = $1`, [decisionId])
      expect(rows[0].n).toBe(table === 'decision_events' ? 5 : 2)
    })
  }
})

describe('tampering', () => {
  it('makes /verify report the first altered event, and leaves other decisions valid', async () => {
    // A decision of its own, so the other tests' decision stays intact whatever the order.
    const draft = await createDraft(engineer, project['KB-102']!)
    const submitted = await act(engineer, `/api/decisions/${draft.id}/submit`, { version: draft.version })
    await act(reviewer, `/api/decisions/${draft.id}/comments`, { comment: 'Which inlet profile did you assume?' })
    await act(reviewer, `/api/decisions/${draft.id}/approve`, { version: submitted.version })
    const tampered = draft.id
    const tamperedId = await tamperWithEvent(owner, tampered, 3, { comment: 'Looks fine.' })
    const res = await auditor.get(`/api/decisions/${tampered}/verify`)
    expect(res.status).toBe(200)
    expect(res.body).toEqual({ valid: false, checked: 3, brokenAt: tamperedId, problems: [] })
    expect((await auditor.get(`/api/decisions/${untouchedId}/verify`)).body).toEqual({ valid: true, checked: 1, brokenAt: null, problems: [] })
    // The trigger is back on.
    await expect(owner.query('DELETE FROM decision_events WHERE id = $1', [tamperedId])).rejects.toThrow(/append-only/)
  })
})
