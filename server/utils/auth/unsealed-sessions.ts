import type { H3Event } from 'h3'
import { getCookie, getRequestHeader } from 'h3'

// Opening the sealed session cookie (iron: PBKDF2 key derivation, AES-CBC and an HMAC through
// WebCrypto) costs about a quarter of a millisecond, more than anything else a cached API answer
// does. What a given cookie opens to never changes, so the server keeps the result by cookie and
// hands it to h3 as the request's session (h3 reads `event.context.sessions[name]` before it
// unseals). Only cookies that opened once are kept, and each only until the seal or the session
// would expire. Whether the session is still in force (signed out, older session version, user
// deactivated) is checked in the database on every request all the same (./session-version.ts).

type OpenedSession = { id: string; createdAt: number; data: Record<string, unknown> }
// Held as JSON text: parsing it gives each request its own copy, cheaper than a structured clone.
type Held = { json: string; usableUntil: number }

const CAPACITY = 2000
const held = new Map<string, Held>()

function sessionName() {
  return useRuntimeConfig().session?.name || 'nuxt-session'
}

function maxAgeMs() {
  return (Number(useRuntimeConfig().session?.maxAge) || 0) * 1000
}

/** The sealed session this request carries in its cookie; undefined when h3 would read a header instead. */
export function sealedSessionOf(event: H3Event): string | undefined {
  const name = sessionName()
  if (getRequestHeader(event, `x-${name.toLowerCase()}-session`) !== undefined) return undefined
  return getCookie(event, name) || undefined
}

/** Before the session is read: a cookie opened before becomes this request's session without unsealing. */
export function reuseOpenedSession(event: H3Event, sealed: string | undefined): boolean {
  if (!sealed) return false
  const found = held.get(sealed)
  if (!found) return false
  if (found.usableUntil <= Date.now()) {
    held.delete(sealed)
    return false
  }
  const sessions = (event.context.sessions ??= Object.create(null)) as Record<string, unknown>
  const name = sessionName()
  if (sessions[name]) return false
  // A copy (the seal itself holds JSON, so nothing is lost): the request may update its session,
  // which must not change what the cookie opens to.
  sessions[name] = JSON.parse(found.json)
  return true
}

/** Right after h3 has opened the cookie (before anything updates the session): keeps the result. */
export function keepOpenedSession(event: H3Event, sealed: string | undefined) {
  const session = (event.context.sessions as Record<string, OpenedSession> | undefined)?.[sessionName()]
  if (!sealed || !session?.id || !session.createdAt) return
  const usableUntil = Math.min(sealExpiry(sealed), maxAgeMs() ? session.createdAt + maxAgeMs() : Infinity)
  if (!(usableUntil > Date.now())) return
  held.delete(sealed)
  held.set(sealed, { json: JSON.stringify({ id: session.id, createdAt: session.createdAt, data: session.data }), usableUntil })
  if (held.size > CAPACITY) held.delete(held.keys().next().value!)
}

/** The seal's own expiry (iron: `Fe26.2*id*salt*iv*data*expiration*hmacSalt*hmac`, covered by the HMAC). */
function sealExpiry(sealed: string): number {
  const expiration = sealed.split('*')[5]
  return expiration ? Number(expiration) : Infinity
}
