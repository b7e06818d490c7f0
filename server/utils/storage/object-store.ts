import { createReadStream } from 'node:fs'
import type { Readable } from 'node:stream'
import { GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3'

// Uploaded files live in S3-compatible object storage: a real bucket in production, the local
// fake (s3rver, started by npm start and npm test) in development and tests. The database keeps
// each object's key and sha256; the bytes are only ever read back through the server.

type StorageConfig = {
  endpoint: string
  region: string
  bucket: string
  accessKeyId: string
  secretAccessKey: string
  forcePathStyle: boolean | string
}

let client: S3Client | undefined

function storageConfig(): StorageConfig {
  return useRuntimeConfig().storage as StorageConfig
}

function useS3(): S3Client {
  if (!client) {
    const c = storageConfig()
    client = new S3Client({
      region: c.region || 'us-east-1',
      ...(c.endpoint ? { endpoint: c.endpoint } : {}),
      forcePathStyle: c.forcePathStyle === true || c.forcePathStyle === 'true',
      // Without explicit keys the SDK's default chain applies (instance role, environment).
      ...(c.accessKeyId ? { credentials: { accessKeyId: c.accessKeyId, secretAccessKey: c.secretAccessKey } } : {}),
      // Checksums only when the operation requires them: streamed bodies then go up unaltered
      // (some S3-compatible servers store the aws-chunked framing otherwise).
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
    })
  }
  return client
}

function unavailable(error: unknown): never {
  console.error('[storage]', error)
  throw createError({ statusCode: 503, message: 'The file store cannot be reached just now; nothing was saved. Try again in a minute.' })
}

/** Stores a file from disk under `key`, with its sha256 as object metadata. */
export async function putObjectFromFile(key: string, path: string, meta: { contentType: string; size: number; sha256: string }) {
  try {
    await useS3().send(new PutObjectCommand({
      Bucket: storageConfig().bucket,
      Key: key,
      Body: createReadStream(path),
      ContentLength: meta.size,
      ContentType: meta.contentType,
      Metadata: { sha256: meta.sha256 },
    }))
  } catch (error) {
    unavailable(error)
  }
}

/** The stored bytes of `key` as a stream, with their length. */
export async function getObjectStream(key: string): Promise<{ body: Readable; size: number | undefined }> {
  try {
    const res = await useS3().send(new GetObjectCommand({ Bucket: storageConfig().bucket, Key: key }))
    return { body: res.Body as Readable, size: res.ContentLength }
  } catch (error) {
    const name = (error as { name?: string }).name
    if (name === 'NoSuchKey') throw createError({ statusCode: 404, message: 'The stored file is missing from the file store' })
    unavailable(error)
  }
}
