import { randomUUID } from 'node:crypto'
import type { H3Event } from 'h3'
import { eq, lt, or, sql, type SQL } from 'drizzle-orm'
import type { UserSession } from '#auth-utils'
import type { Role } from '#shared/utils/roles'
import { tables, useDb } from '../db'

// The session cookie is sealed and stateless, so ending a session needs a record on the server:
// - each user has a session version, sealed into every session at sign-in; raising it (password
//   change, deactivation, role change, "sign out everywhere") ends all of the user's sessions;
// - each session has an id of its own; signing out records it in revoked_sessions until the cookie
//   would have expired, so a copy of the cookie stops working too.
// requireUser (server/utils/auth.ts) checks both on every request.

type SessionSubject = { id: number; email: string; name: string; role: Role; sessionVersion: number }

function sessionMaxAgeSeconds() {
  return Number(useRuntimeConfig().session.maxAge) || 60 * 60 * 12
}

/** Signs the user in on this request: a new session id, carrying the user's current session version. */
export async function startUserSession(event: H3Event, user: SessionSubject) {
  // Signing in over another session (another account in the same browser) ends that one.
  await revokeSession(await getUserSession(event))
  const sessionUser = { id: user.id, email: user.email, name: user.name, role: user.role }
  await setUserSession(event, {
    user: sessionUser,
    loggedInAt: Date.now(),
    secure: { sessionId: randomUUID(), sessionVersion: user.sessionVersion },
  })
  return sessionUser
}

/** Records the session as ended (no-op for a session without a signed-in user). */
export async function revokeSession(session: Partial<UserSession>) {
  const id = session.secure?.sessionId
  const userId = session.user?.id
  if (!id || !userId) return
  const db = useDb()
  await db.insert(tables.revokedSessions)
    .values({ id, userId, expiresAt: new Date(Date.now() + sessionMaxAgeSeconds() * 1000) })
    .onConflictDoNothing()
  // Entries outlive their cookies by nothing: drop the expired ones on the way.
  await db.delete(tables.revokedSessions).where(lt(tables.revokedSessions.expiresAt, new Date()))
}

/** What new advice stands on: the published ruleset's head and the calibration version in force. */
export type VersionsInForce = {
  ruleset: { id: number; key: string; version: string } | null
  calibration: number | null
}

let sessionQuery: { db: ReturnType<typeof useDb>; query: ReturnType<typeof prepareSessionQuery> } | undefined

// Prepared once (a named statement, parsed once per connection): it runs on every signed-in request.
// It also reads the versions advice depends on, two index lookups on small tables, so that the
// advice route needs no query of its own (server/utils/advice/basis.ts).
function prepareSessionQuery(db: ReturnType<typeof useDb>) {
  const u = tables.users
  return db.select({
    id: u.id, email: u.email, name: u.name, role: u.role, active: u.active, sessionVersion: u.sessionVersion,
    revoked: sql<boolean>`EXISTS (SELECT 1 FROM revoked_sessions r WHERE r.id = ${sql.placeholder('sessionId')})`,
    rulesetInForce: sql<VersionsInForce['ruleset']>`(SELECT json_build_object('id', p.id, 'key', p.key, 'version', p.version) FROM rulesets p WHERE p.status = 'published')`,
    calibrationInForce: sql<number | null>`(SELECT max(c.version) FROM calibration_adoptions c)`,
  }).from(u).where(eq(u.id, sql.placeholder('id'))).prepare('session_user_and_versions')
}

/**
 * The user behind a session, or undefined when the session has ended: unknown or inactive user, an
 * older session version, or a revoked session id. One query per request, which also reads the
 * versions in force.
 */
export async function findSessionUser(session: Partial<UserSession>) {
  const id = session.user?.id
  const sessionId = session.secure?.sessionId
  const version = session.secure?.sessionVersion
  if (!id || !sessionId || version === undefined) return undefined
  const db = useDb()
  if (sessionQuery?.db !== db) sessionQuery = { db, query: prepareSessionQuery(db) }
  const [row] = await sessionQuery.query.execute({ id, sessionId })
  if (!row || !row.active || row.revoked || row.sessionVersion !== version) return undefined
  const inForce: VersionsInForce = { ruleset: row.rulesetInForce, calibration: row.calibrationInForce }
  return { ...row, inForce }
}

/** Ends every session of the user, on every device. */
export async function endAllSessions(userId: number) {
  await useDb().update(tables.users)
    .set({ sessionVersion: sql`${tables.users.sessionVersion} + 1`, updatedAt: new Date() })
    .where(eq(tables.users.id, userId))
}

/**
 * For an admin's update of a user: raises the session version when the role or the active flag
 * actually changes, so the person signs in again under the new terms. Spread into `.set(...)`.
 */
export function sessionVersionOnAccessChange(change: { role?: Role; active?: boolean }) {
  const u = tables.users
  const changed: SQL[] = []
  if (change.role !== undefined) changed.push(sql`${u.role} IS DISTINCT FROM ${change.role}::role`)
  if (change.active !== undefined) changed.push(sql`${u.active} IS DISTINCT FROM ${change.active}`)
  if (!changed.length) return {}
  return { sessionVersion: sql`${u.sessionVersion} + CASE WHEN ${or(...changed)} THEN 1 ELSE 0 END` }
}
