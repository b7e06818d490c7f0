// A saved decision re-evaluated under today's engine and published ruleset, to show what would
// differ. Nothing in the record changes: only the author's superseding decision would.
import { and, eq } from 'drizzle-orm'
import { ENGINE_VERSION, adviseParsed, caseInputSchema, type Advice } from '#shared/rules'
import { tables, useDb } from '../db'
import { choiceOf } from './cases'
import { changedRuleIds, responsibleRules, sameChoice } from './replay'
import { publishedRuleset } from './rulesets'

async function currentRevisionOf(decisionId: number) {
  const r = tables.decisionRevisions
  const [row] = await useDb().select({ revision: r }).from(r)
    .innerJoin(tables.decisions, and(eq(tables.decisions.id, r.decisionId), eq(tables.decisions.currentRevision, r.revision)))
    .where(eq(tables.decisions.id, decisionId))
  if (!row) throw createError({ statusCode: 404, message: `Decision ${decisionId} does not exist` })
  return row.revision
}

/** The stored version's rules as data, when the catalogue has it (it may not fit today's schema). */
async function storedRules(key: string, version: string) {
  const rows = await useDb().select({ rules: tables.rulesets.rules, status: tables.rulesets.status }).from(tables.rulesets)
    .where(and(eq(tables.rulesets.key, key), eq(tables.rulesets.version, version)))
  return rows.find(row => row.status !== 'draft')?.rules ?? null
}

function listDifference(before: string[], after: string[]) {
  return { added: after.filter(item => !before.includes(item)), removed: before.filter(item => !after.includes(item)) }
}

function scoreChanges(before: Advice, now: Advice) {
  const old = new Map(before.approaches.map(a => [a.id, a.score]))
  return now.approaches
    .map(a => ({ approach: a.id, before: old.get(a.id) ?? null, now: a.score }))
    .filter(s => s.before !== s.now)
}

export async function reevaluateDecision(decisionId: number) {
  const revision = await currentRevisionOf(decisionId)
  const ruleset = await publishedRuleset()
  const parsed = caseInputSchema.safeParse(revision.caseInput)
  if (!parsed.success) {
    throw createError({ statusCode: 409, message: `This decision's input does not fit engine ${ENGINE_VERSION}: ${parsed.error.issues[0]?.message}; revise it in a superseding decision` })
  }
  const now = adviseParsed(parsed.data, { ruleset })
  const before = revision.advice
  const made = choiceOf(before)
  const current = choiceOf(now)
  const oldRules = await storedRules(revision.rulesetId, revision.rulesetVersion)
  const changed = oldRules ? changedRuleIds({ rules: oldRules }, ruleset) : new Set(ruleset.rules.map(rule => rule.id))
  const fired = (advice: Advice) => advice.trace.filter(entry => entry.fired).map(entry => entry.rule)
  return {
    made: { rulesetId: revision.rulesetId, rulesetVersion: revision.rulesetVersion, engineVersion: revision.engineVersion, recommendation: made },
    current: { rulesetId: ruleset.id, rulesetVersion: ruleset.version, engineVersion: ENGINE_VERSION, recommendation: current },
    newerRuleset: revision.rulesetId !== ruleset.id || revision.rulesetVersion !== ruleset.version,
    newerEngine: revision.engineVersion !== ENGINE_VERSION,
    recommendationChanged: !sameChoice(made, current),
    differs: {
      approach: made.approach !== current.approach,
      model: made.model !== current.model,
      wallTreatment: made.wallTreatment !== current.wallTreatment,
    },
    rules: responsibleRules(before, now, changed),
    firedRules: listDifference(fired(before), fired(now)),
    scores: scoreChanges(before, now),
    cautions: listDifference(before.cautions, now.cautions),
  }
}
