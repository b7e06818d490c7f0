import { and, asc, eq, isNull, sql } from 'drizzle-orm'
import { notFound } from '../http/errors'
import type { UserCreateBody, UserUpdateBody } from '#shared/schemas/users'
import { findUserByEmail } from './lookup'
import { queueInvitation } from './user-tokens'
import { kickMailDelivery } from '../mail/outbox'
import { tables, useDb } from '../db'
import { sessionVersionOnAccessChange } from '../auth/session-version'

// The public shape of a user: never the password hash.
export const publicUserColumns = {
  id: tables.users.id,
  email: tables.users.email,
  name: tables.users.name,
  role: tables.users.role,
  active: tables.users.active,
  // Invited but no password chosen yet: the admin may send the invitation again.
  awaitingPassword: sql<boolean>`${tables.users.passwordHash} IS NULL`,
  createdAt: tables.users.createdAt,
}

export function listUsers() {
  return useDb().select(publicUserColumns).from(tables.users).orderBy(asc(tables.users.name))
}

/** Creates the user and, in the same transaction, the invitation to set a password; sent after commit. */
export async function createUser(body: UserCreateBody, invitedBy?: { name: string }) {
  if (await findUserByEmail(body.email)) {
    throw createError({ statusCode: 409, message: `A user with the e-mail ${body.email} already exists` })
  }
  const user = await useDb().transaction(async (tx) => {
    const [row] = await tx.insert(tables.users).values(body).returning(publicUserColumns)
    await queueInvitation(tx, row!, invitedBy)
    return row!
  }).catch((error) => {
    // Two admins adding the same address at once: the unique index decides.
    if ((error as { cause?: { code?: string }; code?: string }).cause?.code === '23505' || (error as { code?: string }).code === '23505') {
      throw createError({ statusCode: 409, message: `A user with the e-mail ${body.email} already exists` })
    }
    throw error
  })
  kickMailDelivery()
  return user
}

/**
 * A fresh invitation for someone who has not set a password yet (the first link expired or got
 * lost); the links sent before stop working.
 */
export async function resendInvitation(id: number, invitedBy: { name: string }) {
  const user = await useDb().query.users.findFirst({ where: eq(tables.users.id, id) })
  if (!user) throw notFound(`User ${id} does not exist`)
  if (!user.active) throw createError({ statusCode: 409, message: `${user.name} is deactivated; reactivate the account first` })
  if (user.passwordHash) {
    throw createError({ statusCode: 409, message: `${user.name} has already set a password; "Forgot password?" on the sign-in page sends a reset link` })
  }
  await useDb().transaction(async (tx) => {
    await tx.update(tables.userTokens).set({ usedAt: new Date() })
      .where(and(eq(tables.userTokens.userId, id), eq(tables.userTokens.purpose, 'invite'), isNull(tables.userTokens.usedAt)))
    await queueInvitation(tx, user, invitedBy)
  })
  kickMailDelivery()
  return { email: user.email }
}

export async function updateUser(id: number, body: UserUpdateBody, actorId: number) {
  if (id === actorId && (body.active === false || (body.role && body.role !== 'admin'))) {
    throw createError({ statusCode: 409, message: 'You cannot deactivate yourself or drop your own admin role' })
  }
  const [user] = await useDb().update(tables.users).set({ ...body, ...sessionVersionOnAccessChange(body), updatedAt: new Date() })
    .where(eq(tables.users.id, id)).returning(publicUserColumns)
  if (!user) throw notFound(`User ${id} does not exist`)
  return user
}
