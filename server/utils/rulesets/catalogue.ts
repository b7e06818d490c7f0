// The writes of the ruleset catalogue: a draft, its edits and canonical cases, and publication
// (the previous version retired, the history chained), each inside the caller's transaction.
// Relative imports only, so the demo seed writes its versions through the same steps; refusals
// come back as values and the server (rulesets.ts beside it) turns them into HTTP answers.
import { and, asc, eq, ne } from 'drizzle-orm'
import { RULESET, compileRuleset, RulesetInvalidError, type CaseInput, type Rule, type RulesetProblem, type Ruleset } from '../../../shared/rules'
import type { ExpectedRecommendation } from '../../../shared/types/rulesets'
import type { Role } from '../../../shared/utils/roles'
import { canonicalHash } from '../../db/event-chain'
import { SHIPPED_RULESETS } from '../../db/ruleset-releases'
import * as schema from '../../db/schema'
import type { DbOrTx } from '../../db/types'
import { checkCases } from './cases'
import { engineForm, type RulesetRow } from './compiled'
import { appendRulesetEvent, lockRulesetCatalogue, type RulesetEventType } from './history'

export type CatalogueActor = { id: number; role: Role }
export type CanonicalCase = { title: string; caseInput: CaseInput; expected: ExpectedRecommendation }

/** Semantic versions compared as numbers: 1.10.0 comes after 1.9.0. */
export function compareVersions(a: string, b: string): number {
  const pa = a.split('.').map(Number)
  const pb = b.split('.').map(Number)
  for (let index = 0; index < 3; index++) {
    const difference = (pa[index] ?? 0) - (pb[index] ?? 0)
    if (difference) return difference
  }
  return 0
}

export function nextMinorVersion(version: string): string {
  const [major = 0, minor = 0] = version.split('.').map(Number)
  return `${major}.${minor + 1}.0`
}

/** The highest published or retired version of a ruleset key, or null when none is. */
export async function latestReleasedVersion(db: DbOrTx, key: string): Promise<string | null> {
  const rows = await db.select({ version: schema.rulesets.version }).from(schema.rulesets)
    .where(and(eq(schema.rulesets.key, key), ne(schema.rulesets.status, 'draft')))
  return rows.map(row => row.version).sort(compareVersions).at(-1) ?? null
}

export async function insertDraft(tx: DbOrTx, input: {
  source: { id: string; version: string; baseScores: Partial<Ruleset['baseScores']>; baseWhy: string; rules: Rule[] }
  note?: string
  basedOnId?: number | null
  actor: CatalogueActor | null
  cases?: CanonicalCase[]
  at?: Date
}): Promise<RulesetRow> {
  const at = input.at ?? new Date()
  const [row] = await tx.insert(schema.rulesets).values({
    key: input.source.id,
    version: input.source.version,
    status: 'draft',
    // An earlier version's scores are stored as they shipped, whatever approaches today's engine has.
    baseScores: input.source.baseScores as Ruleset['baseScores'],
    baseWhy: input.source.baseWhy,
    rules: input.source.rules,
    note: input.note ?? '',
    basedOnId: input.basedOnId ?? null,
    createdBy: input.actor?.id ?? null,
    createdAt: at,
    updatedAt: at,
  }).returning()
  if (input.cases?.length) await replaceCases(tx, row!.id, input.cases)
  return row!
}

export async function readCases(db: DbOrTx, rulesetId: number) {
  return db.select().from(schema.rulesetCases).where(eq(schema.rulesetCases.rulesetId, rulesetId))
    .orderBy(asc(schema.rulesetCases.position))
}

/** A draft's canonical cases replaced as a whole (the trigger refuses it for a released version). */
export async function replaceCases(tx: DbOrTx, rulesetId: number, cases: CanonicalCase[]) {
  await tx.delete(schema.rulesetCases).where(eq(schema.rulesetCases.rulesetId, rulesetId))
  if (!cases.length) return []
  return tx.insert(schema.rulesetCases).values(cases.map((item, position) => ({
    rulesetId, position, title: item.title, caseInput: item.caseInput, expected: item.expected,
  }))).returning()
}

export type PublishRefusal =
  | { reason: 'missing' }
  | { reason: 'not-draft'; status: RulesetRow['status'] }
  | { reason: 'invalid'; problems: RulesetProblem[] }
  | { reason: 'cases-fail'; failures: { title: string; misses: string[] }[] }
  | { reason: 'version-taken'; version: string; latest: string }

/**
 * Publishes a draft that has passed the checks: the published version (if any) retires, the draft
 * becomes published with its content hash, and the history gains the event. Holds the lock.
 */
export async function releaseDraft(tx: DbOrTx, input: {
  row: RulesetRow
  note: string
  actor: CatalogueActor | null
  type?: RulesetEventType
  at?: Date
}): Promise<RulesetRow> {
  const at = input.at ?? new Date()
  await lockRulesetCatalogue(tx)
  const [retired] = await tx.update(schema.rulesets).set({ status: 'retired', retiredAt: at, updatedAt: at })
    .where(eq(schema.rulesets.status, 'published')).returning()
  const contentHash = canonicalHash(engineForm(input.row))
  const [published] = await tx.update(schema.rulesets).set({
    status: 'published', note: input.note, contentHash, publishedBy: input.actor?.id ?? null, publishedAt: at, updatedAt: at,
  }).where(and(eq(schema.rulesets.id, input.row.id), eq(schema.rulesets.status, 'draft'))).returning()
  await appendRulesetEvent(tx, {
    rulesetId: published!.id,
    type: input.type ?? 'published',
    actor: input.actor,
    payload: {
      key: published!.key,
      version: published!.version,
      note: input.note,
      contentHash,
      rules: published!.rules.length,
      replaces: retired ? { id: retired.id, version: retired.version } : null,
    },
    at,
  })
  return published!
}

/**
 * Publication of a draft: valid under today's engine, every canonical case passing, and a version
 * after every released one. A refusal says which check failed; nothing changes then.
 */
export async function publishDraft(tx: DbOrTx, input: { id: number; note: string; actor: CatalogueActor; at?: Date }): Promise<{ row: RulesetRow } | { refusal: PublishRefusal }> {
  await lockRulesetCatalogue(tx)
  const [row] = await tx.select().from(schema.rulesets).where(eq(schema.rulesets.id, input.id)).for('update')
  if (!row) return { refusal: { reason: 'missing' } }
  if (row.status !== 'draft') return { refusal: { reason: 'not-draft', status: row.status } }
  let ruleset: Ruleset
  try {
    ruleset = compileRuleset(engineForm(row))
  } catch (error) {
    if (error instanceof RulesetInvalidError) return { refusal: { reason: 'invalid', problems: error.problems } }
    throw error
  }
  const failures = checkCases(ruleset, await readCases(tx, row.id)).filter(item => !item.passes)
  if (failures.length) return { refusal: { reason: 'cases-fail', failures: failures.map(f => ({ title: f.title, misses: f.misses })) } }
  const latest = await latestReleasedVersion(tx, row.key)
  if (latest && compareVersions(row.version, latest) <= 0) return { refusal: { reason: 'version-taken', version: row.version, latest } }
  return { row: await releaseDraft(tx, { row, note: input.note, actor: input.actor, at: input.at }) }
}

/** The versions the engine ships, oldest first: the earlier ones kept as data, then the built-in. */
export function shippedRulesets() {
  const builtIn = JSON.parse(JSON.stringify(RULESET)) as typeof SHIPPED_RULESETS[number]
  const earlier = SHIPPED_RULESETS.filter(r => r.id === builtIn.id && compareVersions(r.version, builtIn.version) < 0)
  return [...earlier, builtIn]
}

/**
 * A database without a published ruleset gets the engine's shipped versions, the built-in one
 * published and the earlier ones retired, so advice always has a version to use. A database that
 * has one but not the built-in version (a newer engine) gets the built-in as a draft, for a lead
 * to preview and publish. Safe to run from several servers at once (the catalogue's lock).
 */
export async function installShippedRulesets(db: DbOrTx) {
  await db.transaction(async (tx) => {
    await lockRulesetCatalogue(tx)
    const rows = await tx.select({ key: schema.rulesets.key, version: schema.rulesets.version, status: schema.rulesets.status })
      .from(schema.rulesets)
    const shipped = shippedRulesets()
    const builtIn = shipped.at(-1)!
    if (rows.some(row => row.status === 'published')) {
      if (!rows.some(row => row.key === builtIn.id && row.version === builtIn.version)) {
        await insertDraft(tx, { source: builtIn, actor: null, note: `The ruleset shipped with this engine (${builtIn.id} ${builtIn.version}); preview its impact before publishing it.` })
      }
      return
    }
    for (const source of rows.length ? [builtIn] : shipped) {
      const taken = await latestReleasedVersion(tx, source.id)
      if (taken && compareVersions(source.version, taken) <= 0) continue
      const row = await insertDraft(tx, { source, actor: null })
      await releaseDraft(tx, { row, note: `Installed with the engine (ruleset ${source.id} ${source.version}).`, actor: null, type: 'installed' })
    }
  })
}
