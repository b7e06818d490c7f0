import type { H3Event } from 'h3'
import { uploadRouteOf } from './uploads'

// Request bodies are capped before they are read: by the declared Content-Length (Node stops a
// body at that length), and for a chunked body by counting while it streams in. JSON bodies get
// bodyLimit.jsonBytes; a declared upload route (./uploads.ts) its own, larger cap.

function tooLarge(limit: number, what: string): never {
  throw createError({
    statusCode: 413,
    message: `The ${what} is larger than the ${formatBytes(limit)} this server accepts.`,
    data: { limitBytes: limit },
  })
}

export function formatBytes(bytes: number) {
  if (bytes >= 1024 * 1024) return `${Math.round(bytes / (1024 * 1024))} MB`
  if (bytes >= 1024) return `${Math.round(bytes / 1024)} kB`
  return `${bytes} bytes`
}

/** The cap and what to call the body in a refusal, for this request. */
export function bodyLimitFor(event: H3Event) {
  const upload = uploadRouteOf(event)
  if (upload) return { limit: upload.maxBytes(), what: upload.what }
  return { limit: Number(useRuntimeConfig().bodyLimit.jsonBytes), what: 'request body' }
}

/** Reads a chunked body up to `limit` bytes; stops reading and refuses past it. */
function readCapped(event: H3Event, limit: number, what: string): Promise<Buffer> {
  const req = event.node.req
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    let size = 0
    const onData = (chunk: Buffer) => {
      size += chunk.length
      if (size > limit) {
        req.off('data', onData)
        req.pause()
        // The rest of the body is not read; the connection is not reused.
        setResponseHeader(event, 'Connection', 'close')
        try { tooLarge(limit, what) }
        catch (error) { reject(error) }
        return
      }
      chunks.push(chunk)
    }
    req.on('data', onData)
    req.once('end', () => resolve(Buffer.concat(chunks)))
    req.once('error', reject)
  })
}

/** Throws 413 for a body over its cap; a chunked JSON body is read here, within the cap, for h3 to use. */
export async function limitRequestBody(event: H3Event) {
  if (event.method === 'GET' || event.method === 'HEAD' || event.method === 'OPTIONS') return
  const { limit, what } = bodyLimitFor(event)
  const headers = event.node.req.headers
  const declared = headers['content-length']
  if (declared !== undefined) {
    const length = Number(declared)
    if (!Number.isSafeInteger(length) || length < 0) throw createError({ statusCode: 400, message: 'The Content-Length header is not a number.' })
    if (length > limit) {
      setResponseHeader(event, 'Connection', 'close')
      tooLarge(limit, what)
    }
    return
  }
  // An upload route streams its body itself, with its own cap (receiveUpload); the stream is left to it.
  if (/\bchunked\b/i.test(String(headers['transfer-encoding'] ?? '')) && !uploadRouteOf(event)) {
    // h3's body readers take a body already read from here (readRawBody looks at _requestBody).
    const body = await readCapped(event, limit, what)
    ;(event as unknown as { _requestBody?: unknown })._requestBody = body
  }
}
