/**
 * API benchmark at size: `npm run db:seed:scale -- --decisions 100000`, then `npm run bench:api`.
 * In one run, against the built app on the scale database:
 *  - each list route's median latency and its ratio to a primary-key fetch of one decision
 *    (GET /api/decisions/:id), requests interleaved round by round so both see the same load;
 *  - the full CSV export: time to the first bytes, duration, the server's memory above idle;
 *  - POST /api/advice's throughput against GET /api/health's at 20 connections (autocannon);
 *  - /overview, /audit and /review in chromium at this size and at the demo's size;
 *  - the plans of each route's statements (EXPLAIN ANALYZE): scans used, sorts spilled to disk.
 * Options: --rounds 25 --duration 10 --loads 5 --skip-latency --skip-csv --skip-throughput --skip-pages --skip-explain.
 */
import { rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { parseArgs } from 'node:util'
import autocannon from 'autocannon'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { drizzle } from 'drizzle-orm/node-postgres'
import { migrate } from 'drizzle-orm/node-postgres/migrator'
import pg from 'pg'
import * as schema from '../server/db/schema'
import { DATA_HALL_DUCT, seedDemo } from '../server/db/seed-demo'
import { encodeCursor } from '../shared/schemas/pagination'
import { explainRequest } from './lib/explain'
import { launchBrowser, pageTimes } from './lib/pages'
import { signedIn, startApp, type RunningServer } from './lib/server'
import { median, ms, ratio } from './lib/stats'

const { values: options } = parseArgs({
  options: {
    rounds: { type: 'string', default: '25' },
    duration: { type: 'string', default: '10' },
    loads: { type: 'string', default: '5' },
    'skip-pages': { type: 'boolean', default: false },
    'skip-explain': { type: 'boolean', default: false },
    'skip-throughput': { type: 'boolean', default: false },
    'skip-latency': { type: 'boolean', default: false },
    'skip-csv': { type: 'boolean', default: false },
  },
})
const scaleUrl = process.env.SCALE_DATABASE_URL ?? process.env.DATABASE_URL
if (!scaleUrl) throw new Error('SCALE_DATABASE_URL is not set: run through npm run bench:api')
const TARGET = 3

const db = new pg.Client({ connectionString: scaleUrl })
await db.connect()
const one = async <T>(text: string, params: unknown[] = []) => (await db.query(text, params)).rows[0] as T

// ---- what the routes will be asked

const size = await one<{ decisions: number; history: string }>(`SELECT (SELECT count(*)::int FROM decisions) AS decisions,
  pg_size_pretty(pg_total_relation_size('decision_revisions') + pg_total_relation_size('decision_events')) AS history`)
if (size.decisions < 1000) throw new Error(`the scale database holds ${size.decisions} decisions: run npm run db:seed:scale first`)
console.log(`Scale database: ${size.decisions.toLocaleString('en-GB')} decisions, ${size.history} of history`)

const sampleIds = (await db.query<{ id: number }>('SELECT id FROM decisions TABLESAMPLE SYSTEM (2) LIMIT 500')).rows.map(r => r.id)
const pickId = () => sampleIds[Math.floor(Math.random() * sampleIds.length)]!
const cursorAt = async (query: string, params: unknown[]) => {
  const row = await one<{ at: Date; id: number } | undefined>(query, params)
  return row ? encodeURIComponent(encodeCursor(row)) : ''
}
const auditDepth = Math.min(99_000, size.decisions - 20)
const deepAudit = await cursorAt('SELECT updated_at AS at, decision_id AS id FROM decision_summaries ORDER BY updated_at DESC, decision_id DESC OFFSET $1 LIMIT 1', [auditDepth])
const biggest = await one<{ projectId: number; n: number }>('SELECT project_id AS "projectId", count(*)::int AS n FROM decision_summaries GROUP BY 1 ORDER BY 2 DESC LIMIT 1')
const deepProject = await cursorAt('SELECT updated_at AS at, decision_id AS id FROM decision_summaries WHERE project_id = $1 ORDER BY updated_at DESC, decision_id DESC OFFSET $2 LIMIT 1', [biggest.projectId, biggest.n - 21])
const reviewerId = (await one<{ id: number }>("SELECT id FROM users WHERE email = 'reviewer@eddyledger.test'")).id
const queueRows = `FROM decision_summaries WHERE status = 'in_review' AND author_id <> $1 AND project_id IN (SELECT project_id FROM project_members WHERE user_id = $1)`
const queueSize = (await one<{ n: number }>(`SELECT count(*)::int AS n ${queueRows}`, [reviewerId])).n
const deepQueue = await cursorAt(`SELECT submitted_at AS at, decision_id AS id ${queueRows} ORDER BY submitted_at, decision_id OFFSET $2 LIMIT 1`, [reviewerId, Math.max(0, queueSize - 26)])
const year = await one<{ from: string; to: string }>(`SELECT to_char(max(created_at) - interval '1 year', 'YYYY-MM-DD') AS from, to_char(max(created_at), 'YYYY-MM-DD') AS to FROM decision_summaries WHERE project_id = $1`, [biggest.projectId])

type Account = 'lead' | 'auditor' | 'reviewer' | 'engineer'
const BASELINE = 'decision by id (primary key)'
const ROUTES: { name: string; account: Account; path: () => string; target?: boolean }[] = [
  { name: BASELINE, account: 'auditor', path: () => `/api/decisions/${pickId()}` },
  { name: 'overview, all projects, all time', account: 'lead', path: () => '/api/overview', target: true },
  { name: 'overview, one project, one year', account: 'lead', path: () => `/api/overview?projectId=${biggest.projectId}&from=${year.from}&to=${year.to}`, target: true },
  { name: 'audit list, first page', account: 'auditor', path: () => '/api/audit/decisions?limit=20', target: true },
  { name: `audit list at ${auditDepth.toLocaleString('en-GB')}`, account: 'auditor', path: () => `/api/audit/decisions?limit=20&cursor=${deepAudit}`, target: true },
  { name: 'audit list, approved in one project', account: 'auditor', path: () => `/api/audit/decisions?limit=20&status=approved&projectId=${biggest.projectId}`, target: true },
  { name: 'audit search by title', account: 'auditor', path: () => '/api/audit/decisions?limit=20&q=intake', target: true },
  { name: 'audit search by author', account: 'auditor', path: () => '/api/audit/decisions?limit=20&q=Lindqvist', target: true },
  { name: `review queue, first page (of ${queueSize.toLocaleString('en-GB')})`, account: 'reviewer', path: () => '/api/review/queue?limit=25', target: true },
  { name: 'review queue, last page', account: 'reviewer', path: () => `/api/review/queue?limit=25&cursor=${deepQueue}`, target: true },
  { name: `project list, first page (of ${biggest.n.toLocaleString('en-GB')})`, account: 'auditor', path: () => `/api/projects/${biggest.projectId}/decisions?limit=20`, target: true },
  { name: 'project list, last page', account: 'auditor', path: () => `/api/projects/${biggest.projectId}/decisions?limit=20&cursor=${deepProject}`, target: true },
]

async function clients(base: string) {
  const entries = await Promise.all((['lead', 'auditor', 'reviewer', 'engineer'] as const).map(async key => [key, await signedIn(base, key)] as const))
  return Object.fromEntries(entries) as Record<Account, Awaited<ReturnType<typeof signedIn>>>
}

// ---- latency, interleaved

async function latencies(app: RunningServer) {
  const as = await clients(app.base)
  const samples = new Map(ROUTES.map(r => [r.name, [] as number[]]))
  const rounds = Number(options.rounds)
  for (let round = -3; round < rounds; round++) {
    // A new order each round, so no route always follows the same one.
    for (const route of [...ROUTES].sort(() => Math.random() - 0.5)) {
      const start = performance.now()
      await as[route.account].get(route.path())
      if (round >= 0) samples.get(route.name)!.push(performance.now() - start)
    }
  }
  const base = median(samples.get(BASELINE)!)
  console.log(`\nLatency: median of ${rounds} interleaved rounds; ratio to ${BASELINE} (target <= ${TARGET}x)`)
  for (const route of ROUTES) {
    const value = median(samples.get(route.name)!)
    const mark = route.target ? (value / base <= TARGET ? '  OK' : '  OVER TARGET') : ''
    console.log(`  ${route.name.padEnd(46)} ${ms(value)}  ${ratio(value / base).padStart(6)}${mark}`)
  }
}

// ---- the CSV export

async function csvExport(app: RunningServer) {
  const auditor = await signedIn(app.base, 'auditor')
  await new Promise(r => setTimeout(r, 2000))
  const idle = median(Array.from({ length: 5 }, () => app.rssMb()))
  let peak = idle
  const sampler = setInterval(() => { peak = Math.max(peak, app.rssMb()) }, 50)
  const start = performance.now()
  const res = await fetch(`${app.base}/api/audit/decisions.csv`, { headers: auditor.headers })
  const reader = res.body!.getReader()
  let firstByte = 0
  let bytes = 0
  let lines = 0
  for (;;) {
    const { done, value } = await reader.read()
    if (done) break
    if (!firstByte) firstByte = performance.now() - start
    bytes += value.length
    for (const byte of value) if (byte === 10) lines++
  }
  const total = performance.now() - start
  clearInterval(sampler)
  const rows = lines - 1
  console.log(`\nCSV export of everything: HTTP ${res.status}, ${rows.toLocaleString('en-GB')} rows (${rows === size.decisions ? 'all' : `EXPECTED ${size.decisions}`}), ${(bytes / 1e6).toFixed(1)} MB`)
  console.log(`  first bytes after ${ms(firstByte)} (target < 1000 ms) ${firstByte < 1000 ? 'OK' : 'OVER TARGET'}; complete after ${(total / 1000).toFixed(1)} s`)
  console.log(`  server memory: idle ${idle.toFixed(0)} MB, peak ${peak.toFixed(0)} MB, +${(peak - idle).toFixed(0)} MB (target <= 50 MB) ${peak - idle <= 50 ? 'OK' : 'OVER TARGET'}`)
}

// ---- throughput of the advice against the health check

async function throughput(app: RunningServer) {
  const engineer = await signedIn(app.base, 'engineer')
  const duration = Number(options.duration)
  const health = await fetch(`${app.base}/api/health`)
  const run = (opts: autocannon.Options) => new Promise<autocannon.Result>((resolve, reject) =>
    autocannon({ connections: 20, duration, ...opts }, (error, result) => (error ? reject(error) : resolve(result))))
  const headers = { ...engineer.headers, 'content-type': 'application/json' }
  // Repeated cases (the questionnaire asks again for a case it has seen: answered from the
  // versioned cache) and a new case every request (the engine runs each time).
  const DUCTS = Array.from({ length: 20 }, (_, i) => JSON.stringify({ caseInput: { ...DATA_HALL_DUCT, velocity: 4 + i / 2 } }))
  let count = 0
  const advice = {
    repeated: () => run({ url: `${app.base}/api/advice`, method: 'POST', headers, requests: DUCTS.map(body => ({ method: 'POST', body })) }),
    new: () => run({
      url: `${app.base}/api/advice`, method: 'POST', headers,
      requests: [{ method: 'POST', setupRequest: req => ({ ...req, body: JSON.stringify({ caseInput: { ...DATA_HALL_DUCT, velocity: 1 + (count++ % 1e6) / 1e4 } }) }) }],
    }),
  }
  const mean = (list: number[]) => list.reduce((sum, v) => sum + v, 0) / list.length
  console.log(`\nThroughput at 20 connections, ${duration} s a run, runs alternating`)
  const rates: Record<'health' | keyof typeof advice, number[]> = { health: [], repeated: [], new: [] }
  const available = health.status === 200
  for (let i = 0; i < 2; i++) {
    if (available) rates.health.push(await measure('health', () => run({ url: `${app.base}/api/health` })))
    rates.repeated.push(await measure('advice, repeated cases', advice.repeated))
    rates.new.push(await measure('advice, a new case each', advice.new))
  }
  const line = (label: string, rate: number) => `  ${label.padEnd(34)} ${rate.toFixed(0).padStart(6)} req/s`
  if (!available) {
    console.log(line('POST /api/advice, repeated cases', mean(rates.repeated)))
    console.log(line('POST /api/advice, a new case each', mean(rates.new)))
    console.log(`  GET /api/health answers ${health.status}: this build has no health check yet, so the ratio is not measured`)
    return
  }
  const base = mean(rates.health)
  console.log(line('GET /api/health', base))
  for (const [key, label] of [['repeated', 'POST /api/advice, repeated cases'], ['new', 'POST /api/advice, a new case each']] as const) {
    const share = mean(rates[key]) / base
    console.log(`${line(label, mean(rates[key]))}  ${ratio(share)} of the health check (target >= 0.5x) ${share >= 0.5 ? 'OK' : 'UNDER TARGET'}`)
  }
}

async function measure(label: string, work: () => Promise<autocannon.Result>) {
  const result = await work()
  if (result.non2xx || result.errors) console.log(`  ${label}: ${result.non2xx} answers other than 2xx, ${result.errors} errors`)
  return result.requests.average
}

// ---- pages in the browser, at this size and at the demo's

async function demoDatabase(url: string) {
  const pool = new pg.Pool({ connectionString: url, max: 1 })
  const demo = drizzle(pool, { schema })
  await pool.query('DROP SCHEMA IF EXISTS drizzle CASCADE; DROP SCHEMA public CASCADE; CREATE SCHEMA public')
  await migrate(demo, { migrationsFolder: new URL('../server/db/migrations', import.meta.url).pathname })
  await seedDemo(demo, await new Hash(new Scrypt({})).make(process.env.DEMO_PASSWORD || 'ledger-demo-2026'))
  await pool.end()
}

async function pages(app: RunningServer) {
  const demoUrl = process.env.DEMO_DATABASE_URL
  if (!demoUrl) {
    console.log('\nPages: DEMO_DATABASE_URL is not set, so the browser comparison is skipped')
    return
  }
  // Rebuilt as the owner (the server's own role may not drop the schema).
  await demoDatabase(process.env.DEMO_DATABASE_OWNER_URL || demoUrl)
  const demoApp = await startApp(demoUrl)
  const browser = await launchBrowser()
  try {
    const loads = Number(options.loads)
    const atScale = await pageTimes(browser, app.base, loads)
    const atDemo = await pageTimes(browser, demoApp.base, loads)
    console.log(`\nPages in chromium: median of ${loads} loads until the content shows, at ${size.decisions.toLocaleString('en-GB')} decisions and at the demo's size`)
    for (const path of Object.keys(atScale)) {
      const share = atScale[path]! / atDemo[path]!
      console.log(`  ${path.padEnd(10)} ${ms(atScale[path]!)} at scale, ${ms(atDemo[path]!)} demo  ${ratio(share)}`)
    }
  } finally {
    await browser.close()
    await demoApp.stop()
  }
}

// ---- plans

async function plans() {
  const logFile = join(tmpdir(), `eddyledger-bench-sql-${process.pid}.jsonl`)
  const app = await startApp(scaleUrl!, { EDDY_SQL_LOG: logFile })
  try {
    const as = await clients(app.base)
    console.log('\nPlans (EXPLAIN ANALYZE of every SELECT a request ran; sequential scans of the large tables and sorts to disk flagged)')
    for (const route of ROUTES) {
      const found = await explainRequest(logFile, db, () => as[route.account].get(route.path()))
      const verdict = found.largeSeqScans.length || found.spilledSorts.length
        ? `FLAGGED: ${[...found.largeSeqScans.map(t => `seq scan of ${t}`), ...found.spilledSorts.map(s => `sort spilled (${s})`)].join(', ')}`
        : 'index scans, no sort spilled'
      console.log(`  ${route.name.padEnd(46)} ${found.statements} statements: ${verdict}`)
      console.log(`      ${found.scans.join('; ')}${found.sorts.length ? ` | sorts: ${found.sorts.join(', ')}` : ''}`)
    }
  } finally {
    await app.stop()
    rmSync(logFile, { force: true })
  }
}

const app = await startApp(scaleUrl)
try {
  if (!options['skip-latency']) await latencies(app)
  if (!options['skip-csv']) await csvExport(app)
  if (!options['skip-throughput']) await throughput(app)
  if (!options['skip-pages']) await pages(app)
} finally {
  await app.stop()
}
if (!options['skip-explain']) await plans()
await db.end()
