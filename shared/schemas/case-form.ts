/**
 * The questionnaire's values (a number and a unit per dimensional field, as the engineer typed
 * them) and their mapping to the engine's SI case input. The form validates by converting to SI
 * and running the engine's own caseInputSchema, then says every limit in the units of the field,
 * so a field shows the same check the server makes, in the engineer's units. The same values are
 * stored beside the SI case ("entered"), so a decision is shown, revised, mailed and printed in the
 * units it was typed in.
 */
import { z, type ZodIssue } from 'zod'
import { QUANTITIES, caseInputSchema, type ApproachId, type CaseInput, type CaseInputDraft, type Quantity, type WallTreatment } from '../rules'
import { SUTHERLAND_TEMPERATURE_RANGE, WATER_TEMPERATURE_RANGE } from '../rules/fluid-properties'
import { formatInput, UNIT_SPACE } from '../utils/format'
import { UNIT_SYSTEMS, convertUnit, defaultUnit, fromSI, isUnitOf, tidy, toSI, unitLabel, type QuantityKind, type UnitSystem } from '../units'
import { impliedTreatment, requestedChoiceSchema, yPlusConflict } from './requested-choice'

export interface QuantityValue {
  /** absent or undefined when left empty */
  value?: number
  unit: string
}

/** The case as typed: what the engine needs, each dimensional value with its unit. */
export interface EnteredCase {
  regime: 'external' | 'internal'
  fluid: {
    medium: 'air' | 'water' | 'custom'
    temperature: QuantityValue
    pressure: QuantityValue
    density: QuantityValue
    viscosity: QuantityValue
  }
  velocity: QuantityValue
  length: QuantityValue
  roughness: QuantityValue
  /** percent in the form, a fraction in the engine */
  turbulenceIntensityPercent?: number
  geometry: 'streamlined' | 'bluff' | 'duct' | 'rotating' | 'complex'
  separation: 'none' | 'mild' | 'massive'
  physics: { transition: boolean; heatTransfer: boolean; rotation: boolean; buoyancy: boolean; acoustics: boolean }
  quantities: Quantity[]
  budget: { coreHours?: number; cores?: number; wallClockHours?: number }
  yPlusTarget?: number
  growthRatio?: number
}

/** The engineer's own choice in the form; '' is "the engine's". */
export interface RequestedChoiceValues {
  approach: ApproachId | ''
  wallTreatment: WallTreatment | ''
  reason: string
}

/** Everything the questionnaire holds: the case as typed and the engineer's own choice. */
export interface CaseFormValues extends EnteredCase {
  requested: RequestedChoiceValues
}

/** Every dimensional field of the form, its quantity, its label and its path in the engine's input. */
export const QUANTITY_FIELDS = [
  { field: 'fluid.temperature', kind: 'temperature', engine: 'fluid.temperatureK', label: 'Temperature' },
  { field: 'fluid.pressure', kind: 'pressure', engine: 'fluid.pressurePa', label: 'Pressure' },
  { field: 'fluid.density', kind: 'density', engine: 'fluid.density', label: 'Density' },
  { field: 'fluid.viscosity', kind: 'viscosity', engine: 'fluid.viscosity', label: 'Dynamic viscosity' },
  { field: 'velocity', kind: 'velocity', engine: 'velocity', label: 'Velocity' },
  { field: 'length', kind: 'length', engine: 'length', label: 'Length' },
  { field: 'roughness', kind: 'roughness', engine: 'roughness', label: 'Roughness' },
] as const satisfies readonly { field: string; kind: QuantityKind; engine: string; label: string }[]

export type QuantityFieldPath = (typeof QUANTITY_FIELDS)[number]['field']

/** The value and unit of a dimensional field. */
export function quantityAt(values: EnteredCase, field: QuantityFieldPath): QuantityValue {
  switch (field) {
    case 'fluid.temperature': return values.fluid.temperature
    case 'fluid.pressure': return values.fluid.pressure
    case 'fluid.density': return values.fluid.density
    case 'fluid.viscosity': return values.fluid.viscosity
    case 'velocity': return values.velocity
    case 'length': return values.length
    case 'roughness': return values.roughness
  }
}

function setQuantityAt(values: EnteredCase, field: QuantityFieldPath, q: QuantityValue) {
  switch (field) {
    case 'fluid.temperature': values.fluid.temperature = q; break
    case 'fluid.pressure': values.fluid.pressure = q; break
    case 'fluid.density': values.fluid.density = q; break
    case 'fluid.viscosity': values.fluid.viscosity = q; break
    case 'velocity': values.velocity = q; break
    case 'length': values.length = q; break
    case 'roughness': values.roughness = q; break
  }
}

/**
 * What the engine assumes for a field left empty; the form says so beside the field and the record
 * marks the value as assumed. Standard atmosphere 101,325 Pa (ISO 2533); the rest are the engine's
 * defaults (common practice, no source).
 */
export const ASSUMED = {
  pressurePa: 101325,
  turbulenceIntensity: 0.01,
  growthRatio: 1.2,
} as const

function quantity(kind: QuantityKind, si: number | undefined, system: UnitSystem): QuantityValue {
  const unit = defaultUnit(kind, system)
  return { value: si === undefined ? undefined : tidy(fromSI(kind, si, unit), 6), unit }
}

export function emptyRequestedChoice(): RequestedChoiceValues {
  return { approach: '', wallTreatment: '', reason: '' }
}

/** A new case: air at 20 °C and one standard atmosphere, 1 % intensity, growth ratio 1.2, a mid-size budget. */
export function defaultCaseFormValues(system: UnitSystem): CaseFormValues {
  return {
    regime: 'external',
    fluid: {
      medium: 'air',
      temperature: quantity('temperature', 293.15, system),
      pressure: quantity('pressure', ASSUMED.pressurePa, system),
      density: quantity('density', undefined, system),
      viscosity: quantity('viscosity', undefined, system),
    },
    velocity: quantity('velocity', undefined, system),
    length: quantity('length', undefined, system),
    roughness: quantity('roughness', undefined, system),
    turbulenceIntensityPercent: 1,
    geometry: 'streamlined',
    separation: 'none',
    physics: { transition: false, heatTransfer: false, rotation: false, buoyancy: false, acoustics: false },
    quantities: ['forces'],
    budget: { coreHours: 20000, cores: 256, wallClockHours: 72 },
    yPlusTarget: undefined,
    growthRatio: 1.2,
    requested: emptyRequestedChoice(),
  }
}

/**
 * A case stored in SI only (before the typed values were kept, or sent by an API client in SI)
 * as the values of the form in a unit system's default units.
 */
export function enteredFromCaseInput(input: CaseInput | CaseInputDraft, system: UnitSystem): EnteredCase {
  const { requested: _, ...base } = defaultCaseFormValues(system)
  const fluid = input.fluid
  return {
    ...base,
    regime: input.regime,
    fluid: {
      medium: fluid.medium,
      temperature: quantity('temperature', fluid.temperatureK, system),
      pressure: quantity('pressure', fluid.pressurePa, system),
      density: quantity('density', fluid.density, system),
      viscosity: quantity('viscosity', fluid.viscosity, system),
    },
    velocity: quantity('velocity', input.velocity, system),
    length: quantity('length', input.length, system),
    roughness: quantity('roughness', input.roughness, system),
    turbulenceIntensityPercent: input.turbulenceIntensity === undefined ? undefined : tidy(input.turbulenceIntensity * 100, 6),
    geometry: input.geometry,
    separation: input.separation,
    physics: { ...base.physics, ...input.physics },
    quantities: [...input.quantities],
    budget: { ...input.budget },
    yPlusTarget: input.yPlusTarget,
    growthRatio: input.growthRatio,
  }
}

/** A saved case back into form values in the given unit system (converted from SI). */
export function caseFormValuesFrom(input: CaseInput | CaseInputDraft, system: UnitSystem): CaseFormValues {
  return { ...enteredFromCaseInput(input, system), requested: emptyRequestedChoice() }
}

function si(kind: QuantityKind, q: QuantityValue | undefined): number | undefined {
  if (!q || q.value === undefined || q.value === null || (typeof q.value === 'number' && Number.isNaN(q.value))) {
    // NaN (a half-typed number) goes through so the engine can say it is not a number.
    return q && typeof q.value === 'number' ? q.value : undefined
  }
  return toSI(kind, q.value, q.unit)
}

function optional(value: number | undefined | null): number | undefined {
  return value === null || value === undefined ? undefined : value
}

/**
 * The typed values as the engine's input, in SI. Only the properties the chosen fluid uses are
 * sent (air: temperature and pressure; water: temperature; custom: density and viscosity);
 * roughness for any wall.
 */
export function toCaseInputDraft(values: EnteredCase): CaseInputDraft {
  // Missing groups become empty ones, so the engine names each missing field.
  const fluid = values.fluid ?? ({} as EnteredCase['fluid'])
  const budget = values.budget ?? ({} as EnteredCase['budget'])
  const draft: Record<string, unknown> = {
    regime: values.regime,
    fluid: {
      medium: fluid.medium,
      ...(fluid.medium !== 'custom' ? { temperatureK: si('temperature', fluid.temperature) } : {}),
      ...(fluid.medium === 'air' ? { pressurePa: si('pressure', fluid.pressure) } : {}),
      ...(fluid.medium === 'custom' ? { density: si('density', fluid.density), viscosity: si('viscosity', fluid.viscosity) } : {}),
    },
    velocity: si('velocity', values.velocity),
    length: si('length', values.length),
    geometry: values.geometry,
    separation: values.separation,
    physics: { ...values.physics },
    quantities: [...(values.quantities ?? [])],
    budget: {
      coreHours: optional(budget.coreHours),
      cores: optional(budget.cores),
      wallClockHours: optional(budget.wallClockHours),
    },
  }
  draft.roughness = si('roughness', values.roughness)
  const intensity = optional(values.turbulenceIntensityPercent)
  if (intensity !== undefined) draft.turbulenceIntensity = intensity / 100
  if (optional(values.yPlusTarget) !== undefined) draft.yPlusTarget = values.yPlusTarget
  if (optional(values.growthRatio) !== undefined) draft.growthRatio = values.growthRatio
  return dropUndefined(draft) as CaseInputDraft
}

/** The case part of the form's values (without the engineer's own choice). */
export function enteredOf(values: CaseFormValues): EnteredCase {
  const { requested: _, ...entered } = values
  return entered
}

function dropUndefined(value: unknown): unknown {
  if (Array.isArray(value)) return value
  if (value && typeof value === 'object') {
    return Object.fromEntries(
      Object.entries(value).filter(([, v]) => v !== undefined).map(([k, v]) => [k, dropUndefined(v)]),
    )
  }
  return value
}

const ENGINE_TO_FORM: Record<string, string> = {
  ...Object.fromEntries(QUANTITY_FIELDS.map((f) => [f.engine, `${f.field}.value`])),
  turbulenceIntensity: 'turbulenceIntensityPercent',
}

/** An engine (or route) error path, e.g. "fluid.temperatureK" or "caseInput.quantities.0", as the form field it belongs to. */
export function formPathFor(enginePath: string | readonly (string | number)[]): string {
  const parts = (typeof enginePath === 'string' ? enginePath.split('.') : enginePath.map(String)).filter((p) => p !== '')
  if (parts[0] === 'caseInput' || parts[0] === 'entered') parts.shift()
  // Errors inside a list belong to the list field (e.g. a quantity of interest).
  const firstIndex = parts.findIndex((p) => /^\d+$/.test(p))
  const path = (firstIndex === -1 ? parts : parts.slice(0, firstIndex)).join('.')
  return ENGINE_TO_FORM[path] ?? path
}

// ---- messages in the field's own units

function readPath(source: unknown, path: string): unknown {
  return path.split('.').reduce<unknown>((at, key) => (at as Record<string, unknown> | undefined)?.[key], source)
}

function valueInUnit(kind: QuantityKind, siValue: number, unit: string): string {
  return `${formatInput(tidy(fromSI(kind, siValue, unit), 6))}${UNIT_SPACE}${unitLabel(kind, unit)}`
}

const MEDIUM_RANGE_TEXT = {
  water: (low: string, high: string) => `Water is covered as a liquid from ${low} to ${high} at ordinary pressure.`,
  air: (low: string, high: string) => `Sutherland's law for air holds from about ${low} to ${high}.`,
} as const

/**
 * The engine's message for a field, with any limit it quotes in SI said again in the unit the
 * engineer typed: "Velocity above 32,808.4 ft/s ...", "at most 50 %".
 */
function messageInFieldUnits(issue: ZodIssue, values: EnteredCase): string {
  const enginePath = issue.path.map(String).join('.')
  if (enginePath === 'turbulenceIntensity') {
    if (issue.code === 'too_big') return `Turbulence intensity must be at most ${formatInput(Number(issue.maximum) * 100)}${UNIT_SPACE}%.`
    if (issue.code === 'invalid_type' && issue.received !== 'undefined') return 'Turbulence intensity must be a number in %.'
    return issue.message
  }
  const field = QUANTITY_FIELDS.find((f) => f.engine === enginePath)
  if (!field) return issue.message
  const typed = readPath(values, field.field) as QuantityValue | undefined
  const unit = typed && isUnitOf(field.kind, typed.unit) ? typed.unit : defaultUnit(field.kind, 'si')
  const label = field.field === 'length' ? 'Length' : field.label
  switch (issue.code) {
    case 'too_big':
      return `${label} above ${valueInUnit(field.kind, Number(issue.maximum), unit)} is outside the range this engine handles.`
    case 'too_small':
      if (field.kind === 'temperature' && Number(issue.minimum) === 0) {
        return `Temperature must be above absolute zero (${valueInUnit('temperature', 0, unit)}).`
      }
      if (Number(issue.minimum) === 0) return issue.message
      return `${label} below ${valueInUnit(field.kind, Number(issue.minimum), unit)} is outside the range this engine handles.`
    case 'invalid_type':
      return issue.received === 'undefined' ? issue.message : `${label} must be a number in ${unitLabel(field.kind, unit)}.`
    case 'custom': {
      const medium = values.fluid?.medium
      if (field.kind === 'temperature' && (medium === 'water' || medium === 'air')) {
        const range = medium === 'water' ? WATER_TEMPERATURE_RANGE : SUTHERLAND_TEMPERATURE_RANGE
        return MEDIUM_RANGE_TEXT[medium](valueInUnit('temperature', range.min, unit), valueInUnit('temperature', range.max, unit))
      }
      return issue.message
    }
    default:
      return issue.message
  }
}

/** What the engine assumes for each field left empty, by form path: said beside the field. */
export function assumptionsOf(values: EnteredCase, system: UnitSystem): Record<string, string> {
  const notes: Record<string, string> = {}
  if (values.fluid?.medium === 'air' && values.fluid.pressure?.value === undefined) {
    const unit = values.fluid.pressure?.unit ?? defaultUnit('pressure', system)
    notes['fluid.pressure.value'] = `Left empty: one standard atmosphere, ${valueInUnit('pressure', ASSUMED.pressurePa, unit)}, is assumed.`
  }
  if (values.turbulenceIntensityPercent === undefined) {
    notes.turbulenceIntensityPercent = `Left empty: ${formatInput(ASSUMED.turbulenceIntensity * 100)}${UNIT_SPACE}% is assumed.`
  }
  if (values.growthRatio === undefined) notes.growthRatio = `Left empty: a growth ratio of ${ASSUMED.growthRatio} is assumed.`
  return notes
}

/** Engine validation of the form's values, its issues placed at the form's fields. */
export type CaseValidation = { ok: true; input: CaseInput; draft: CaseInputDraft } | { ok: false; errors: Record<string, string> }

/**
 * The form's checks: the engine's own schema on the SI case (messages in the field's units), a
 * temperature for air and water (never silently room temperature), and a y+ target that suits the
 * wall treatment the engineer requested.
 */
export function validateCaseForm(values: EnteredCase & { requested?: RequestedChoiceValues | null }): CaseValidation {
  const draft = toCaseInputDraft(values)
  const errors: Record<string, string> = {}
  const medium = values.fluid?.medium
  if ((medium === 'air' || medium === 'water') && draft.fluid?.temperatureK === undefined) {
    errors['fluid.temperature.value'] = `Temperature is required for ${medium}: its viscosity${medium === 'air' ? ' and density' : ''} depend on it.`
  }
  const requested = values.requested
  if (requested) {
    const choice = requestedChoiceSchema.safeParse(requested)
    if (!choice.success) for (const issue of choice.error.issues) errors[['requested', ...issue.path].join('.')] ??= issue.message
    const conflict = yPlusConflict(optional(values.yPlusTarget), impliedTreatment({
      approach: requested.approach || undefined,
      wallTreatment: requested.wallTreatment || undefined,
    }))
    if (conflict) errors.yPlusTarget = conflict
  }
  const result = caseInputSchema.safeParse(draft)
  if (result.success && !Object.keys(errors).length) return { ok: true, input: result.data, draft }
  if (!result.success) {
    for (const issue of result.error.issues) {
      const path = formPathFor(issue.path)
      errors[path] ??= messageInFieldUnits(issue, values)
    }
  }
  return { ok: false, errors }
}

/** The vee-validate schema: the form's values pass when the engine accepts them in SI. */
export const caseFormSchema = z.custom<CaseFormValues>(() => true).superRefine((values, ctx) => {
  const result = validateCaseForm(values)
  if (result.ok) return
  for (const [path, message] of Object.entries(result.errors)) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, path: path.split('.'), message })
  }
})

/** A field's value converted to another unit (for a unit switch that keeps the physical value). */
export function convertQuantityValue(kind: QuantityKind, q: QuantityValue, unit: string): QuantityValue {
  if (q.value === undefined || Number.isNaN(q.value)) return { value: q.value, unit }
  return { value: tidy(convertUnit(kind, q.value, q.unit, unit), 6), unit }
}

/** Every dimensional field of the values converted to a unit system's units. */
export function inUnitSystem<T extends EnteredCase>(values: T, system: UnitSystem): T {
  const next = structuredClone(values)
  for (const { field, kind } of QUANTITY_FIELDS) {
    const unit = defaultUnit(kind, system)
    const current = quantityAt(next, field)
    if (current.unit !== unit) setQuantityAt(next, field, convertQuantityValue(kind, current, unit))
  }
  return next
}

// ---- the typed values as a route accepts them

const typedNumber = z.number({ invalid_type_error: 'Must be a number.' }).nullable().optional()
  .transform(v => (v === null ? undefined : v))

function quantityValueSchema(kind: QuantityKind) {
  return z.object({
    value: typedNumber,
    unit: z.string({ required_error: 'A unit is required.' }).refine(u => isUnitOf(kind, u), { message: `Not a unit of ${kind}.` }),
  })
}

/** The typed values of a case in a request body: structure and units checked here, the physics by the engine. */
export const enteredCaseSchema = z.object({
  regime: z.enum(['external', 'internal']),
  fluid: z.object({
    medium: z.enum(['air', 'water', 'custom']),
    temperature: quantityValueSchema('temperature'),
    pressure: quantityValueSchema('pressure'),
    density: quantityValueSchema('density'),
    viscosity: quantityValueSchema('viscosity'),
  }),
  velocity: quantityValueSchema('velocity'),
  length: quantityValueSchema('length'),
  roughness: quantityValueSchema('roughness'),
  turbulenceIntensityPercent: typedNumber,
  geometry: z.enum(['streamlined', 'bluff', 'duct', 'rotating', 'complex']),
  separation: z.enum(['none', 'mild', 'massive']),
  physics: z.object({
    transition: z.boolean().default(false),
    heatTransfer: z.boolean().default(false),
    rotation: z.boolean().default(false),
    buoyancy: z.boolean().default(false),
    acoustics: z.boolean().default(false),
  }).default({}),
  quantities: z.array(z.enum(QUANTITIES)),
  budget: z.object({ coreHours: typedNumber, cores: typedNumber, wallClockHours: typedNumber }),
  yPlusTarget: typedNumber,
  growthRatio: typedNumber,
}, { invalid_type_error: 'The case as entered must be an object of fields with their units.' }) satisfies z.ZodType<EnteredCase, z.ZodTypeDef, unknown>

export const unitSystemSchema = z.enum(UNIT_SYSTEMS, {
  errorMap: () => ({ message: `The unit system must be one of: ${UNIT_SYSTEMS.join(', ')}.` }),
})
