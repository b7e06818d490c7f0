/**
 * The case description the engine accepts, as one zod schema shared by the questionnaire form,
 * the server route and the engine. All quantities SI; the UI converts units. Every field added in
 * engine 2.0 is optional: a case that leaves them out gets today's defaults.
 */
import { z } from 'zod'
import { SUTHERLAND_TEMPERATURE_RANGE, WATER_TEMPERATURE_RANGE } from './fluid-properties'
import { MAX_RELATIVE_ROUGHNESS } from './skin-friction'

export const QUANTITIES = ['forces', 'pressure', 'heat-transfer', 'unsteady-loads', 'noise', 'mixing', 'statistics'] as const
export type Quantity = (typeof QUANTITIES)[number]

/** Kinds of flow with their own published practice; inferred from the other fields when not given. */
export const APPLICATIONS = ['general', 'atmospheric', 'indoor', 'marine', 'turbomachinery', 'swirl', 'jet'] as const
export type Application = (typeof APPLICATIONS)[number]

/** External roughness above half the reference length is an obstacle to model, not a roughness (our limit, no source). */
export const MAX_EXTERNAL_ROUGHNESS_FRACTION = 0.5
/** A roughness length z0 above a tenth of the reference length describes obstacles (our limit, no source). */
export const MAX_ROUGHNESS_LENGTH_FRACTION = 0.1

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

/**
 * Optional description of the computational domain. Absent fields keep the defaults: a 3-D
 * domain; external: a wetted area of the geometry's factor times L x L; internal: a straight duct
 * of 10 hydraulic diameters of circular section.
 */
const domainSchema = z
  .object(
    {
      /** 2d: one cell deep for RANS; scale-resolving methods run span-periodic. axisymmetric: likewise about the axis. */
      dimensions: choice(['3d', '2d', 'axisymmetric', 'span-periodic'], 'Domain dimensions').optional(),
      /** streamwise length of the domain in reference lengths (internal: hydraulic diameters) */
      lengthRatio: within('Domain length', 'reference lengths', 0.1, 1000).optional(),
      /** span of a 3-D or span-periodic domain, m */
      span: within('Span', 'm', 1e-6, 1e5).optional(),
      /** wetted area of all walls, m2; replaces the geometry's area factor */
      wettedArea: within('Wetted area', 'm2', 1e-12, 1e10).optional(),
      /** internal flow: circular pipe (default), plane channel between two walls (L = 4 x half-height), or rectangular duct */
      crossSection: choice(['pipe', 'channel', 'duct'], 'Cross-section').optional(),
    },
    { invalid_type_error: 'Domain must describe dimensions, length, span, wetted area or cross-section.' },
  )
  .strict()

const budgetSchema = z.object(
  {
    coreHours: positive('Core-hour budget', 'core-hours', 1e15),
    cores: quantity('Cores', '').int('Cores must be a whole number.').positive('Cores must be at least 1.').max(1e8, 'Cores above 1e8 are outside the range this engine handles.'),
    wallClockHours: positive('Wall-clock budget', 'hours', 1e6),
  },
  { required_error: 'Budget is required.', invalid_type_error: 'Budget must give core-hours, cores and wall-clock hours.' },
)

/** The fields of a case, without the checks that relate one field to another. */
const caseInputFields = z
  .object({
    regime: choice(['external', 'internal'], 'Flow regime'),
    fluid: fluidSchema,
    velocity: within('Velocity', 'm/s', 1e-6, 1e4),
    length: within('Length', 'm', 1e-6, 1e4),
    /** equivalent sand-grain roughness height k_s of the walls, m; any regime */
    roughness: quantity('Roughness', 'm').nonnegative('Roughness cannot be negative.').optional(),
    /** aerodynamic roughness length z0 of terrain (atmospheric flow), m; converted to k_s */
    roughnessLength: within('Roughness length z0', 'm', 1e-7, 10).optional(),
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
    domain: domainSchema.optional(),
    /** the lowest frequency the unsteady loads or noise must resolve, Hz; sets the simulated time */
    lowestFrequencyHz: within('Lowest frequency of interest', 'Hz', 1e-6, 1e7).optional(),
    /** wall temperature for the compressible wall figures, K; adiabatic wall when absent */
    wallTemperatureK: within('Wall temperature', 'K', 1, 1e4).optional(),
    /** time integration of the scale-resolving solver; explicit compressible solvers pay the acoustic time-step limit */
    timeIntegration: choice(['explicit', 'implicit'], 'Time integration').optional(),
    /** swirl number S (axial flux of angular momentum over R times the axial momentum flux) */
    swirlNumber: quantity('Swirl number', '').nonnegative('Swirl number cannot be negative.').max(10, 'Swirl number above 10 is outside the range this engine handles.').optional(),
    /** the kind of flow, when the engine should not infer it from the other fields */
    application: choice(APPLICATIONS, 'Application').optional(),
  })

type Issues = z.IssueData[]
type CaseFields = z.output<typeof caseInputFields>

function issue(issues: Issues, path: (string | number)[], message: string): void {
  issues.push({ code: z.ZodIssueCode.custom, path, message })
}

/** The checks that relate fields to each other, on a case whose fields are each valid. */
function crossFieldIssues(input: CaseFields): Issues {
  const issues: Issues = []
  checkFluid(input.fluid, issues)
  checkRoughness(input, issues)
  if (input.domain?.crossSection !== undefined && input.regime !== 'internal') {
    issue(issues, ['domain', 'crossSection'], 'A cross-section describes internal flow; leave it empty for external flow.')
  }
  return issues
}

export const caseInputSchema = caseInputFields.superRefine((input, ctx) => {
  for (const found of crossFieldIssues(input)) ctx.addIssue(found)
})

/**
 * caseInputSchema.parse without zod's refinement wrapper, which costs more than the rest of the
 * parse: the same fields, defaults, checks and ZodError issues.
 */
export function parseCaseInput(input: unknown): CaseFields {
  const fields = caseInputFields.parse(input)
  const issues = crossFieldIssues(fields)
  if (issues.length > 0) throw new z.ZodError(issues.map((found) => ({ ...found, message: found.message ?? '' }) as z.ZodIssue))
  return fields
}

type FluidInput = z.output<typeof fluidSchema>

function checkFluid(fluid: FluidInput, issues: Issues): void {
  if (fluid.medium === 'custom') {
    if (fluid.density === undefined) issue(issues, ['fluid', 'density'], 'Density is required for a custom fluid.')
    if (fluid.viscosity === undefined) issue(issues, ['fluid', 'viscosity'], 'Dynamic viscosity is required for a custom fluid.')
  }
  if (fluid.medium === 'water' && fluid.temperatureK !== undefined) {
    const { min, max } = WATER_TEMPERATURE_RANGE
    if (fluid.temperatureK < min || fluid.temperatureK > max) {
      issue(issues, ['fluid', 'temperatureK'], `Water is covered as a liquid from ${min} K (0 °C) to ${max} K (100 °C) at ordinary pressure.`)
    }
  }
  if (fluid.medium === 'air' && fluid.temperatureK !== undefined) {
    const { min, max } = SUTHERLAND_TEMPERATURE_RANGE
    if (fluid.temperatureK < min || fluid.temperatureK > max) {
      issue(issues, ['fluid', 'temperatureK'], `Sutherland's law for air holds from about ${min} K to ${max} K.`)
    }
  }
}

interface RoughnessInput {
  regime: 'external' | 'internal'
  length: number
  roughness?: number | undefined
  roughnessLength?: number | undefined
}

function checkRoughness(input: RoughnessInput, issues: Issues): void {
  const roughness = input.roughness ?? 0
  if (input.roughnessLength !== undefined) {
    if (roughness > 0) issue(issues, ['roughnessLength'], 'Give either the sand-grain roughness height or the roughness length z0, not both.')
    if (input.regime !== 'external') {
      issue(issues, ['roughnessLength'], 'The roughness length z0 describes terrain under an atmospheric boundary layer (external flow); for a duct give the sand-grain roughness height.')
    } else if (input.roughnessLength > MAX_ROUGHNESS_LENGTH_FRACTION * input.length) {
      issue(issues, ['roughnessLength'], `A roughness length above ${MAX_ROUGHNESS_LENGTH_FRACTION} of the reference length describes obstacles, not roughness; model them.`)
    }
  }
  if (roughness <= 0) return
  if (input.regime === 'internal' && roughness / input.length > MAX_RELATIVE_ROUGHNESS) {
    issue(issues, ['roughness'], `Relative roughness k/D above ${MAX_RELATIVE_ROUGHNESS} is beyond the range of the Colebrook-White equation.`)
  }
  if (input.regime === 'external' && roughness / input.length > MAX_EXTERNAL_ROUGHNESS_FRACTION) {
    issue(issues, ['roughness'], `Roughness above ${MAX_EXTERNAL_ROUGHNESS_FRACTION} of the reference length is an obstacle, not roughness; model it.`)
  }
}

/** A case with defaults applied (what the engine works on). */
export type CaseInput = CaseFields
/** A case as the form or a caller may send it, defaults not yet applied. */
export type CaseInputDraft = z.input<typeof caseInputSchema>
/** The optional domain description. */
export type DomainInput = z.output<typeof domainSchema>
