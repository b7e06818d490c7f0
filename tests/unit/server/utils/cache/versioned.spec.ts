import { describe, expect, it } from 'vitest'
import { versionedCache } from '../../../../../server/utils/cache/versioned'

describe('versionedCache', () => {
  it('computes a value once per key and version', () => {
    const cache = versionedCache<number>(10)
    let loads = 0
    const load = () => ++loads
    expect(cache.get('v1', 'a', load)).toBe(1)
    expect(cache.get('v1', 'a', load)).toBe(1)
    // A new version is a new value: what was computed under the old one is not served.
    expect(cache.get('v2', 'a', load)).toBe(2)
    expect(cache.get('v1', 'b', load)).toBe(3)
    expect(loads).toBe(3)
  })

  it('lets the least recently used entry go at capacity', () => {
    const cache = versionedCache<string>(2)
    cache.get('v', 'a', () => 'A')
    cache.get('v', 'b', () => 'B')
    cache.get('v', 'a', () => 'never')
    cache.get('v', 'c', () => 'C')
    expect(cache.size).toBe(2)
    expect(cache.get('v', 'a', () => 'again')).toBe('A')
    expect(cache.get('v', 'b', () => 'B2')).toBe('B2')
  })

  it('holds values put from an asynchronous load, and peeks without loading', () => {
    const cache = versionedCache<string>(2)
    expect(cache.peek('v', 'a')).toBeUndefined()
    cache.put('v', 'a', 'A')
    cache.put('v', 'b', 'B')
    expect(cache.peek('v', 'a')).toBe('A')
    // Peeking made "a" the most recently used: "b" goes first.
    cache.put('v', 'c', 'C')
    expect(cache.peek('v', 'b')).toBeUndefined()
    expect(cache.peek('w', 'a')).toBeUndefined()
    expect(cache.get('v', 'a', () => 'never')).toBe('A')
  })
})
