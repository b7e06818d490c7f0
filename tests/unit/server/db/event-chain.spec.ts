import { createHash } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { GENESIS_HASH, canonicalHash, checkChain, eventHash, type HashedFields } from '../../../../server/db/event-chain'

const base: HashedFields = {
  decisionId: 7, seq: 1, type: 'created', actorId: 3, actorRole: 'engineer',
  payload: { revision: 1, approach: 'rans' }, createdAt: new Date('2026-11-20T09:30:00.125Z'),
}

function chain(count: number) {
  const events = []
  let prevHash = GENESIS_HASH
  for (let seq = 1; seq <= count; seq++) {
    const fields = { ...base, seq, type: seq === 1 ? 'created' as const : 'commented' as const, payload: { n: seq } }
    const hash = eventHash(prevHash, fields)
    events.push({ ...fields, id: 100 + seq, prevHash, hash })
    prevHash = hash
  }
  return events
}

describe('the decision event chain', () => {
  it('hashes sha256(previous hash + RFC 8785 canonical JSON), whatever the key order', () => {
    // RFC 8785 sorts keys and writes numbers in their shortest form; SHA-256 per FIPS 180-4.
    const canonical = '{"actorId":3,"actorRole":"engineer","createdAt":"2026-11-20T09:30:00.125Z","decisionId":7,'
      + '"payload":{"approach":"rans","revision":1},"seq":1,"type":"created"}'
    const expected = createHash('sha256').update(GENESIS_HASH + canonical).digest('hex')
    expect(eventHash(GENESIS_HASH, base)).toBe(expected)
    expect(eventHash(GENESIS_HASH, { ...base, payload: { approach: 'rans', revision: 1 } })).toBe(expected)
    expect(canonicalHash({ b: 1, a: [2, 1] })).toBe(canonicalHash({ a: [2, 1], b: 1 }))
    expect(canonicalHash({ a: [1, 2] })).not.toBe(canonicalHash({ a: [2, 1] }))
  })

  it('accepts an intact chain and reports the first event whose payload, link or order is wrong', () => {
    expect(checkChain(chain(4))).toEqual({ valid: true, checked: 4, brokenAt: null })
    expect(checkChain([])).toEqual({ valid: true, checked: 0, brokenAt: null })

    const altered = chain(4)
    altered[2] = { ...altered[2]!, payload: { n: 99 } }
    expect(checkChain(altered)).toEqual({ valid: false, checked: 3, brokenAt: 103 })

    // Rehashing the altered event does not help: the next link no longer matches.
    const rehashed = chain(4)
    rehashed[1] = { ...rehashed[1]!, payload: { n: 99 } }
    rehashed[1]!.hash = eventHash(rehashed[1]!.prevHash, rehashed[1]!)
    expect(checkChain(rehashed)).toEqual({ valid: false, checked: 3, brokenAt: 103 })

    const missing = chain(4).filter(e => e.seq !== 2)
    expect(checkChain(missing).brokenAt).toBe(103)
  })
})
