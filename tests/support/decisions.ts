// Fixtures for the decision and review API tests: cases from the demo scenario and small helpers
// that go through the real routes.
import { expect } from 'vitest'
import type { CaseInputDraft } from '../../shared/rules'
import { CONDENSER_WAKE, DATA_HALL_DUCT } from '../../server/db/seed-demo'
import type { ApiClient } from './api-client'

// The demo scenario's cases (server/db/seed-demo.ts): KB-102's supply duct (air, 8 m/s in a 0.6 m
// galvanised duct, heat transfer) and KB-103's rooftop condenser (2 m bluff body, 10 m/s wind,
// massive separation, tonal noise).
export const DUCT_CASE: CaseInputDraft = DATA_HALL_DUCT
export const CONDENSER_CASE: CaseInputDraft = CONDENSER_WAKE

export async function projectIds(client: ApiClient): Promise<Record<string, number>> {
  const res = await client.get('/api/projects')
  expect(res.status).toBe(200)
  return Object.fromEntries((res.body.projects as { id: number; code: string }[]).map(p => [p.code, p.id]))
}

let counter = 0
export function uniqueTitle(what: string) {
  return `${what} #${Date.now().toString(36)}-${++counter}`
}

/** A new draft through POST /api/projects/:id/decisions; fails the test on anything but 201. */
export async function createDraft(client: ApiClient, projectId: number, options: { title?: string; caseInput?: CaseInputDraft; notes?: string } = {}) {
  const res = await client.post(`/api/projects/${projectId}/decisions`, {
    title: options.title ?? uniqueTitle('Duct case'),
    caseInput: options.caseInput ?? DUCT_CASE,
    ...(options.notes !== undefined ? { notes: options.notes } : {}),
  })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body.decision as { id: number; version: number; status: string; [key: string]: any }
}

/** A route call that must succeed: returns the decision it answers with. */
export async function act(client: ApiClient, path: string, body: Record<string, unknown>, expected = 200) {
  const res = await client.post(path, body)
  expect(res.status, `${path}: ${JSON.stringify(res.body)}`).toBe(expected)
  return res.body.decision as { id: number; version: number; status: string; [key: string]: any }
}

/**
 * What only a tamperer with the database owner's rights could do: switch the append-only trigger
 * off, rewrite one event's payload, switch it on again. Returns the altered event's id.
 */
export async function tamperWithEvent(owner: import('pg').Client, decisionId: number, seq: number, payload: unknown) {
  const { rows } = await owner.query('SELECT id FROM decision_events WHERE decision_id = $1 AND seq = $2', [decisionId, seq])
  const eventId = Number(rows[0].id)
  await owner.query('BEGIN')
  try {
    await owner.query('ALTER TABLE decision_events DISABLE TRIGGER decision_events_append_only')
    await owner.query('UPDATE decision_events SET payload = $2 WHERE id = $1', [eventId, JSON.stringify(payload)])
    await owner.query('ALTER TABLE decision_events ENABLE TRIGGER decision_events_append_only')
    await owner.query('COMMIT')
  } catch (error) {
    await owner.query('ROLLBACK')
    throw error
  }
  return eventId
}
