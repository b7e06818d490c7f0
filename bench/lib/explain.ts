// What a route really asks of PostgreSQL: the app runs with EDDY_SQL_LOG (every statement and its
// parameters to a file); the statements one request ran are replayed under EXPLAIN ANALYZE, and
// their plans read for the scans used and any sort that spilled to disk.
import { existsSync, readFileSync, statSync } from 'node:fs'
import type pg from 'pg'

// Tables that grow with the record; a sequential scan of one of these is a finding. Small tables
// (users, projects, members) are read whole by design when that is cheaper.
const LARGE = new Set(['decisions', 'decision_revisions', 'decision_events', 'decision_summaries'])

type PlanNode = {
  'Node Type': string
  'Relation Name'?: string
  'Index Name'?: string
  'Sort Method'?: string
  'Sort Space Type'?: string
  Plans?: PlanNode[]
}

export type PlanFindings = { scans: string[]; largeSeqScans: string[]; sorts: string[]; spilledSorts: string[]; statements: number }

function walk(node: PlanNode, found: PlanFindings) {
  const type = node['Node Type']
  if (node['Relation Name']) {
    const scan = `${type}${node['Index Name'] ? ` ${node['Index Name']}` : ''} on ${node['Relation Name']}`
    if (!found.scans.includes(scan)) found.scans.push(scan)
    if (type === 'Seq Scan' && LARGE.has(node['Relation Name'])) found.largeSeqScans.push(node['Relation Name'])
  }
  if (type === 'Sort' || type === 'Incremental Sort') {
    found.sorts.push(`${node['Sort Method'] ?? 'sort'} (${node['Sort Space Type'] ?? '?'})`)
    if (node['Sort Space Type'] === 'Disk') found.spilledSorts.push(node['Sort Method'] ?? 'sort')
  }
  for (const child of node.Plans ?? []) walk(child, found)
}

/** Runs `request` once and explains every SELECT the app ran for it. */
export async function explainRequest(logFile: string, client: pg.Client, request: () => Promise<unknown>): Promise<PlanFindings> {
  const start = existsSync(logFile) ? statSync(logFile).size : 0
  await request()
  const lines = readFileSync(logFile).subarray(start).toString('utf8').split('\n').filter(Boolean)
  const found: PlanFindings = { scans: [], largeSeqScans: [], sorts: [], spilledSorts: [], statements: 0 }
  for (const line of lines) {
    const { query, params } = JSON.parse(line) as { query: string; params: unknown[] }
    if (!/^\s*(select|with)\b/i.test(query)) continue
    found.statements++
    const { rows } = await client.query(`EXPLAIN (ANALYZE, BUFFERS, FORMAT JSON) ${query}`, params)
    walk((rows[0]['QUERY PLAN'] as [{ Plan: PlanNode }])[0].Plan, found)
  }
  return found
}
