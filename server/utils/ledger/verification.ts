import { and, desc, eq } from 'drizzle-orm'
import { PROBLEM_KIND_LABELS, PROBLEM_KINDS } from '#shared/schemas/ledger'
import { countByKind, verifyLedger, type LedgerReport, type VerifyMode } from '../../db/ledger-verify'
import { tables, useDb } from '../db'
import { enqueueMail, kickMailDelivery } from '../mail/outbox'
import { ledgerSigningKey, ledgerTrustedKeys } from './keys'

// The ledger verification as the server runs it: on request (incremental), as a background full
// run with progress, and on a timer that mails the auditors when it finds anything new.

export function runLedgerVerification(mode: VerifyMode, onProgress?: (done: number, total: number) => void) {
  return verifyLedger(useDb(), { mode, trusted: ledgerTrustedKeys(), signingKey: ledgerSigningKey(), onProgress })
}

export function ledgerReportDto(r: LedgerReport) {
  return {
    valid: r.valid, entries: r.entries, checkpoints: r.checkpoints, problems: r.problems,
    mode: r.mode, recomputed: r.recomputed, head: r.head, from: r.from,
  }
}

type FullRun = {
  state: 'running' | 'done' | 'failed'
  startedAt: Date
  finishedAt: Date | null
  startedBy: string
  done: number
  total: number
  report: ReturnType<typeof ledgerReportDto> | null
  error: string | null
}

// One full run at a time per server process; its result is also kept in ledger_verifications.
let fullRun: FullRun | null = null

export function startFullLedgerVerification(user: { name: string }) {
  if (fullRun?.state === 'running') return { run: fullRun, started: false }
  const run: FullRun = { state: 'running', startedAt: new Date(), finishedAt: null, startedBy: user.name, done: 0, total: 0, report: null, error: null }
  fullRun = run
  runLedgerVerification('full', (done, total) => {
    run.done = done
    run.total = total
  }).then((report) => {
    run.report = ledgerReportDto(report)
    run.state = 'done'
    if (!report.valid) return mailProblems(report)
  }).catch((error) => {
    run.error = error instanceof Error ? error.message : String(error)
    run.state = 'failed'
    console.error(`[ledger] full verification failed: ${run.error}`)
  }).finally(() => {
    run.finishedAt = new Date()
  })
  return { run, started: true }
}

export async function fullLedgerVerificationStatus() {
  const [last] = await useDb().select({
    id: tables.ledgerVerifications.id, finishedAt: tables.ledgerVerifications.finishedAt, headSeq: tables.ledgerVerifications.headSeq,
    entries: tables.ledgerVerifications.entries, problems: tables.ledgerVerifications.problems,
  }).from(tables.ledgerVerifications).where(eq(tables.ledgerVerifications.mode, 'full'))
    .orderBy(desc(tables.ledgerVerifications.id)).limit(1)
  return {
    run: fullRun,
    lastFullRun: last ? { id: last.id, finishedAt: last.finishedAt, headSeq: last.headSeq, entries: last.entries, problemCount: last.problems.length } : null,
  }
}

// The findings last mailed by this process: the same findings are not mailed again every interval.
let lastMailed = ''

async function mailProblems(report: LedgerReport) {
  const findings = JSON.stringify(report.problems.map(p => `${p.kind}|${p.detail}`).sort())
  if (findings === lastMailed) return
  lastMailed = findings
  const counts = countByKind(report.problems)
  const lines = PROBLEM_KINDS.filter(k => counts[k]).map(k => `- ${PROBLEM_KIND_LABELS[k]}: ${counts[k]}`)
  const examples = report.problems.slice(0, 20).map(p => `- [${p.kind}] ${p.detail}`)
  const text = [
    `The ${report.mode} verification of Eddyledger's ledger found ${report.problems.length} ${report.problems.length === 1 ? 'problem' : 'problems'} (${report.entries} entries, ${report.checkpoints} checkpoints):`,
    '',
    ...lines,
    '',
    ...examples,
    ...(report.problems.length > examples.length ? [`… and ${report.problems.length - examples.length} more.`] : []),
    '',
    `The whole report: ${useRuntimeConfig().appUrl}/ledger (Verify the ledger). Do not rely on the affected decisions' history until this is explained.`,
  ].join('\n')
  await useDb().transaction(async (tx) => {
    const auditors = await tx.select({ email: tables.users.email }).from(tables.users)
      .where(and(eq(tables.users.role, 'auditor'), eq(tables.users.active, true)))
    for (const a of auditors) {
      await enqueueMail(tx, { to: a.email, subject: `Ledger verification found ${report.problems.length} ${report.problems.length === 1 ? 'problem' : 'problems'}`, text, kind: 'ledger-problems' })
    }
  })
  kickMailDelivery()
}

let scheduledRunning = false

/**
 * The timer's run: incremental, skipped when another run finished within half the interval (several
 * server processes share one database). Mails the auditors when it finds anything, unless this
 * process already mailed the very same findings.
 */
export async function scheduledLedgerVerification(intervalMs: number) {
  if (scheduledRunning) return
  scheduledRunning = true
  try {
    const v = tables.ledgerVerifications
    const [last] = await useDb().select().from(v).orderBy(desc(v.id)).limit(1)
    if (last && Date.now() - last.finishedAt.getTime() < intervalMs / 2) return
    const report = await runLedgerVerification('incremental')
    if (!report.valid) await mailProblems(report)
  }
  catch (error) {
    console.error(`[ledger] scheduled verification failed: ${error instanceof Error ? error.message : String(error)}`)
  }
  finally {
    scheduledRunning = false
  }
}
