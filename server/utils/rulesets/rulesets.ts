// The ruleset catalogue as the routes see it: reading versions, the published one for advice,
// drafting, editing, canonical cases and publication, with the server's refusals.
import { eq, inArray, ne, sql } from 'drizzle-orm'
import { RulesetInvalidError, describeProblem, rulesetProblems, type Ruleset, type RulesetProblem } from '#shared/rules'
import type { SessionUser } from '#shared/types/session'
import type { RulesetCreateBody, RulesetUpdateBody } from '#shared/schemas/rulesets'
import { canonicalCaseSchema } from '#shared/schemas/rulesets'
import { RULESET_EDITORS } from '#shared/utils/ruleset-status'
import type { DbOrTx } from '../../db/types'
import { conflict, notFound } from '../http/errors'
import { tables, useDb } from '../db'
import { checkCases } from './cases'
import {
  compareVersions, insertDraft, installShippedRulesets, latestReleasedVersion, nextMinorVersion, publishDraft, readCases,
  replaceCases, type CanonicalCase, type PublishRefusal,
} from './catalogue'
import { cachedRelease, compiledRelease, compiledRuleset, engineForm, type RulesetRow } from './compiled'
import { checkRulesetChain, readRulesetHistory } from './history'

const rulesets = tables.rulesets

export function isRulesetEditor(user: SessionUser) {
  return (RULESET_EDITORS as readonly string[]).includes(user.role)
}

let installing: Promise<void> | undefined
/** Once per server: a database without a published ruleset gets the engine's shipped versions. */
export function ensureRulesetCatalogue(): Promise<void> {
  installing ??= installShippedRulesets(useDb()).catch((error) => {
    installing = undefined
    throw error
  })
  return installing
}

/** The published version's row (the catalogue installed first when empty). */
export async function publishedRulesetRow(db: DbOrTx = useDb()) {
  await ensureRulesetCatalogue()
  const [row] = await db.select().from(rulesets).where(eq(rulesets.status, 'published'))
  if (!row) throw createError({ statusCode: 503, message: 'No ruleset is published; a team lead must publish one' })
  return row
}

function unfitForEngine(row: { key: string; version: string }, error: RulesetInvalidError) {
  return createError({
    statusCode: 503,
    message: `The published ruleset ${row.key} ${row.version} does not fit this engine (${error.problems.slice(0, 2).map(describeProblem).join('; ')}); a team lead must publish a version that does`,
  })
}

/**
 * What new advice uses: the published version, compiled once per version and kept in memory. One
 * small query per call finds which version that is, so a publication elsewhere is seen at once.
 */
export async function publishedRuleset(db: DbOrTx = useDb()): Promise<Ruleset> {
  await ensureRulesetCatalogue()
  const [head] = await db.select({ id: rulesets.id, key: rulesets.key, version: rulesets.version })
    .from(rulesets).where(eq(rulesets.status, 'published'))
  if (!head) throw createError({ statusCode: 503, message: 'No ruleset is published; a team lead must publish one' })
  return releaseOf(head, db)
}

/** A released version by its head (id, key, version): from memory once compiled, else read and compiled. */
export async function releaseOf(head: { id: number; key: string; version: string }, db: DbOrTx = useDb()): Promise<Ruleset> {
  const cached = cachedRelease(head.key, head.version)
  if (cached) return cached
  const [row] = await db.select().from(rulesets).where(eq(rulesets.id, head.id))
  try {
    return compiledRelease(row!)
  } catch (error) {
    if (error instanceof RulesetInvalidError) throw unfitForEngine(row!, error)
    throw error
  }
}

async function userNames(ids: (number | null)[]) {
  const wanted = [...new Set(ids.filter((id): id is number => id !== null))]
  if (!wanted.length) return new Map<number, string>()
  const rows = await useDb().select({ id: tables.users.id, name: tables.users.name }).from(tables.users).where(inArray(tables.users.id, wanted))
  return new Map(rows.map(row => [row.id, row.name]))
}

/**
 * How many decisions stand on each version: those whose current revision names it, read from the
 * monthly tally the summaries keep (a few rows however many decisions there are).
 */
async function decisionCounts() {
  const t = tables.decisionRulesetTallies
  const rows = await useDb().select({ key: t.rulesetId, version: t.rulesetVersion, count: sql<number>`sum(${t.decisions})::int` })
    .from(t).groupBy(t.rulesetId, t.rulesetVersion)
  return new Map(rows.map(row => [`${row.key}@${row.version}`, row.count]))
}

function toDto(row: RulesetRow, names: Map<number, string>, decisions: number) {
  const person = (id: number | null) => (id === null ? null : { id, name: names.get(id) ?? `user ${id}` })
  return {
    id: row.id,
    key: row.key,
    version: row.version,
    status: row.status,
    rules: row.rules,
    baseScores: row.baseScores,
    baseWhy: row.baseWhy,
    note: row.note,
    basedOnId: row.basedOnId,
    contentHash: row.contentHash,
    createdBy: person(row.createdBy),
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
    publishedBy: person(row.publishedBy),
    publishedAt: row.publishedAt,
    retiredAt: row.retiredAt,
    decisions,
  }
}
export type RulesetDto = ReturnType<typeof toDto>

async function toDtos(rows: RulesetRow[]) {
  const [names, counts] = await Promise.all([
    userNames(rows.flatMap(row => [row.createdBy, row.publishedBy])),
    decisionCounts(),
  ])
  return rows.map(row => toDto(row, names, row.status === 'draft' ? 0 : counts.get(`${row.key}@${row.version}`) ?? 0))
}

/** Every version, newest first; drafts only for those who edit rulesets. */
export async function listRulesets(user: SessionUser) {
  await ensureRulesetCatalogue()
  const rows = await useDb().select().from(rulesets)
    .where(isRulesetEditor(user) ? undefined : ne(rulesets.status, 'draft'))
  rows.sort((a, b) => compareVersions(b.version, a.version) || b.id - a.id)
  return toDtos(rows)
}

/** One version's row; a draft is not revealed to those who cannot edit it. */
export async function requireRulesetRow(id: number, user: SessionUser, db: DbOrTx = useDb()) {
  const [row] = await db.select().from(rulesets).where(eq(rulesets.id, id))
  if (!row || (row.status === 'draft' && !isRulesetEditor(user))) throw notFound(`Ruleset ${id} does not exist`)
  return row
}

export async function readRuleset(row: RulesetRow) {
  const [dto] = await toDtos([row])
  return dto!
}

function invalidRules(problems: RulesetProblem[]) {
  const shown = problems.slice(0, 5).map(describeProblem)
  const more = problems.length > shown.length ? ` (and ${problems.length - shown.length} more)` : ''
  return createError({
    statusCode: 400,
    message: `${shown.join('; ')}${more}`,
    data: {
      problems: problems.map(p => ({ rule: p.ruleId, ruleIndex: p.ruleIndex, path: p.path.join('.'), message: p.message })),
      fieldErrors: Object.fromEntries(problems.map(p => [
        [p.ruleIndex === null ? null : `rules.${p.ruleIndex}`, ...p.path].filter(part => part !== null).join('.') || '_form',
        [describeProblem(p)],
      ])),
    },
  })
}

async function checkedVersion(db: DbOrTx, key: string, version: string) {
  const latest = await latestReleasedVersion(db, key)
  if (latest && compareVersions(version, latest) <= 0) {
    throw createError({ statusCode: 400, message: `Version ${version} is not after ${latest}, the latest released version; choose a later one`, data: { fieldErrors: { version: [`Choose a version after ${latest}.`] } } })
  }
  return version
}

/** An imported file: an exported ruleset with its cases, or a bare ruleset in the engine's shape. */
function importedSource(data: Record<string, unknown>) {
  const source = (typeof data.ruleset === 'object' && data.ruleset !== null ? data.ruleset : data) as Record<string, unknown>
  const problems = rulesetProblems(source)
  if (problems.length) throw invalidRules(problems)
  const parsedCases = canonicalCaseSchema.array().max(200).safeParse(data.cases ?? [])
  if (!parsedCases.success) {
    throw createError({ statusCode: 400, message: `The imported canonical cases are invalid: ${parsedCases.error.issues.slice(0, 3).map(i => `${i.path.join('.')}: ${i.message}`).join('; ')}` })
  }
  return { source: source as unknown as Ruleset, cases: parsedCases.data as CanonicalCase[] }
}

/** A new draft: a copy of a version (the published one by default; an earlier one rolls back) or an import. */
export async function createRulesetDraft(body: RulesetCreateBody, user: SessionUser) {
  const db = useDb()
  return db.transaction(async (tx) => {
    let draft: RulesetRow
    if (body.import) {
      const { source, cases } = importedSource(body.import)
      const latest = await latestReleasedVersion(tx, source.id)
      const version = latest && compareVersions(source.version, latest) <= 0 ? nextMinorVersion(latest) : source.version
      draft = await insertDraft(tx, { source: { ...engineForm({ ...source, key: source.id }), version }, note: body.note ?? `Imported from ${source.id} ${source.version}.`, actor: user, cases })
    } else {
      const from = body.from ? await requireRulesetRow(body.from, user, tx) : await publishedRulesetRow(tx)
      const latest = await latestReleasedVersion(tx, from.key)
      const rollback = from.status === 'retired'
      const cases = (await readCases(tx, from.id)).map(({ title, caseInput, expected }) => ({ title, caseInput, expected }))
      draft = await insertDraft(tx, {
        source: { ...engineForm(from), version: nextMinorVersion(latest ?? from.version) },
        note: body.note ?? (rollback ? `Rolls back to the rules of ${from.version}.` : ''),
        basedOnId: from.id,
        actor: user,
        cases,
      })
    }
    return readRuleset(draft)
  })
}

function notADraft(row: RulesetRow, doing: string) {
  return conflict(`Ruleset ${row.version} is ${row.status}: only a draft can be ${doing}; start a new draft from it`)
}

/** A draft's rules, base scores, version or note; the result must be a valid ruleset. */
export async function updateRulesetDraft(id: number, body: RulesetUpdateBody, user: SessionUser) {
  return useDb().transaction(async (tx) => {
    const [row] = await tx.select().from(rulesets).where(eq(rulesets.id, id)).for('update')
    if (!row || (row.status === 'draft' && !isRulesetEditor(user))) throw notFound(`Ruleset ${id} does not exist`)
    if (row.status !== 'draft') throw notADraft(row, 'edited')
    const candidate = { ...engineForm(row), ...body.rules && { rules: body.rules }, ...body.baseScores && { baseScores: body.baseScores }, ...body.baseWhy !== undefined && { baseWhy: body.baseWhy } }
    const problems = rulesetProblems({ ...candidate, version: body.version ?? row.version })
    if (problems.length) throw invalidRules(problems)
    const version = body.version === undefined ? row.version : await checkedVersion(tx, row.key, body.version)
    const [updated] = await tx.update(rulesets).set({
      rules: candidate.rules as RulesetRow['rules'],
      baseScores: candidate.baseScores as RulesetRow['baseScores'],
      baseWhy: candidate.baseWhy as string,
      version,
      ...(body.note !== undefined ? { note: body.note } : {}),
      updatedAt: new Date(),
    }).where(eq(rulesets.id, id)).returning()
    return readRuleset(updated!)
  })
}

export async function deleteRulesetDraft(id: number, user: SessionUser) {
  await useDb().transaction(async (tx) => {
    const [row] = await tx.select().from(rulesets).where(eq(rulesets.id, id)).for('update')
    if (!row || (row.status === 'draft' && !isRulesetEditor(user))) throw notFound(`Ruleset ${id} does not exist`)
    if (row.status !== 'draft') throw notADraft(row, 'deleted')
    await tx.delete(rulesets).where(eq(rulesets.id, id))
  })
}

/** Each canonical case with what the ruleset gives for it. */
export async function rulesetCases(row: RulesetRow, db: DbOrTx = useDb()) {
  const cases = await readCases(db, row.id)
  let ruleset: Ruleset
  try {
    ruleset = compiledRuleset(row)
  } catch (error) {
    if (!(error instanceof RulesetInvalidError)) throw error
    const reason = `the ruleset is not valid under this engine: ${describeProblem(error.problems[0]!)}`
    return cases.map(item => ({ ...item, actual: null, passes: false, misses: [reason] }))
  }
  return checkCases(ruleset, cases)
}

export async function replaceRulesetCases(id: number, cases: CanonicalCase[], user: SessionUser) {
  return useDb().transaction(async (tx) => {
    const [row] = await tx.select().from(rulesets).where(eq(rulesets.id, id)).for('update')
    if (!row || (row.status === 'draft' && !isRulesetEditor(user))) throw notFound(`Ruleset ${id} does not exist`)
    if (row.status !== 'draft') throw notADraft(row, 'given new canonical cases')
    await replaceCases(tx, id, cases)
    await tx.update(rulesets).set({ updatedAt: new Date() }).where(eq(rulesets.id, id))
    return rulesetCases(row, tx)
  })
}

function publishRefused(refusal: PublishRefusal, id: number) {
  switch (refusal.reason) {
    case 'missing': return notFound(`Ruleset ${id} does not exist`)
    case 'not-draft': return conflict(`Ruleset ${id} is ${refusal.status}: only a draft can be published`)
    case 'invalid': return createError({ statusCode: 409, message: `This draft is not a valid ruleset: ${refusal.problems.slice(0, 3).map(describeProblem).join('; ')}`, data: { problems: refusal.problems } })
    case 'version-taken': return conflict(`Version ${refusal.version} is not after ${refusal.latest}, the latest released version; give the draft a later version`)
    case 'cases-fail': return createError({
      statusCode: 409,
      message: `${refusal.failures.length === 1 ? 'A canonical case fails' : `${refusal.failures.length} canonical cases fail`}: ${refusal.failures.slice(0, 3).map(f => `"${f.title}" gets ${f.misses.join(', ')}`).join('; ')}`,
      data: { failures: refusal.failures },
    })
  }
}

export async function publishRulesetDraft(id: number, note: string, user: SessionUser) {
  return useDb().transaction(async (tx) => {
    const result = await publishDraft(tx, { id, note, actor: user })
    if ('refusal' in result) throw publishRefused(result.refusal, id)
    return readRuleset(result.row)
  })
}

/** The ruleset history with its chain checked. */
export async function rulesetHistory() {
  await ensureRulesetCatalogue()
  const events = await readRulesetHistory(useDb())
  const names = await userNames(events.map(e => e.actorId))
  const versions = new Map((await useDb().select({ id: rulesets.id, version: rulesets.version }).from(rulesets)).map(r => [r.id, r.version]))
  return {
    chain: checkRulesetChain(events),
    events: events.map(({ actorId, ...event }) => ({
      ...event,
      version: versions.get(event.rulesetId) ?? null,
      actor: actorId === null ? null : { id: actorId, name: names.get(actorId) ?? `user ${actorId}` },
    })),
  }
}

/** The file a lead exports: the ruleset in the engine's shape with its canonical cases. */
export async function exportRuleset(row: RulesetRow) {
  const cases = await readCases(useDb(), row.id)
  return {
    format: 'eddyledger-ruleset',
    formatVersion: 1,
    status: row.status,
    note: row.note,
    ruleset: engineForm(row),
    cases: cases.map(({ title, caseInput, expected }) => ({ title, caseInput, expected })),
  }
}
