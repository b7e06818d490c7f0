import type { H3Event } from 'h3'
import { uploadRouteOf } from './uploads'

// Cross-site request forgery: a page on another site can make the browser send a POST with the
// user's cookie, but it cannot make it claim to come from our own origin, and without CORS it
// cannot send a JSON body. A write is refused when the browser says it came from elsewhere
// (Sec-Fetch-Site or Origin), and any write body must be JSON (or a file on a declared upload route).

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS'])

function trustProxy() {
  return useRuntimeConfig().loginLimit.trustProxy === true
}

/** The origins that are our own: the one the request was addressed to, and the configured app URL. */
function isOwnOrigin(event: H3Event, origin: string) {
  let url: URL
  try { url = new URL(origin) }
  catch { return false }
  const host = getRequestHost(event, { xForwardedHost: trustProxy() })
  if (url.host === host) return true
  try { return url.origin === new URL(String(useRuntimeConfig().appUrl)).origin }
  catch { return false }
}

function refuse(statusCode: 403 | 415, message: string): never {
  throw createError({ statusCode, message })
}

export function hasRequestBody(event: H3Event) {
  const headers = event.node.req.headers
  return Number.parseInt(headers['content-length'] || '0', 10) > 0 || /\bchunked\b/i.test(String(headers['transfer-encoding'] ?? ''))
}

/** Throws 403 for a write from another site and 415 for a write body that is not JSON. */
export function guardWriteRequest(event: H3Event) {
  if (SAFE_METHODS.has(event.method)) return
  // A browser that sends Sec-Fetch-Site is believed on it alone: a page cannot forge it, and a
  // same-origin request from a page with Referrer-Policy no-referrer says "Origin: null".
  // Without it (older browsers), the Origin must be ours. Neither: not a browser, so no CSRF.
  const site = getRequestHeader(event, 'sec-fetch-site')
  const origin = getRequestHeader(event, 'origin')
  const foreign = site ? site !== 'same-origin' && site !== 'none' : origin !== undefined && !isOwnOrigin(event, origin)
  if (foreign) refuse(403, 'This request came from another site and was refused. Make the change from Eddyledger\'s own pages.')

  const type = (getRequestHeader(event, 'content-type') ?? '').split(';')[0]!.trim().toLowerCase()
  // No body and no type: a plain action such as "resend the invitation".
  if (!type && !hasRequestBody(event)) return
  if (type === 'application/json') return
  const upload = uploadRouteOf(event)
  if (upload && type === 'multipart/form-data') return
  refuse(415, upload
    ? `Send the ${upload.what} as multipart/form-data, or a JSON body (Content-Type: application/json).`
    : 'Send the request body as JSON (Content-Type: application/json).')
}
