// Which ruleset versions the decisions stand on (the version named by each decision's current
// revision), as the lead's overview lists them: by ruleset, the newest version first.
import { compareVersions } from './catalogue'

export function sortByRulesetVersion<Row extends { key: string; version: string }>(rows: Row[]) {
  return rows.sort((a, b) => a.key.localeCompare(b.key) || compareVersions(b.version, a.version))
}
