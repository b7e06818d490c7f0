// Payloads of the verification routes (wall y+ checks, grid studies, run records, calibration).
import { z } from 'zod'
import { APPROACH_IDS, APPROACH_LABELS } from '../rules'
import { HARDWARE } from '../verification/calibration'
import { positiveInt } from './common'

const MAX_TEXT = 4000
export const MIN_REASON = 15

const positiveId = (what: string) => positiveInt(`The ${what}`, { coerce: true })

export const wallCheckParamsSchema = z.object({ id: positiveId('id'), checkId: positiveId('check id') })
export const gridStudyParamsSchema = z.object({ id: positiveId('id'), studyId: positiveId('study id') })
export const runParamsSchema = z.object({ id: positiveId('id'), runId: positiveId('run id') })

const columnName = z.string().trim().max(200, 'A column name is at most 200 characters')
/** The optional column choices sent beside the file; an empty area or patch column means "none". */
export const wallCheckFieldsSchema = z.object({
  yPlusColumn: columnName.min(1, 'Choose the y+ column').optional(),
  areaColumn: columnName.optional(),
  patchColumn: columnName.optional(),
})
export type WallCheckFields = z.infer<typeof wallCheckFieldsSchema>

const text = (what: string, min = 1) => z.string({ required_error: `${what} is required.`, invalid_type_error: `${what} must be text.` })
  .trim()
  .min(min, min > 1 ? `${what} needs at least a sentence (${min} characters or more).` : `${what} is required.`)
  .max(MAX_TEXT, `${what} is at most ${MAX_TEXT} characters.`)

export const wallCheckReviewSchema = z.object({
  accepted: z.boolean({ required_error: 'Say whether the check is accepted.', invalid_type_error: 'accepted must be true or false.' }),
  comment: text('The comment'),
}).superRefine((value, ctx) => {
  if (!value.accepted && value.comment.length < MIN_REASON) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['comment'], message: `Say why the check is rejected (${MIN_REASON} characters or more).` })
  }
})
export type WallCheckReviewBody = z.infer<typeof wallCheckReviewSchema>

export const retractSchema = z.object({ reason: text('The reason for the retraction', MIN_REASON) })

const finite = (what: string) => z.number({ required_error: `${what} is required.`, invalid_type_error: `${what} must be a number.` })
  .finite(`${what} must be a finite number.`)

export const gridLevelSchema = z.object({
  cells: finite('The cell count').int('The cell count must be a whole number.').positive('The cell count must be above zero.').max(1e13, 'The cell count is at most 10¹³.'),
  value: finite('The value'),
})

export const gridStudySchema = z.object({
  quantity: text('The quantity of interest').pipe(z.string().max(200, 'The quantity is at most 200 characters.')),
  unit: z.string({ invalid_type_error: 'The unit must be text.' }).trim().max(40, 'The unit is at most 40 characters.').default(''),
  dimensions: z.union([z.literal(1), z.literal(2), z.literal(3)], { errorMap: () => ({ message: 'Dimensions must be 1, 2 or 3.' }) }),
  grids: z.array(gridLevelSchema, { required_error: 'Give the grids.', invalid_type_error: 'The grids must be a list.' })
    .min(3, 'A grid-convergence study needs at least three grids.').max(12, 'At most 12 grids.'),
}).superRefine((value, ctx) => {
  const counts = value.grids.map(g => g.cells)
  if (new Set(counts).size !== counts.length) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['grids'], message: 'Each grid must have a different number of cells.' })
  }
})
export type GridStudyBody = z.infer<typeof gridStudySchema>

const positive = (what: string) => finite(what).positive(`${what} must be above zero.`)

export const runRecordSchema = z.object({
  approach: z.enum(APPROACH_IDS, { errorMap: () => ({ message: `Choose the approach that was run: ${APPROACH_IDS.map(id => APPROACH_LABELS[id]).join(', ')}.` }) }),
  cells: positive('The cell count').max(1e13, 'The cell count is at most 10¹³.'),
  timeSteps: positive('The number of time steps (iterations for steady RANS)').max(1e10, 'At most 10¹⁰ steps.'),
  innerIterations: finite('Inner iterations').int('Inner iterations must be a whole number.').positive('Inner iterations must be above zero.').max(10_000).optional(),
  coreHours: positive('Core-hours').max(1e12, 'At most 10¹² core-hours.'),
  wallClockHours: positive('Wall-clock hours').max(1e6, 'At most 10⁶ hours.'),
  cores: finite('Cores').int('Cores must be a whole number.').positive('Cores must be above zero.').max(10_000_000),
  hardware: z.enum(HARDWARE, { errorMap: () => ({ message: 'Hardware is cpu or gpu.' }) }),
  hardwareNote: z.string({ invalid_type_error: 'The hardware note must be text.' }).trim().max(200, 'The hardware note is at most 200 characters.').default(''),
  solverFamily: z.string({ invalid_type_error: 'The solver family must be text.' }).trim().max(200, 'The solver family is at most 200 characters.').default(''),
})
export type RunRecordBody = z.infer<typeof runRecordSchema>

export const passFractionSchema = z.object({
  wallCheckPassFraction: finite('The pass fraction').min(0.5, 'The pass fraction is at least 0.5 (half the wall).').max(1, 'The pass fraction is at most 1 (all of the wall).'),
  note: z.string().trim().max(MAX_TEXT).default(''),
})

export const adoptCalibrationSchema = z.object({ note: z.string().trim().max(MAX_TEXT).default('') })
