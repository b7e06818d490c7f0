import type { H3Event } from 'h3'
import { sql } from 'drizzle-orm'
import { useDb } from '../db'

// Failed sign-ins are counted per account and per client address in PostgreSQL, so the limit
// holds across several server processes. Limits come from runtimeConfig.loginLimit.
type LimitRow = { failures: number; locked_until: Date | null }

function limits() {
  const c = useRuntimeConfig().loginLimit
  return {
    accountFailures: Number(c.accountFailures),
    clientFailures: Number(c.clientFailures),
    windowMinutes: Number(c.windowMinutes),
    // Nuxt parses NUXT_LOGIN_LIMIT_TRUST_PROXY=true into a boolean.
    trustProxy: c.trustProxy === true,
  }
}

export function loginKeys(event: H3Event, email: string) {
  const address = getRequestIP(event, { xForwardedFor: limits().trustProxy }) ?? 'unknown'
  return { account: `account:${email.toLowerCase()}`, client: `client:${address}` }
}

/** Throws 429 with Retry-After when either key is locked. */
export async function assertNotLocked(event: H3Event, keys: { account: string; client: string }) {
  const { rows } = await useDb().execute<{ locked_until: Date }>(sql`
    SELECT max(locked_until) AS locked_until FROM login_attempts
    WHERE key IN (${keys.account}, ${keys.client}) AND locked_until > now()`)
  const lockedUntil = rows[0]?.locked_until
  if (!lockedUntil) return
  const seconds = Math.max(1, Math.ceil((new Date(lockedUntil).getTime() - Date.now()) / 1000))
  setResponseHeader(event, 'Retry-After', seconds)
  const minutes = Math.ceil(seconds / 60)
  throw createError({
    statusCode: 429,
    statusMessage: 'Too Many Requests',
    message: `Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
    data: { retryAfterSeconds: seconds },
  })
}

async function countFailure(key: string, limit: number, windowMinutes: number) {
  // One atomic upsert: a new window starts when the old one has passed.
  const { rows } = await useDb().execute<LimitRow>(sql`
    INSERT INTO login_attempts (key, failures, window_started_at) VALUES (${key}, 1, now())
    ON CONFLICT (key) DO UPDATE SET
      failures = CASE WHEN login_attempts.window_started_at < now() - make_interval(mins => ${windowMinutes})
                      THEN 1 ELSE login_attempts.failures + 1 END,
      window_started_at = CASE WHEN login_attempts.window_started_at < now() - make_interval(mins => ${windowMinutes})
                      THEN now() ELSE login_attempts.window_started_at END
    RETURNING failures, locked_until`)
  if ((rows[0]?.failures ?? 0) >= limit) {
    await useDb().execute(sql`
      UPDATE login_attempts SET locked_until = now() + make_interval(mins => ${windowMinutes}), failures = 0,
        window_started_at = now()
      WHERE key = ${key}`)
  }
}

export async function recordLoginFailure(keys: { account: string; client: string }) {
  const l = limits()
  await countFailure(keys.account, l.accountFailures, l.windowMinutes)
  await countFailure(keys.client, l.clientFailures, l.windowMinutes)
}

export async function recordLoginSuccess(keys: { account: string }) {
  await useDb().execute(sql`DELETE FROM login_attempts WHERE key = ${keys.account}`)
}
