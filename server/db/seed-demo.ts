// The demo scenario: Kestrel Bay Flow Consulting, a fictional CFD consultancy, and four projects of
// its own. Relative imports only: run by scripts/seed.ts under plain Node.
import type { NodePgDatabase } from 'drizzle-orm/node-postgres'
import * as schema from './schema'

type Db = NodePgDatabase<typeof schema>

export const DEMO_DOMAIN = 'eddyledger.test'

export const DEMO_USERS = [
  { key: 'engineer', name: 'Ada Ferreira', role: 'engineer' },
  { key: 'engineer2', name: 'Tomas Lindqvist', role: 'engineer' },
  { key: 'reviewer', name: 'Priya Raman', role: 'reviewer' },
  { key: 'reviewer2', name: 'Jonah Okafor', role: 'reviewer' },
  { key: 'auditor', name: 'Mei Tanaka', role: 'auditor' },
  { key: 'lead', name: 'Ruth Calder', role: 'lead' },
  { key: 'admin', name: 'Sam Ortiz', role: 'admin' },
] as const

export const DEMO_PROJECTS = [
  {
    code: 'KB-101', name: 'Harbour ferry hull resistance', client: 'Saltmarsh Ferry Company',
    description: 'Calm-water resistance of a 38 m passenger ferry hull at service speed, model and full scale.',
    members: ['engineer', 'reviewer'],
  },
  {
    code: 'KB-102', name: 'Data-hall cooling air ducts', client: 'Gridline Hosting',
    description: 'Pressure drop and wall heat transfer in the supply ducts of a new data hall.',
    members: ['engineer', 'engineer2', 'reviewer', 'reviewer2'],
  },
  {
    code: 'KB-103', name: 'Rooftop condenser wake and noise', client: 'Marlow Street Developments',
    description: 'Separated wake of rooftop condenser units and its tonal noise at the neighbouring facade.',
    members: ['engineer', 'engineer2', 'reviewer', 'reviewer2'],
  },
  {
    code: 'KB-104', name: 'Pump intake swirl', client: 'Fenwater Utilities',
    description: 'Swirl and vortex formation at the intake bay of a raw-water pumping station.',
    members: ['engineer2', 'reviewer2'],
  },
] as const

export async function seedDemo(db: Db, passwordHash: string) {
  const users = await db.insert(schema.users).values(DEMO_USERS.map(u => ({
    email: `${u.key}@${DEMO_DOMAIN}`, name: u.name, role: u.role, passwordHash,
  }))).returning()
  const userByKey = new Map(DEMO_USERS.map((u, i) => [u.key, users[i]!]))

  for (const p of DEMO_PROJECTS) {
    const [project] = await db.insert(schema.projects).values({
      code: p.code, name: p.name, client: p.client, description: p.description,
    }).returning()
    await db.insert(schema.projectMembers).values(p.members.map(key => ({
      projectId: project!.id, userId: userByKey.get(key)!.id,
    })))
  }
  return { users: userByKey }
}
