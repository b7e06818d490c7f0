// The impact preview: every past decision's latest revision (or those matching a filter) replayed
// under the published ruleset and under another version, both under today's engine. Small sets
// answer at once; large ones run as a job in this server with progress, reading the decisions in
// batches while the previous batch is evaluated.
import { randomUUID } from 'node:crypto'
import { and, asc, count, eq, gt, gte, lt, sql, type SQL } from 'drizzle-orm'
import { RulesetInvalidError, describeProblem, type Ruleset } from '#shared/rules'
import type { ImpactFilter } from '#shared/schemas/rulesets'
import type { SessionUser } from '#shared/types/session'
import type { RecommendationChoice } from '#shared/types/rulesets'
import { tables, useDb } from '../db'
import { currentRevisionJoin } from '../decisions/queries'
import { compiledRuleset, type RulesetRow } from './compiled'
import { createReplay, type ImpactChange, type ImpactProblem, type StoredRevision } from './replay'
import { publishedRulesetRow, publishedRuleset } from './rulesets'

const decisions = tables.decisions
const revisions = tables.decisionRevisions

/** Up to this many decisions the route answers with the result; beyond, it starts a job. */
export const IMPACT_SYNC_LIMIT = 5_000
const BATCH = 1_000

function dayAfter(isoDate: string) {
  const day = new Date(`${isoDate}T00:00:00Z`)
  day.setUTCDate(day.getUTCDate() + 1)
  return day
}

// Decisions created within the range (whole UTC days, both ends inclusive), as the overview counts them.
function impactWhere(filter: ImpactFilter): SQL | undefined {
  return and(
    filter.projectId ? eq(decisions.projectId, filter.projectId) : undefined,
    filter.status ? eq(decisions.status, filter.status) : undefined,
    filter.from ? gte(decisions.createdAt, new Date(`${filter.from}T00:00:00Z`)) : undefined,
    filter.to ? lt(decisions.createdAt, dayAfter(filter.to)) : undefined,
  )
}

export async function countImpactDecisions(filter: ImpactFilter) {
  const [row] = await useDb().select({ total: count() }).from(decisions).where(impactWhere(filter))
  return row?.total ?? 0
}

function readBatch(filter: ImpactFilter, after: number): Promise<StoredRevision[]> {
  return useDb().select({
    decisionId: decisions.id,
    caseInput: revisions.caseInput,
    inputHash: revisions.inputHash,
    rulesetId: revisions.rulesetId,
    rulesetVersion: revisions.rulesetVersion,
    engineVersion: revisions.engineVersion,
    recommendation: sql<RecommendationChoice>`${revisions.advice}->'recommendation'`,
  }).from(decisions).innerJoin(revisions, currentRevisionJoin)
    .where(and(impactWhere(filter), gt(decisions.id, after)))
    .orderBy(asc(decisions.id)).limit(BATCH)
}

/** The two sides, compiled once for the whole run; 409 when the other version does not fit today's engine. */
async function impactSides(row: RulesetRow) {
  const from = await publishedRuleset()
  let to: Ruleset
  try {
    to = compiledRuleset(row)
  } catch (error) {
    if (!(error instanceof RulesetInvalidError)) throw error
    throw createError({ statusCode: 409, message: `Ruleset ${row.version} is not valid under this engine: ${describeProblem(error.problems[0]!)}` })
  }
  return { from, to }
}

export interface ImpactResult {
  from: { key: string; version: string }
  to: { key: string; version: string }
  filter: ImpactFilter
  evaluated: number
  changes: ImpactChange[]
  problems: ImpactProblem[]
}

async function runImpact(sides: { from: Ruleset; to: Ruleset }, filter: ImpactFilter, onProgress: (evaluated: number) => void): Promise<ImpactResult> {
  const replay = createReplay(sides.from, sides.to)
  const changes: ImpactChange[] = []
  const problems: ImpactProblem[] = []
  let evaluated = 0
  let next = readBatch(filter, 0)
  for (;;) {
    const batch = await next
    if (!batch.length) break
    next = readBatch(filter, batch.at(-1)!.decisionId)
    for (const stored of batch) {
      try {
        const change = replay.replay(stored)
        if (change) changes.push(change)
      } catch (error) {
        problems.push({ decisionId: stored.decisionId, message: error instanceof Error ? error.message : String(error) })
      }
    }
    evaluated += batch.length
    onProgress(evaluated)
  }
  return {
    from: { key: sides.from.id, version: sides.from.version },
    to: { key: sides.to.id, version: sides.to.version },
    filter,
    evaluated,
    changes,
    problems,
  }
}

export interface ImpactJob {
  id: string
  rulesetId: number
  status: 'running' | 'done' | 'failed'
  evaluated: number
  total: number
  startedAt: Date
  finishedAt: Date | null
  startedBy: number
  error: string | null
  result: ImpactResult | null
}

// Jobs live in this server's memory for an hour; a restart forgets them (the preview is recomputed).
const jobs = new Map<string, ImpactJob>()
const JOB_LIFETIME_MS = 3_600_000
const MAX_JOBS = 50

function forgetOldJobs() {
  const now = Date.now()
  for (const [id, job] of jobs) {
    if (job.finishedAt && now - job.finishedAt.getTime() > JOB_LIFETIME_MS) jobs.delete(id)
  }
  while (jobs.size >= MAX_JOBS) jobs.delete(jobs.keys().next().value!)
}

export function jobSummary(job: ImpactJob) {
  const { result, ...summary } = job
  return { ...summary, ...(result ? { evaluated: result.evaluated, changes: result.changes, problems: result.problems, from: result.from, to: result.to } : {}) }
}

/**
 * The impact of a version against the published one: the result itself for a small set (or when
 * asked), else a job to poll with GET /api/rulesets/impact-jobs/:jobId.
 */
export async function previewImpact(row: RulesetRow, request: { filter: ImpactFilter; background: boolean }, user: SessionUser) {
  await publishedRulesetRow()
  const sides = await impactSides(row)
  const total = await countImpactDecisions(request.filter)
  if (!request.background && total <= IMPACT_SYNC_LIMIT) {
    return { result: await runImpact(sides, request.filter, () => {}) }
  }
  forgetOldJobs()
  const job: ImpactJob = {
    id: randomUUID(), rulesetId: row.id, status: 'running', evaluated: 0, total,
    startedAt: new Date(), finishedAt: null, startedBy: user.id, error: null, result: null,
  }
  jobs.set(job.id, job)
  runImpact(sides, request.filter, (evaluated) => { job.evaluated = evaluated })
    .then((result) => {
      job.result = result
      job.status = 'done'
    })
    .catch((error: unknown) => {
      job.status = 'failed'
      job.error = error instanceof Error ? error.message : String(error)
    })
    .finally(() => { job.finishedAt = new Date() })
  return { job }
}

export function findImpactJob(id: string) {
  const job = jobs.get(id)
  if (!job) throw createError({ statusCode: 404, message: 'No such impact preview: it finished over an hour ago or this server restarted; run it again' })
  return job
}
