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
      const id = `${version}\u0000${key}`
      const held = entries.get(id)
      if (held !== undefined) {
        // Most recently used last.
        entries.delete(id)
        entries.set(id, held)
        return held
      }
      const value = load()
      entries.set(id, value)
      if (entries.size > capacity) entries.delete(entries.keys().next().value!)
      return value
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
