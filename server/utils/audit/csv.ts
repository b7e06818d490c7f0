// The audit as a CSV download, streamed: the header goes out at once, then the rows in batches
// read one after another by keyset from a single read-only snapshot, each batch's chains checked
// from one read of its events. Memory stays that of one batch, whatever the size of the record.
import { once } from 'node:events'
import { PassThrough } from 'node:stream'
import type { H3Event } from 'h3'
import Papa from 'papaparse'
import { and } from 'drizzle-orm'
import { APPROACH_LABELS, WALL_TREATMENT_LABELS, type ApproachId, type WallTreatment } from '#shared/rules'
import type { AuditFilter } from '#shared/schemas/audit'
import { DECISION_STATUS_LABELS } from '#shared/utils/decision-status'
import { FIGURES, formatPlain } from '#shared/utils/format'
import type { DbOrTx } from '../../db/types'
import { afterCursor } from '../pagination/keyset'
import { tables, useDb } from '../db'
import { verificationSummaries, type VerificationSummary } from '../verification/summary'
import { chainFacts, type ChainFacts } from './chains'
import { auditRows, auditWhere } from './list'

export const AUDIT_CSV_COLUMNS = [
  'project', 'decision', 'title', 'status', 'approach', 'model', 'wall treatment', 'engine recommended', 'author', 'reviewer',
  'override reason', 'created', 'submitted', 'reviewed', 'last change', 'ruleset version', 'engine version', 'revisions',
  'events', 'chain valid', 'chain broken at event', 'last hash',
  // After the run (records that stand; retracted ones counted apart).
  'wall checks', 'latest wall check in band', 'latest wall check verdict', 'latest wall check review', 'latest wall check sha256',
  'grid studies', 'latest fine-grid GCI', 'CPU runs', 'actual core-hours', 'estimated core-hours of the runs', 'retracted records',
  // The case's unit system and the decision's estimate against the budget.
  'unit system', 'estimated core-hours of the decision', 'core-hour budget',
] as const

const BATCH = 200
const s = tables.decisionSummaries

// RFC 4180 with CRLF lines; text a spreadsheet would run as a formula (= + - @ first) gets a
// leading apostrophe (papaparse's escapeFormulae).
const unparse = (rows: unknown[][]) => `${Papa.unparse(rows, { newline: '\r\n', escapeFormulae: true })}\r\n`
const iso = (date: Date | null) => date?.toISOString() ?? ''

type AuditRow = Awaited<ReturnType<ReturnType<typeof auditRows>['limit']>>[number]

function csvLine(r: AuditRow, facts: ChainFacts, v: VerificationSummary) {
  const w = v.latestWallCheck
  return [
    r.projectCode, r.id, r.title, DECISION_STATUS_LABELS[r.status],
    APPROACH_LABELS[r.approach as ApproachId] ?? r.approach, r.model, WALL_TREATMENT_LABELS[r.wallTreatment as WallTreatment] ?? r.wallTreatment,
    APPROACH_LABELS[r.engineApproach as ApproachId] ?? r.engineApproach, r.authorName, r.reviewerName ?? '', r.overrideReason ?? '',
    iso(r.createdAt), iso(r.submittedAt), iso(r.reviewedAt), iso(r.updatedAt), r.rulesetVersion, r.engineVersion, r.revision,
    facts.eventCount, facts.chain.valid ? 'yes' : 'no', facts.chain.brokenAt ?? '', facts.lastHash ?? '',
    v.wallChecks, w?.fractionInBand ?? '', w?.verdict ?? '', w?.review ?? '', w?.sha256 ?? '',
    v.gridStudies, v.latestGciFine ?? '', v.runs, v.runs ? v.actualCoreHours : '', v.estimatedCoreHours ?? '', v.retracted,
    // Numbers for a spreadsheet to read: the product's one formatting module, plain digits.
    r.unitSystem, formatPlain(r.coreHours, FIGURES.estimate), formatPlain(r.budgetCoreHours),
  ]
}

/** Waits until the stream takes more or is closed, leaving no listener behind either way. */
async function drainedOrClosed(out: PassThrough) {
  const done = new AbortController()
  try {
    await Promise.race([once(out, 'drain', { signal: done.signal }), once(out, 'close', { signal: done.signal })])
  } finally {
    done.abort()
  }
}

/** Writes every row the filter selects to `out`, waiting whenever the client is slower than the database. */
async function writeRows(tx: DbOrTx, filter: AuditFilter, out: PassThrough) {
  const where = await auditWhere(filter)
  let cursor: { at: Date; id: number } | undefined
  while (!out.destroyed) {
    const rows = await auditRows(and(where, afterCursor(s.updatedAt, s.decisionId, cursor, 'desc')), tx).limit(BATCH)
    if (!rows.length) return
    const ids = rows.map(r => r.id)
    // One connection in a transaction: the reads run in turn (server/db/reads.ts).
    const facts = await chainFacts(tx, ids)
    const verification = await verificationSummaries(ids, tx)
    const text = unparse(rows.map(r => csvLine(r, facts.get(r.id)!, verification.get(r.id)!)))
    if (!out.write(text)) await drainedOrClosed(out)
    const last = rows.at(-1)!
    cursor = { at: last.updatedAt, id: last.id }
    if (rows.length < BATCH) return
  }
}

/** Starts the download on the response: a UTF-8 byte-order mark and the header first, then every row. */
export function streamAuditCsv(event: H3Event, filter: AuditFilter) {
  const out = new PassThrough()
  // A client that goes away ends the export, and with it the transaction.
  event.node.res.once('close', () => out.destroy())
  out.write(`\uFEFF${unparse([[...AUDIT_CSV_COLUMNS]])}`)
  useDb().transaction(tx => writeRows(tx, filter, out), { isolationLevel: 'repeatable read', accessMode: 'read only' })
    .then(() => out.end(), (error: unknown) => {
      console.error('audit export failed', error)
      out.destroy(error as Error)
    })
  return out
}

export function auditCsvFilename(now = new Date()) {
  return `eddyledger-audit-${now.toISOString().slice(0, 10)}.csv`
}
