// Which ruleset versions the decisions stand on: the version named by each decision's current
// revision, for the lead's overview.
import { sql, type SQL } from 'drizzle-orm'
import { tables, useDb } from '../db'
import { currentRevisionJoin } from '../decisions/queries'
import { compareVersions } from './catalogue'

export async function decisionsByRulesetVersion(where?: SQL) {
  const r = tables.decisionRevisions
  const rows = await useDb().select({
    key: r.rulesetId,
    version: r.rulesetVersion,
    count: sql<number>`count(*)::int`,
    standing: sql<number>`(count(*) FILTER (WHERE ${tables.decisions.status} <> 'superseded'))::int`,
  }).from(tables.decisions).innerJoin(r, currentRevisionJoin).where(where).groupBy(r.rulesetId, r.rulesetVersion)
  return rows.sort((a, b) => a.key.localeCompare(b.key) || compareVersions(b.version, a.version))
}
