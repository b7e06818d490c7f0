/**
 * The shape of a ruleset, checked when the ruleset module loads. Rules are data: a condition in
 * json-logic over the facts (see facts.ts), and effects on scores, models, wall treatments and
 * cautions. A ruleset that does not fit this schema stops the engine from loading, so a bad edit
 * is found by the first test rather than by a user.
 */
import { z } from 'zod'
import { APPROACH_IDS, MODELS_BY_APPROACH, WALL_TREATMENTS, WALL_TREATMENTS_BY_APPROACH, type ApproachId } from './approaches'
import { FACT_PATHS, PHYSICS_FACT_PATHS } from './facts'

/** json-logic operations a rule may use. Array operations with their own scope (map, some, all...) are left out so every var names a fact. */
export const ALLOWED_OPERATIONS: ReadonlySet<string> = new Set([
  'var', '==', '===', '!=', '!==', '!', '!!', 'or', 'and', 'if', '?:',
  '>', '>=', '<', '<=', 'max', 'min', '+', '-', '*', '/', '%', 'in', 'cat',
])

export interface LogicProblem {
  path: (string | number)[]
  message: string
}

/** Every reason a value is not a json-logic expression over known facts (`facts`: the paths it may read). */
export function logicProblems(logic: unknown, path: (string | number)[] = [], facts: ReadonlySet<string> = FACT_PATHS): LogicProblem[] {
  if (logic === null || typeof logic === 'boolean' || typeof logic === 'string') return []
  if (typeof logic === 'number') return Number.isFinite(logic) ? [] : [{ path, message: 'Numbers in rules must be finite.' }]
  if (Array.isArray(logic)) return logic.flatMap((item, index) => logicProblems(item, [...path, index], facts))
  if (typeof logic !== 'object') return [{ path, message: 'Not a json-logic value.' }]
  const keys = Object.keys(logic)
  if (keys.length !== 1) return [{ path, message: `A json-logic operation has exactly one key; found ${keys.length}.` }]
  const operation = keys[0]!
  const argument = (logic as Record<string, unknown>)[operation]
  if (!ALLOWED_OPERATIONS.has(operation)) return [{ path, message: `Unknown or disallowed json-logic operation "${operation}".` }]
  if (operation === 'var') {
    const name = Array.isArray(argument) ? argument[0] : argument
    if (typeof name !== 'string' || !FACT_PATHS.has(name)) {
      return [{ path: [...path, 'var'], message: `Unknown fact ${JSON.stringify(name)}; see FACT_PATHS in facts.ts.` }]
    }
    if (!facts.has(name)) {
      return [{ path: [...path, 'var'], message: `The fact ${JSON.stringify(name)} is a cost; treatment rules choose from the physics alone, before costs exist.` }]
    }
    return []
  }
  return logicProblems(argument, [...path, operation], facts)
}

/** A json-logic expression; validated structurally, typed loosely. */
export const logicSchema = z.unknown().superRefine((value, ctx) => {
  if (value === undefined) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, message: 'A json-logic condition is required.' })
    return
  }
  for (const problem of logicProblems(value)) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, path: problem.path, message: problem.message })
  }
})

/** A score change: a constant, or a json-logic expression that evaluates to a number on the facts. */
const scoreChangeSchema = z.union([
  z.number().finite().min(-100).max(100),
  z.record(z.unknown()).superRefine((value, ctx) => {
    for (const problem of logicProblems(value)) {
      ctx.addIssue({ code: z.ZodIssueCode.custom, path: problem.path, message: problem.message })
    }
  }),
])

function perApproach<T extends z.ZodTypeAny>(value: T) {
  const shape = Object.fromEntries(APPROACH_IDS.map((id) => [id, value.optional()])) as Record<ApproachId, z.ZodOptional<T>>
  return z.object(shape).strict()
}

export const ruleSchema = z
  .object({
    id: z.string().regex(/^[a-z][a-z0-9-]*$/, 'Rule ids are lower-case words joined by hyphens.'),
    title: z.string().min(3),
    stage: z.enum(['treatment', 'scoring']),
    when: logicSchema,
    effects: z
      .object({
        scores: perApproach(scoreChangeSchema).optional(),
        models: perApproach(z.string().min(1)).optional(),
        wallTreatment: perApproach(z.enum(WALL_TREATMENTS)).optional(),
        cautions: z.array(z.string().min(1)).optional(),
      })
      .strict(),
    why: z.string().min(20),
    source: z.string().min(3),
  })
  .strict()
  .superRefine((rule, ctx) => {
    const { effects } = rule
    if (!effects.scores && !effects.models && !effects.wallTreatment && !effects.cautions?.length) {
      ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['effects'], message: 'A rule must have at least one effect.' })
    }
    if (rule.stage === 'treatment') {
      for (const problem of logicProblems(rule.when, ['when'], PHYSICS_FACT_PATHS)) {
        if (problem.message.includes('is a cost')) ctx.addIssue({ code: z.ZodIssueCode.custom, path: problem.path, message: problem.message })
      }
    }
    if (rule.stage === 'treatment' && (effects.scores || effects.models)) {
      ctx.addIssue({
        code: z.ZodIssueCode.custom,
        path: ['effects'],
        message: 'Treatment-stage rules set wall treatments and cautions only; scores and models belong to scoring rules.',
      })
    }
    if (rule.stage === 'scoring' && effects.wallTreatment) {
      ctx.addIssue({
        code: z.ZodIssueCode.custom,
        path: ['effects', 'wallTreatment'],
        message: 'Wall treatments are chosen by treatment-stage rules, before costs are scored.',
      })
    }
    for (const [approach, model] of Object.entries(effects.models ?? {}) as [ApproachId, string | undefined][]) {
      if (model !== undefined && !MODELS_BY_APPROACH[approach].includes(model)) {
        ctx.addIssue({
          code: z.ZodIssueCode.custom,
          path: ['effects', 'models', approach],
          message: `"${model}" is not among the models listed for ${approach}.`,
        })
      }
    }
    for (const [approach, treatment] of Object.entries(effects.wallTreatment ?? {}) as [ApproachId, string | undefined][]) {
      if (treatment !== undefined && !(WALL_TREATMENTS_BY_APPROACH[approach] as readonly string[]).includes(treatment)) {
        ctx.addIssue({
          code: z.ZodIssueCode.custom,
          path: ['effects', 'wallTreatment', approach],
          message: `${approach} cannot use the wall treatment "${treatment}".`,
        })
      }
    }
  })

export const rulesetSchema = z
  .object({
    id: z.string().regex(/^[a-z][a-z0-9-]*$/),
    version: z.string().regex(/^\d+\.\d+\.\d+$/, 'Ruleset versions are semantic versions, e.g. 1.0.0.'),
    baseScores: perApproach(z.number().min(0).max(100)).required(),
    baseWhy: z.string().min(20),
    rules: z.array(ruleSchema).min(1),
  })
  .strict()
  .superRefine((ruleset, ctx) => {
    const seen = new Set<string>()
    let scoringStarted = false
    ruleset.rules.forEach((rule, index) => {
      if (seen.has(rule.id)) {
        ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['rules', index, 'id'], message: `Duplicate rule id "${rule.id}".` })
      }
      seen.add(rule.id)
      if (rule.stage === 'scoring') scoringStarted = true
      else if (scoringStarted) {
        ctx.addIssue({
          code: z.ZodIssueCode.custom,
          path: ['rules', index, 'stage'],
          message: 'Treatment-stage rules come before scoring rules, in the order they are evaluated.',
        })
      }
    })
  })

export type Rule = z.output<typeof ruleSchema>
export type Ruleset = z.output<typeof rulesetSchema>
export type RulesetSource = z.input<typeof rulesetSchema>
