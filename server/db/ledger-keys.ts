// The Ed25519 key that signs the ledger's checkpoints, and the public keys that verify them.
// The private key is never stored in the database: it is a git-ignored file made by the set-up
// scripts (.secrets/ledger-signing-key) or, in production, NUXT_LEDGER_SIGNING_KEY. The keys
// trusted to have signed checkpoints are this one plus the retired ones kept outside the database
// (.secrets/ledger-public-keys, written by npm run ledger:rotate-key, or NUXT_LEDGER_TRUSTED_KEYS),
// so that whoever can write to the database cannot slip a key of their own in.
import { createHash, createPrivateKey, createPublicKey, generateKeyPairSync, sign, verify, type KeyObject } from 'node:crypto'
import { existsSync, readFileSync } from 'node:fs'

export const DEFAULT_KEY_FILE = '.secrets/ledger-signing-key'
export const DEFAULT_KEYRING_FILE = '.secrets/ledger-public-keys'

export type SigningKey = { privateKey: KeyObject; publicKey: KeyObject; keyId: string; publicPem: string }

export type KeySettings = {
  /** The private key itself: PEM (PKCS #8) or the base64 of its DER. */
  signingKey?: string
  keyFile?: string
  /** Retired public keys: PEM blocks or base64 DER (SPKI), separated by commas or white space. */
  trustedKeys?: string
  keyringFile?: string
}

export function keySettingsFromEnv(env: Record<string, string | undefined> = process.env): KeySettings {
  return {
    signingKey: env.NUXT_LEDGER_SIGNING_KEY,
    keyFile: env.NUXT_LEDGER_KEY_FILE || DEFAULT_KEY_FILE,
    trustedKeys: env.NUXT_LEDGER_TRUSTED_KEYS,
    keyringFile: env.NUXT_LEDGER_KEYRING_FILE || DEFAULT_KEYRING_FILE,
  }
}

/** A key's name: its algorithm and the first 16 hex digits of the sha256 of its public key (SPKI DER). */
export function keyIdOf(publicKey: KeyObject) {
  const der = publicKey.export({ type: 'spki', format: 'der' })
  return `ed25519:${createHash('sha256').update(der).digest('hex').slice(0, 16)}`
}

export function publicPemOf(publicKey: KeyObject) {
  return String(publicKey.export({ type: 'spki', format: 'pem' })).trim()
}

function ed25519(key: KeyObject, what: string) {
  if (key.asymmetricKeyType !== 'ed25519') throw new Error(`${what} is not an Ed25519 key`)
  return key
}

export function parsePrivateKey(text: string): KeyObject {
  const trimmed = text.trim()
  const key = trimmed.includes('-----BEGIN')
    ? createPrivateKey(trimmed)
    : createPrivateKey({ key: Buffer.from(trimmed, 'base64'), format: 'der', type: 'pkcs8' })
  return ed25519(key, 'The ledger signing key')
}

export function signingKeyFrom(privateKey: KeyObject): SigningKey {
  const publicKey = createPublicKey(privateKey)
  return { privateKey, publicKey, keyId: keyIdOf(publicKey), publicPem: publicPemOf(publicKey) }
}

/** Public keys from PEM blocks or base64 SPKI DER; anything else in the text (comments) is ignored. */
export function parsePublicKeys(text: string): KeyObject[] {
  const keys: KeyObject[] = []
  const pems = text.match(/-----BEGIN PUBLIC KEY-----[\s\S]*?-----END PUBLIC KEY-----/g) ?? []
  for (const pem of pems) keys.push(ed25519(createPublicKey(pem), 'A trusted ledger key'))
  const rest = text.replace(/-----BEGIN PUBLIC KEY-----[\s\S]*?-----END PUBLIC KEY-----/g, ' ')
    .split('\n').filter(line => !line.trim().startsWith('#')).join(' ')
  for (const token of rest.split(/[\s,]+/).filter(t => /^[A-Za-z0-9+/=]{40,}$/.test(t))) {
    keys.push(ed25519(createPublicKey({ key: Buffer.from(token, 'base64'), format: 'der', type: 'spki' }), 'A trusted ledger key'))
  }
  return keys
}

export function generateSigningKeyPem(): string {
  const { privateKey } = generateKeyPairSync('ed25519')
  return String(privateKey.export({ type: 'pkcs8', format: 'pem' }))
}

/** The configured signing key, or null when there is none (the server then signs nothing). */
export function loadSigningKey(settings: KeySettings): SigningKey | null {
  if (settings.signingKey?.trim()) return signingKeyFrom(parsePrivateKey(settings.signingKey))
  const file = settings.keyFile || DEFAULT_KEY_FILE
  if (!existsSync(file)) return null
  return signingKeyFrom(parsePrivateKey(readFileSync(file, 'utf8')))
}

/** The keys a checkpoint may have been signed with: our own and the retired ones kept outside the database. */
export function loadTrustedKeys(settings: KeySettings, own: SigningKey | null): Map<string, KeyObject> {
  const keys = new Map<string, KeyObject>()
  if (own) keys.set(own.keyId, own.publicKey)
  const texts = [settings.trustedKeys ?? '']
  const file = settings.keyringFile || DEFAULT_KEYRING_FILE
  if (existsSync(file)) texts.push(readFileSync(file, 'utf8'))
  for (const key of parsePublicKeys(texts.join('\n'))) keys.set(keyIdOf(key), key)
  return keys
}

export function signText(key: SigningKey, text: string) {
  return sign(null, Buffer.from(text, 'utf8'), key.privateKey).toString('base64')
}

export function verifyText(publicKey: KeyObject, text: string, signature: string) {
  try {
    return verify(null, Buffer.from(text, 'utf8'), publicKey, Buffer.from(signature, 'base64'))
  } catch {
    return false
  }
}
