// The uploaded files the database refers to, for npm run db:backup and db:restore:
//   tsx scripts/storage-files.ts backup DIR    every stored file the database names, into DIR/files/, each
//                                              checked against the sha256 its record holds
//   tsx scripts/storage-files.ts restore DIR   the files put back into the configured bucket, checked again
// The object store is the one the server uses (NUXT_STORAGE_*); the database is DATABASE_OWNER_URL
// (else DATABASE_URL). A file missing, or differing from its recorded sha256, stops the command.
import { createHash } from 'node:crypto'
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3'
import pg from 'pg'

type StoredFile = { key: string; sha256: string; size: number; contentType: string }

const [command, dir] = process.argv.slice(2)
if (!dir || (command !== 'backup' && command !== 'restore')) {
  console.error('usage: tsx scripts/storage-files.ts backup|restore DIR')
  process.exit(2)
}
const url = process.env.DATABASE_OWNER_URL || process.env.DATABASE_URL
if (!url) throw new Error('DATABASE_OWNER_URL (or DATABASE_URL) is not set')
const bucket = process.env.NUXT_STORAGE_BUCKET
const s3 = new S3Client({
  region: process.env.NUXT_STORAGE_REGION || 'us-east-1',
  ...(process.env.NUXT_STORAGE_ENDPOINT ? { endpoint: process.env.NUXT_STORAGE_ENDPOINT } : {}),
  forcePathStyle: process.env.NUXT_STORAGE_FORCE_PATH_STYLE === 'true',
  ...(process.env.NUXT_STORAGE_ACCESS_KEY_ID
    ? { credentials: { accessKeyId: process.env.NUXT_STORAGE_ACCESS_KEY_ID, secretAccessKey: process.env.NUXT_STORAGE_SECRET_ACCESS_KEY ?? '' } }
    : {}),
  requestChecksumCalculation: 'WHEN_REQUIRED',
  responseChecksumValidation: 'WHEN_REQUIRED',
})
const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex')
const local = (key: string) => join(dir, 'files', ...key.split('/').filter(part => part && part !== '..'))

/** Every file the database refers to, with the sha256 its record holds. */
async function storedFiles(): Promise<StoredFile[]> {
  const client = new pg.Client({ connectionString: url })
  await client.connect()
  try {
    const { rows } = await client.query<{ key: string; sha256: string; size: number; content_type: string }>(
      'SELECT storage_key AS key, sha256, size_bytes AS size, content_type FROM wall_checks ORDER BY id')
    return rows.map(r => ({ key: r.key, sha256: r.sha256, size: r.size, contentType: r.content_type }))
  } finally {
    await client.end()
  }
}

async function backup() {
  const files = await storedFiles()
  if (files.length && !bucket) throw new Error(`The database names ${files.length} stored files but NUXT_STORAGE_BUCKET is not set`)
  for (const file of files) {
    const res = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: file.key })).catch((error: { name?: string }) => {
      throw new Error(error.name === 'NoSuchKey' ? `The stored file ${file.key} is missing from the object store` : String(error))
    })
    const bytes = await res.Body!.transformToByteArray()
    if (sha256(bytes) !== file.sha256) throw new Error(`The stored file ${file.key} differs from the sha256 its record holds`)
    mkdirSync(dirname(local(file.key)), { recursive: true })
    writeFileSync(local(file.key), bytes)
  }
  writeFileSync(join(dir, 'files.json'), `${JSON.stringify(files, null, 2)}\n`)
  console.log(`[eddyledger] ${files.length} stored ${files.length === 1 ? 'file' : 'files'} copied`)
}

async function restore() {
  const files = JSON.parse(readFileSync(join(dir, 'files.json'), 'utf8')) as StoredFile[]
  const named = new Set((await storedFiles()).map(f => `${f.key}|${f.sha256}`))
  if (files.length && !bucket) throw new Error(`The backup holds ${files.length} stored files but NUXT_STORAGE_BUCKET is not set`)
  for (const file of files) {
    const bytes = readFileSync(local(file.key))
    if (sha256(bytes) !== file.sha256) throw new Error(`The backup's copy of ${file.key} differs from the sha256 its record holds`)
    if (!named.has(`${file.key}|${file.sha256}`)) throw new Error(`The restored database does not name ${file.key} with that sha256`)
    await s3.send(new PutObjectCommand({
      Bucket: bucket, Key: file.key, Body: bytes, ContentLength: bytes.length, ContentType: file.contentType, Metadata: { sha256: file.sha256 },
    }))
  }
  console.log(`[eddyledger] ${files.length} stored ${files.length === 1 ? 'file' : 'files'} put back`)
}

await (command === 'backup' ? backup() : restore())
