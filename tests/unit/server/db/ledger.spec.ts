import { createHash, generateKeyPairSync } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { LEDGER_GENESIS, ledgerEntryHash, type LedgerFields } from '../../../../server/db/ledger'
import { checkpointMessage, checkpointSignatureHolds, parseReceipt, receiptText, type Checkpoint } from '../../../../server/db/ledger-checkpoint'
import { keyIdOf, loadTrustedKeys, parsePrivateKey, parsePublicKeys, publicPemOf, signText, signingKeyFrom } from '../../../../server/db/ledger-keys'

const entry: LedgerFields = {
  seq: 1, subjectType: 'decision', subjectId: '7', type: 'decision-event', recordTable: 'decision_events', recordId: 41,
  recordHash: 'ab'.repeat(32), createdAt: new Date('2026-11-20T09:30:00.125Z'),
}

function freshKey() {
  return signingKeyFrom(parsePrivateKey(String(generateKeyPairSync('ed25519').privateKey.export({ type: 'pkcs8', format: 'pem' }))))
}

function signedCheckpoint(key = freshKey()): Checkpoint {
  const fields = { number: 3, seq: 120, hash: 'cd'.repeat(32), signedAt: new Date('2026-11-21T10:00:00.000Z'), keyId: key.keyId }
  return { ...fields, signature: signText(key, checkpointMessage(fields)), reason: 'request' }
}

describe('the ledger entry hash', () => {
  it('is sha256(previous hash + RFC 8785 canonical JSON of the entry)', () => {
    // RFC 8785: keys sorted, numbers in their shortest form, null kept; SHA-256 per FIPS 180-4.
    const canonical = '{"createdAt":"2026-11-20T09:30:00.125Z","recordHash":"' + 'ab'.repeat(32) + '","recordId":41,'
      + '"recordTable":"decision_events","seq":1,"subjectId":"7","subjectType":"decision","type":"decision-event"}'
    expect(ledgerEntryHash(LEDGER_GENESIS, entry)).toBe(createHash('sha256').update(LEDGER_GENESIS + canonical).digest('hex'))
  })

  it('changes with any field and with the previous hash', () => {
    const base = ledgerEntryHash(LEDGER_GENESIS, entry)
    expect(ledgerEntryHash('1'.repeat(64), entry)).not.toBe(base)
    expect(ledgerEntryHash(LEDGER_GENESIS, { ...entry, seq: 2 })).not.toBe(base)
    expect(ledgerEntryHash(LEDGER_GENESIS, { ...entry, recordHash: 'ac'.repeat(32) })).not.toBe(base)
    expect(ledgerEntryHash(LEDGER_GENESIS, { ...entry, recordTable: null, recordId: null })).not.toBe(base)
  })
})

describe('checkpoint signatures', () => {
  it('hold under the signing key and under nothing else, and not once a field changes', () => {
    const key = freshKey()
    const checkpoint = signedCheckpoint(key)
    const trusted = new Map([[key.keyId, key.publicKey]])
    expect(checkpointSignatureHolds(checkpoint, trusted)).toBe(true)
    expect(checkpointSignatureHolds({ ...checkpoint, seq: 121 }, trusted)).toBe(false)
    expect(checkpointSignatureHolds({ ...checkpoint, hash: 'ce'.repeat(32) }, trusted)).toBe(false)
    expect(checkpointSignatureHolds({ ...checkpoint, signedAt: new Date('2026-11-21T10:00:00.001Z') }, trusted)).toBe(false)
    const other = freshKey()
    expect(checkpointSignatureHolds(checkpoint, new Map([[key.keyId, other.publicKey]]))).toBe(false)
    expect(checkpointSignatureHolds(checkpoint, new Map())).toBe(false)
  })

  it('name keys by the sha256 of their public key, and read public keys as PEM or base64 DER', () => {
    const key = freshKey()
    const der = key.publicKey.export({ type: 'spki', format: 'der' })
    expect(key.keyId).toBe(`ed25519:${createHash('sha256').update(der).digest('hex').slice(0, 16)}`)
    const other = freshKey()
    const parsed = parsePublicKeys(`# retired 2026-11-01\n${publicPemOf(key.publicKey)}\n\n${der.toString('base64')}, ${other.publicKey.export({ type: 'spki', format: 'der' }).toString('base64')}`)
    expect(parsed.map(keyIdOf)).toEqual([key.keyId, key.keyId, other.keyId])
    expect(() => parsePrivateKey(String(generateKeyPairSync('ec', { namedCurve: 'P-256' }).privateKey.export({ type: 'pkcs8', format: 'pem' }))))
      .toThrow(/not an Ed25519 key/)
  })

  it('trust the own key and the retired ones given outside the database', () => {
    const own = freshKey()
    const retired = freshKey()
    const trusted = loadTrustedKeys({ trustedKeys: publicPemOf(retired.publicKey), keyringFile: '/nonexistent/keyring' }, own)
    expect([...trusted.keys()].sort()).toEqual([own.keyId, retired.keyId].sort())
  })
})

describe('receipts', () => {
  const checkpoint = signedCheckpoint()
  const fields = { number: 3, seq: 120, hash: checkpoint.hash, signedAt: checkpoint.signedAt, keyId: checkpoint.keyId, signature: checkpoint.signature }

  it('read back what receiptText wrote, also quoted in a reply or with Windows line ends', () => {
    const text = receiptText(checkpoint)
    expect(text.split('\n')[0]).toBe('Eddyledger ledger checkpoint')
    expect(parseReceipt(text)).toEqual(fields)
    expect(parseReceipt(`On Monday you wrote:\n${text.split('\n').map(l => `> ${l}`).join('\r\n')}`)).toEqual(fields)
  })

  it('read the same fields as JSON', () => {
    expect(parseReceipt(JSON.stringify({ ...fields, checkpoint: 3, key: checkpoint.keyId }))).toEqual(fields)
  })

  it.each([
    ['seq: 5', /lacks checkpoint, hash, signed-at, key, signature/],
    [receiptText(checkpoint).replace('seq: 120', 'seq: -4'), /seq is not a positive whole number/],
    [receiptText(checkpoint).replace(/hash: \w+/, 'hash: 12ab'), /hash is not 64 hexadecimal digits/],
    [receiptText(checkpoint).replace(/signed-at: \S+/, 'signed-at: yesterday'), /signed-at is not a date/],
    ['{ not json', /does not parse/],
  ])('explain what is wrong with text that is not a whole receipt (%#)', (text, message) => {
    const parsed = parseReceipt(text)
    expect(parsed).toHaveProperty('error')
    expect((parsed as { error: string }).error).toMatch(message)
  })
})
