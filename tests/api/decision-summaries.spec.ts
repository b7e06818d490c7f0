// Decision summaries (the typed figures lists, the audit and the overview read): after every step
// of the workflow each row equals what the decision's record gives, written in the same
// transaction; rows cannot be removed, and a row altered behind the application's back shows.
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { advise, caseInputSchema, costFor } from '#shared/rules'
import * as schema from '../../server/db/schema'
import { summaryDrift, writeDecisionSummary } from '../../server/utils/decisions/summary'
import { type ApiClient, signIn } from '../support/api-client'
import { CONDENSER_CASE, DUCT_CASE, act, createDraft, projectIds, uniqueTitle } from '../support/decisions'

let engineer: ApiClient
let reviewer: ApiClient
let project: Record<string, number>
let pool: pg.Pool
let db: ReturnType<typeof drizzle<typeof schema>>

async function summaryOf(id: number) {
  const { rows } = await pool.query('SELECT * FROM decision_summaries WHERE decision_id = $1', [id])
  return rows[0]
}

/** The summary matches the record (the view's derivation) and holds `expected`. */
async function expectSummary(id: number, expected: Record<string, unknown>) {
  expect(await summaryDrift(db, [id])).toEqual([])
  expect(await summaryOf(id)).toMatchObject(expected)
}

beforeAll(async () => {
  ;[engineer, reviewer] = await Promise.all(['engineer', 'reviewer'].map(signIn))
  project = await projectIds(engineer)
  pool = new pg.Pool({ connectionString: inject('databaseUrl'), max: 2 })
  db = drizzle(pool, { schema })
})

afterAll(async () => {
  await pool?.end()
})

describe('decision summaries', () => {
  it('follow every step of the workflow in the same transaction as its event', async () => {
    const duct = advise(DUCT_CASE)
    const draft = await createDraft(engineer, project['KB-102']!, { title: uniqueTitle('Summary duct') })
    await expectSummary(draft.id, {
      status: 'draft', version: 1, revision: 1, approach: duct.recommendation.approach, engine_approach: duct.recommendation.approach,
      wall_treatment: duct.recommendation.wallTreatment, overridden: false, reviewer_id: null, submitted_at: null, budget_core_hours: 5000,
    })

    const revised = await engineer.put(`/api/decisions/${draft.id}`, { caseInput: CONDENSER_CASE, version: draft.version, title: 'Renamed in the summary' })
    expect(revised.status).toBe(200)
    const wake = advise(CONDENSER_CASE)
    await expectSummary(draft.id, { title: 'Renamed in the summary', revision: 2, version: 2, approach: wake.recommendation.approach, budget_core_hours: 200_000 })

    const submitted = await act(engineer, `/api/decisions/${draft.id}/submit`, { version: 2 })
    const afterSubmit = await summaryOf(draft.id)
    expect(afterSubmit.status).toBe('in_review')
    expect(afterSubmit.submitted_at).toEqual(afterSubmit.updated_at)
    await expectSummary(draft.id, {})

    await act(reviewer, `/api/decisions/${draft.id}/comments`, { comment: 'A remark changes no figure.' })
    await expectSummary(draft.id, { version: submitted.version })

    const approach = wake.recommendation.approach === 'urans' ? 'rans' : 'urans'
    const overridden = await act(reviewer, `/api/decisions/${draft.id}/override`, {
      version: submitted.version, approach, model: 'k-omega SST', wallTreatment: 'wall-function',
      comment: 'The client needs loads only; the unsteady wake is not reported.',
    })
    // An override is costed for its own approach and wall treatment (costFor), as the record does.
    const chosen = costFor(caseInputSchema.parse(CONDENSER_CASE), approach, 'wall-function')
    await expectSummary(draft.id, {
      status: 'overridden', approach, model: 'k-omega SST', wall_treatment: 'wall-function', engine_approach: wake.recommendation.approach,
      overridden: true, override_reason: 'The client needs loads only; the unsteady wake is not reported.',
    })
    const row = await summaryOf(draft.id)
    expect(row.core_hours).toBeCloseTo(chosen.coreHours, 6)
    expect(row.reviewed_at).toEqual(row.updated_at)
    expect(row.reviewer_id).toBe((await reviewer.get('/api/auth/me')).body.user.id)

    const successor = await act(engineer, `/api/decisions/${draft.id}/supersede`, { version: overridden.version }, 201)
    await expectSummary(draft.id, { status: 'superseded', overridden: true })
    await expectSummary(successor.id, { status: 'draft', overridden: false, reviewer_id: null })
  })

  it('cannot be removed, as the history they summarise', async () => {
    const draft = await createDraft(engineer, project['KB-101']!, { title: uniqueTitle('Kept summary') })
    await expect(pool.query('DELETE FROM decision_summaries WHERE decision_id = $1', [draft.id])).rejects.toThrow(/summarises the append-only history: DELETE refused/)
    await expect(pool.query('TRUNCATE decision_summaries')).rejects.toThrow(/TRUNCATE refused/)
    expect(await summaryOf(draft.id)).toBeDefined()
  })

  it('show a row altered behind the application\'s back, and which figures differ', async () => {
    const draft = await createDraft(engineer, project['KB-101']!, { title: uniqueTitle('Altered summary') })
    const other = await createDraft(engineer, project['KB-101']!, { title: uniqueTitle('Untouched summary') })
    await pool.query('UPDATE decision_summaries SET approach = $2, core_hours = 1 WHERE decision_id = $1', [draft.id, 'dns'])
    expect(await summaryDrift(db, [draft.id, other.id])).toEqual([{ decisionId: draft.id, missing: false, columns: ['approach', 'core_hours'] }])
    // Rewritten from the record, it matches again.
    await writeDecisionSummary(db, draft.id)
    expect(await summaryDrift(db, [draft.id])).toEqual([])
  })
})
