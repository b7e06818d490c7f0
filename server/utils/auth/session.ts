import type { H3Event } from 'h3'
import type { Role } from '#shared/utils/roles'
import type { SessionUser } from '#shared/types/session'
import { findSessionUser, type VersionsInForce } from './session-version'
import { keepOpenedSession, reuseOpenedSession, sealedSessionOf } from './unsealed-sessions'

/**
 * The signed-in user, re-read from the database so that a role change or a deactivation takes
 * effect on the next request, not when the cookie expires; a session that was signed out, or is
 * older than the user's session version, has ended (./session-version.ts).
 */
export async function requireUser(event: H3Event): Promise<SessionUser> {
  if (event.context.user) return event.context.user as SessionUser
  const sealed = sealedSessionOf(event)
  const reused = reuseOpenedSession(event, sealed)
  const session = await getUserSession(event)
  const id = session.user?.id
  if (!id) throw createError({ statusCode: 401, message: 'Sign in to continue' })
  // Only a session with a user came from the cookie (h3 starts an empty one when it cannot open it).
  if (!reused) keepOpenedSession(event, sealed)
  const row = await findSessionUser(session)
  if (!row) {
    await clearUserSession(event)
    throw createError({ statusCode: 401, message: 'Your session has ended; sign in again' })
  }
  const user: SessionUser = { id: row.id, email: row.email, name: row.name, role: row.role }
  const seen = session.user!
  if (seen.role !== user.role || seen.name !== user.name || seen.email !== user.email) {
    await setUserSession(event, { user })
  }
  event.context.user = user
  event.context.versionsInForce = row.inForce
  return user
}

/** The versions in force as the request's session query read them (server/utils/advice/basis.ts). */
export async function versionsInForce(event: H3Event): Promise<VersionsInForce> {
  await requireUser(event)
  return event.context.versionsInForce as VersionsInForce
}

export async function requireRole(event: H3Event, ...roles: Role[]): Promise<SessionUser> {
  const user = await requireUser(event)
  if (!roles.includes(user.role)) {
    throw createError({ statusCode: 403, message: `This needs the role ${roles.join(' or ')}` })
  }
  return user
}
