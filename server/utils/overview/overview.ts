// The team lead's overview: method usage, overrides and compute across projects, aggregated in
// PostgreSQL over each decision and the advice of its current revision.
import { and, asc, count, desc, eq, gte, isNotNull, lt, sql, type SQL } from 'drizzle-orm'
import { DECISION_STATUSES, type DecisionStatus } from '#shared/utils/decision-status'
import type { OverviewQuery } from '#shared/schemas/overview'
import { budgetCoreHours, chosenApproach, chosenCoreHours, chosenModel, currentRevisionJoin } from '../decisions/queries'
import { tables, useDb } from '../db'
import { decisionsByRulesetVersion } from '../rulesets/usage'

const decisions = tables.decisions
const revisions = tables.decisionRevisions

// How many override pairs and disagreed rules the overview lists.
const TOP = 10

function nextDay(isoDate: string) {
  const day = new Date(`${isoDate}T00:00:00Z`)
  day.setUTCDate(day.getUTCDate() + 1)
  return day
}

// Decisions created within the range (both ends inclusive, whole UTC days), in one project or all.
function overviewWhere(query: OverviewQuery): SQL | undefined {
  return and(
    query.projectId ? eq(decisions.projectId, query.projectId) : undefined,
    query.from ? gte(decisions.createdAt, new Date(`${query.from}T00:00:00Z`)) : undefined,
    query.to ? lt(decisions.createdAt, nextDay(query.to)) : undefined,
  )
}

export async function decisionOverview(query: OverviewQuery) {
  const db = useDb()
  // One row per decision: what it stands for and what it costs, for the aggregates below.
  const base = db.select({
    id: decisions.id,
    projectId: decisions.projectId,
    status: decisions.status,
    approach: chosenApproach.as('approach'),
    model: chosenModel.as('model'),
    engineApproach: sql<string>`${revisions.advice}->'recommendation'->>'approach'`.as('engine_approach'),
    reviewerApproach: sql<string | null>`${decisions.override}->>'approach'`.as('reviewer_approach'),
    // An override stays on a decision that is later superseded: the review happened, so it counts.
    overridden: sql<boolean>`(${decisions.override} IS NOT NULL)`.as('overridden'),
    coreHours: chosenCoreHours.as('core_hours'),
    budget: budgetCoreHours.as('budget'),
  }).from(decisions).innerJoin(revisions, currentRevisionJoin).where(overviewWhere(query)).as('base')

  const n = sql<number>`count(*)::int`
  // Compute counts the decisions that stand: a superseded one was replaced by its successor, whose
  // cost is counted instead, so counting both would plan the same work twice.
  const stands = sql`${base.status} <> 'superseded'`
  const overBudget = sql<number>`(count(*) FILTER (WHERE ${base.coreHours} > ${base.budget} AND ${stands}))::int`
  const sumOf = (column: SQL.Aliased) => sql<number>`coalesce(sum(${column}) FILTER (WHERE ${stands}), 0)::float8`.mapWith(Number)
  const countStatus = (status: DecisionStatus) => sql<number>`(count(*) FILTER (WHERE ${base.status} = ${status}))::int`
  const countOverridden = sql<number>`(count(*) FILTER (WHERE ${base.overridden}))::int`

  const disagreed = db.select({
    rule: sql<string>`jsonb_array_elements_text(coalesce(${decisions.override}->'disagreedRules', '[]'::jsonb))`.as('rule'),
  }).from(decisions).where(and(overviewWhere(query), isNotNull(decisions.override))).as('disagreed')

  const [byStatus, [overrideTotals], byApproach, byModel, perProject, pairs, rules, projectRows, byRuleset] = await Promise.all([
    db.select({ status: base.status, count: n }).from(base).groupBy(base.status),
    db.select({ overridden: countOverridden }).from(base),
    db.select({ approach: base.approach, count: n }).from(base).groupBy(base.approach).orderBy(desc(n), asc(base.approach)),
    db.select({ approach: base.approach, model: base.model, count: n }).from(base)
      .groupBy(base.approach, base.model).orderBy(desc(n), asc(base.approach), asc(base.model)),
    db.select({
      projectId: base.projectId,
      decisions: n,
      approved: countStatus('approved'),
      overridden: countOverridden,
      coreHours: sumOf(base.coreHours),
      budgetCoreHours: sumOf(base.budget),
      overBudget,
    }).from(base).groupBy(base.projectId),
    db.select({ engineApproach: base.engineApproach, reviewerApproach: base.reviewerApproach, count: n }).from(base)
      .where(sql`${base.overridden}`)
      .groupBy(base.engineApproach, base.reviewerApproach)
      .orderBy(desc(n), asc(base.engineApproach), asc(base.reviewerApproach)).limit(TOP),
    db.select({ rule: disagreed.rule, count: count() }).from(disagreed).groupBy(disagreed.rule)
      .orderBy(desc(count()), asc(disagreed.rule)).limit(TOP),
    db.select({ id: tables.projects.id, code: tables.projects.code, name: tables.projects.name, archived: tables.projects.archived })
      .from(tables.projects).where(query.projectId ? eq(tables.projects.id, query.projectId) : undefined).orderBy(asc(tables.projects.code)),
    decisionsByRulesetVersion(overviewWhere(query)),
  ])

  const statusCounts = Object.fromEntries(DECISION_STATUSES.map(s => [s, 0])) as Record<DecisionStatus, number>
  for (const row of byStatus) statusCounts[row.status] = row.count
  const totalDecisions = DECISION_STATUSES.reduce((sum, s) => sum + statusCounts[s], 0)
  // Only approved or overridden decisions can be superseded, so each superseded one was reviewed.
  const reviewed = statusCounts.approved + statusCounts.overridden + statusCounts.superseded
  const overridden = overrideTotals?.overridden ?? 0

  // Every project in scope gets a row, those without decisions in the range too.
  const figures = new Map(perProject.map(row => [row.projectId, row]))
  const projects = projectRows.map((p) => {
    const f = figures.get(p.id)
    return {
      ...p,
      decisions: f?.decisions ?? 0,
      approved: f?.approved ?? 0,
      overridden: f?.overridden ?? 0,
      coreHours: f?.coreHours ?? 0,
      budgetCoreHours: f?.budgetCoreHours ?? 0,
      overBudget: f?.overBudget ?? 0,
    }
  })

  return {
    filters: query,
    decisions: { total: totalDecisions, byStatus: statusCounts },
    methods: { byApproach, byModel },
    overrides: {
      overridden,
      reviewed,
      rate: reviewed ? overridden / reviewed : null,
      pairs: pairs.map(p => ({ engineApproach: p.engineApproach, reviewerApproach: p.reviewerApproach!, count: p.count })),
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
