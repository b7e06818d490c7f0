import type { H3Event } from 'h3'
import { sql, type SQL } from 'drizzle-orm'
import { useDb } from '../db'

// Attempts (sign-ins, reset requests, invitation resends) are counted in PostgreSQL, so a limit
// holds across server processes, and each is counted by one atomic upsert BEFORE the work it
// guards: of 100 simultaneous wrong passwords only `limit` are ever checked.
//
// Sign-ins are counted per account-and-client-address pair (5), per address over all accounts (30)
// and per account over all addresses (100). Past a limit the key waits, and each further failure
// doubles the wait (30 s, 1 min, 2 min ... up to the window), so a guesser is slowed to a crawl
// while the owner, signing in from another address, is not locked out.

/** 'growing': past the limit, waits that double from delaySeconds up to the window.
 *  'window': `limit` attempts per window, then a wait until the window ends. */
export type AttemptCounter = { key: string; limit: number; lock: 'growing' | 'window'; windowSeconds?: number }

function limits() {
  const c = useRuntimeConfig().loginLimit
  return {
    pairFailures: Number(c.accountFailures),
    clientFailures: Number(c.clientFailures),
    accountFailures: Number(c.accountTotalFailures),
    windowSeconds: Number(c.windowMinutes) * 60,
    delaySeconds: Number(c.delaySeconds),
    // Nuxt parses NUXT_LOGIN_LIMIT_TRUST_PROXY=true into a boolean.
    trustProxy: c.trustProxy === true,
  }
}

/**
 * Counts one attempt on the key. Returns false, without counting, while the key waits. The row is
 * updated only when not locked (ON CONFLICT ... WHERE), so "no row returned" means refused.
 */
async function countOne(counter: AttemptCounter): Promise<boolean> {
  const l = limits()
  const window = counter.windowSeconds ?? l.windowSeconds
  // The attempt number within the current window, after this attempt.
  let quiet: SQL
  let lockAfter: (n: SQL, windowStart: SQL) => SQL
  if (counter.lock === 'window') {
    quiet = sql`a.window_started_at < now() - make_interval(secs => ${window}::float8)`
    lockAfter = (_n, windowStart) => sql`${windowStart} + make_interval(secs => ${window}::float8)`
  }
  else {
    // A streak ends after a whole window without attempts or waits.
    quiet = sql`greatest(a.window_started_at, coalesce(a.locked_until, a.window_started_at)) < now() - make_interval(secs => ${window}::float8)`
    lockAfter = n => sql`now() + make_interval(secs => least(${window}::float8,
      ${l.delaySeconds}::float8 * power(2, least(${n} - ${counter.limit}::int, 20))))`
  }
  const n = sql`(CASE WHEN ${quiet} THEN 1 ELSE a.failures + 1 END)`
  const windowStart = sql`(CASE WHEN ${quiet} THEN now() ELSE a.window_started_at END)`
  const { rows } = await useDb().execute<{ failures: number }>(sql`
    INSERT INTO login_attempts AS a (key, failures, window_started_at, locked_until)
    VALUES (${counter.key}, 1, now(), CASE WHEN 1 >= ${counter.limit}::int THEN ${counter.lock === 'window'
      ? sql`now() + make_interval(secs => ${window}::float8)`
      : sql`now() + make_interval(secs => least(${window}::float8, ${l.delaySeconds}::float8))`} END)
    ON CONFLICT (key) DO UPDATE SET
      failures = ${n},
      window_started_at = ${windowStart},
      locked_until = CASE WHEN ${n} >= ${counter.limit}::int THEN ${lockAfter(n, windowStart)} ELSE NULL END
    WHERE a.locked_until IS NULL OR a.locked_until <= now()
    RETURNING failures`)
  return rows.length > 0
}

async function secondsLocked(key: string) {
  const { rows } = await useDb().execute<{ seconds: number | null }>(sql`
    SELECT ceil(extract(epoch FROM locked_until - now()))::int AS seconds FROM login_attempts WHERE key = ${key}`)
  return Math.max(1, rows[0]?.seconds ?? 1)
}

/**
 * Counts the attempt on each key in turn; on the first key that waits, stops and returns how long
 * it waits (seconds). Undefined: the attempt may go ahead.
 */
export async function countAttempt(counters: AttemptCounter[]): Promise<number | undefined> {
  for (const counter of counters) {
    if (!(await countOne(counter))) return secondsLocked(counter.key)
  }
  return undefined
}

export function describeWait(seconds: number) {
  if (seconds < 60) return `${seconds} second${seconds === 1 ? '' : 's'}`
  const minutes = Math.ceil(seconds / 60)
  return `${minutes} minute${minutes === 1 ? '' : 's'}`
}

/** 429 with Retry-After and a message: "Too many <what>. Try again in 2 minutes." */
export function refuseTooMany(event: H3Event, seconds: number, what: string): never {
  setResponseHeader(event, 'Retry-After', seconds)
  throw createError({
    statusCode: 429,
    statusMessage: 'Too Many Requests',
    message: `Too many ${what}. Try again in ${describeWait(seconds)}.`,
    data: { retryAfterSeconds: seconds },
  })
}

export function clientAddress(event: H3Event) {
  return getRequestIP(event, { xForwardedFor: limits().trustProxy }) ?? 'unknown'
}

export function loginKeys(event: H3Event, email: string) {
  const address = clientAddress(event)
  const account = email.toLowerCase()
  return { pair: `pair:${account}|${address}`, client: `client:${address}`, account: `account:${account}` }
}
export type LoginKeys = ReturnType<typeof loginKeys>

function loginCounters(keys: LoginKeys): AttemptCounter[] {
  const l = limits()
  return [
    { key: keys.pair, limit: l.pairFailures, lock: 'growing' },
    { key: keys.client, limit: l.clientFailures, lock: 'growing' },
    { key: keys.account, limit: l.accountFailures, lock: 'growing' },
  ]
}

/** Counts a sign-in attempt before the password is checked; 429 while any of its keys waits. */
export async function countLoginAttempt(event: H3Event, keys: LoginKeys) {
  const wait = await countAttempt(loginCounters(keys))
  if (wait !== undefined) refuseTooMany(event, wait, 'failed sign-ins')
}

/**
 * A successful sign-in was not a failure: the pair starts afresh, and the address's and account's
 * counts (with a wait this very attempt may have started) are taken back by one.
 */
export async function recordLoginSuccess(keys: LoginKeys) {
  await useDb().execute(sql`DELETE FROM login_attempts WHERE key = ${keys.pair}`)
  for (const counter of loginCounters(keys).slice(1)) {
    await useDb().execute(sql`
      UPDATE login_attempts SET failures = greatest(failures - 1, 0),
        locked_until = CASE WHEN failures - 1 < ${counter.limit}::int THEN NULL ELSE locked_until END
      WHERE key = ${counter.key}`)
  }
}

/** After the owner has set a new password through an e-mailed link: the account's waits end. */
export async function clearLoginLimits(email: string) {
  const account = email.toLowerCase()
  await useDb().execute(sql`
    DELETE FROM login_attempts WHERE key = ${`account:${account}`} OR starts_with(key, ${`pair:${account}|`})`)
}
