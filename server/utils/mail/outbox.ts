import { randomUUID } from 'node:crypto'
import nodemailer, { type Transporter } from 'nodemailer'
import { CAUTION_SUMMARY } from '#shared/rules/cautions'
import { notFound } from '../http/errors'
import { and, desc, eq, sql } from 'drizzle-orm'
import type { DbOrTx } from '../../db/types'
import { tables, useDb } from '../db'

// Outgoing mail goes through the mail_outbox table: a row is written inside the transaction of the
// action that causes it, and delivered after the commit by deliverDueMail (kicked by the action and
// every few seconds by server/plugins/mail-delivery.ts). A failed send stays in the table and is
// retried with backoff, so the action itself is never lost and admins can see what went wrong.

export type MailKind = 'submitted' | 'approved' | 'overridden' | 'changes_requested' | 'invite' | 'reset' | 'wall_check' | 'wall_check_reviewed'
  | 'ledger-checkpoint' | 'ledger-problems'

/** The closing line of every message: the same cautions every page carries. */
export const MAIL_CAUTIONS = CAUTION_SUMMARY

// Retry schedule: 30 s, 1 min, 2 min ... capped at an hour; after MAX_ATTEMPTS the row is 'failed'
// until an admin retries it.
const BASE_DELAY_SECONDS = 30
const MAX_DELAY_SECONDS = 3600
export const MAX_ATTEMPTS = 8
const BATCH = 20

// A message is claimed on its own just before it is sent, and leased (next_attempt_at moved
// forward) for runtimeConfig.mail.leaseSeconds; the lease is renewed while the relay takes its
// time, so no other process sends it meanwhile. A process that dies mid-send stops renewing and
// the message is retried after the lease runs out. The result is written only under the claim
// token, so a sender that lost its lease cannot overwrite the new holder's outcome.
function leaseSeconds() {
  return Math.max(1, Number(useRuntimeConfig().mail?.leaseSeconds) || 120)
}

export function retryDelaySeconds(attempts: number) {
  return Math.min(BASE_DELAY_SECONDS * 2 ** Math.max(0, attempts - 1), MAX_DELAY_SECONDS)
}

type SmtpConfig = { host: string; port: number; user: string; pass: string; from: string; secure: boolean }

function smtpConfig(): SmtpConfig {
  const c = useRuntimeConfig().smtp as Record<string, unknown>
  return {
    host: String(c.host || '127.0.0.1'),
    port: Number(c.port) || 1025,
    user: String(c.user ?? ''),
    pass: String(c.pass ?? ''),
    from: String(c.from || 'Eddyledger <no-reply@eddyledger.test>'),
    secure: c.secure === true || c.secure === 'true',
  }
}

let transporter: Transporter | undefined

function useTransport(): Transporter {
  if (!transporter) {
    const c = smtpConfig()
    transporter = nodemailer.createTransport({
      host: c.host,
      port: c.port,
      secure: c.secure,
      auth: c.user ? { user: c.user, pass: c.pass } : undefined,
      // The local mail catcher speaks plain SMTP; a real relay with credentials gets STARTTLS.
      ignoreTLS: !c.secure && !c.user,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 20_000,
    })
  }
  return transporter
}

/** Writes one message to the outbox inside the caller's transaction. */
export async function enqueueMail(tx: DbOrTx, mail: { to: string; subject: string; text: string; kind: MailKind }) {
  const [row] = await tx.insert(tables.mailOutbox).values({
    toAddress: mail.to,
    subject: mail.subject,
    text: mail.text,
    kind: mail.kind,
  }).returning({ id: tables.mailOutbox.id })
  return row!.id
}

type OutboxRow = { id: number; to_address: string; subject: string; text: string; attempts: number; claim_token: string }

// An error as it may be shown to an admin: the message only, never credentials.
function describeError(error: unknown) {
  const { pass, user } = smtpConfig()
  let message = error instanceof Error ? error.message : String(error)
  if (pass) message = message.split(pass).join('***')
  if (user) message = message.split(user).join('***')
  return message.slice(0, 500)
}

/** Claims the next due message for this sender, with a fresh claim token; undefined when none is due. */
async function claimNext(): Promise<OutboxRow | undefined> {
  const token = randomUUID()
  const { rows } = await useDb().execute<OutboxRow>(sql`
    UPDATE mail_outbox SET next_attempt_at = now() + make_interval(secs => ${leaseSeconds()}::float8), claim_token = ${token}
    WHERE id = (
      SELECT id FROM mail_outbox
      WHERE status = 'pending' AND next_attempt_at <= now()
      ORDER BY next_attempt_at, id
      LIMIT 1
      FOR UPDATE SKIP LOCKED)
    RETURNING id, to_address, subject, text, attempts, claim_token`)
  return rows[0]
}

/** Keeps the lease on a message while it is being sent; stop() when the send has ended. */
function holdLease(row: OutboxRow) {
  const renew = () => useDb().execute(sql`
    UPDATE mail_outbox SET next_attempt_at = now() + make_interval(secs => ${leaseSeconds()}::float8)
    WHERE id = ${row.id} AND claim_token = ${row.claim_token} AND status = 'pending'`)
    .catch(error => console.error(`[mail] could not renew the lease on message ${row.id}: ${describeError(error)}`))
  const timer = setInterval(renew, (leaseSeconds() * 1000) / 3)
  return { stop: () => clearInterval(timer) }
}

/**
 * Sends the messages that are due, one claim at a time, so several server processes never send
 * one message twice, however slow the relay.
 */
export async function deliverDueMail(limit = BATCH) {
  const db = useDb()
  const m = tables.mailOutbox
  const { from } = smtpConfig()
  let sent = 0
  let failed = 0
  for (let i = 0; i < limit; i++) {
    const row = await claimNext()
    if (!row) break
    const held = eq(m.claimToken, row.claim_token)
    const lease = holdLease(row)
    try {
      await useTransport().sendMail({ from, to: row.to_address, subject: row.subject, text: row.text })
      lease.stop()
      await db.update(m)
        .set({ status: 'sent', sentAt: new Date(), attempts: row.attempts + 1, lastError: null, claimToken: null })
        .where(and(eq(m.id, row.id), held))
      sent++
    }
    catch (error) {
      lease.stop()
      const attempts = row.attempts + 1
      await db.update(m).set({
        attempts,
        lastError: describeError(error),
        status: attempts >= MAX_ATTEMPTS ? 'failed' : 'pending',
        nextAttemptAt: new Date(Date.now() + retryDelaySeconds(attempts) * 1000),
        claimToken: null,
      }).where(and(eq(m.id, row.id), held))
      failed++
    }
  }
  return { sent, failed }
}

let running: Promise<void> | undefined
let again = false

/** True while a delivery round runs in this process. */
export function mailDeliveryRunning() {
  return running !== undefined
}

/**
 * Fire-and-forget delivery after a commit. Never throws; a kick during a running round asks for one
 * more round, so a message committed meanwhile is not left for the next timer tick.
 */
export function kickMailDelivery(): void {
  if (running) {
    again = true
    return
  }
  running = (async () => {
    do {
      again = false
      try {
        const { sent, failed } = await deliverDueMail(BATCH)
        // A full batch means more may be waiting.
        if (sent + failed === BATCH) again = true
      }
      catch (error) {
        console.error(`[mail] delivery round failed: ${describeError(error)}`)
      }
    } while (again)
  })().finally(() => { running = undefined })
}

export const MAIL_PAGE_SIZE = 50

/** The outbox as admins see it: newest first; addresses and subjects, not the bodies (they hold links). */
export async function listOutbox(query: { status?: 'pending' | 'sent' | 'failed'; page: number }) {
  const m = tables.mailOutbox
  const where = query.status ? eq(m.status, query.status) : undefined
  const [rows, [count]] = await Promise.all([
    useDb().select({
      id: m.id, toAddress: m.toAddress, subject: m.subject, kind: m.kind, status: m.status, attempts: m.attempts,
      lastError: m.lastError, nextAttemptAt: m.nextAttemptAt, sentAt: m.sentAt, createdAt: m.createdAt,
    }).from(m).where(where).orderBy(desc(m.createdAt), desc(m.id))
      .limit(MAIL_PAGE_SIZE).offset((query.page - 1) * MAIL_PAGE_SIZE),
    useDb().select({ total: sql<number>`count(*)::int` }).from(m).where(where),
  ])
  return { mail: rows, page: query.page, pageSize: MAIL_PAGE_SIZE, total: count?.total ?? 0 }
}

/**
 * An admin's retry: a failed message becomes due now with a fresh set of attempts. Pending ones are
 * left alone: they are retried on their own, and one may be in the middle of its send.
 */
export async function retryMail(id: number) {
  const m = tables.mailOutbox
  const [row] = await useDb().update(m).set({ status: 'pending', attempts: 0, nextAttemptAt: new Date() })
    .where(and(eq(m.id, id), eq(m.status, 'failed')))
    .returning({ id: m.id, status: m.status })
  if (!row) {
    const exists = await useDb().query.mailOutbox.findFirst({ where: eq(m.id, id) })
    if (!exists) throw notFound(`Message ${id} does not exist`)
    throw createError({
      statusCode: 409,
      message: exists.status === 'sent' ? 'This message was already sent' : 'This message is still being retried on its own',
    })
  }
  kickMailDelivery()
  return row
}
