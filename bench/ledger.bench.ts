/**
 * Ledger benchmark at scale: BENCH_DECISIONS approved decisions (default 100,000; a revision with the
 * engine's real advice and three events each, four ledger entries) written in bulk, then measured in
 * one run: the full verification, appends through the real record code (one writer, eight writers),
 * the incremental verification after them and after one tampered old event, signing a checkpoint,
 * a receipt check (recomputes the chain from the first entry), and one audit page's decision checks.
 * Run with `npm run bench:ledger [-- DECISIONS]` (scripts/bench-ledger.sh: a throwaway cluster).
 */
import { performance } from 'node:perf_hooks'
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import { advise, caseInputSchema } from '../shared/rules'
import { enteredFromCaseInput } from '../shared/schemas/case-form'
import { changeDecision, insertDecision } from '../server/utils/decisions/record'
import { GENESIS_HASH, canonicalHash, eventHash } from '../server/db/event-chain'
import { ledgerEntryHash, ledgerHead, type LedgerFields } from '../server/db/ledger'
import { checkReceipt, createCheckpoint, parseReceipt, receiptText } from '../server/db/ledger-checkpoint'
import { checkDecisions } from '../server/db/ledger-decision-check'
import { generateSigningKeyPem, parsePrivateKey, signingKeyFrom } from '../server/db/ledger-keys'
import { revisionHash } from '../server/db/ledger-records'
import { verifyLedger } from '../server/db/ledger-verify'
import * as schema from '../server/db/schema'
import { CONDENSER_WAKE, DATA_HALL_DUCT, FERRY_HULL, PUMP_INTAKE, seedDemo } from '../server/db/seed-demo'

const DECISIONS = Number(process.env.BENCH_DECISIONS || 100_000)
const BATCH = 1000
const ownerUrl = process.env.DATABASE_OWNER_URL!
const appUrl = process.env.DATABASE_URL!
const owner = new pg.Pool({ connectionString: ownerUrl, max: 2 })
const pool = new pg.Pool({ connectionString: appUrl, max: 10 })
const ownerDb = drizzle(owner, { schema })
const db = drizzle(pool, { schema })

const results: [string, string][] = []
async function measure<T>(name: string, run: () => Promise<T>, describe: (value: T, seconds: number) => string) {
  const start = performance.now()
  const value = await run()
  const seconds = (performance.now() - start) / 1000
  results.push([name, describe(value, seconds)])
  console.log(`[bench] ${name}: ${describe(value, seconds)}`)
  return value
}
const s = (seconds: number) => `${seconds.toFixed(2)} s`

// ---- the data: the demo accounts and projects, then DECISIONS approved decisions in bulk

await seedDemo(ownerDb, 'not-a-password-hash')
const users = await ownerDb.select().from(schema.users)
const engineer = users.find(u => u.role === 'engineer')!
const reviewer = users.find(u => u.role === 'reviewer')!
const projects = (await ownerDb.select().from(schema.projects)).map(p => p.id)
const cases = [FERRY_HULL, DATA_HALL_DUCT, CONDENSER_WAKE, PUMP_INTAKE].map((raw) => {
  const caseInput = JSON.parse(JSON.stringify(caseInputSchema.parse(raw)))
  const advice = JSON.parse(JSON.stringify(advise(caseInput)))
  const entered = JSON.parse(JSON.stringify(enteredFromCaseInput(caseInput, 'si')))
  return { caseInput, entered, advice, inputHash: canonicalHash(caseInput) }
})

async function nextIds(sequence: string, count: number) {
  const { rows } = await owner.query(`SELECT nextval('${sequence}')::bigint AS id FROM generate_series(1, $1)`, [count])
  return rows.map(r => Number(r.id))
}

async function generate() {
  await owner.query('ALTER TABLE decisions DISABLE TRIGGER decisions_state_follows_history')
  let head = await ledgerHead(ownerDb)
  const start = Date.now() - DECISIONS * 1000
  for (let done = 0; done < DECISIONS; done += BATCH) {
    const count = Math.min(BATCH, DECISIONS - done)
    const [decisionIds, revisionIds, eventIds] = await Promise.all([
      nextIds('decisions_id_seq', count), nextIds('decision_revisions_id_seq', count), nextIds('decision_events_id_seq', count * 3),
    ])
    const decisions: (typeof schema.decisions.$inferInsert)[] = []
    const revisions: (typeof schema.decisionRevisions.$inferSelect)[] = []
    const events: (typeof schema.decisionEvents.$inferSelect)[] = []
    const entries: (typeof schema.ledgerEntries.$inferSelect)[] = []
    const append = (fields: Omit<LedgerFields, 'seq' | 'createdAt'>) => {
      const entry = { ...fields, seq: head.seq + 1, createdAt: new Date() }
      const hash = ledgerEntryHash(head.hash, entry)
      entries.push({ ...entry, prevHash: head.hash, hash })
      head = { seq: entry.seq, hash }
    }
    for (let i = 0; i < count; i++) {
      const id = decisionIds[i]!
      const at = new Date(start + (done + i) * 1000)
      const { caseInput, entered, advice, inputHash } = cases[(done + i) % cases.length]!
      const title = `Bench case ${done + i + 1}`
      decisions.push({
        id, projectId: projects[(done + i) % projects.length]!, title, status: 'approved', version: 3, currentRevision: 1,
        authorId: engineer.id, createdAt: at, updatedAt: at,
      })
      const revision = {
        id: revisionIds[i]!, decisionId: id, revision: 1, caseInput, unitSystem: 'si' as const, entered, requested: null, advice, notes: '', inputHash,
        rulesetId: advice.ruleset.id, rulesetVersion: advice.ruleset.version, engineVersion: advice.engineVersion, createdBy: engineer.id, createdAt: at,
      }
      revisions.push(revision)
      append({ subjectType: 'decision', subjectId: String(id), type: 'decision-revision', recordTable: 'decision_revisions', recordId: revision.id, recordHash: revisionHash(revision) })
      const { approach, model, wallTreatment } = advice.recommendation
      const steps = [
        { type: 'created' as const, actor: engineer, payload: { revision: 1, title, inputHash, approach, model, wallTreatment, rulesetVersion: advice.ruleset.version } },
        { type: 'submitted' as const, actor: engineer, payload: {} },
        { type: 'approved' as const, actor: reviewer, payload: { comment: 'Agreed.' } },
      ]
      let prevHash = GENESIS_HASH
      steps.forEach((step, k) => {
        const fields = { decisionId: id, seq: k + 1, type: step.type, actorId: step.actor.id, actorRole: step.actor.role, payload: step.payload, createdAt: new Date(at.getTime() + k) }
        const hash = eventHash(prevHash, fields)
        const event = { ...fields, id: eventIds[i * 3 + k]!, prevHash, hash }
        events.push(event)
        append({ subjectType: 'decision', subjectId: String(id), type: 'decision-event', recordTable: 'decision_events', recordId: event.id, recordHash: hash })
        prevHash = hash
      })
    }
    await ownerDb.transaction(async (tx) => {
      await tx.insert(schema.decisions).values(decisions)
      await tx.insert(schema.decisionRevisions).values(revisions)
      for (let k = 0; k < events.length; k += 1000) await tx.insert(schema.decisionEvents).values(events.slice(k, k + 1000))
      for (let k = 0; k < entries.length; k += 1000) await tx.insert(schema.ledgerEntries).values(entries.slice(k, k + 1000))
    })
    if ((done / BATCH) % 10 === 0) process.stderr.write(`\r[bench] written ${done + count} of ${DECISIONS} decisions`)
  }
  process.stderr.write('\n')
  await owner.query('ALTER TABLE decisions ENABLE TRIGGER decisions_state_follows_history')
  await owner.query('ANALYZE')
  return head
}

const head = await measure('bulk write (not the product path)', generate, (h, t) => `${DECISIONS} decisions, ${h.seq} entries in ${s(t)}`)
const key = signingKeyFrom(parsePrivateKey(generateSigningKeyPem()))
const trusted = new Map([[key.keyId, key.publicKey]])

const phases = (label: string) => (phase: string, ms: number) => { if (ms > 50) console.log(`[bench]   ${label} · ${phase}: ${(ms / 1000).toFixed(2)} s`) }
const full = await measure('full verification', () => verifyLedger(db, { mode: 'full', trusted, signingKey: key, onPhase: phases('full') }),
  (r, t) => `${r.entries} entries recomputed in ${s(t)} (${Math.round(r.entries / t)} entries/s), ${r.problems.length} problems`)
if (!full.valid) throw new Error(`the generated ledger does not verify: ${JSON.stringify(full.problems.slice(0, 3))}`)

await measure('first checkpoint', () => createCheckpoint(db, key, 'request'), (_, t) => s(t))

// ---- appends through the real record code

async function oneDecision(n: number) {
  return db.transaction(async (tx) => {
    const d = await insertDecision(tx, { projectId: projects[n % projects.length]!, title: `Appended ${n}`, caseInput: DATA_HALL_DUCT, author: engineer })
    const submitted = await changeDecision(tx, { decisionId: d.id, version: d.version, from: ['draft'], set: { status: 'in_review' }, event: { type: 'submitted', actor: engineer } })
    await changeDecision(tx, { decisionId: d.id, version: submitted!.version, from: ['in_review'], set: { status: 'approved' }, event: { type: 'approved', actor: reviewer } })
  })
}
const APPENDED = 200
await measure('appends, one writer', async () => { for (let n = 0; n < APPENDED; n++) await oneDecision(n) },
  (_, t) => `${APPENDED} decisions (${APPENDED * 4} entries) in ${s(t)}: ${Math.round((APPENDED * 4) / t)} entries/s`)
await measure('appends, eight writers', () => Promise.all(Array.from({ length: 8 }, (_, w) => (async () => {
  for (let n = 0; n < APPENDED / 8; n++) await oneDecision(1000 + w * 100 + n)
})())), (_, t) => `${APPENDED} decisions (${APPENDED * 4} entries) in ${s(t)}: ${Math.round((APPENDED * 4) / t)} entries/s`)

const incremental = await measure('incremental verification after the appends', () => verifyLedger(db, { mode: 'incremental', trusted, signingKey: key, onPhase: phases('incremental') }),
  (r, t) => `${r.recomputed} of ${r.entries} entries recomputed in ${s(t)}, ${r.problems.length} problems`)
if (!incremental.valid) throw new Error('the appended ledger does not verify')

const checkpoint = await measure('checkpoint over the appended entries', () => createCheckpoint(db, key, 'request'), (_, t) => s(t))

// ---- one old event tampered with as the owner
await owner.query(`BEGIN; ALTER TABLE decision_events DISABLE TRIGGER USER;
  UPDATE decision_events SET payload = '{"comment":"Looks fine."}' WHERE decision_id = (SELECT min(id) + 10 FROM decisions) AND type = 'approved';
  ALTER TABLE decision_events ENABLE TRIGGER USER; COMMIT`)
await measure('incremental verification after one old event was tampered with', () => verifyLedger(db, { mode: 'incremental', trusted, signingKey: key }),
  (r, t) => `${r.recomputed} entries recomputed in ${s(t)}; found: ${r.problems.map(p => p.kind).join(', ') || 'nothing'}`)

if ('checkpoint' in checkpoint) {
  const receipt = parseReceipt(receiptText(checkpoint.checkpoint))
  if ('error' in receipt) throw new Error(receipt.error)
  await measure('receipt check (the chain from the first entry)', () => checkReceipt(db, receipt, trusted),
    (r, t) => `${r.matches ? 'matches' : 'does not match'} in ${s(t)}`)
}

const page = (await pool.query('SELECT id FROM decisions ORDER BY id DESC LIMIT 50')).rows.map(r => r.id as number)
await measure('one audit page (50 decisions) checked', () => checkDecisions(db, page), (_, t) => s(t))

const { rows: [size] } = await owner.query(`SELECT pg_size_pretty(pg_database_size(current_database())) AS size`)
console.log(`\nLedger at ${DECISIONS} decisions (${head.seq} entries, database ${size.size}):`)
for (const [name, value] of results) console.log(`  ${name.padEnd(66)} ${value}`)
await Promise.all([owner.end(), pool.end()])
