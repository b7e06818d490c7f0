// Fixtures for the decision and review API tests: cases from the demo scenario and small helpers
// that go through the real routes.
import { expect } from 'vitest'
import type { CaseInputDraft } from '../../shared/rules'
import type { ApiClient } from './api-client'

// KB-102's supply duct: air at 295 K, 8 m/s in a 0.6 m galvanised duct (k about 0.15 mm).
export const DUCT_CASE: CaseInputDraft = {
  regime: 'internal',
  fluid: { medium: 'air', temperatureK: 295, pressurePa: 101_325 },
  velocity: 8,
  length: 0.6,
  roughness: 0.00015,
  geometry: 'duct',
  separation: 'none',
  physics: { heatTransfer: true },
  quantities: ['pressure', 'heat-transfer'],
  budget: { coreHours: 5_000, cores: 128, wallClockHours: 48 },
}

// KB-103's rooftop condenser: a 2 m bluff body in a 10 m/s wind, massive separation, tonal noise.
export const CONDENSER_CASE: CaseInputDraft = {
  regime: 'external',
  fluid: { medium: 'air', temperatureK: 288.15, pressurePa: 101_325 },
  velocity: 10,
  length: 2,
  turbulenceIntensity: 0.1,
  geometry: 'bluff',
  separation: 'massive',
  physics: { acoustics: true },
  quantities: ['noise', 'unsteady-loads'],
  budget: { coreHours: 200_000, cores: 1024, wallClockHours: 168 },
}

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
