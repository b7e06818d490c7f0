import { createHash, randomBytes } from 'node:crypto'
import type { H3Event } from 'h3'
import { and, eq, isNull, sql } from 'drizzle-orm'
import { ROLE_LABELS } from '#shared/utils/roles'
import type { DbOrTx } from '../../db/types'
import { findUserByEmail } from './lookup'
import { clientAddress, countAttempt, refuseTooMany } from '../auth/login-limiter'
import { MAIL_CAUTIONS, enqueueMail, kickMailDelivery } from '../mail/outbox'
import { tables, useDb } from '../db'

// Single-use links for setting a password: an invitation (72 h) or a reset (1 h). Only the sha256 of
// the token is stored, so a copy of the database cannot be turned into working links.

export type TokenPurpose = 'invite' | 'reset'
const LIFETIME_HOURS: Record<TokenPurpose, number> = { invite: 72, reset: 1 }

export const INVALID_LINK_MESSAGE = 'This link has expired or was already used'
export const FORGOT_PASSWORD_MESSAGE = 'If the address belongs to an active account, a link to set a new password is on its way. It works once, for 1 hour.'

export function hashToken(token: string) {
  return createHash('sha256').update(token).digest('hex')
}

export function newToken() {
  const token = randomBytes(32).toString('base64url')
  return { token, tokenHash: hashToken(token) }
}

function setPasswordLink(token: string) {
  return `${String(useRuntimeConfig().appUrl).replace(/\/$/, '')}/set-password?token=${token}`
}

/** Stores a new token for the user inside the caller's transaction and returns the raw token. */
export async function issueUserToken(tx: DbOrTx, userId: number, purpose: TokenPurpose, pre = newToken()) {
  await tx.insert(tables.userTokens).values({
    userId,
    purpose,
    tokenHash: pre.tokenHash,
    expiresAt: new Date(Date.now() + LIFETIME_HOURS[purpose] * 3600_000),
  })
  return pre.token
}

/** The invitation mail for a user an admin has just created. */
export async function queueInvitation(tx: DbOrTx, user: { id: number; email: string; name: string; role: keyof typeof ROLE_LABELS }, invitedBy?: { name: string }) {
  const token = await issueUserToken(tx, user.id, 'invite')
  await enqueueMail(tx, {
    to: user.email,
    kind: 'invite',
    subject: 'Your Eddyledger account: set a password',
    text: [
      `Hello ${user.name},`,
      '',
      `${invitedBy?.name ?? 'An administrator'} has given you an Eddyledger account as ${ROLE_LABELS[user.role]}.`,
      'Choose your password here (the link works once and expires in 72 hours):',
      '',
      setPasswordLink(token),
      '',
      'Then sign in with this e-mail address.',
      '',
      '--',
      MAIL_CAUTIONS,
    ].join('\n'),
  })
}

/** A reset link for an existing, active account, or nothing at all for an unknown address. */
export async function requestPasswordReset(email: string) {
  const pre = newToken()
  const user = await findUserByEmail(email)
  if (!user || !user.active) return false
  await useDb().transaction(async (tx) => {
    const token = await issueUserToken(tx, user.id, 'reset', pre)
    await enqueueMail(tx, {
      to: user.email,
      kind: 'reset',
      subject: 'Reset your Eddyledger password',
      text: [
        `Hello ${user.name},`,
        '',
        'Someone (we hope you) asked to reset the password of your Eddyledger account.',
        'Choose a new password here (the link works once and expires in 1 hour):',
        '',
        setPasswordLink(token),
        '',
        'If it was not you, ignore this message: your password stays as it is.',
        '',
        '--',
        MAIL_CAUTIONS,
      ].join('\n'),
    })
  })
  return true
}

/** requestPasswordReset in the background (after the answer): never throws, logs without the address. */
export async function sendPasswordReset(email: string) {
  try {
    if (await requestPasswordReset(email)) kickMailDelivery()
  }
  catch (error) {
    console.error(`[mail] a password reset request failed: ${error instanceof Error ? error.message : String(error)}`)
  }
}

/**
 * Uses a token to set the password: the token is claimed atomically (single use even under
 * concurrent requests), the password stored, and every other open link of the user voided.
 */
export async function setPasswordWithToken(token: string, passwordHash: string) {
  return useDb().transaction(async (tx) => {
    const { rows } = await tx.execute<{ id: number; user_id: number }>(sql`
      UPDATE user_tokens SET used_at = now()
      WHERE token_hash = ${hashToken(token)} AND used_at IS NULL AND expires_at > now()
      RETURNING id, user_id`)
    const claimed = rows[0]
    if (!claimed) throw createError({ statusCode: 400, message: INVALID_LINK_MESSAGE })
    // A new password ends every session signed in with the old one.
    const [user] = await tx.update(tables.users)
      .set({ passwordHash, sessionVersion: sql`${tables.users.sessionVersion} + 1`, updatedAt: new Date() })
      .where(and(eq(tables.users.id, claimed.user_id), eq(tables.users.active, true)))
      .returning({ id: tables.users.id, email: tables.users.email, name: tables.users.name, role: tables.users.role, sessionVersion: tables.users.sessionVersion })
    // A deactivated account: the transaction rolls back and the link stays as it was.
    if (!user) throw createError({ statusCode: 400, message: 'This account is deactivated; ask an administrator' })
    await tx.update(tables.userTokens).set({ usedAt: new Date() })
      .where(and(eq(tables.userTokens.userId, user.id), isNull(tables.userTokens.usedAt)))
    return user
  })
}

/** Who a still-usable link belongs to (to judge the new password against their name), or undefined. */
export async function findTokenHolder(token: string) {
  const { rows } = await useDb().execute<{ email: string; name: string }>(sql`
    SELECT u.email, u.name FROM user_tokens t JOIN users u ON u.id = t.user_id
    WHERE t.token_hash = ${hashToken(token)} AND t.used_at IS NULL AND t.expires_at > now()`)
  return rows[0]
}

/**
 * Reset requests are counted in the login limiter's table under keys of their own (5 per address
 * to reset, 30 per client, per window), so a flood of requests cannot fill an inbox, and cannot
 * lock anyone out of signing in either.
 */
export async function limitPasswordResetRequests(event: H3Event, email: string) {
  const c = useRuntimeConfig().loginLimit
  const wait = await countAttempt([
    { key: `reset-account:${email.toLowerCase()}`, limit: Number(c.accountFailures), lock: 'window' },
    { key: `reset-client:${clientAddress(event)}`, limit: Number(c.clientFailures), lock: 'window' },
  ])
  if (wait !== undefined) refuseTooMany(event, wait, 'password reset requests')
}
