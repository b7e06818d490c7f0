/**
 * The case description the engine accepts, as one zod schema shared by the questionnaire form,
 * the server route and the engine. All quantities SI; the UI converts units.
 */
import { z } from 'zod'
import { SUTHERLAND_TEMPERATURE_RANGE, WATER_TEMPERATURE_RANGE } from './fluid-properties'
import { MAX_RELATIVE_ROUGHNESS } from './skin-friction'

export const QUANTITIES = ['forces', 'pressure', 'heat-transfer', 'unsteady-loads', 'noise', 'mixing', 'statistics'] as const
export type Quantity = (typeof QUANTITIES)[number]

/** A finite number with readable messages; `label` starts the sentence, `unit` is shown beside it. */
function quantity(label: string, unit: string) {
  return z
    .number({
      required_error: `${label} is required.`,
      invalid_type_error: `${label} must be a number${unit ? ` in ${unit}` : ''}.`,
    })
    .finite(`${label} must be a finite number.`)
}

function positive(label: string, unit: string, max: number) {
  return quantity(label, unit)
    .positive(`${label} must be greater than zero.`)
    .max(max, `${label} above ${max}${unit ? ` ${unit}` : ''} is outside the range this engine handles.`)
}

/** Positive, and within [min, max]: the engine's numbers stay finite inside these bounds. */
function within(label: string, unit: string, min: number, max: number) {
  return positive(label, unit, max).min(min, `${label} below ${min}${unit ? ` ${unit}` : ''} is outside the range this engine handles.`)
}

function choice<const T extends readonly [string, ...string[]]>(values: T, label: string) {
  return z.enum(values, {
    errorMap: () => ({ message: `${label} must be one of: ${values.join(', ')}.` }),
  })
}

function flag(label: string) {
  return z.boolean({ invalid_type_error: `${label} must be true or false.` }).default(false)
}

const fluidSchema = z.object(
  {
    medium: choice(['air', 'water', 'custom'], 'Fluid'),
    temperatureK: positive('Temperature', 'K', 1e4).optional(),
    pressurePa: within('Pressure', 'Pa', 1, 1e9).optional(),
    density: within('Density', 'kg/m3', 1e-6, 1e5).optional(),
    viscosity: within('Dynamic viscosity', 'Pa s', 1e-7, 1e6).optional(),
  },
  { required_error: 'Fluid is required.', invalid_type_error: 'Fluid must be described by its medium and properties.' },
)

const physicsSchema = z
  .object({
    transition: flag('Transition'),
    heatTransfer: flag('Heat transfer'),
    rotation: flag('Rotation or swirl'),
    buoyancy: flag('Buoyancy'),
    acoustics: flag('Acoustics'),
  })
  .default({})

const budgetSchema = z.object(
  {
    coreHours: positive('Core-hour budget', 'core-hours', 1e15),
    cores: quantity('Cores', '').int('Cores must be a whole number.').positive('Cores must be at least 1.').max(1e8, 'Cores above 1e8 are outside the range this engine handles.'),
    wallClockHours: positive('Wall-clock budget', 'hours', 1e6),
  },
  { required_error: 'Budget is required.', invalid_type_error: 'Budget must give core-hours, cores and wall-clock hours.' },
)

export const caseInputSchema = z
  .object({
    regime: choice(['external', 'internal'], 'Flow regime'),
    fluid: fluidSchema,
    velocity: within('Velocity', 'm/s', 1e-6, 1e4),
    length: within('Length', 'm', 1e-6, 1e4),
    roughness: quantity('Roughness', 'm').nonnegative('Roughness cannot be negative.').optional(),
    turbulenceIntensity: quantity('Turbulence intensity', 'a fraction, e.g. 0.01 for 1%')
      .positive('Turbulence intensity must be greater than zero.')
      .max(0.5, 'Turbulence intensity must be at most 0.5 (50%).')
      .default(0.01),
    geometry: choice(['streamlined', 'bluff', 'duct', 'rotating', 'complex'], 'Geometry'),
    separation: choice(['none', 'mild', 'massive'], 'Separation'),
    physics: physicsSchema,
    quantities: z
      .array(choice(QUANTITIES, 'Each quantity'), {
        required_error: 'Choose at least one quantity of interest.',
        invalid_type_error: 'Quantities must be a list.',
      })
      .min(1, 'Choose at least one quantity of interest.'),
    budget: budgetSchema,
    yPlusTarget: quantity('Target y+', '')
      .positive('Target y+ must be greater than zero.')
      .max(1000, 'Target y+ must be at most 1000.')
      .optional(),
    growthRatio: quantity('Growth ratio', '')
      .min(1.01, 'Growth ratio must be at least 1.01.')
      .max(2, 'Growth ratio must be at most 2.')
      .default(1.2),
  })
  .superRefine((input, ctx) => {
    const { fluid } = input
    if (fluid.medium === 'custom') {
      if (fluid.density === undefined) {
        ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['fluid', 'density'], message: 'Density is required for a custom fluid.' })
      }
      if (fluid.viscosity === undefined) {
        ctx.addIssue({
          code: z.ZodIssueCode.custom,
          path: ['fluid', 'viscosity'],
          message: 'Dynamic viscosity is required for a custom fluid.',
        })
      }
    }
    if (fluid.medium === 'water' && fluid.temperatureK !== undefined) {
      const { min, max } = WATER_TEMPERATURE_RANGE
      if (fluid.temperatureK < min || fluid.temperatureK > max) {
        ctx.addIssue({
          code: z.ZodIssueCode.custom,
          path: ['fluid', 'temperatureK'],
          message: `Water is covered as a liquid from ${min} K (0 °C) to ${max} K (100 °C) at ordinary pressure.`,
        })
      }
    }
    if (fluid.medium === 'air' && fluid.temperatureK !== undefined) {
      const { min, max } = SUTHERLAND_TEMPERATURE_RANGE
      if (fluid.temperatureK < min || fluid.temperatureK > max) {
        ctx.addIssue({
          code: z.ZodIssueCode.custom,
          path: ['fluid', 'temperatureK'],
          message: `Sutherland's law for air holds from about ${min} K to ${max} K.`,
        })
      }
    }
    if (input.roughness !== undefined && input.roughness > 0) {
      if (input.regime !== 'internal') {
        ctx.addIssue({
          code: z.ZodIssueCode.custom,
          path: ['roughness'],
          message: 'Roughness is used only for internal flow (duct or pipe); leave it empty for external flow.',
        })
      } else if (input.roughness / input.length > MAX_RELATIVE_ROUGHNESS) {
        ctx.addIssue({
          code: z.ZodIssueCode.custom,
          path: ['roughness'],
          message: `Relative roughness k/D above ${MAX_RELATIVE_ROUGHNESS} is beyond the range of the Colebrook-White equation.`,
        })
      }
    }
  })

/** A case with defaults applied (what the engine works on). */
export type CaseInput = z.output<typeof caseInputSchema>
/** A case as the form or a caller may send it, defaults not yet applied. */
export type CaseInputDraft = z.input<typeof caseInputSchema>
