import { createHash, randomUUID } from 'node:crypto'
import { createWriteStream } from 'node:fs'
import { mkdtemp, rm } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { pipeline } from 'node:stream/promises'
import { Transform } from 'node:stream'
import busboy from 'busboy'
import type { H3Event } from 'h3'
import { formatMegabytes } from '#shared/verification/limits'

// A multipart upload read as a stream: the body goes to a temporary file while its sha256 and size
// are computed, so a size cap holds without the body ever being in memory. Nothing in it is
// trusted until the caller has parsed it.

export interface ReceivedFile {
  path: string
  fileName: string
  /** the type the client claimed; checked by the caller against the content */
  claimedType: string
  size: number
  sha256: string
  /** the first bytes, for magic-number checks */
  head: Buffer
}

export interface ReceivedUpload {
  file: ReceivedFile | null
  fields: Record<string, string>
  /** removes the temporary file; call it in a finally */
  cleanup: () => Promise<void>
}

// Room for the multipart framing and the small fields around the file.
const FRAMING_ALLOWANCE = 64 * 1024
const HEAD_BYTES = 64 * 1024
// A refused body is read and dropped up to this many times the cap; past it the connection is cut.
const DISCARD_FACTOR = 4

function discardBody(event: H3Event, limit: number): Promise<void> {
  const req = event.node.req
  if (req.readableEnded) return Promise.resolve()
  return new Promise((resolve) => {
    let seen = 0
    req.on('data', (chunk: Buffer) => {
      seen += chunk.length
      if (seen > limit) {
        req.destroy()
        resolve()
      }
    })
    req.on('end', () => resolve())
    req.on('error', () => resolve())
    req.on('close', () => resolve())
  })
}

function tooLarge(maxBytes: number): never {
  throw createError({ statusCode: 413, message: `The file is larger than ${formatMegabytes(maxBytes)}, the most Eddyledger stores. Compress it with gzip (.csv.gz) or export the wall patches only.` })
}

export async function receiveUpload(event: H3Event, options: { fileField: string; maxBytes: number; fields: readonly string[] }): Promise<ReceivedUpload> {
  const headers = event.node.req.headers
  const declared = Number(headers['content-length'])
  // Refused before anything is stored when the client says how big it is. The body is discarded
  // (up to a bound) so the client can read the answer instead of seeing a reset connection.
  if (Number.isFinite(declared) && declared > options.maxBytes + FRAMING_ALLOWANCE) {
    await discardBody(event, options.maxBytes * DISCARD_FACTOR)
    tooLarge(options.maxBytes)
  }
  if (!String(headers['content-type'] ?? '').toLowerCase().startsWith('multipart/form-data')) {
    await discardBody(event, options.maxBytes * DISCARD_FACTOR)
    throw createError({ statusCode: 415, message: `Send the file as multipart/form-data in a field named "${options.fileField}"` })
  }

  const dir = await mkdtemp(join(tmpdir(), 'eddyledger-upload-'))
  const cleanup = () => rm(dir, { recursive: true, force: true })
  const fields: Record<string, string> = {}
  let file: ReceivedFile | null = null
  let failure: unknown = null
  const writes: Promise<void>[] = []

  try {
    let parser: busboy.Busboy
    try {
      parser = busboy({
        headers,
        limits: { files: 1, fileSize: options.maxBytes, fields: options.fields.length + 4, fieldSize: 4096, parts: options.fields.length + 6 },
      })
    } catch {
      throw createError({ statusCode: 400, message: 'The upload is not a readable multipart form (boundary missing)' })
    }
    parser.on('field', (name, value) => {
      if (options.fields.includes(name)) fields[name] = value
    })
    parser.on('file', (name, stream, info) => {
      if (name !== options.fileField || file) {
        stream.resume()
        return
      }
      const path = join(dir, randomUUID())
      const hash = createHash('sha256')
      const headChunks: Buffer[] = []
      let headLength = 0
      let size = 0
      let truncated = false
      stream.on('limit', () => { truncated = true })
      const meter = new Transform({
        transform(chunk: Buffer, _enc, done) {
          size += chunk.length
          hash.update(chunk)
          if (headLength < HEAD_BYTES) {
            headChunks.push(chunk)
            headLength += chunk.length
          }
          done(null, chunk)
        },
      })
      writes.push(pipeline(stream, meter, createWriteStream(path)).then(() => {
        if (truncated) {
          failure = createError({ statusCode: 413, message: `The file is larger than ${formatMegabytes(options.maxBytes)}, the most Eddyledger stores. Compress it with gzip (.csv.gz) or export the wall patches only.` })
          return
        }
        file = {
          path,
          fileName: info.filename || 'upload',
          claimedType: (info.mimeType || 'application/octet-stream').toLowerCase(),
          size,
          sha256: hash.digest('hex'),
          head: Buffer.concat(headChunks).subarray(0, HEAD_BYTES),
        }
      }))
    })
    await new Promise<void>((resolve, reject) => {
      parser.on('close', resolve)
      parser.on('error', (error: Error) => reject(createError({ statusCode: 400, message: `The upload could not be read: ${error.message}` })))
      event.node.req.on('error', reject)
      event.node.req.pipe(parser)
    })
    await Promise.all(writes)
    if (failure) throw failure
    return { file, fields, cleanup }
  } catch (error) {
    await cleanup()
    throw error
  }
}
