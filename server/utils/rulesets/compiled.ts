// Rulesets from the catalogue in the engine's form, compiled once per released version and kept in
// memory: a released version never changes (trigger), so its version names it for good. Drafts
// change, so they are compiled where used (once per impact run or case check). Relative imports
// only: the demo seed uses it under plain Node.
import { compileRuleset, type Ruleset } from '../../../shared/rules'
import type * as schema from '../../db/schema'

export type RulesetRow = typeof schema.rulesets.$inferSelect
type EngineFields = Pick<RulesetRow, 'key' | 'version' | 'baseScores' | 'baseWhy' | 'rules'>

/** The ruleset as the engine reads it (and as it is exported). */
export function engineForm(row: EngineFields) {
  return { id: row.key, version: row.version, baseScores: row.baseScores, baseWhy: row.baseWhy, rules: row.rules }
}

const released = new Map<string, Ruleset>()
// A handful of versions is all a server meets; the oldest entry goes first beyond this.
const MAX_CACHED = 16

/** A released version already compiled, if this server has met it. */
export function cachedRelease(key: string, version: string): Ruleset | undefined {
  return released.get(`${key}@${version}`)
}

/** The compiled form of a published or retired version, compiled on its first use. */
export function compiledRelease(row: EngineFields): Ruleset {
  const key = `${row.key}@${row.version}`
  let ruleset = released.get(key)
  if (!ruleset) {
    ruleset = compileRuleset(engineForm(row))
    if (released.size >= MAX_CACHED) released.delete(released.keys().next().value!)
    released.set(key, ruleset)
  }
  return ruleset
}

/** The compiled form of any row: cached when released, fresh for a draft. */
export function compiledRuleset(row: EngineFields & Pick<RulesetRow, 'status'>): Ruleset {
  return row.status === 'draft' ? compileRuleset(engineForm(row)) : compiledRelease(row)
}
