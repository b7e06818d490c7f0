// npm run ledger:rotate-key: replaces the ledger's signing key. The old key signs a last checkpoint;
// its public half is kept in .secrets/ledger-public-keys (and stays listed in the ledger), so its
// receipts still verify; the new key is listed in the ledger and signs the next checkpoint. The old
// private key is deleted. A running server picks the new key up from the file on its next signing.
// With NUXT_LEDGER_SIGNING_KEY (production), it prints a new key and what to configure instead.
import { appendFileSync, renameSync, writeFileSync } from 'node:fs'
import { and, eq } from 'drizzle-orm'
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import type { LedgerDbOrTx } from '../server/db/ledger'
import { createCheckpoint, receiptMail, type Checkpoint } from '../server/db/ledger-checkpoint'
import {
  DEFAULT_KEY_FILE, DEFAULT_KEYRING_FILE, generateSigningKeyPem, keySettingsFromEnv, loadSigningKey, parsePrivateKey, signingKeyFrom,
} from '../server/db/ledger-keys'
import * as schema from '../server/db/schema'

const settings = keySettingsFromEnv()
const fresh = generateSigningKeyPem()
const next = signingKeyFrom(parsePrivateKey(fresh))

if (settings.signingKey?.trim()) {
  const old = loadSigningKey(settings)!
  console.log([
    'The signing key comes from NUXT_LEDGER_SIGNING_KEY. To rotate it:',
    '1. Set NUXT_LEDGER_SIGNING_KEY to this new key (keep it secret):', '', fresh,
    `2. Add the old key's public half (${old.keyId}) to NUXT_LEDGER_TRUSTED_KEYS, so its receipts still verify:`, '', old.publicPem, '',
    `3. Restart the server: it lists the new key (${next.keyId}) in the ledger when it starts.`,
  ].join('\n'))
  process.exit(0)
}

const url = process.env.DATABASE_URL || process.env.NUXT_DATABASE_URL
if (!url) throw new Error('DATABASE_URL is not set')
const keyFile = settings.keyFile || DEFAULT_KEY_FILE
const keyringFile = settings.keyringFile || DEFAULT_KEYRING_FILE
const pool = new pg.Pool({ connectionString: url, max: 2 })
const db = drizzle(pool, { schema })
const appUrl = process.env.NUXT_APP_URL || `http://127.0.0.1:${process.env.PORT || 3000}`

// Receipts go out through the outbox; the server delivers them.
async function signed(result: Awaited<ReturnType<typeof createCheckpoint>>, what: string) {
  if ('checkpoint' in result) {
    console.log(`[ledger] checkpoint #${result.checkpoint.number} at entry #${result.checkpoint.seq}, signed by ${what}`)
  } else if ('refused' in result) {
    console.log(`[ledger] no checkpoint signed by ${what}: ${result.refused}`)
  }
}
async function mailReceipt(tx: LedgerDbOrTx, checkpoint: Checkpoint) {
  const mail = receiptMail(checkpoint, appUrl)
  const auditors = await tx.select({ email: schema.users.email }).from(schema.users)
    .where(and(eq(schema.users.role, 'auditor'), eq(schema.users.active, true)))
  for (const a of auditors) {
    await tx.insert(schema.mailOutbox).values({ toAddress: a.email, subject: mail.subject, text: mail.text, kind: 'ledger-checkpoint' })
  }
}

try {
  const old = loadSigningKey(settings)
  if (old) {
    await signed(await createCheckpoint(db, old, 'rotation', { onSigned: mailReceipt }), `the old key ${old.keyId}`)
    // The old public key is kept outside the database before the private key goes.
    appendFileSync(keyringFile, `# ${old.keyId}, retired ${new Date().toISOString()}\n${old.publicPem}\n`, { mode: 0o600 })
  }
  writeFileSync(`${keyFile}.new`, fresh, { mode: 0o600 })
  renameSync(`${keyFile}.new`, keyFile)
  await signed(await createCheckpoint(db, next, 'rotation', { onSigned: mailReceipt }), `the new key ${next.keyId}`)
  console.log(`[ledger] the signing key is now ${next.keyId}${old ? `; ${old.keyId} is retired and its public key kept in ${keyringFile}` : ''}`)
} finally {
  await pool.end()
}
