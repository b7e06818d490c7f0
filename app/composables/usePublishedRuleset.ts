import { compileRuleset, type Ruleset } from '#shared/rules'

// The published ruleset for the engine in the browser: fetched from the server (any signed-in
// role may read it) and compiled once per version for the life of the page.
const compiled = new Map<string, Ruleset>()

export function usePublishedRuleset() {
  const { data, error } = useFetch('/api/rulesets/published', { key: 'published-ruleset', server: false, lazy: true })
  const ruleset = computed((): Ruleset | undefined => {
    const row = data.value?.ruleset
    if (!row) return undefined
    const key = `${row.key}@${row.version}`
    let ready = compiled.get(key)
    if (!ready) {
      ready = compileRuleset({ id: row.key, version: row.version, baseScores: row.baseScores, baseWhy: row.baseWhy, rules: row.rules })
      compiled.set(key, ready)
    }
    return ready
  })
  // Without the server's version the built-in rules stand in, and the panel says so.
  const unavailable = computed(() => Boolean(error.value))
  return { ruleset, unavailable, version: computed(() => data.value?.ruleset.version) }
}
