import { describe, expect, it } from 'vitest'
import { MAX_ATTEMPTS, retryDelaySeconds } from '../../../../../server/utils/mail/outbox'

// Exponential backoff with a cap: common practice, no source.
describe('retryDelaySeconds', () => {
  it('doubles from 30 s after each failed attempt', () => {
    expect([1, 2, 3, 4, 5].map(retryDelaySeconds)).toEqual([30, 60, 120, 240, 480])
  })

  it('never waits more than an hour', () => {
    expect(retryDelaySeconds(20)).toBe(3600)
  })

  it('gives up on its own after a bounded number of attempts, well inside a day', () => {
    const total = Array.from({ length: MAX_ATTEMPTS - 1 }, (_, i) => retryDelaySeconds(i + 1)).reduce((a, b) => a + b, 0)
    expect(MAX_ATTEMPTS).toBe(8)
    expect(total).toBeLessThan(24 * 3600)
  })
})
