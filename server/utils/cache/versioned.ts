// In-memory caches for what is versioned: a value stays valid for as long as the version it was
// computed under (an engine and ruleset version, a published ruleset's number, a calibration's),
// so a request pays a cheap version check, not the load or the computation. Least recently used
// entries go first once `capacity` is reached. Per server process; nothing here is shared state
// that must agree across processes, since the version is part of every key.

export function versionedCache<Value>(capacity: number) {
  const entries = new Map<string, Value>()
  return {
    /** The value for `key` under `version`, computed by `load` when not yet held. */
    get(version: string, key: string, load: () => Value): Value {
      const held = this.peek(version, key)
      if (held !== undefined) return held
      const value = load()
      this.put(version, key, value)
      return value
    },
    /** The value when held (and then the most recently used), else undefined. */
    peek(version: string, key: string): Value | undefined {
      const id = `${version}\u0000${key}`
      const held = entries.get(id)
      if (held === undefined) return undefined
      entries.delete(id)
      entries.set(id, held)
      return held
    },
    /** Holds a value computed elsewhere (an asynchronous load), the least recently used going first when full. */
    put(version: string, key: string, value: Value) {
      const id = `${version}\u0000${key}`
      entries.delete(id)
      entries.set(id, value)
      if (entries.size > capacity) entries.delete(entries.keys().next().value!)
    },
    /** Drops one entry (a load that failed, so the next request tries again). */
    forget(version: string, key: string) {
      entries.delete(`${version}\u0000${key}`)
    },
    get size() {
      return entries.size
    },
    clear() {
      entries.clear()
    },
  }
}
