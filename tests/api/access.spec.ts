import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, signIn } from '../support/api-client'
import { apiRoutes } from '../support/routes'

const PUBLIC = new Set(['/api/auth/login', '/api/auth/password/forgot', '/api/auth/password/set', '/api/health'])

describe('signed-out requests', () => {
  const routes = apiRoutes().filter(r => !PUBLIC.has(r.path))

  it('finds the API routes to check', () => {
    expect(routes.length).toBeGreaterThan(8)
  })

  it.each(routes)('$method $path answers 401', async ({ method, path }) => {
    const res = await new ApiClient().request(method, path, method === 'GET' || method === 'DELETE' ? undefined : {})
    expect(res.status).toBe(401)
  })
})

describe('role matrix', () => {
  const roles = ['engineer', 'reviewer', 'auditor', 'lead', 'admin'] as const
  const clients = {} as Record<(typeof roles)[number], ApiClient>
  let projects: { id: number; code: string }[]

  beforeAll(async () => {
    for (const role of roles) clients[role] = await signIn(role)
    projects = (await clients.admin.get('/api/projects')).body.projects
  })

  // Valid bodies, so that a refusal can only come from the role check.
  const adminOnly = () => [
    { method: 'GET', path: '/api/users' },
    { method: 'POST', path: '/api/users', body: { email: `matrix.${Math.random().toString(36).slice(2)}@eddyledger.test`, name: 'Matrix', role: 'engineer' } },
    { method: 'PATCH', path: '/api/users/1', body: { name: 'Renamed By Someone' } },
    { method: 'POST', path: '/api/projects', body: { code: `MX-${Math.floor(Math.random() * 1e6)}`, name: 'Matrix project' } },
    { method: 'PATCH', path: `/api/projects/${projects[0]!.id}`, body: { description: 'changed' } },
    { method: 'POST', path: `/api/projects/${projects[0]!.id}/members`, body: { userId: 1 } },
    { method: 'DELETE', path: `/api/projects/${projects[0]!.id}/members/1` },
  ]

  it.each(['engineer', 'reviewer', 'auditor', 'lead'] as const)('refuses every admin-only route to %s with 403', async (role) => {
    for (const route of adminOnly()) {
      const res = await clients[role].request(route.method, route.path, route.body)
      expect(res.status, `${route.method} ${route.path}`).toBe(403)
    }
  })

  it('lets the admin use the admin routes', async () => {
    expect((await clients.admin.get('/api/users')).status).toBe(200)
    const code = `AD-${Date.now() % 100000}`
    const created = await clients.admin.post('/api/projects', { code, name: 'Admin-made project' })
    expect(created.status).toBe(201)
    expect(created.body.project.code).toBe(code)
  })

  it('shows an engineer only the projects they are a member of, and refuses the others', async () => {
    const mine = (await clients.engineer.get('/api/projects')).body.projects as { id: number; code: string }[]
    expect(mine.map(p => p.code).sort()).toEqual(['KB-101', 'KB-102', 'KB-103'])
    const notMine = projects.find(p => p.code === 'KB-104')!
    const res = await clients.engineer.get(`/api/projects/${notMine.id}`)
    expect(res.status).toBe(403)
    expect(res.body.message).toMatch(/not a member/i)
    // The reason phrase matches the status, not a generic "Server Error".
    expect(res.body.statusMessage).toBe('Forbidden')
    expect((await clients.engineer.get(`/api/projects/${mine[0]!.id}`)).status).toBe(200)
  })

  it('lets auditors and leads read every project without membership', async () => {
    for (const role of ['auditor', 'lead'] as const) {
      const list = (await clients[role].get('/api/projects')).body.projects as { code: string }[]
      expect(list.map(p => p.code)).toEqual(expect.arrayContaining(['KB-101', 'KB-102', 'KB-103', 'KB-104']))
      const kb104 = projects.find(p => p.code === 'KB-104')!
      expect((await clients[role].get(`/api/projects/${kb104.id}`)).status).toBe(200)
    }
  })

  it('answers 404 for a project that does not exist and 400 for a malformed id', async () => {
    const missing = await clients.auditor.get('/api/projects/999999')
    expect(missing.status).toBe(404)
    expect(missing.body.statusMessage).toBe('Not Found')
    const bad = await clients.auditor.get('/api/projects/abc')
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/number/i)
  })
})

describe('admin bodies', () => {
  it('rejects a bad user body with per-field messages', async () => {
    const admin = await signIn('admin')
    const res = await admin.post('/api/users', { email: 'x', name: '', role: 'wizard' })
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.data.fieldErrors).sort()).toEqual(['email', 'name', 'role'])
  })

  it('refuses a duplicate e-mail with 409', async () => {
    const admin = await signIn('admin')
    const res = await admin.post('/api/users', { email: 'ENGINEER@eddyledger.test', name: 'Dup', role: 'engineer' })
    expect(res.status).toBe(409)
  })

  it('adds and removes a member', async () => {
    const admin = await signIn('admin')
    const projects = (await admin.get('/api/projects')).body.projects as { id: number; code: string }[]
    const kb104 = projects.find(p => p.code === 'KB-104')!
    const users = (await admin.get('/api/users')).body.users as { id: number; email: string }[]
    const auditor = users.find(u => u.email === 'auditor@eddyledger.test')!
    const added = await admin.post(`/api/projects/${kb104.id}/members`, { userId: auditor.id })
    expect(added.status).toBe(201)
    expect(added.body.members.map((m: { id: number }) => m.id)).toContain(auditor.id)
    const removed = await admin.delete(`/api/projects/${kb104.id}/members/${auditor.id}`)
    expect(removed.status).toBe(200)
    expect(removed.body.members.map((m: { id: number }) => m.id)).not.toContain(auditor.id)
    expect((await admin.delete(`/api/projects/${kb104.id}/members/${auditor.id}`)).status).toBe(404)
  })
})
