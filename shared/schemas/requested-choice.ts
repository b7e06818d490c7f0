/**
 * The engineer's own choice of approach or wall treatment, recorded beside the engine's (for
 * instance to adopt what a reviewer asked for in an override), with the reason. The engine still
 * advises on the case; the record shows both.
 */
import { z } from 'zod'
import {
  APPROACH_IDS,
  APPROACH_LABELS,
  WALL_TREATMENTS,
  WALL_TREATMENT_LABELS,
  WALL_TREATMENTS_BY_APPROACH,
  type ApproachId,
  type WallTreatment,
} from '../rules'

/** A reason is a sentence, as for a reviewer's override. */
export const MIN_CHOICE_REASON = 15

/**
 * The y+ of the first cell centre each wall treatment works at, for refusing a target that
 * contradicts a requested treatment:
 * - a resolved wall puts the first cell in the viscous sublayer, y+ < 5 (Pope, Turbulent Flows
 *   2000, sec. 7.1; textbook);
 * - log-law wall functions need it in the log layer, 30 <= y+ <= 300 (common practice, no source);
 * - an equilibrium wall model matches the log law at y+ >= 30 (textbook; Larsson et al. 2016,
 *   Mech. Eng. Rev. 3, place the matching point well above the buffer layer);
 * - a blended law holds at any y+ up to the log layer (Spalding 1961, J. Appl. Mech. 28, 455);
 * - rough-wall functions, as log-law wall functions, in the log layer (common practice, no source).
 */
export const TREATMENT_Y_PLUS: Readonly<Record<WallTreatment, { min?: number; max?: number; where: string }>> = {
  resolved: { max: 5, where: 'inside the viscous sublayer (y+ below 5)' },
  'wall-function': { min: 30, max: 300, where: 'in the log layer (y+ from 30 to 300)' },
  'wall-model': { min: 30, where: 'in the log layer (y+ of 30 or more)' },
  // A blended law of the wall holds wherever the first cell falls (Spalding 1961), up to the log
  // layer's top; rough-wall functions need the cell centre in the log layer above the roughness.
  blended: { max: 300, where: 'anywhere up to the top of the log layer (y+ up to 300)' },
  'rough-wall-function': { min: 30, where: 'in the log layer above the roughness (y+ of 30 or more)' },
}

/** The wall treatment a requested choice implies: the one asked for, or the only one its approach allows. */
export function impliedTreatment(choice: { approach?: ApproachId | null; wallTreatment?: WallTreatment | null }): WallTreatment | undefined {
  if (choice.wallTreatment) return choice.wallTreatment
  const allowed = choice.approach ? WALL_TREATMENTS_BY_APPROACH[choice.approach] : undefined
  return allowed && allowed.length === 1 ? allowed[0] : undefined
}

/** Why a y+ target contradicts the requested treatment, or null when it does not. */
export function yPlusConflict(yPlusTarget: number | undefined, treatment: WallTreatment | undefined): string | null {
  if (yPlusTarget === undefined || treatment === undefined || !Number.isFinite(yPlusTarget)) return null
  const band = TREATMENT_Y_PLUS[treatment]
  const below = band.min !== undefined && yPlusTarget < band.min
  const above = band.max !== undefined && yPlusTarget > band.max
  if (!below && !above) return null
  return `A target y+ of ${yPlusTarget} contradicts the wall treatment you requested: ${WALL_TREATMENT_LABELS[treatment].toLowerCase()} puts the first cell centre ${band.where}. Change the target or the treatment.`
}

const emptyToUndefined = (value: unknown) => (value === '' || value === null ? undefined : value)

export const requestedChoiceSchema = z.object({
  approach: z.preprocess(emptyToUndefined, z.enum(APPROACH_IDS, {
    errorMap: () => ({ message: `Choose an approach: ${APPROACH_IDS.map(id => APPROACH_LABELS[id]).join(', ')}.` }),
  }).optional()),
  wallTreatment: z.preprocess(emptyToUndefined, z.enum(WALL_TREATMENTS, {
    errorMap: () => ({ message: `Choose a wall treatment: ${WALL_TREATMENTS.map(t => WALL_TREATMENT_LABELS[t]).join(', ')}.` }),
  }).optional()),
  reason: z.string({ invalid_type_error: 'The reason must be text.' }).trim().max(4000, 'The reason is at most 4000 characters.').default(''),
}).superRefine((choice, ctx) => {
  if (!choice.approach && !choice.wallTreatment) return
  if (choice.reason.length < MIN_CHOICE_REASON) {
    ctx.addIssue({
      code: z.ZodIssueCode.custom,
      path: ['reason'],
      message: `Say why you choose differently from the engine: at least a sentence (${MIN_CHOICE_REASON} characters or more).`,
    })
  }
  if (choice.approach && choice.wallTreatment && !WALL_TREATMENTS_BY_APPROACH[choice.approach].includes(choice.wallTreatment)) {
    ctx.addIssue({
      code: z.ZodIssueCode.custom,
      path: ['wallTreatment'],
      message: `${APPROACH_LABELS[choice.approach]} goes with: ${WALL_TREATMENTS_BY_APPROACH[choice.approach].map(t => WALL_TREATMENT_LABELS[t]).join(', ')}.`,
    })
  }
})
export type RequestedChoiceInput = z.input<typeof requestedChoiceSchema>
export type RequestedChoiceBody = z.output<typeof requestedChoiceSchema>

/** A requested choice worth recording: an approach or a treatment was chosen. */
export function isRequested(choice: RequestedChoiceBody | null | undefined): choice is RequestedChoiceBody & ({ approach: ApproachId } | { wallTreatment: WallTreatment }) {
  return Boolean(choice && (choice.approach || choice.wallTreatment))
}
