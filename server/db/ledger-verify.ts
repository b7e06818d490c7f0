// Verification of the whole ledger, reported by kind:
//   altered      an entry, or the record it holds, no longer hashes to what was recorded; or a
//                history row that no entry holds (added behind the ledger's back)
//   broken-link  an entry (or a decision's event) does not link to the one before it
//   rewritten    a signed checkpoint (or a signed clean verification) no longer matches the
//                chain: the history was recomputed after it was signed
//   gap          entries, events, checkpoints or whole decisions are missing
//   state        a decision's row disagrees with what replaying its events gives
//
// A full run recomputes every entry and record. An incremental run starts from the last clean,
// signed run (its anchor): every check that SQL can do over the whole ledger still runs (gaps,
// links, stored hashes against the ledger's, checkpoints, derived state), and hashes are recomputed
// for the entries appended since the anchor and for every row written since the anchor's snapshot,
// found by its transaction id (xmin): no row can change without getting a new one. Relative imports
// only: npm run ledger:verify runs the same code.
import type { KeyObject } from 'node:crypto'
import { performance } from 'node:perf_hooks'
import canonicalize from 'canonicalize'
import { asc, desc, sql, type SQL } from 'drizzle-orm'
import { LEDGER_GENESIS, ledgerEntryHash, ledgerHead, type LedgerDbOrTx } from './ledger'
import { checkpointSignatureHolds } from './ledger-checkpoint'
import { signText, verifyText, type SigningKey } from './ledger-keys'
import { RECORD_SOURCES, rulesetHash, rulesetSubject } from './ledger-records'
import { PROBLEM_KINDS, type LedgerProblem, type LedgerProblemKind } from '../../shared/schemas/ledger'
import * as schema from './schema'
import { summaryDrift } from './summary-drift'
import type { Db } from './types'

export { PROBLEM_KINDS, type LedgerProblem, type LedgerProblemKind }
export type VerifyMode = 'full' | 'incremental'

export type LedgerReport = {
  valid: boolean
  /** Entries in the ledger. */
  entries: number
  /** Checkpoints in the ledger. */
  checkpoints: number
  problems: LedgerProblem[]
  mode: VerifyMode
  /** Entries whose hash and record this run recomputed (all of them in a full run). */
  recomputed: number
  head: { seq: number; hash: string }
  /** The clean run an incremental run started from. */
  from: { run: number; seq: number; at: Date } | null
  verificationId: number | null
}

type Run = typeof schema.ledgerVerifications.$inferSelect
type Row = Record<string, unknown>

const BATCH = 2000
// Beyond this many transactions since the anchor, xmin comparisons are no longer safe (they wrap at 2^31).
const MAX_XID_DISTANCE = 1_000_000_000n

class Problems {
  list: LedgerProblem[] = []
  private seen = new Set<string>()
  add(p: LedgerProblem) {
    const key = `${p.kind}|${p.decisionId ?? ''}|${p.seq ?? ''}|${p.detail}`
    if (this.seen.has(key)) return
    this.seen.add(key)
    this.list.push(Object.fromEntries(Object.entries(p).filter(([, v]) => v !== undefined)) as LedgerProblem)
  }
}

const decisionOf = (subjectType: unknown, subjectId: unknown) =>
  subjectType === 'decision' && /^\d+$/.test(String(subjectId)) ? Number(subjectId) : undefined

async function rows<T = Row>(db: LedgerDbOrTx, query: SQL): Promise<T[]> {
  return (await db.execute(query)).rows as T[]
}

// ---- signed runs: the anchors of incremental runs

function runMessage(r: Pick<Run, 'mode' | 'startedAt' | 'finishedAt' | 'snapshotXmin' | 'headSeq' | 'headHash' | 'entries' | 'checkpoints' | 'problems'>) {
  return `eddyledger-verification-v1\n${canonicalize({
    mode: r.mode, startedAt: r.startedAt.toISOString(), finishedAt: r.finishedAt.toISOString(), snapshotXmin: r.snapshotXmin,
    headSeq: r.headSeq, headHash: r.headHash, entries: r.entries, checkpoints: r.checkpoints, problems: r.problems,
  })}`
}

function runSignatureHolds(run: Run, trusted: Map<string, KeyObject>) {
  const key = run.keyId ? trusted.get(run.keyId) : undefined
  return Boolean(key && run.signature && verifyText(key, runMessage(run), run.signature))
}

async function findAnchor(tx: LedgerDbOrTx, trusted: Map<string, KeyObject>, xmin: string) {
  const runs = await tx.select().from(schema.ledgerVerifications)
    .where(sql`${schema.ledgerVerifications.problems} = '[]'::jsonb AND ${schema.ledgerVerifications.signature} IS NOT NULL`)
    .orderBy(desc(schema.ledgerVerifications.id)).limit(20)
  for (const run of runs) {
    if (!runSignatureHolds(run, trusted)) continue
    const distance = BigInt(xmin) - BigInt(run.snapshotXmin)
    return distance >= 0n && distance < MAX_XID_DISTANCE ? run : null
  }
  return null
}

// ---- checks over the whole ledger, in SQL

async function checkSequence(tx: LedgerDbOrTx, problems: Problems) {
  const found = await rows<{ seq: string; prev: string; prev_hash: string; prev_stored: string | null; subject_type: string; subject_id: string }>(tx, sql`
    SELECT seq, prev, prev_hash, prev_stored, subject_type, subject_id FROM (
      SELECT seq, prev_hash, subject_type, subject_id,
        lag(seq, 1, 0::bigint) OVER (ORDER BY seq) AS prev, lag(hash) OVER (ORDER BY seq) AS prev_stored
      FROM ledger_entries) s
    WHERE seq <> prev + 1 OR prev_hash IS DISTINCT FROM coalesce(prev_stored, ${LEDGER_GENESIS})`)
  for (const r of found) {
    const seq = Number(r.seq)
    const prev = Number(r.prev)
    if (seq !== prev + 1) {
      problems.add({ kind: 'gap', seq: prev + 1, detail: seq === prev + 2 ? `Entry #${prev + 1} is missing from the ledger` : `Entries #${prev + 1}–#${seq - 1} are missing from the ledger` })
    } else {
      problems.add({ kind: 'broken-link', seq, decisionId: decisionOf(r.subject_type, r.subject_id), detail: `Entry #${seq} does not link to entry #${prev}: the hash it chains on is not entry #${prev}'s` })
    }
  }
}

async function checkRecords(tx: LedgerDbOrTx, problems: Problems, goneDecisions: Set<number>) {
  const tables = Object.keys(RECORD_SOURCES)
  const unknown = await rows<{ seq: string; record_table: string }>(tx, sql`
    SELECT seq, record_table FROM ledger_entries WHERE record_table IS NOT NULL AND NOT (record_table = ANY(${`{${tables.join(',')}}`}::text[]))`)
  for (const r of unknown) problems.add({ kind: 'altered', seq: Number(r.seq), detail: `Entry #${r.seq} names a table the ledger does not hold (${r.record_table})` })

  for (const [table, source] of Object.entries(RECORD_SOURCES)) {
    const t = sql.raw(table)
    const key = sql.raw(source.idColumn ?? 'id')
    // Entries whose row is gone: one problem per subject.
    const gone = await rows<{ subject_type: string; subject_id: string; first: string; n: number }>(tx, sql`
      SELECT l.subject_type, l.subject_id, min(l.seq) AS first, count(*)::int AS n FROM ledger_entries l
      WHERE l.record_table = ${table} AND NOT EXISTS (SELECT 1 FROM ${t} r WHERE r.${key} = l.record_id)
      GROUP BY l.subject_type, l.subject_id`)
    for (const r of gone) {
      const decisionId = decisionOf(r.subject_type, r.subject_id)
      if (decisionId !== undefined && goneDecisions.has(decisionId)) continue
      problems.add({
        kind: 'gap', decisionId, seq: Number(r.first),
        detail: `${r.n} ${source.noun}${r.n === 1 ? '' : 's'} of ${r.subject_type} ${r.subject_id} recorded in the ledger (from entry #${r.first}) ${r.n === 1 ? 'is' : 'are'} gone`,
      })
    }
    // Rows that no entry holds.
    const loose = await rows<{ id: string }>(tx, sql`
      SELECT r.${key} AS id FROM ${t} r WHERE NOT EXISTS (SELECT 1 FROM ledger_entries l WHERE l.record_table = ${table} AND l.record_id = r.${key})
      ORDER BY r.${key} LIMIT 1000`)
    if (loose.length) {
      for (const row of await source.load(tx, loose.map(r => Number(r.id)))) {
        const subject = source.subject(row)
        problems.add({ kind: 'altered', decisionId: decisionOf(subject.type, subject.id), detail: `${source.describe(row)} is not in the ledger: it was added behind its back` })
      }
    }
    // Rows whose own stored hash is what the ledger holds (events): compared in SQL, every row.
    if (source.hashColumn) {
      const c = sql.raw(source.hashColumn)
      const differ = await rows<{ seq: string; id: string }>(tx, sql`
        SELECT l.seq, r.${key} AS id FROM ledger_entries l JOIN ${t} r ON l.record_table = ${table} AND r.${key} = l.record_id
        WHERE r.${c} IS DISTINCT FROM l.record_hash ORDER BY l.seq LIMIT 1000`)
      if (differ.length) {
        const byId = new Map((await source.load(tx, differ.map(r => Number(r.id)))).map(row => [source.id(row), row]))
        for (const r of differ) {
          const row = byId.get(Number(r.id))
          if (!row) continue
          const subject = source.subject(row)
          problems.add({ kind: 'altered', seq: Number(r.seq), decisionId: decisionOf(subject.type, subject.id), detail: `${source.describe(row)} no longer has the hash ledger entry #${r.seq} recorded: it was changed and rehashed` })
        }
      }
    }
  }
}

async function checkDecisionChains(tx: LedgerDbOrTx, problems: Problems) {
  const found = await rows<{ decision_id: number; seq: number; prev: number; prev_hash: string; prev_stored: string | null }>(tx, sql`
    SELECT decision_id, seq, prev, prev_hash, prev_stored FROM (
      SELECT decision_id, seq, prev_hash,
        lag(seq, 1, 0) OVER w AS prev, lag(hash) OVER w AS prev_stored
      FROM decision_events WINDOW w AS (PARTITION BY decision_id ORDER BY seq)) s
    WHERE seq <> prev + 1 OR prev_hash IS DISTINCT FROM coalesce(prev_stored, ${LEDGER_GENESIS})`)
  for (const r of found) {
    if (r.seq !== r.prev + 1) {
      problems.add({ kind: 'gap', decisionId: r.decision_id, detail: r.seq === r.prev + 2 ? `Event #${r.prev + 1} of decision ${r.decision_id} is missing` : `Events #${r.prev + 1}–#${r.seq - 1} of decision ${r.decision_id} are missing` })
    } else {
      problems.add({ kind: 'broken-link', decisionId: r.decision_id, detail: `Event #${r.seq} of decision ${r.decision_id} does not link to event #${r.prev}` })
    }
  }
}

/** Decisions the ledger holds entries for but whose row is gone (a whole decision deleted). */
async function checkGoneDecisions(tx: LedgerDbOrTx, problems: Problems) {
  const found = await rows<{ subject_id: string; first: string; n: number }>(tx, sql`
    SELECT l.subject_id, min(l.seq) AS first, count(*)::int AS n FROM ledger_entries l
    WHERE l.subject_type = 'decision' AND NOT EXISTS (SELECT 1 FROM decisions d WHERE d.id::text = l.subject_id)
    GROUP BY l.subject_id`)
  const gone = new Set<number>()
  for (const r of found) {
    const decisionId = Number(r.subject_id)
    gone.add(decisionId)
    problems.add({ kind: 'gap', decisionId, seq: Number(r.first), detail: `Decision ${decisionId} is gone, though ${r.n} ledger entries from #${r.first} hold its history` })
  }
  return gone
}

async function checkState(tx: LedgerDbOrTx, problems: Problems) {
  const found = await rows<{ decision_id: number; events: number; mismatch: string }>(tx, sql`
    SELECT decision_id, events, mismatch FROM decision_state_check WHERE mismatch IS NOT NULL ORDER BY decision_id`)
  for (const r of found) {
    problems.add(r.events === 0
      ? { kind: 'gap', decisionId: r.decision_id, detail: `Decision ${r.decision_id} has no events left: its history is gone` }
      : { kind: 'state', decisionId: r.decision_id, detail: `Decision ${r.decision_id}: ${r.mismatch}` })
  }
}

// The summaries the lists and the overview read are derived (decision_summary_source, migration
// 0012): a row that no longer says what its decision's record gives, or is missing, is reported.
async function checkSummaries(tx: LedgerDbOrTx, problems: Problems) {
  const found = await summaryDrift(tx, null)
  // A decision already reported is not reported again for the summary its tampered record left behind.
  const reported = new Set(problems.list.map(p => p.decisionId).filter(id => id !== undefined))
  for (const r of found) {
    const { decisionId } = r
    if (reported.has(decisionId)) continue
    // A summary left behind by a decision that is gone is one more trace of the removal.
    if (r.orphan) problems.add({ kind: 'gap', decisionId, detail: `Decision ${decisionId} is gone, but its summary row is still there` })
    else if (r.missing) problems.add({ kind: 'state', decisionId, detail: `Decision ${decisionId} has no summary row: the lists and the overview leave it out` })
    else problems.add({ kind: 'state', decisionId, detail: `Decision ${decisionId}: its summary row disagrees with its record (${r.columns.join(', ')})` })
  }
}

async function checkCheckpoints(tx: LedgerDbOrTx, problems: Problems, trusted: Map<string, KeyObject>, head: { seq: number }) {
  const list = await tx.select().from(schema.ledgerCheckpoints).orderBy(asc(schema.ledgerCheckpoints.number))
  const hashes = new Map((await rows<{ seq: string; hash: string }>(tx, sql`
    SELECT l.seq, l.hash FROM ledger_entries l JOIN ledger_checkpoints c ON c.seq = l.seq`)).map(r => [Number(r.seq), r.hash]))
  let expected = 1
  for (const c of list) {
    if (c.number !== expected) {
      problems.add({ kind: 'gap', detail: c.number === expected + 1 ? `Checkpoint #${expected} is missing` : `Checkpoints #${expected}–#${c.number - 1} are missing` })
    }
    expected = c.number + 1
    const signed = `checkpoint #${c.number} (signed ${c.signedAt.toISOString()})`
    if (!trusted.has(c.keyId)) {
      problems.add({ kind: 'rewritten', seq: c.seq, detail: `The ${signed} names the key ${c.keyId}, which is not one of this ledger's signing keys` })
    } else if (!checkpointSignatureHolds(c, trusted)) {
      problems.add({ kind: 'rewritten', seq: c.seq, detail: `The signature of ${signed} does not hold: the checkpoint was changed after it was signed` })
    }
    const hash = hashes.get(c.seq)
    if (c.seq > head.seq) {
      problems.add({ kind: 'gap', seq: head.seq + 1, detail: `The ledger ends at entry #${head.seq}, but ${signed} covered it up to #${c.seq}: entries after #${head.seq} are gone` })
    } else if (hash !== undefined && hash !== c.hash) {
      problems.add({ kind: 'rewritten', seq: c.seq, detail: `Entry #${c.seq} holds a hash other than the one ${signed} signed: the history up to it was rewritten` })
    }
  }
  return list.length
}

/** Clean, signed runs are witnesses too: the head each saw must still be there. */
async function checkRuns(tx: LedgerDbOrTx, problems: Problems, trusted: Map<string, KeyObject>, head: { seq: number }) {
  const found = await rows<{ id: number }>(tx, sql`
    SELECT v.id FROM ledger_verifications v LEFT JOIN ledger_entries l ON l.seq = v.head_seq
    WHERE v.problems = '[]'::jsonb AND v.signature IS NOT NULL AND v.head_seq > 0 AND l.hash IS DISTINCT FROM v.head_hash`)
  if (!found.length) return
  const runs = await tx.select().from(schema.ledgerVerifications)
    .where(sql`${schema.ledgerVerifications.id} = ANY(${`{${found.map(r => r.id).join(',')}}`}::int[])`)
  for (const run of runs) {
    if (!runSignatureHolds(run, trusted)) continue
    const at = run.finishedAt.toISOString()
    problems.add(run.headSeq > head.seq
      ? { kind: 'gap', seq: head.seq + 1, detail: `The ledger ends at entry #${head.seq}, but the verification of ${at} found it intact up to #${run.headSeq}: entries after #${head.seq} are gone` }
      : { kind: 'rewritten', seq: run.headSeq, detail: `Entry #${run.headSeq} holds a hash other than the one the signed verification of ${at} found: the history up to it was rewritten` })
  }
}

async function checkRuleset(tx: LedgerDbOrTx, problems: Problems) {
  const [entry] = await tx.select().from(schema.ledgerEntries)
    .where(sql`${schema.ledgerEntries.subjectType} = 'ruleset' AND ${schema.ledgerEntries.subjectId} = ${rulesetSubject()}`)
    .orderBy(asc(schema.ledgerEntries.seq)).limit(1)
  if (entry && entry.recordHash !== rulesetHash()) {
    problems.add({ kind: 'altered', seq: entry.seq, detail: `The ruleset ${rulesetSubject()} in the running code differs from the one published in entry #${entry.seq}: a rule changed without a new version` })
  }
}

// ---- recomputation, in batches

async function entriesChangedSince(tx: LedgerDbOrTx, anchor: Run) {
  // xmin is 32 bits wide; age() compares both within the same window (the distance was checked).
  const xid = String(BigInt(anchor.snapshotXmin) % 2n ** 32n)
  const parts = [sql`SELECT seq FROM ledger_entries WHERE seq > ${anchor.headSeq} OR age(xmin) <= age(${xid}::xid)`]
  for (const [table, source] of Object.entries(RECORD_SOURCES)) {
    parts.push(sql`SELECT l.seq FROM ledger_entries l JOIN ${sql.raw(table)} r ON l.record_table = ${table} AND l.record_id = r.${sql.raw(source.idColumn ?? 'id')}
      WHERE age(r.xmin) <= age(${xid}::xid)`)
  }
  const found = await rows<{ seq: string }>(tx, sql`${sql.join(parts, sql` UNION `)} ORDER BY seq`)
  return found.map(r => Number(r.seq))
}

async function recompute(tx: LedgerDbOrTx, problems: Problems, only: number[] | null, total: number, onProgress?: (done: number, total: number) => void) {
  const e = schema.ledgerEntries
  let done = 0
  let after = 0
  for (let i = 0; ; i += BATCH) {
    const batch = only
      ? (only.length > i ? await tx.select().from(e).where(sql`${e.seq} = ANY(${`{${only.slice(i, i + BATCH).join(',')}}`}::bigint[])`).orderBy(asc(e.seq)) : [])
      : await tx.select().from(e).where(sql`${e.seq} > ${after}`).orderBy(asc(e.seq)).limit(BATCH)
    if (!batch.length) break
    after = batch.at(-1)!.seq
    for (const entry of batch) {
      if (ledgerEntryHash(entry.prevHash, entry) !== entry.hash) {
        problems.add({ kind: 'altered', seq: entry.seq, decisionId: decisionOf(entry.subjectType, entry.subjectId), detail: `Entry #${entry.seq} was edited: it no longer hashes to its stored hash` })
      }
    }
    const byTable = new Map<string, typeof batch>()
    for (const entry of batch) {
      if (!entry.recordTable || !RECORD_SOURCES[entry.recordTable]) continue
      byTable.set(entry.recordTable, [...(byTable.get(entry.recordTable) ?? []), entry])
    }
    for (const [table, entries] of byTable) {
      const source = RECORD_SOURCES[table]!
      const loaded = new Map((await source.load(tx, entries.map(x => x.recordId!))).map(row => [source.id(row), row]))
      for (const entry of entries) {
        const row = loaded.get(entry.recordId!)
        if (!row) continue // reported as a gap
        const subject = source.subject(row)
        const decisionId = decisionOf(subject.type, subject.id)
        if (subject.type !== entry.subjectType || subject.id !== entry.subjectId) {
          problems.add({ kind: 'altered', seq: entry.seq, decisionId, detail: `${source.describe(row)} now belongs to another subject than ledger entry #${entry.seq} recorded` })
        }
        if (!source.hashColumn && source.hash(row) !== entry.recordHash) {
          problems.add({ kind: 'altered', seq: entry.seq, decisionId, detail: `${source.describe(row)} was changed after ledger entry #${entry.seq} recorded it` })
        }
        const own = source.selfCheck?.(row)
        if (own) problems.add({ kind: 'altered', seq: entry.seq, decisionId, detail: own })
      }
    }
    done += batch.length
    onProgress?.(done, total)
  }
  return done
}

// ---- the run

export type VerifyOptions = {
  mode: VerifyMode
  /** Keys that may have signed checkpoints and clean runs (ledger-keys.ts, loadTrustedKeys). */
  trusted: Map<string, KeyObject>
  /** Signs the run, so that a clean one can anchor the next incremental run. */
  signingKey?: SigningKey | null
  onProgress?: (done: number, total: number) => void
  /** How long each part took, for the benchmark. */
  onPhase?: (phase: string, ms: number) => void
}

export async function verifyLedger(db: Db, options: VerifyOptions): Promise<LedgerReport> {
  const startedAt = new Date()
  const problems = new Problems()
  const run = await db.transaction(async (tx) => {
    // The first statement fixes the snapshot; every transaction before its xmin is in it.
    const [{ xmin }] = await rows<{ xmin: string }>(tx, sql`SELECT pg_snapshot_xmin(pg_current_snapshot())::text AS xmin`) as [{ xmin: string }]
    const head = await ledgerHead(tx)
    const [{ n: entries }] = await rows<{ n: number }>(tx, sql`SELECT count(*)::int AS n FROM ledger_entries`) as [{ n: number }]
    let mark = performance.now()
    const phase = async <T>(name: string, run: () => Promise<T>) => {
      const value = await run()
      options.onPhase?.(name, performance.now() - mark)
      mark = performance.now()
      return value
    }
    const anchor = options.mode === 'incremental' ? await phase('anchor', () => findAnchor(tx, options.trusted, xmin)) : null
    await phase('sequence and links', () => checkSequence(tx, problems))
    const gone = await phase('decisions gone', () => checkGoneDecisions(tx, problems))
    await phase('records', () => checkRecords(tx, problems, gone))
    await phase('decision chains', () => checkDecisionChains(tx, problems))
    await phase('state', () => checkState(tx, problems))
    const checkpoints = await phase('checkpoints', () => checkCheckpoints(tx, problems, options.trusted, head))
    await phase('signed runs', () => checkRuns(tx, problems, options.trusted, head))
    await phase('ruleset', () => checkRuleset(tx, problems))
    const only = anchor ? await phase('rows written since', () => entriesChangedSince(tx, anchor)) : null
    const recomputed = await phase('recompute', () => recompute(tx, problems, only, only ? only.length : entries, options.onProgress))
    await phase('summaries', () => checkSummaries(tx, problems))
    return { xmin, head, entries, checkpoints, anchor, recomputed }
  }, { isolationLevel: 'repeatable read', accessMode: 'read only' })

  const record = {
    mode: options.mode,
    startedAt,
    finishedAt: new Date(),
    snapshotXmin: run.xmin,
    headSeq: run.head.seq,
    headHash: run.head.hash,
    entries: run.entries,
    checkpoints: run.checkpoints,
    problems: problems.list,
  }
  const key = options.signingKey
  const [saved] = await db.insert(schema.ledgerVerifications).values({
    ...record,
    keyId: key?.keyId ?? null,
    signature: key ? signText(key, runMessage(record)) : null,
  }).returning({ id: schema.ledgerVerifications.id })
  return {
    valid: problems.list.length === 0,
    entries: run.entries,
    checkpoints: run.checkpoints,
    problems: problems.list,
    mode: options.mode,
    recomputed: run.recomputed,
    head: run.head,
    from: run.anchor ? { run: run.anchor.id, seq: run.anchor.headSeq, at: run.anchor.finishedAt } : null,
    verificationId: saved?.id ?? null,
  }
}

/** Counts by kind, for summaries (the CLI, the scheduled mail). */
export function countByKind(problems: LedgerProblem[]) {
  const counts = Object.fromEntries(PROBLEM_KINDS.map(k => [k, 0])) as Record<LedgerProblemKind, number>
  for (const p of problems) counts[p.kind]++
  return counts
}
