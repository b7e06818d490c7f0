import { desc } from 'drizzle-orm'
import { activateSigningKey } from '../../db/ledger-checkpoint'
import { loadSigningKey, loadTrustedKeys, type KeySettings, type SigningKey } from '../../db/ledger-keys'
import { tables, useDb } from '../db'

// The server's ledger keys, read from the runtime config (NUXT_LEDGER_*) on every use, so that a
// key file replaced by npm run ledger:rotate-key takes effect without a restart.

export function ledgerKeySettings(): KeySettings {
  const c = useRuntimeConfig().ledger as Record<string, unknown>
  return {
    signingKey: String(c.signingKey ?? ''),
    keyFile: String(c.keyFile || ''),
    trustedKeys: String(c.trustedKeys ?? ''),
    keyringFile: String(c.keyringFile || ''),
  }
}

let warned = ''

/** The signing key, or null (logged once) when none is configured or it cannot be read. */
export function ledgerSigningKey(): SigningKey | null {
  try {
    const key = loadSigningKey(ledgerKeySettings())
    if (!key && warned !== 'missing') {
      warned = 'missing'
      console.warn('[ledger] no signing key (NUXT_LEDGER_SIGNING_KEY or .secrets/ledger-signing-key): checkpoints are not signed')
    }
    return key
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error)
    if (warned !== message) {
      warned = message
      console.error(`[ledger] the signing key cannot be read: ${message}`)
    }
    return null
  }
}

export function ledgerTrustedKeys() {
  return loadTrustedKeys(ledgerKeySettings(), ledgerSigningKey())
}

/** The public keys for auditors: the newest is active, earlier ones retired when the next came in. */
export async function listLedgerKeys() {
  const rows = await useDb().select().from(tables.ledgerKeys).orderBy(desc(tables.ledgerKeys.id))
  const own = ledgerSigningKey()
  const trusted = ledgerTrustedKeys()
  return {
    serverKeyId: own?.keyId ?? null,
    keys: rows.map((k, i) => ({
      keyId: k.keyId,
      algorithm: k.algorithm,
      publicKey: k.publicKey,
      createdAt: k.createdAt,
      retiredAt: i === 0 ? null : rows[i - 1]!.createdAt,
      active: i === 0,
      trusted: trusted.has(k.keyId),
    })),
  }
}

/** At start: lists the server's key (the first time) and says so when it is a retired one. */
export async function prepareLedgerKey() {
  const key = ledgerSigningKey()
  if (!key) return
  try {
    const retired = await useDb().transaction(tx => activateSigningKey(tx, key))
    if (retired) console.error(`[ledger] ${retired}`)
  }
  catch (error) {
    console.error(`[ledger] the signing key could not be listed: ${error instanceof Error ? error.message : String(error)}`)
  }
}
