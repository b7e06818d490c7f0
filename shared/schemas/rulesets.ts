// Payloads of the ruleset routes. The rules themselves are checked by the engine's own schema
// (shared/rules/ruleset-schema.ts) when a draft is saved, so that each problem names its rule.
import { z } from 'zod'
import { APPROACH_IDS, MODELS_BY_APPROACH, WALL_TREATMENTS, WALL_TREATMENTS_BY_APPROACH, caseInputSchema } from '../rules'
import { DECISION_STATUSES } from '../utils/decision-status'
import { isoDate, projectFilterSchema } from './overview'

const MAX_NOTE = 4000

export const semverSchema = z.string({ invalid_type_error: 'The version must be text.' }).trim()
  .regex(/^\d{1,4}\.\d{1,4}\.\d{1,4}$/, 'Ruleset versions are semantic versions, e.g. 1.2.0.')

const noteSchema = z.string({ invalid_type_error: 'The note must be text.' }).trim().max(MAX_NOTE, `The note is at most ${MAX_NOTE} characters.`)

/** A new draft: a copy of a version (the published one when none is named), or an imported file. */
export const rulesetCreateSchema = z.object({
  from: z.number({ invalid_type_error: 'Copy from a ruleset given by its id.' }).int().positive().optional(),
  // An exported file (or a bare ruleset in the engine's shape); checked like any draft.
  import: z.record(z.unknown(), { invalid_type_error: 'An imported ruleset is a JSON object.' }).optional(),
  note: noteSchema.optional(),
}).strict().refine(body => !(body.from && body.import), { message: 'Copy a version or import a file, not both.', path: ['import'] })
export type RulesetCreateBody = z.infer<typeof rulesetCreateSchema>

export const rulesetUpdateSchema = z.object({
  rules: z.array(z.unknown(), { invalid_type_error: 'The rules are a list.' }).min(1, 'A ruleset needs at least one rule.').max(500).optional(),
  baseScores: z.record(z.unknown()).optional(),
  baseWhy: z.string().optional(),
  version: semverSchema.optional(),
  note: noteSchema.optional(),
}).strict().refine(body => Object.keys(body).length > 0, { message: 'Nothing to change: send rules, baseScores, baseWhy, version or note.' })
export type RulesetUpdateBody = z.infer<typeof rulesetUpdateSchema>

export const publishSchema = z.object({
  note: z.string({ required_error: 'A change note is required: say what changed and why.', invalid_type_error: 'The note must be text.' })
    .trim().min(3, 'A change note is required: say what changed and why.').max(MAX_NOTE),
}).strict()

export const expectedRecommendationSchema = z.object({
  approach: z.enum(APPROACH_IDS, { errorMap: () => ({ message: `The approach is one of ${APPROACH_IDS.join(', ')}.` }) }),
  model: z.string().min(1).optional(),
  wallTreatment: z.enum(WALL_TREATMENTS).optional(),
}).strict().superRefine((expected, ctx) => {
  if (expected.model !== undefined && !MODELS_BY_APPROACH[expected.approach].includes(expected.model)) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['model'], message: `"${expected.model}" is not among the models listed for ${expected.approach}.` })
  }
  if (expected.wallTreatment !== undefined && !(WALL_TREATMENTS_BY_APPROACH[expected.approach] as readonly string[]).includes(expected.wallTreatment)) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['wallTreatment'], message: `${expected.approach} cannot use the wall treatment "${expected.wallTreatment}".` })
  }
})

export const canonicalCaseSchema = z.object({
  title: z.string({ required_error: 'Each case needs a title.' }).trim().min(1, 'Each case needs a title.').max(200),
  caseInput: caseInputSchema,
  expected: expectedRecommendationSchema,
}).strict()

export const casesUpdateSchema = z.object({
  cases: z.array(canonicalCaseSchema).max(200, 'At most 200 canonical cases.'),
}).strict()

export const impactFilterSchema = z.object({
  projectId: projectFilterSchema,
  status: z.enum(DECISION_STATUSES, { errorMap: () => ({ message: `Status must be one of: ${DECISION_STATUSES.join(', ')}.` }) }).optional(),
  from: isoDate('From'),
  to: isoDate('To'),
}).strict().refine(q => !q.from || !q.to || q.from <= q.to, { path: ['to'], message: 'To must be on or after From.' })
export type ImpactFilter = z.infer<typeof impactFilterSchema>

/** The filter may come as `filter` or as top-level fields; `background` asks for a job with progress. */
export const impactRequestSchema = z.object({
  filter: impactFilterSchema.optional(),
  background: z.boolean().optional(),
  projectId: z.unknown().optional(),
  status: z.unknown().optional(),
  from: z.unknown().optional(),
  to: z.unknown().optional(),
}).strict().transform((body, ctx) => {
  const { filter, background, ...loose } = body
  const merged = impactFilterSchema.safeParse({ ...Object.fromEntries(Object.entries(loose).filter(([, v]) => v !== undefined)), ...filter })
  if (!merged.success) {
    for (const issue of merged.error.issues) ctx.addIssue({ ...issue, path: ['filter', ...issue.path] })
    return z.NEVER
  }
  return { filter: merged.data, background: background ?? false }
})
export type ImpactRequest = z.infer<typeof impactRequestSchema>

export const rulesetParamSchema = z.object({
  id: z.coerce.number({ invalid_type_error: 'The ruleset id must be a number' }).int().positive('The ruleset id must be a positive whole number'),
})

export const jobParamSchema = z.object({
  jobId: z.string().regex(/^[a-z0-9-]{8,64}$/, 'Not an impact job id'),
})
