// Payloads of the decision and review routes. The case itself is the engine's schema, so the
// questionnaire, the routes and the engine check the same rules.
import { z } from 'zod'
import {
  APPROACH_IDS,
  APPROACH_LABELS,
  MODELS_BY_APPROACH,
  WALL_TREATMENTS,
  WALL_TREATMENT_LABELS,
  WALL_TREATMENTS_BY_APPROACH,
  caseInputSchema,
} from '../rules'
import { DECISION_STATUSES } from '../utils/decision-status'
import { enteredCaseSchema, enteredFromCaseInput, unitSystemSchema, validateCaseForm } from './case-form'
import { impliedTreatment, requestedChoiceSchema, yPlusConflict } from './requested-choice'
import { INT32_MAX, positiveInt, storable } from './common'
import { pageQuerySchema } from './pagination'

// A review comment must say why: a sentence, not a tick.
export const MIN_REVIEW_COMMENT = 15
const MAX_TEXT = 4000

export const versionSchema = z.number({
  required_error: 'The version you last saw is required; reload the decision.',
  invalid_type_error: 'The version must be a number.',
}).int('The version must be a whole number.').positive('The version must be a positive whole number.')
  .max(INT32_MAX, `The version must be at most ${INT32_MAX}.`)

export const decisionTitleSchema = z.string({ required_error: 'Title is required.', invalid_type_error: 'Title must be text.' })
  .trim().min(1, 'Title is required.').max(200, 'Title is at most 200 characters.').refine(...storable('Title'))

const notesSchema = z.string({ invalid_type_error: 'Notes must be text.' })
  .trim().max(10_000, 'Notes are at most 10,000 characters.').refine(...storable('Notes'))

function commentSchema(what: string, min = 1) {
  return z.string({ required_error: `${what} is required.`, invalid_type_error: `${what} must be text.` })
    .trim()
    .min(min, min > 1 ? `${what} needs at least a sentence (${min} characters or more).` : `${what} is required.`)
    .max(MAX_TEXT, `${what} is at most ${MAX_TEXT} characters.`)
    .refine(...storable(what))
}

export const adviceRequestSchema = z.object({ caseInput: caseInputSchema }, { required_error: 'A case input is required.' })

/**
 * A case as a form or an API client sends it: the values as typed with their units ("entered",
 * with the unit system) or the engine's SI case ("caseInput"), and optionally the engineer's own
 * approach or wall treatment. The output always carries both the SI case and the typed values.
 */
const caseSubmissionFields = {
  caseInput: caseInputSchema.optional(),
  entered: enteredCaseSchema.optional(),
  unitSystem: unitSystemSchema.optional(),
  requested: requestedChoiceSchema.optional(),
}
type CaseSubmissionIn = {
  caseInput?: z.output<typeof caseInputSchema>
  entered?: z.output<typeof enteredCaseSchema>
  unitSystem?: z.output<typeof unitSystemSchema>
  requested?: z.output<typeof requestedChoiceSchema>
}

function sortedJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(sortedJson).join(',')}]`
  if (value && typeof value === 'object') {
    return `{${Object.keys(value).sort().filter(k => (value as Record<string, unknown>)[k] !== undefined)
      .map(k => `${JSON.stringify(k)}:${sortedJson((value as Record<string, unknown>)[k])}`).join(',')}}`
  }
  return JSON.stringify(value)
}

function checkCaseSubmission(body: CaseSubmissionIn, ctx: z.RefinementCtx, required: boolean) {
  const requested = body.requested
  if (body.entered) {
    // The object's own checks (units, structure) may have failed already; then there is no case to
    // check, and their messages say what is wrong.
    let checked: ReturnType<typeof validateCaseForm>
    try {
      checked = validateCaseForm(body.entered)
    } catch {
      return
    }
    if (!checked.ok) {
      for (const [path, message] of Object.entries(checked.errors)) {
        ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['entered', ...path.split('.')], message })
      }
      return
    }
    const conflict = yPlusConflict(checked.input.yPlusTarget, impliedTreatment(requested ?? {}))
    if (conflict) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['entered', 'yPlusTarget'], message: conflict })
    if (body.caseInput && sortedJson(body.caseInput) !== sortedJson(checked.input)) {
      ctx.addIssue({
        code: z.ZodIssueCode.custom,
        path: ['caseInput'],
        message: 'The SI case input does not match the values as entered; send the entered values alone.',
      })
    }
    return
  }
  if (!body.caseInput) {
    if (required) {
      ctx.addIssue({
        code: z.ZodIssueCode.custom,
        path: ['caseInput'],
        message: 'A case is required: the values as entered with their units, or the case input in SI.',
      })
    }
    return
  }
  const conflict = yPlusConflict(body.caseInput.yPlusTarget, impliedTreatment(requested ?? {}))
  if (conflict) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['caseInput', 'yPlusTarget'], message: conflict })
}

/** The SI case and the typed values of a checked submission (the SI case derived from the typed values when given). */
function withCase<T extends CaseSubmissionIn>(body: T) {
  const { caseInput, entered, unitSystem, requested, ...rest } = body
  const system = unitSystem ?? 'si'
  const input = entered ? (validateCaseForm(entered) as { ok: true; input: z.output<typeof caseInputSchema> }).input : caseInput!
  return {
    ...rest,
    caseInput: input,
    unitSystem: system,
    entered: entered ?? enteredFromCaseInput(input, system),
    requested: requested && (requested.approach || requested.wallTreatment) ? requested : undefined,
  }
}

export const decisionCreateSchema = z.object({
  title: decisionTitleSchema,
  notes: notesSchema.optional(),
  ...caseSubmissionFields,
}).superRefine((body, ctx) => checkCaseSubmission(body, ctx, true)).transform(withCase)
export type DecisionCreateBody = z.output<typeof decisionCreateSchema>

export const decisionReviseSchema = z.object({
  notes: notesSchema.optional(),
  title: decisionTitleSchema.optional(),
  version: versionSchema,
  ...caseSubmissionFields,
}).superRefine((body, ctx) => checkCaseSubmission(body, ctx, true)).transform(withCase)
export type DecisionReviseBody = z.output<typeof decisionReviseSchema>

export const decisionListQuerySchema = z.object({
  status: z.enum(DECISION_STATUSES, {
    errorMap: () => ({ message: `Status must be one of: ${DECISION_STATUSES.join(', ')}.` }),
  }).optional(),
}).merge(pageQuerySchema(100, 20))
export type DecisionListQuery = z.infer<typeof decisionListQuerySchema>

export const revisionParamsSchema = z.object({
  id: positiveInt('The id', { coerce: true }),
  n: positiveInt('The revision', { coerce: true }),
})

export const submitSchema = z.object({ version: versionSchema })

export const approveSchema = z.object({
  version: versionSchema,
  comment: commentSchema('The comment').optional(),
})

const overrideChoice = z.object({
  approach: z.enum(APPROACH_IDS, {
    errorMap: () => ({ message: `Choose an approach: ${APPROACH_IDS.map(id => APPROACH_LABELS[id]).join(', ')}.` }),
  }),
  model: z.string({ required_error: 'Choose a model.', invalid_type_error: 'The model must be text.' }).trim().min(1, 'Choose a model.'),
  wallTreatment: z.enum(WALL_TREATMENTS, {
    errorMap: () => ({ message: `Choose a wall treatment: ${WALL_TREATMENTS.map(t => WALL_TREATMENT_LABELS[t]).join(', ')}.` }),
  }),
  yPlusTarget: z.number({ invalid_type_error: 'Target y+ must be a number.' })
    .positive('Target y+ must be greater than zero.').max(1000, 'Target y+ must be at most 1000.').optional(),
  comment: commentSchema('The reason for the override', MIN_REVIEW_COMMENT),
  disagreedRules: z.array(
    z.string({ invalid_type_error: 'Each rule must be given by its id.' }).trim().min(1, 'A rule id cannot be empty.'),
    { invalid_type_error: 'The rules disagreed with must be a list of rule ids.' },
  ).max(100, 'At most 100 rules.').default([]),
})

// The chosen model and wall treatment must belong to the chosen approach.
function checkOverrideChoice(value: z.infer<typeof overrideChoice>, ctx: z.RefinementCtx) {
  const models = MODELS_BY_APPROACH[value.approach]
  if (!models.includes(value.model)) {
    ctx.addIssue({
      code: z.ZodIssueCode.custom,
      path: ['model'],
      message: `${APPROACH_LABELS[value.approach]} uses one of: ${models.join(', ')}.`,
    })
  }
  const treatments = WALL_TREATMENTS_BY_APPROACH[value.approach]
  if (!treatments.includes(value.wallTreatment)) {
    ctx.addIssue({
      code: z.ZodIssueCode.custom,
      path: ['wallTreatment'],
      message: `${APPROACH_LABELS[value.approach]} goes with: ${treatments.map(t => WALL_TREATMENT_LABELS[t]).join(', ')}.`,
    })
  }
}

/** The override form's fields (the page adds the version it loaded). */
export const overrideFormSchema = overrideChoice.superRefine(checkOverrideChoice)
export const overrideSchema = overrideChoice.extend({ version: versionSchema }).superRefine(checkOverrideChoice)
export type OverrideBody = z.infer<typeof overrideSchema>

export const requestChangesSchema = z.object({
  version: versionSchema,
  comment: commentSchema('The request for changes', MIN_REVIEW_COMMENT),
})

export const supersedeSchema = z.object({
  version: versionSchema,
  title: decisionTitleSchema.optional(),
})

export const decisionCommentSchema = z.object({ comment: commentSchema('The comment') })
