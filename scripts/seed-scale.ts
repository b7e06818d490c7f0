// Fills a database with years of decisions for benchmarks and for seeing the product at size:
//   npm run db:seed:scale -- --decisions 100000 [--projects 60] [--years 5] [--seed 1]
// The demo scenario first (its accounts sign in as usual), then staff, projects and decisions, each
// with its engine advice, revision, chained events (2-4) and summary, inserted in bulk. Wipes the
// database: refuses one that holds data unless --force (scripts/scale.sh passes it for its own).
import { parseArgs } from 'node:util'
import { setImmediate as yieldToIo } from 'node:timers/promises'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { sql } from 'drizzle-orm'
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres'
import { migrate } from 'drizzle-orm/node-postgres/migrator'
import pg from 'pg'
import { appendLedgerEntries } from '../server/db/ledger'
import { ledgerEntryFor, recordRuleset } from '../server/db/ledger-records'
import * as schema from '../server/db/schema'
import { DEMO_DOMAIN, seedDemo } from '../server/db/seed-demo'
import { writeSummaries } from '../server/utils/decisions/summary'
import { WORK_KINDS, fate, plannedDecision, random, scaleProject, staffName, variedCase, type Person } from './lib/scale-data'

const { values: options } = parseArgs({
  options: {
    decisions: { type: 'string', default: '100000' },
    projects: { type: 'string', default: '60' },
    years: { type: 'string', default: '5' },
    seed: { type: 'string', default: '1' },
    force: { type: 'boolean', default: false },
  },
})
const total = Number(options.decisions)
const projectCount = Number(options.projects)
const years = Number(options.years)
if (!Number.isInteger(total) || total < 1 || !Number.isInteger(projectCount) || projectCount < 1 || !(years > 0)) {
  throw new Error('--decisions and --projects must be whole numbers of at least 1, --years a positive number')
}
const url = process.env.DATABASE_URL ?? process.env.NUXT_DATABASE_URL
if (!url) throw new Error('DATABASE_URL is not set (npm run db:seed:scale uses its own cluster when it is not)')

type Db = NodePgDatabase<typeof schema>
const pool = new pg.Pool({ connectionString: url, max: 2 })
const db: Db = drizzle(pool, { schema })
const rng = random(Number(options.seed))
const started = Date.now()
const log = (text: string) => console.log(`[seed:scale ${((Date.now() - started) / 1000).toFixed(0).padStart(4)} s] ${text}`)

async function resetDatabase() {
  const [{ present }] = (await db.execute<{ present: boolean }>(sql`SELECT to_regclass('public.users') IS NOT NULL AS present`)).rows
  if (present && !options.force) {
    const [{ count }] = (await db.execute<{ count: number }>(sql`SELECT count(*)::int AS count FROM users`)).rows
    if (count > 0) throw new Error('the database holds data; pass --force to wipe it for the scale seed')
  }
  // History is append-only by trigger: start from an empty schema, as npm run db:seed does.
  await db.execute(sql`DROP SCHEMA IF EXISTS drizzle CASCADE`)
  await db.execute(sql`DROP SCHEMA public CASCADE`)
  await db.execute(sql`CREATE SCHEMA public`)
  await migrate(drizzle(pool), { migrationsFolder: new URL('../server/db/migrations', import.meta.url).pathname })
}

/** The demo accounts plus engineers and reviewers enough for years of work. */
async function seedPeople(passwordHash: string) {
  const { users } = await seedDemo(db, passwordHash)
  const staff = await db.insert(schema.users).values(Array.from({ length: 16 }, (_, i) => ({
    email: `staff${i + 1}@${DEMO_DOMAIN}`, name: staffName(i), role: i % 4 === 3 ? 'reviewer' as const : 'engineer' as const, passwordHash,
  }))).returning()
  const person = (u: { id: number; name: string; role: Person['role'] }): Person => ({ id: u.id, name: u.name, role: u.role })
  return {
    engineers: [users.get('engineer')!, users.get('engineer2')!, ...staff.filter(u => u.role === 'engineer')].map(person),
    reviewers: [users.get('reviewer')!, users.get('reviewer2')!, ...staff.filter(u => u.role === 'reviewer')].map(person),
  }
}

/** Projects with their team: a few engineers and reviewers each; the demo reviewer sits on most. */
async function seedProjects(people: Awaited<ReturnType<typeof seedPeople>>) {
  const projects = []
  for (let index = 0; index < projectCount; index++) {
    const { kind, ...values } = scaleProject(index, rng)
    const [project] = await db.insert(schema.projects).values({ ...values, archived: index < projectCount / 3 && rng.next() < 0.5 }).returning()
    const engineers = [people.engineers[index % people.engineers.length]!, people.engineers[(index * 5 + 1) % people.engineers.length]!]
    const reviewers = [people.reviewers[index % people.reviewers.length]!, ...(index % 10 !== 9 ? [people.reviewers[0]!] : [])]
    const team = [...new Map([...engineers, ...reviewers].map(p => [p.id, p])).values()]
    await db.insert(schema.projectMembers).values(team.map(p => ({ projectId: project!.id, userId: p.id })))
    projects.push({ id: project!.id, kind, engineers, reviewers: [...new Set(reviewers)] })
  }
  return projects
}

type Planned = ReturnType<typeof plannedDecision>

async function insertBatch(batch: Planned[]) {
  await db.transaction(async (tx) => {
    await tx.insert(schema.decisions).values(batch.map(p => p.decision))
    const revisions = await tx.insert(schema.decisionRevisions).values(batch.map(p => p.revision)).returning()
    const events = await tx.insert(schema.decisionEvents).values(batch.flatMap(p => p.events)).returning()
    // Into the ledger in the order the app writes them: a decision's revision, then its events.
    await recordRuleset(tx)
    const eventsOf = new Map<number, typeof events>()
    for (const event of events) eventsOf.set(event.decisionId, [...(eventsOf.get(event.decisionId) ?? []), event])
    await appendLedgerEntries(tx, revisions.flatMap(revision => [
      ledgerEntryFor('decision_revisions', revision),
      ...(eventsOf.get(revision.decisionId) ?? []).map(event => ledgerEntryFor('decision_events', event)),
    ]))
    await writeSummaries(tx, batch.map(p => p.decision.id!))
  })
}

async function seedDecisions(projects: Awaited<ReturnType<typeof seedProjects>>) {
  const [{ next }] = (await db.execute<{ next: number }>(sql`SELECT coalesce(max(id), 0)::int + 1 AS next FROM decisions`)).rows
  const span = years * 365 * 24 * 3600 * 1000
  const start = Date.now() - span - 7 * 24 * 3600 * 1000
  const BATCH = 400
  let batch: Planned[] = []
  let pending: Promise<void> = Promise.resolve()
  let id = next
  for (let index = 0; id < next + total; index++) {
    // Projects run for a while: a decision goes to one of the projects active at its date.
    const share = (id - next) / total
    const window = Math.max(1, Math.round(projects.length / 6))
    const project = projects[Math.min(projects.length - 1, Math.floor(share * (projects.length - window)) + Math.floor(rng.next() * window))]!
    const kind = WORK_KINDS[project.kind]!
    const author = rng.pick(project.engineers)
    const reviewer = rng.pick(project.reviewers)
    const at = new Date(start + share * span + rng.next() * 3600 * 1000)
    const planned = plannedDecision({
      id, projectId: project.id, title: `${kind.subject}, ${rng.pick(kind.parts)} (case ${id})`,
      caseInput: variedCase(project.kind, rng), author, reviewer, fate: fate(rng, 1 - share), at, rng,
    })
    batch.push(planned)
    id++
    // Now and then a closed decision is replaced by a newer one on revised inputs.
    const closed = planned.decision.status === 'approved' || planned.decision.status === 'overridden'
    if (closed && rng.next() < 0.05 && share < 0.9 && id < next + total) {
      const at2 = new Date(planned.end.getTime() + 3 * 24 * 3600 * 1000)
      const successor = plannedDecision({
        id, projectId: project.id, title: `${kind.subject}, revised inputs (case ${id})`, caseInput: variedCase(project.kind, rng),
        author, reviewer, fate: fate(rng, 0.5), at: at2, supersedes: planned.decision.id!, rng,
      })
      planned.supersede(id, reviewer, at2)
      batch.push(successor)
      id++
    }
    if (batch.length >= BATCH || id >= next + total) {
      await pending
      const full = batch
      batch = []
      pending = insertBatch(full)
      if ((id - next) % 10_000 < full.length) log(`${id - next} decisions`)
    }
    // Let the previous batch's bytes flow to PostgreSQL while the next one is planned.
    if (index % 25 === 0) await yieldToIo()
  }
  await pending
  await db.execute(sql`SELECT setval('decisions_id_seq', ${id - 1})`)
}

await resetDatabase()
log('schema migrated')
const people = await seedPeople(await new Hash(new Scrypt({})).make(process.env.DEMO_PASSWORD || 'ledger-demo-2026'))
const projects = await seedProjects(people)
log(`demo, ${people.engineers.length + people.reviewers.length} engineers and reviewers, ${projects.length} projects`)
await seedDecisions(projects)
log('vacuum and statistics')
await db.execute(sql`VACUUM ANALYZE`)
const [sizes] = (await db.execute<{ decisions: number; history: string }>(sql`SELECT (SELECT count(*)::int FROM decisions) AS decisions,
  pg_size_pretty(pg_total_relation_size('decision_revisions') + pg_total_relation_size('decision_events')) AS history`)).rows
log(`done: ${sizes!.decisions} decisions, ${sizes!.history} of history`)
await pool.end()
