// The QA audit of the decision record: every decision across projects with its history and the
// check of its hash chain, as a page for the screen or as all rows for a CSV export.
import { and, count, desc, eq, sql } from 'drizzle-orm'
import type { AuditFilter, AuditListQuery } from '#shared/schemas/audit'
import { DECISION_STATUS_LABELS } from '#shared/utils/decision-status'
import { FIGURES, formatPlain } from '#shared/utils/format'
import { checkDecisions } from '../../db/ledger-decision-check'
import { summaryQuery, toSummary } from '../decisions/queries'
import { tables, useDb } from '../db'
import { verificationSummaries } from '../verification/summary'

const decisions = tables.decisions
const revisions = tables.decisionRevisions
const events = tables.decisionEvents

function auditWhere(filter: AuditFilter) {
  return and(
    filter.projectId ? eq(decisions.projectId, filter.projectId) : undefined,
    filter.status ? eq(decisions.status, filter.status) : undefined,
  )
}

function auditQuery(filter: AuditFilter) {
  return summaryQuery({
    projectCode: sql<string>`(SELECT p.code FROM projects p WHERE p.id = ${decisions.projectId})`,
    eventCount: sql<number>`(SELECT count(*)::int FROM decision_events e WHERE e.decision_id = ${decisions.id})`,
    lastEventAt: sql<Date | null>`(SELECT max(e.created_at) FROM decision_events e WHERE e.decision_id = ${decisions.id})`
      .mapWith(events.createdAt),
    lastHash: sql<string | null>`(SELECT e.hash FROM decision_events e WHERE e.decision_id = ${decisions.id} ORDER BY e.seq DESC LIMIT 1)`,
    engineVersion: sql<string>`${revisions.engineVersion}`,
    rulesetVersion: sql<string>`${revisions.rulesetVersion}`,
  }).where(auditWhere(filter)).orderBy(desc(decisions.updatedAt), desc(decisions.id)).$dynamic()
}

/**
 * The check of each decision (chain, ledger, state), from one read for all of them: the same check
 * as verifyChain (server/utils/decisions/events.ts), without a query per decision for the export.
 */
function checkChains(decisionIds: number[]) {
  return checkDecisions(useDb(), decisionIds)
}

async function withChains(rows: Awaited<ReturnType<typeof auditQuery>>) {
  const chains = await checkChains(rows.map(r => r.id))
  return rows.map(row => ({ ...toSummary(row), chain: chains.get(row.id)! }))
}

export async function listAuditDecisions(query: AuditListQuery) {
  const [rows, [totals]] = await Promise.all([
    auditQuery(query).limit(query.pageSize).offset((query.page - 1) * query.pageSize),
    useDb().select({ total: count() }).from(decisions).where(auditWhere(query)),
  ])
  return { decisions: await withChains(rows), page: query.page, pageSize: query.pageSize, total: totals?.total ?? 0 }
}

export const AUDIT_CSV_COLUMNS = [
  'decision id', 'project', 'title', 'status', 'author', 'revisions', 'events', 'chain valid', 'chain broken at event',
  'last hash', 'engine version', 'ruleset version',
  // After the run (records that stand; retracted ones counted apart).
  'wall checks', 'latest wall check in band', 'latest wall check verdict', 'latest wall check review', 'latest wall check sha256',
  'grid studies', 'latest fine-grid GCI', 'CPU runs', 'actual core-hours', 'estimated core-hours of the runs', 'retracted records',
  // What the decision stands for and its estimate against the budget, in the case's unit system.
  'approach', 'unit system', 'estimated core-hours of the decision', 'core-hour budget',
] as const

/**
 * One CSV field (RFC 4180): quoted when it holds a comma, quote, line break or edge space. Text
 * that a spreadsheet would run as a formula (= + - @ first) gets a leading apostrophe.
 */
export function csvField(value: string | number | boolean | null | undefined): string {
  if (value === null || value === undefined) return ''
  let text = String(value)
  if (typeof value === 'string' && /^[=+\-@\t\r]/.test(text)) text = `'${text}`
  return /[",\r\n]|^\s|\s$/.test(text) ? `"${text.replace(/"/g, '""')}"` : text
}

/** Every decision the filter selects, as CSV (CRLF lines, a UTF-8 byte-order mark for spreadsheets). */
export async function auditCsv(filter: AuditFilter) {
  const rows = await withChains(await auditQuery(filter))
  const verification = await verificationSummaries(rows.map(r => r.id))
  const lines = [
    AUDIT_CSV_COLUMNS.map(csvField).join(','),
    ...rows.map((r) => {
      const v = verification.get(r.id)!
      const w = v.latestWallCheck
      return [
        r.id, r.projectCode, r.title, DECISION_STATUS_LABELS[r.status], r.author.name, r.revision, r.eventCount,
        r.chain.valid ? 'yes' : 'no', r.chain.brokenAt, r.lastHash, r.engineVersion, r.rulesetVersion,
        v.wallChecks, w?.fractionInBand, w?.verdict, w?.review, w?.sha256,
        v.gridStudies, v.latestGciFine, v.runs, v.runs ? v.actualCoreHours : null, v.estimatedCoreHours, v.retracted,
        // Numbers for a spreadsheet to read: the product's one formatting module, plain digits.
        r.approach, r.unitSystem, formatPlain(r.coreHours, FIGURES.estimate), formatPlain(r.budgetCoreHours),
      ].map(csvField).join(',')
    }),
  ]
  return `\uFEFF${lines.join('\r\n')}\r\n`
}

export function auditCsvFilename(now = new Date()) {
  return `eddyledger-audit-${now.toISOString().slice(0, 10)}.csv`
}
