// Every API route, fed malformed and hostile input (ids past 2^31, 1e21, NUL characters, lone
// surrogates, wrong types, missing and extra fields, bodies that are not JSON): the answer is never a
// 5xx, and a refusal carries a message. Routes are found in server/api, so new ones are covered.
// FUZZ_RUNS sets the requests per route (30 by default; a full run uses 1000 or more).
// The routes change data (archive projects, deactivate users...), so this file has a server and a
// database of its own.
import fc from 'fast-check'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, demoEmail } from '../support/api-client'
import { DUCT_CASE } from '../support/decisions'
import { apiRoutes } from '../support/routes'
import { uploadFile } from '../support/uploads'
import { wallCsv } from '../support/wall-files'
import { freePort, startServer } from '../support/test-server'

const RUNS = Number(process.env.FUZZ_RUNS || 30)
const TIMEOUT = Math.max(60_000, RUNS * 1_500)

type Json = null | boolean | number | string | Json[] | { [key: string]: Json }
type Role = 'admin' | 'engineer' | 'reviewer' | 'auditor' | 'lead' | 'anonymous'
// endsSession: the route signs its caller out, so the caller signs in again after each success.
type Plan = { role: Role; ids: Record<string, number>; body?: Json; unknown?: boolean; endsSession?: boolean }

let server: Awaited<ReturnType<typeof startServer>>
const clients = {} as Record<Role, ApiClient>
const fixtures = {} as {
  projectId: number
  userId: number
  memberId: number
  mailId: number
}

async function client(role: Role) {
  const c = new ApiClient(server.url)
  if (role !== 'anonymous') await c.login(demoEmail(role))
  return c
}

async function expectStatus(res: { status: number; body: any }, status: number) {
  expect(res.status, JSON.stringify(res.body)).toBe(status)
  return res.body
}

const DEMO_ROLES = { engineer: 'engineer', reviewer: 'reviewer', auditor: 'auditor', lead: 'lead' } as const

/**
 * Undoes what earlier fuzzing may have done to the callers the next route needs: a deactivated or
 * re-roled demo account, a member removed from the fuzz project, the project archived.
 */
async function restoreFixtures() {
  const users = (await clients.admin.get('/api/users')).body.users as { id: number; email: string }[]
  for (const [key, role] of Object.entries(DEMO_ROLES)) {
    const id = users.find(u => u.email === demoEmail(key))!.id
    await expectStatus(await clients.admin.patch(`/api/users/${id}`, { active: true, role }), 200)
    if (role === 'engineer' || role === 'reviewer') await clients.admin.post(`/api/projects/${fixtures.projectId}/members`, { userId: id })
    const c = clients[key as Role]
    if ((await c.get('/api/auth/me')).status === 401) await c.login(demoEmail(key))
  }
  await expectStatus(await clients.admin.patch(`/api/projects/${fixtures.projectId}`, { archived: false }), 200)
}

/** A decision of the fuzz project in the given state, made through the routes. */
async function decisionIn(state: 'draft' | 'in_review' | 'approved') {
  await restoreFixtures()
  const created = await expectStatus(await clients.engineer.post(`/api/projects/${fixtures.projectId}/decisions`,
    { title: `Fuzz target ${Math.random().toString(36).slice(2)}`, caseInput: DUCT_CASE }), 201)
  let decision = created.decision as { id: number; version: number }
  if (state === 'draft') return decision
  decision = (await expectStatus(await clients.engineer.post(`/api/decisions/${decision.id}/submit`, { version: decision.version }), 200)).decision
  if (state === 'in_review') return decision
  return (await expectStatus(await clients.reviewer.post(`/api/decisions/${decision.id}/approve`,
    { version: decision.version, comment: 'Agreed for the fuzz target.' }), 200)).decision as { id: number; version: number }
}

const REVIEW_COMMENT = 'A reason that is long enough to count as one.'
// A run record and a grid study of the duct case (made-up figures of a plausible size).
const RUN: Json = { approach: 'rans', cells: 2_000_000, timeSteps: 5000, coreHours: 1200, wallClockHours: 10, cores: 128, hardware: 'cpu', hardwareNote: '', solverFamily: 'finite volume' }
const GRID_STUDY: Json = { quantity: 'pressure drop', unit: 'Pa', dimensions: 3, grids: [{ cells: 1_000_000, value: 31.0 }, { cells: 2_200_000, value: 30.5 }, { cells: 4_800_000, value: 30.2 }] }

/** Who calls each route and with what valid ids and body, so that mutations reach deep into it. */
async function planFor(method: string, template: string): Promise<Plan> {
  const route = `${method} ${template}`
  switch (route) {
    case 'POST /api/auth/login': return { role: 'anonymous', ids: {}, body: { email: demoEmail('engineer'), password: 'not-the-password' } }
    case 'POST /api/auth/logout': return { role: 'lead', ids: {}, endsSession: true }
    case 'POST /api/auth/sign-out-everywhere': return { role: 'lead', ids: {}, endsSession: true }
    case 'POST /api/auth/password/forgot': return { role: 'anonymous', ids: {}, body: { email: 'fuzz@eddyledger.test' } }
    case 'POST /api/auth/password/set': return { role: 'anonymous', ids: {}, body: { token: 'x'.repeat(43), password: 'tidal-basin-lantern-42' } }
    case 'POST /api/advice': return { role: 'engineer', ids: {}, body: { caseInput: DUCT_CASE as Json } }
    case 'POST /api/projects': return { role: 'admin', ids: {}, body: { code: 'FZ-NEW', name: 'Fuzz project', client: 'Fuzz', description: 'Made by the fuzz test.' } }
    case 'PATCH /api/projects/[id]': return { role: 'admin', ids: { id: fixtures.projectId }, body: { name: 'Fuzz project', description: 'Changed', archived: false } }
    case 'POST /api/projects/[id]/decisions': return { role: 'engineer', ids: { id: fixtures.projectId }, body: { title: 'Fuzz draft', caseInput: DUCT_CASE as Json, notes: 'Notes.' } }
    case 'POST /api/projects/[id]/members': return { role: 'admin', ids: { id: fixtures.projectId }, body: { userId: fixtures.userId } }
    case 'DELETE /api/projects/[id]/members/[userId]': return { role: 'admin', ids: { id: fixtures.projectId, userId: fixtures.memberId } }
    case 'POST /api/users': return { role: 'admin', ids: {}, body: { email: 'fuzz.new@eddyledger.test', name: 'Fuzz Person', role: 'engineer' } }
    case 'PATCH /api/users/[id]': return { role: 'admin', ids: { id: fixtures.userId }, body: { name: 'Fuzz Person', role: 'engineer', active: true } }
    case 'POST /api/users/[id]/invitation': return { role: 'admin', ids: { id: fixtures.userId } }
    case 'POST /api/admin/mail/[id]/retry': return { role: 'admin', ids: { id: fixtures.mailId } }
  }
  switch (route) {
    case 'POST /api/calibration/adopt': return { role: 'lead', ids: {}, body: { note: 'Adopted for the fuzz.' } }
    case 'PUT /api/verification/settings': return { role: 'lead', ids: {}, body: { wallCheckPassFraction: 0.9, note: 'Fuzz.' } }
    case 'POST /api/decisions/[id]/runs': {
      const d = await decisionIn('approved')
      return { role: 'engineer', ids: { id: d.id }, body: RUN }
    }
    case 'POST /api/decisions/[id]/grid-studies': {
      const d = await decisionIn('approved')
      return { role: 'engineer', ids: { id: d.id }, body: GRID_STUDY }
    }
    case 'POST /api/decisions/[id]/wall-checks': {
      const d = await decisionIn('approved')
      return { role: 'engineer', ids: { id: d.id }, body: {} }
    }
    case 'POST /api/decisions/[id]/runs/[runId]/retract': {
      const d = await decisionIn('approved')
      const run = await expectStatus(await clients.engineer.post(`/api/decisions/${d.id}/runs`, RUN), 201)
      return { role: 'engineer', ids: { id: d.id, runId: run.run.id }, body: { reason: REVIEW_COMMENT } }
    }
    case 'POST /api/decisions/[id]/grid-studies/[studyId]/retract': {
      const d = await decisionIn('approved')
      const study = await expectStatus(await clients.engineer.post(`/api/decisions/${d.id}/grid-studies`, GRID_STUDY), 201)
      return { role: 'engineer', ids: { id: d.id, studyId: study.gridStudy.id }, body: { reason: REVIEW_COMMENT } }
    }
    case 'POST /api/decisions/[id]/wall-checks/[checkId]/review':
    case 'POST /api/decisions/[id]/wall-checks/[checkId]/retract': {
      const d = await decisionIn('approved')
      const upload = await expectStatus(await uploadFile(clients.engineer, `/api/decisions/${d.id}/wall-checks`,
        { bytes: new TextEncoder().encode(wallCsv({ faces: 40 })), name: 'fuzz-wall.csv' }), 201)
      const review = template.endsWith('/review')
      return {
        role: review ? 'reviewer' : 'engineer',
        ids: { id: d.id, checkId: upload.wallCheck.id },
        body: review ? { accepted: true, comment: 'Checked against the wall export.' } : { reason: REVIEW_COMMENT },
      }
    }
  }
  if (template.startsWith('/api/decisions/[id]') && method !== 'GET') {
    const action = template.split('/').at(-1)
    if (action === 'approve') {
      const d = await decisionIn('in_review')
      return { role: 'reviewer', ids: { id: d.id }, body: { version: d.version, comment: REVIEW_COMMENT } }
    }
    if (action === 'request-changes') {
      const d = await decisionIn('in_review')
      return { role: 'reviewer', ids: { id: d.id }, body: { version: d.version, comment: REVIEW_COMMENT } }
    }
    if (action === 'override') {
      const d = await decisionIn('in_review')
      return { role: 'reviewer', ids: { id: d.id }, body: { version: d.version, approach: 'rans', model: 'k-omega SST', wallTreatment: 'resolved', yPlusTarget: 1, comment: REVIEW_COMMENT, disagreedRules: [] } }
    }
    if (action === 'supersede') {
      const d = await decisionIn('approved')
      return { role: 'reviewer', ids: { id: d.id }, body: { version: d.version, title: 'Replacement' } }
    }
    const d = await decisionIn('draft')
    if (action === 'submit') return { role: 'engineer', ids: { id: d.id }, body: { version: d.version } }
    if (action === 'comments') return { role: 'engineer', ids: { id: d.id }, body: { comment: 'A comment.' } }
    return { role: 'engineer', ids: { id: d.id }, body: { version: d.version, title: 'Revised', caseInput: DUCT_CASE as Json, notes: 'Revised notes.' } }
  }
  // A route this table does not know yet: several roles, an empty body and ids of 1.
  return { role: 'admin', ids: {}, body: {}, unknown: true }
}

// ---- what the fuzz sends ---------------------------------------------------------------------

const nastyText = fc.constantFrom(
  '\u0000', 'a\u0000b', '\ud800', 'x\udc00', '\udbff\udbff', '', ' ', '\t\n', 'x'.repeat(5000), '<script>alert(1)</script>',
  "'; DROP TABLE users; --", '\u202e', '\u{1F30A}', '%00', '../../etc/passwd', '1e21', '2147483648', 'null', '{}',
)
const nastyNumber = fc.constantFrom(
  2 ** 31, 2 ** 31 - 1, -(2 ** 31) - 1, 2 ** 53 + 2, 1e21, 1e300, -1e300, 0, -0, 0.5, -1, 5e-324, 1.7976931348623157e308,
)
const nastyValue: fc.Arbitrary<Json> = fc.oneof(
  nastyText,
  nastyNumber,
  fc.constantFrom<Json>(null, true, false, [], {}, [null], { '\u0000': 1 }, { '\ud800': 'x' }),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.integer(),
  fc.double(),
  fc.jsonValue({ maxDepth: 3, stringUnit: 'binary' }) as fc.Arbitrary<Json>,
)

/** Every path to a value inside a JSON value (the root included). */
function paths(value: Json, at: (string | number)[] = []): (string | number)[][] {
  const out = [at]
  if (Array.isArray(value)) value.forEach((v, i) => out.push(...paths(v, [...at, i])))
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) out.push(...paths(v, [...at, k]))
  return out
}

/** The value with the one at `path` replaced, or removed when `replacement` is undefined. */
function setAt(value: Json, path: (string | number)[], replacement: Json | undefined): Json {
  if (!path.length) return replacement === undefined ? null : replacement
  const [head, ...rest] = path
  const next = (item: Json) => (rest.length ? setAt(item, rest, replacement) : replacement)
  if (Array.isArray(value)) {
    return value.flatMap((item, i) => (i !== head ? [item] : next(item) === undefined ? [] : [next(item)!]))
  }
  const entries = Object.entries((value ?? {}) as Record<string, Json>)
  return Object.fromEntries(entries.flatMap(([k, item]) => (k !== head ? [[k, item]] : next(item) === undefined ? [] : [[k, next(item)!]])))
}

type Mutation = { kind: 'replace' | 'remove'; pick: number; value: Json } | { kind: 'extra'; key: string; value: Json }

const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  { weight: 5, arbitrary: fc.record({ kind: fc.constant('replace' as const), pick: fc.nat(), value: nastyValue }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('remove' as const), pick: fc.nat(), value: fc.constant(null) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('extra' as const), key: fc.oneof(nastyText, fc.string({ unit: 'binary', maxLength: 8 })), value: nastyValue }) },
)

function mutate(sample: Json, mutations: Mutation[]) {
  let body = sample
  for (const m of mutations) {
    if (m.kind === 'extra') {
      body = body && typeof body === 'object' && !Array.isArray(body) ? { ...body, [m.key]: m.value } : { [m.key]: m.value }
      continue
    }
    const all = paths(body)
    const path = all[m.pick % all.length]!
    body = setAt(body, path, m.kind === 'remove' && path.length ? undefined : m.value)
  }
  return body
}

// A body: a mutated valid one (mostly), a random JSON value, or text that is not JSON at all.
type Body = { json: Json } | { raw: string } | { none: true }
const bodyFor = (sample: Json | undefined): fc.Arbitrary<Body> => fc.oneof(
  { weight: 6, arbitrary: fc.array(mutation, { minLength: 1, maxLength: 3 }).map(ms => ({ json: mutate(sample ?? {}, ms) })) },
  { weight: 1, arbitrary: fc.constant({ json: sample ?? {} }) },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 4, stringUnit: 'binary' }).map(json => ({ json: json as Json })) },
  { weight: 1, arbitrary: fc.oneof(fc.constantFrom('{"a":', '[1,2', 'nul', '{"x":"\\ud800"}', '{"x":"\\u0000"}', '\u0000', '"'), fc.string({ unit: 'binary', maxLength: 30 })).map(raw => ({ raw })) },
  { weight: 1, arbitrary: fc.constant({ none: true as const }) },
)

const idText = (valid: number | undefined) => fc.oneof(
  { weight: 4, arbitrary: fc.constant(String(valid ?? 1)) },
  { weight: 4, arbitrary: fc.constantFrom('0', '-1', '2147483647', '2147483648', '1e21', '1e300', '9007199254740993', 'NaN', 'Infinity', 'abc', '1.5', '%00', '%F0%9F%8C%8A', '%ED%A0%80', '00001', '%201', '0x10', '1_000') },
  { weight: 1, arbitrary: fc.integer().map(String) },
  { weight: 1, arbitrary: fc.string({ unit: 'binary', minLength: 1, maxLength: 12 }).map(encodeURIComponent) },
)

const QUERY_KEYS = ['page', 'pageSize', 'status', 'projectId', 'from', 'to']
const queryText = fc.dictionary(
  fc.constantFrom(...QUERY_KEYS),
  fc.oneof(
    fc.constantFrom('1', '0', '-1', '1e300', '2147483648', '1e21', '', 'draft', 'sent', '2026-02-30', '2026-01-01', '9999-12-31', 'NaN', '%00', '%ED%A0%80'),
    fc.string({ unit: 'binary', maxLength: 10 }).map(encodeURIComponent),
  ),
  { maxKeys: 4 },
).map(q => Object.entries(q).map(([k, v]) => `${k}=${v}`).join('&'))

function fill(template: string, ids: Record<string, string>) {
  return template.replace(/\[([^\]]+)\]/g, (_, name: string) => ids[name] ?? '1')
}

function paramNames(template: string) {
  return [...template.matchAll(/\[([^\]]+)\]/g)].map(m => m[1]!)
}

// FUZZ_REPORT=1 prints how each route answered (status: count), to see how deep the fuzz reaches.
const REPORT = process.env.FUZZ_REPORT === '1'
const answered = new Map<string, Map<number, number>>()

/** Sends one fuzzed request; returns a description of the failure, or undefined when it was answered properly. */
async function send(c: ApiClient, method: string, path: string, body: Body, headers: Record<string, string> = {}, route = path) {
  const payload = 'json' in body ? JSON.stringify(body.json) : 'raw' in body ? body.raw : undefined
  const res = await c.request(method, path, payload, payload === undefined ? headers : { 'content-type': 'application/json', ...headers })
  if (REPORT) {
    const counts = answered.get(route) ?? new Map<number, number>()
    counts.set(res.status, (counts.get(res.status) ?? 0) + 1)
    answered.set(route, counts)
  }
  const readable = res.status < 400 || (typeof res.body?.message === 'string' && res.body.message.length > 0)
  if (res.status >= 500 || !readable) {
    return `${method} ${path} ${payload?.slice(0, 300)} -> ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`
  }
  return undefined
}

const randomAddress = () => `10.${Math.floor(Math.random() * 256)}.${Math.floor(Math.random() * 256)}.${Math.floor(Math.random() * 254) + 1}`

beforeAll(async () => {
  // Mail goes nowhere (nothing listens on a port just found free): the invitations and resets the
  // fuzz causes stay in this database's outbox.
  server = await startServer({ database: 'eddyledger_fuzz', port: await freePort(), env: { NUXT_SMTP_PORT: String(await freePort()) } })
  for (const role of ['admin', 'engineer', 'reviewer', 'auditor', 'lead', 'anonymous'] as const) clients[role] = await client(role)
  const project = await expectStatus(await clients.admin.post('/api/projects', { code: 'FZ-1', name: 'Fuzz project' }), 201)
  fixtures.projectId = project.project.id
  const users = (await clients.admin.get('/api/users')).body.users as { id: number; email: string }[]
  const id = (key: string) => users.find(u => u.email === demoEmail(key))!.id
  for (const key of ['engineer', 'reviewer', 'engineer2']) {
    await expectStatus(await clients.admin.post(`/api/projects/${fixtures.projectId}/members`, { userId: id(key) }), 201)
  }
  fixtures.memberId = id('engineer2')
  const user = await expectStatus(await clients.admin.post('/api/users', { email: 'fuzz.target@eddyledger.test', name: 'Fuzz Target', role: 'engineer' }), 201)
  fixtures.userId = user.user.id
  const mail = (await clients.admin.get('/api/admin/mail')).body.mail as { id: number }[]
  fixtures.mailId = mail[0]!.id
}, 120_000)

afterAll(async () => {
  await server?.stop()
  if (REPORT) {
    for (const [route, counts] of answered) {
      console.log(`${route}: ${[...counts].sort(([a], [b]) => a - b).map(([status, n]) => `${status}x${n}`).join(' ')}`)
    }
  }
})

// The routes that end sessions go last, so the other routes keep their signed-in callers.
const ENDS_SESSIONS = (template: string) => /\/auth\/(logout|sign-out-everywhere)$/.test(template)
const routes = apiRoutes()
const writes = routes.filter(r => r.method !== 'GET').sort((a, b) => Number(ENDS_SESSIONS(a.template)) - Number(ENDS_SESSIONS(b.template)))
const reads = routes.filter(r => r.method === 'GET')

describe('fuzzing every write route', () => {
  it('finds the write routes', () => {
    expect(writes.length).toBeGreaterThan(15)
  })

  it.each(writes)('$method $template never answers 5xx', async ({ method, template }) => {
    const plan = await planFor(method, template)
    const callers = plan.unknown
      ? (['admin', 'engineer', 'reviewer', 'auditor'] as const).map(r => clients[r])
      : [clients[plan.role]]
    const names = paramNames(template)
    const failures: string[] = []
    await fc.assert(fc.asyncProperty(
      fc.record(Object.fromEntries(names.map(n => [n, idText(plan.ids[n])])) as Record<string, fc.Arbitrary<string>>),
      bodyFor(plan.body),
      fc.nat(),
      async (ids, body, who) => {
        const path = fill(template, ids)
        // Sign-ins from many addresses, so the limiter does not stop the fuzz at the door.
        const headers = plan.role === 'anonymous' ? { 'x-forwarded-for': randomAddress() } : {}
        const caller = callers[who % callers.length]!
        const failure = await send(caller, method, path, body, headers, `${method} ${template}`)
        if (failure) failures.push(failure)
        // Signing in again after every run would cost more than the route; every few runs will do.
        if (plan.endsSession && who % 4 === 0 && (await caller.get('/api/auth/me')).status === 401) await caller.login(demoEmail(plan.role))
      },
    ), { numRuns: RUNS, endOnFailure: true })
    expect(failures, failures.slice(0, 5).join('\n')).toEqual([])
  }, TIMEOUT)
})

describe('fuzzing every read route', () => {
  // The write routes' fuzz ended the lead's sessions (sign out, sign out everywhere).
  beforeAll(async () => {
    clients.lead = await client('lead')
    await restoreFixtures()
  })

  it.each(reads)('GET $template never answers 5xx', async ({ template }) => {
    const names = paramNames(template)
    const valid: Record<string, number> = { id: fixtures.projectId, userId: fixtures.userId, n: 1 }
    if (template.startsWith('/api/decisions/')) valid.id = (await decisionIn('draft')).id
    const callers = (['auditor', 'engineer', 'admin', 'lead'] as const).map(r => clients[r])
    const failures: string[] = []
    await fc.assert(fc.asyncProperty(
      fc.record(Object.fromEntries(names.map(n => [n, idText(valid[n])])) as Record<string, fc.Arbitrary<string>>),
      queryText,
      fc.nat(),
      async (ids, query, who) => {
        const path = fill(template, ids) + (query ? `?${query}` : '')
        const failure = await send(callers[who % callers.length]!, 'GET', path, { none: true }, {}, `GET ${template}`)
        if (failure) failures.push(failure)
      },
    ), { numRuns: Math.max(10, Math.ceil(RUNS / 3)), endOnFailure: true })
    expect(failures, failures.slice(0, 5).join('\n')).toEqual([])
  }, TIMEOUT)
})
