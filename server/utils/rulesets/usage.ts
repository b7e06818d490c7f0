// Which ruleset versions the decisions stand on: the version named by each decision's current
// revision (kept in its summary row), for the lead's overview.
import { sql, type SQL } from 'drizzle-orm'
import { tables, useDb } from '../db'
import { compareVersions } from './catalogue'

/** Decisions per ruleset version among the summaries `where` selects; a few rows, however many decisions. */
export async function decisionsByRulesetVersion(where?: SQL) {
  const s = tables.decisionSummaries
  const rows = await useDb().select({
    key: s.rulesetId,
    version: s.rulesetVersion,
    count: sql<number>`count(*)::int`,
    standing: sql<number>`(count(*) FILTER (WHERE ${s.status} <> 'superseded'))::int`,
  }).from(s).where(where).groupBy(s.rulesetId, s.rulesetVersion)
  return rows.sort((a, b) => a.key.localeCompare(b.key) || compareVersions(b.version, a.version))
}
