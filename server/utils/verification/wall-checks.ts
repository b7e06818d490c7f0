import { randomUUID } from 'node:crypto'
import { and, desc, eq, isNull } from 'drizzle-orm'
import { bandFor, DEFAULT_PASS_FRACTION, verdictFor, type WallCheckRecord, type WallCheckResult } from '#shared/verification'
import type { WallCheckReviewBody } from '#shared/schemas/verification'
import type { SessionUser } from '#shared/types/session'
import { recordInLedger } from '../../db/ledger-records'
import { tables, useDb, type DbOrTx } from '../db'
import { appendEvent } from '../decisions/events'
import { MAIL_CAUTIONS, enqueueMail, kickMailDelivery } from '../mail/outbox'
import type { ReceivedFile } from '../storage/multipart-upload'
import { putObjectFromFile } from '../storage/object-store'
import { signedOffChoice, signingReviewer } from './signed-off'
import { checkWallFileType, parseWallFile, sniffWallFile, type WallMappingRequest } from './wall-file'

/** The team's pass fraction for wall checks: the latest setting, or the default. */
export async function currentPassFraction(db: DbOrTx = useDb()) {
  const [row] = await db.select().from(tables.teamSettings).orderBy(desc(tables.teamSettings.id)).limit(1)
  return row?.wallCheckPassFraction ?? DEFAULT_PASS_FRACTION
}

function safeName(name: string) {
  return name.replace(/[^\w.-]+/g, '_').slice(-120) || 'upload'
}

function link(decisionId: number) {
  return `${String(useRuntimeConfig().appUrl).replace(/\/$/, '')}/decisions/${decisionId}`
}

function percent(fraction: number) {
  return `${(fraction * 100).toFixed(1)} %`
}

/**
 * A wall export checked against the signed-off band: type checks, sniffing and a streamed parse of
 * the received file, then the bytes to object storage, then the record, its chained event and the
 * reviewer's notice in one transaction.
 */
export async function createWallCheck(decisionId: number, file: ReceivedFile, request: WallMappingRequest, user: SessionUser) {
  const { compressed, contentType } = checkWallFileType(file)
  const { decision, choice } = await signedOffChoice(decisionId)
  const band = bandFor(choice)
  const { mapping, columns } = await sniffWallFile(file, compressed, request)
  const result = await parseWallFile(file, compressed, mapping, columns, band)
  const passFraction = await currentPassFraction()
  const verdict = verdictFor(result.fractionInBand, passFraction)

  const storageKey = `decisions/${decisionId}/wall-checks/${randomUUID()}/${safeName(file.fileName)}${compressed && !file.fileName.toLowerCase().endsWith('.gz') ? '.gz' : ''}`
  await putObjectFromFile(storageKey, file.path, { contentType, size: file.size, sha256: file.sha256 })

  const row = await useDb().transaction(async (tx) => {
    const [check] = await tx.insert(tables.wallChecks).values({
      decisionId,
      uploadedBy: user.id,
      fileName: file.fileName.slice(0, 255),
      contentType,
      compressed,
      storageKey,
      sizeBytes: file.size,
      sha256: file.sha256,
      columns: mapping,
      band,
      result,
      passFraction,
      verdict,
    }).returning()
    await appendEvent(tx, {
      decisionId,
      type: 'wall_check_uploaded',
      actor: user,
      payload: {
        wallCheckId: check!.id,
        fileName: check!.fileName,
        sha256: file.sha256,
        sizeBytes: file.size,
        rows: result.rows,
        badRows: result.badRows,
        band: { min: band.min, max: band.max, basis: band.basis },
        areaWeighted: result.areaWeighted,
        fractionInBand: result.fractionInBand,
        fractionBelow: result.fractionBelow,
        fractionAbove: result.fractionAbove,
        passFraction,
        verdict,
      },
    })
    await recordInLedger(tx, 'wall_checks', check!)
    const reviewer = await signingReviewer(decisionId, tx)
    if (reviewer && reviewer.id !== user.id) {
      await enqueueMail(tx, {
        to: reviewer.email,
        subject: `Wall y+ check to review: ${decision.title}`,
        kind: 'wall_check',
        text: [
          `Hello ${reviewer.name},`,
          '',
          `${user.name} uploaded the solver's wall y+ for "${decision.title}", which you signed off.`,
          `${percent(result.fractionInBand)} of the wall ${result.areaWeighted ? '(by area)' : '(by face count; no areas given)'} lies in the band y+ ${band.min}-${Number(band.max.toPrecision(3))}: ${verdict === 'pass' ? 'passes' : 'fails'} the team's ${percent(passFraction)}.`,
          `File ${check!.fileName}, sha256 ${file.sha256}.`,
          '',
          `Accept or reject it: ${link(decisionId)}`,
          '',
          '--',
          MAIL_CAUTIONS,
        ].join('\n'),
      })
    }
    return check!
  })
  kickMailDelivery()
  return toWallCheckDto(row)
}

export type WallCheckRow = typeof tables.wallChecks.$inferSelect

export function toWallCheckDto(row: WallCheckRow): WallCheckRecord {
  const r = row.result as WallCheckResult
  return {
    id: row.id,
    decisionId: row.decisionId,
    fileName: row.fileName,
    fileSha256: row.sha256,
    sizeBytes: row.sizeBytes,
    compressed: row.compressed,
    columns: row.columns,
    rows: r.rows,
    badRows: r.badRows,
    badRowSamples: r.badRowSamples,
    band: row.band,
    areaWeighted: r.areaWeighted,
    totalArea: r.totalArea,
    fractionInBand: r.fractionInBand,
    fractionBelow: r.fractionBelow,
    fractionAbove: r.fractionAbove,
    minYPlus: r.minYPlus,
    maxYPlus: r.maxYPlus,
    meanYPlus: r.meanYPlus,
    patches: r.patches,
    histogram: r.histogram,
    cautions: r.cautions,
    passFraction: row.passFraction,
    verdict: row.verdict,
    review: row.reviewedAt ? { accepted: row.reviewAccepted!, comment: row.reviewComment ?? '', reviewerId: row.reviewedBy!, at: row.reviewedAt } : null,
    retraction: row.retractedAt ? { reason: row.retractionReason ?? '', byId: row.retractedBy!, at: row.retractedAt } : null,
    uploadedBy: row.uploadedBy,
    createdAt: row.createdAt,
  }
}

export async function findWallCheck(decisionId: number, checkId: number, db: DbOrTx = useDb()) {
  const row = await db.query.wallChecks.findFirst({
    where: and(eq(tables.wallChecks.id, checkId), eq(tables.wallChecks.decisionId, decisionId)),
  })
  if (!row) throw createError({ statusCode: 404, message: `Decision ${decisionId} has no wall check ${checkId}` })
  return row
}

/** A reviewer accepts or rejects a check once, with a comment; the uploader hears of it. */
export async function reviewWallCheck(decisionId: number, checkId: number, body: WallCheckReviewBody, user: SessionUser) {
  const row = await useDb().transaction(async (tx) => {
    const check = await findWallCheck(decisionId, checkId, tx)
    if (check.uploadedBy === user.id) throw createError({ statusCode: 403, message: 'Nobody reviews their own upload: another reviewer of the project must' })
    if (check.retractedAt) throw createError({ statusCode: 409, message: 'This wall check was retracted; there is nothing to review' })
    const now = new Date()
    const [updated] = await tx.update(tables.wallChecks).set({
      reviewAccepted: body.accepted, reviewedBy: user.id, reviewedAt: now, reviewComment: body.comment,
    }).where(and(eq(tables.wallChecks.id, checkId), isNull(tables.wallChecks.reviewedAt), isNull(tables.wallChecks.retractedAt))).returning()
    if (!updated) throw createError({ statusCode: 409, message: 'This wall check has already been reviewed' })
    await appendEvent(tx, {
      decisionId,
      type: 'wall_check_reviewed',
      actor: user,
      payload: { wallCheckId: checkId, sha256: check.sha256, accepted: body.accepted, comment: body.comment, verdict: check.verdict },
    })
    const uploader = await tx.query.users.findFirst({ where: eq(tables.users.id, check.uploadedBy) })
    if (uploader?.active && uploader.id !== user.id) {
      const decision = await tx.query.decisions.findFirst({ where: eq(tables.decisions.id, decisionId) })
      await enqueueMail(tx, {
        to: uploader.email,
        subject: `Wall y+ check ${body.accepted ? 'accepted' : 'rejected'}: ${decision?.title ?? `decision ${decisionId}`}`,
        kind: 'wall_check_reviewed',
        text: [
          `Hello ${uploader.name},`,
          '',
          `${user.name} ${body.accepted ? 'accepted' : 'rejected'} your wall y+ check (${check.fileName}).`,
          '',
          'Comment:',
          body.comment,
          '',
          `Open the decision: ${link(decisionId)}`,
          '',
          '--',
          MAIL_CAUTIONS,
        ].join('\n'),
      })
    }
    return updated
  })
  kickMailDelivery()
  return toWallCheckDto(row)
}
