// The team lead's overview: method usage, overrides and compute across projects. Whole months of
// the range come from the running tallies (decision_tallies, decision_rule_tallies: a few rows per
// project and month), the days at either end that do not fill a month from the decisions'
// summaries by their creation index, so no request re-reads every decision or its advice.
import { sql, type SQL } from 'drizzle-orm'
import { RULESET } from '#shared/rules'
import { DECISION_STATUSES, type DecisionStatus } from '#shared/utils/decision-status'
import type { OverviewQuery } from '#shared/schemas/overview'
import { tables, useDb } from '../db'
import { sortByRulesetVersion } from '../rulesets/usage'

// How many override pairs and disagreed rules the overview lists.
const TOP = 10
// Rules by id, so the page names them without loading the ruleset.
const RULE_TITLES = new Map(RULESET.rules.map(r => [r.id, r.title]))

const utcDay = (isoDate: string) => new Date(`${isoDate}T00:00:00Z`)
const monthStart = (day: Date) => new Date(Date.UTC(day.getUTCFullYear(), day.getUTCMonth(), 1))
const nextMonth = (day: Date) => new Date(Date.UTC(day.getUTCFullYear(), day.getUTCMonth() + 1, 1))
const isoDay = (day: Date) => day.toISOString().slice(0, 10)

/**
 * The range (whole UTC days, both ends inclusive) as [from, to) instants, split into the whole
 * months inside it and the days outside those months.
 */
export function overviewRange(query: Pick<OverviewQuery, 'from' | 'to'>) {
  const from = query.from ? utcDay(query.from) : undefined
  const to = query.to ? new Date(utcDay(query.to).getTime() + 24 * 3600 * 1000) : undefined
  const monthsFrom = from && (from.getTime() === monthStart(from).getTime() ? from : nextMonth(from))
  const monthsTo = to && monthStart(to)
  if (monthsFrom && monthsTo && monthsFrom >= monthsTo) return { months: null, days: [{ from, to }] }
  const days = [
    ...(from && monthsFrom && from < monthsFrom ? [{ from, to: monthsFrom }] : []),
    ...(to && monthsTo && monthsTo < to ? [{ from: monthsTo, to }] : []),
  ]
  return { months: { from: monthsFrom, to: monthsTo }, days }
}

function projectIs(projectId: number | undefined, column: string) {
  return projectId ? sql` AND ${sql.raw(column)} = ${projectId}` : sql``
}

function monthsWhere(months: { from?: Date; to?: Date }, projectId: number | undefined) {
  return sql`true${months.from ? sql` AND month >= ${isoDay(months.from)}::date` : sql``}${months.to ? sql` AND month < ${isoDay(months.to)}::date` : sql``}${projectIs(projectId, 'project_id')}`
}

function daysWhere(days: { from?: Date; to?: Date }[], projectId: number | undefined) {
  const spans = days.map(d => sql`(created_at >= ${d.from!.toISOString()}::timestamptz AND created_at < ${d.to!.toISOString()}::timestamptz)`)
  return sql`(${sql.join(spans, sql` OR `)})${projectIs(projectId, 'project_id')}`
}

/**
 * The range's rows as one UNION ALL: whole months from a tally (`fromTally`), the days outside them
 * from the summaries (`fromSummaries`), each given its WHERE condition.
 */
function rangeRows(query: OverviewQuery, fromTally: (where: SQL) => SQL, fromSummaries: (where: SQL) => SQL) {
  const { months, days } = overviewRange(query)
  const parts: SQL[] = []
  if (months) parts.push(fromTally(monthsWhere(months, query.projectId)))
  if (days.length) parts.push(fromSummaries(daysWhere(days, query.projectId)))
  return sql.join(parts, sql` UNION ALL `)
}

type Group = {
  projectId: number; status: DecisionStatus; approach: string; model: string; engineApproach: string; overridden: boolean
  count: number; coreHours: number; budgetCoreHours: number; overBudget: number
}

/** Decisions in the range grouped by everything the figures tell apart: a few hundred groups, however many decisions. */
async function groupedDecisions(query: OverviewQuery): Promise<Group[]> {
  const parts = rangeRows(query,
    where => sql`SELECT project_id, status, approach, model, engine_approach, overridden, decisions, core_hours, budget_core_hours, over_budget
      FROM decision_tallies WHERE ${where}`,
    where => sql`SELECT project_id, status, approach, model, engine_approach, overridden, 1, coalesce(core_hours, 0)::numeric,
      budget_core_hours::numeric, coalesce((core_hours > budget_core_hours)::int, 0) FROM decision_summaries WHERE ${where}`)
  const { rows } = await useDb().execute<Group>(sql`SELECT project_id AS "projectId", status, approach, model, engine_approach AS "engineApproach",
      overridden, sum(decisions)::int AS count, sum(core_hours)::float8 AS "coreHours", sum(budget_core_hours)::float8 AS "budgetCoreHours",
      sum(over_budget)::int AS "overBudget"
    FROM (${parts}) AS parts (project_id, status, approach, model, engine_approach, overridden, decisions, core_hours, budget_core_hours, over_budget)
    GROUP BY project_id, status, approach, model, engine_approach, overridden
    HAVING sum(decisions) > 0`)
  return rows
}

/** The rules overriding reviewers named most often in the range (an override counts after its decision is superseded too). */
async function disagreedRules(query: OverviewQuery) {
  const parts = rangeRows(query,
    where => sql`SELECT rule, decisions FROM decision_rule_tallies WHERE ${where}`,
    where => sql`SELECT rule, 1 FROM decision_summaries CROSS JOIN LATERAL unnest(disagreed_rules) AS rule WHERE overridden AND ${where}`)
  const { rows } = await useDb().execute<{ rule: string; count: number }>(sql`SELECT rule, sum(decisions)::int AS count
    FROM (${parts}) AS parts (rule, decisions)
    GROUP BY rule HAVING sum(decisions) > 0 ORDER BY count DESC, rule LIMIT ${TOP}`)
  return rows.map(r => ({ ...r, title: RULE_TITLES.get(r.rule) ?? null }))
}

/** Decisions per ruleset version in the range: whole months from their tally, the days outside them from the summaries. */
async function rulesetVersions(query: OverviewQuery) {
  const parts = rangeRows(query,
    where => sql`SELECT ruleset_id, ruleset_version, status, decisions FROM decision_ruleset_tallies WHERE ${where}`,
    where => sql`SELECT ruleset_id, ruleset_version, status, 1 FROM decision_summaries WHERE ${where}`)
  const { rows } = await useDb().execute<{ key: string; version: string; count: number; standing: number }>(sql`
    SELECT ruleset_id AS key, ruleset_version AS version, sum(decisions)::int AS count,
      (sum(decisions) FILTER (WHERE status <> 'superseded'))::int AS standing
    FROM (${parts}) AS parts (ruleset_id, ruleset_version, status, decisions)
    GROUP BY ruleset_id, ruleset_version HAVING sum(decisions) > 0`)
  return sortByRulesetVersion(rows.map(r => ({ ...r, standing: r.standing ?? 0 })))
}

function countBy<K extends string>(groups: Group[], key: (g: Group) => K) {
  const counts = new Map<K, number>()
  for (const g of groups) counts.set(key(g), (counts.get(key(g)) ?? 0) + g.count)
  return counts
}

// Most first; ties in the order of their names (code points, as the database's C collation), so the lists are stable.
const byCountThenName = <T extends { count: number }>(name: (item: T) => string) => (a: T, b: T) =>
  b.count - a.count || (name(a) < name(b) ? -1 : name(a) > name(b) ? 1 : 0)

function projectFigures(groups: Group[]) {
  const figures = new Map<number, { decisions: number; approved: number; overridden: number; coreHours: number; budgetCoreHours: number; overBudget: number }>()
  for (const g of groups) {
    const f = figures.get(g.projectId) ?? { decisions: 0, approved: 0, overridden: 0, coreHours: 0, budgetCoreHours: 0, overBudget: 0 }
    f.decisions += g.count
    if (g.status === 'approved') f.approved += g.count
    // An override stays on a decision that is later superseded: the review happened, so it counts.
    if (g.overridden) f.overridden += g.count
    // Compute counts the decisions that stand: a superseded one was replaced by its successor, whose
    // cost is counted instead, so counting both would plan the same work twice.
    if (g.status !== 'superseded') {
      f.coreHours += g.coreHours
      f.budgetCoreHours += g.budgetCoreHours
      f.overBudget += g.overBudget
    }
    figures.set(g.projectId, f)
  }
  return figures
}

export async function decisionOverview(query: OverviewQuery) {
  const projectsTable = tables.projects
  const [groups, rules, projectRows, byRuleset] = await Promise.all([
    groupedDecisions(query),
    disagreedRules(query),
    useDb().select({ id: projectsTable.id, code: projectsTable.code, name: projectsTable.name, archived: projectsTable.archived })
      .from(projectsTable).where(query.projectId ? sql`${projectsTable.id} = ${query.projectId}` : undefined).orderBy(projectsTable.code),
    rulesetVersions(query),
  ])

  const statusCounts = Object.fromEntries(DECISION_STATUSES.map(st => [st, 0])) as Record<DecisionStatus, number>
  for (const [status, count] of countBy(groups, g => g.status)) statusCounts[status] = count
  const totalDecisions = DECISION_STATUSES.reduce((sum, st) => sum + statusCounts[st], 0)
  // Only approved or overridden decisions can be superseded, so each superseded one was reviewed.
  const reviewed = statusCounts.approved + statusCounts.overridden + statusCounts.superseded
  const overridden = groups.reduce((sum, g) => sum + (g.overridden ? g.count : 0), 0)

  const byApproach = [...countBy(groups, g => g.approach)].map(([approach, count]) => ({ approach, count }))
    .sort(byCountThenName(m => m.approach))
  const byModel = [...countBy(groups, g => `${g.approach}\u0000${g.model}`)]
    .map(([key, count]) => { const [approach, model] = key.split('\u0000') as [string, string]; return { approach, model, count } })
    .sort(byCountThenName(m => `${m.approach} ${m.model}`))
  const pairs = [...countBy(groups.filter(g => g.overridden), g => `${g.engineApproach}\u0000${g.approach}`)]
    .map(([key, count]) => { const [engineApproach, reviewerApproach] = key.split('\u0000') as [string, string]; return { engineApproach, reviewerApproach, count } })
    .sort(byCountThenName(p => `${p.engineApproach} ${p.reviewerApproach}`)).slice(0, TOP)

  // Every project in scope gets a row, those without decisions in the range too.
  const figures = projectFigures(groups)
  const empty = { decisions: 0, approved: 0, overridden: 0, coreHours: 0, budgetCoreHours: 0, overBudget: 0 }
  const projects = projectRows.map(p => ({ ...p, ...(figures.get(p.id) ?? empty) }))

  return {
    filters: query,
    decisions: { total: totalDecisions, byStatus: statusCounts },
    methods: { byApproach, byModel },
    overrides: {
      overridden,
      reviewed,
      rate: reviewed ? overridden / reviewed : null,
      pairs,
      disagreedRules: rules,
    },
    rulesets: { byVersion: byRuleset },
    compute: {
      coreHours: projects.reduce((sum, p) => sum + p.coreHours, 0),
      budgetCoreHours: projects.reduce((sum, p) => sum + p.budgetCoreHours, 0),
      overBudget: projects.reduce((sum, p) => sum + p.overBudget, 0),
      projects,
    },
  }
}
export type DecisionOverview = Awaited<ReturnType<typeof decisionOverview>>
