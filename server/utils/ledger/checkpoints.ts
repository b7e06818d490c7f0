import { and, eq } from 'drizzle-orm'
import {
  checkReceipt, checkpointLag, createCheckpoint, listCheckpoints, parseReceipt, receiptFilename, receiptMail, receiptText,
  type Checkpoint, type CheckpointReason,
} from '../../db/ledger-checkpoint'
import { ledgerHead, type LedgerDbOrTx } from '../../db/ledger'
import { tables, useDb } from '../db'
import { conflict, notFound } from '../http/errors'
import { MAIL_CAUTIONS, enqueueMail, kickMailDelivery } from '../mail/outbox'
import { ledgerSigningKey, ledgerTrustedKeys } from './keys'

// Checkpoints as the server makes them: signed, listed, and mailed to every auditor as a receipt
// they keep outside Eddyledger.

async function mailReceipt(tx: LedgerDbOrTx, checkpoint: Checkpoint) {
  const auditors = await tx.select({ email: tables.users.email }).from(tables.users)
    .where(and(eq(tables.users.role, 'auditor'), eq(tables.users.active, true)))
  const { subject, text } = receiptMail(checkpoint, useRuntimeConfig().appUrl)
  for (const auditor of auditors) {
    await enqueueMail(tx, { to: auditor.email, subject, text: `${text}\n\n${MAIL_CAUTIONS}`, kind: 'ledger-checkpoint' })
  }
}

/**
 * Signs the ledger's head now and mails the receipt. Null when `onlyIfMoved` and nothing was
 * appended since the last checkpoint; 503 without a key, 409 when the signing is refused.
 */
export async function signLedgerCheckpoint(reason: CheckpointReason, options: { onlyIfMoved?: boolean } = {}) {
  const key = ledgerSigningKey()
  if (!key) {
    throw createError({ statusCode: 503, message: 'No ledger signing key is configured (NUXT_LEDGER_SIGNING_KEY or .secrets/ledger-signing-key): nothing can be signed' })
  }
  const result = await createCheckpoint(useDb(), key, reason, { ...options, onSigned: mailReceipt })
  if ('refused' in result) throw conflict(result.refused)
  if ('skipped' in result) return null
  kickMailDelivery()
  return result.checkpoint
}

export function checkpointDto(c: Checkpoint) {
  return { number: c.number, seq: c.seq, hash: c.hash, signedAt: c.signedAt, keyId: c.keyId, signature: c.signature, reason: c.reason, receipt: receiptText(c) }
}

export async function ledgerCheckpointPage(page: number, pageSize: number) {
  const db = useDb()
  const [{ rows, total }, head] = await Promise.all([listCheckpoints(db, page, pageSize), ledgerHead(db)])
  const c = useRuntimeConfig().ledger as Record<string, unknown>
  return {
    head,
    checkpoints: rows.map(checkpointDto),
    page,
    pageSize,
    total,
    schedule: { everyEntries: Number(c.checkpointEvery), everyMinutes: Number(c.checkpointMinutes) },
  }
}

export async function ledgerReceiptFile(number: number) {
  const [row] = await useDb().select().from(tables.ledgerCheckpoints).where(eq(tables.ledgerCheckpoints.number, number))
  if (!row) throw notFound(`Checkpoint ${number} does not exist`)
  return { filename: receiptFilename(row), text: `${receiptText(row)}\n` }
}

/** Whether today's ledger still holds the head an old receipt signed; 400 for text that is not a receipt. */
export async function checkLedgerReceipt(text: string) {
  const receipt = parseReceipt(text)
  if ('error' in receipt) {
    throw createError({ statusCode: 400, message: receipt.error, data: { fieldErrors: { receipt: [receipt.error] } } })
  }
  return checkReceipt(useDb(), receipt, ledgerTrustedKeys())
}

const bootedAt = Date.now()
let ticking = false

/** The timer's rule: a checkpoint once `checkpointEvery` entries or `checkpointMinutes` have passed with new entries. */
export async function ledgerCheckpointTick() {
  if (ticking) return
  ticking = true
  try {
    if (!ledgerSigningKey()) return
    const c = useRuntimeConfig().ledger as Record<string, unknown>
    const every = Number(c.checkpointEvery)
    const minutes = Number(c.checkpointMinutes)
    const { last, entriesSince } = await checkpointLag(useDb())
    if (entriesSince <= 0) return
    const since = Math.max(last?.signedAt.getTime() ?? 0, bootedAt)
    const reason: CheckpointReason | null = every > 0 && entriesSince >= every ? 'count'
      : minutes > 0 && Date.now() - since >= minutes * 60_000 ? 'time' : null
    if (reason) await signLedgerCheckpoint(reason, { onlyIfMoved: true })
  }
  catch (error) {
    console.error(`[ledger] scheduled checkpoint not signed: ${error instanceof Error ? error.message : String(error)}`)
  }
  finally {
    ticking = false
  }
}
