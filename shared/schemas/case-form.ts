/**
 * The questionnaire's values (a number and a unit per dimensional field) and their mapping to the
 * engine's SI case input. The form validates by converting to SI and running the engine's own
 * caseInputSchema, so a field shows the same message the server would send.
 */
import { z } from 'zod'
import { caseInputSchema, type CaseInput, type CaseInputDraft, type Quantity } from '../rules'
import { convertUnit, defaultUnit, fromSI, tidy, toSI, type QuantityKind, type UnitSystem } from '../units'

export interface QuantityValue {
  value: number | undefined
  unit: string
}

export interface CaseFormValues {
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
  turbulenceIntensityPercent: number | undefined
  geometry: 'streamlined' | 'bluff' | 'duct' | 'rotating' | 'complex'
  separation: 'none' | 'mild' | 'massive'
  physics: { transition: boolean; heatTransfer: boolean; rotation: boolean; buoyancy: boolean; acoustics: boolean }
  quantities: Quantity[]
  budget: { coreHours: number | undefined; cores: number | undefined; wallClockHours: number | undefined }
  yPlusTarget: number | undefined
  growthRatio: number | undefined
}

/** Every dimensional field of the form, its quantity and its path in the engine's input. */
export const QUANTITY_FIELDS = [
  { field: 'fluid.temperature', kind: 'temperature', engine: 'fluid.temperatureK' },
  { field: 'fluid.pressure', kind: 'pressure', engine: 'fluid.pressurePa' },
  { field: 'fluid.density', kind: 'density', engine: 'fluid.density' },
  { field: 'fluid.viscosity', kind: 'viscosity', engine: 'fluid.viscosity' },
  { field: 'velocity', kind: 'velocity', engine: 'velocity' },
  { field: 'length', kind: 'length', engine: 'length' },
  { field: 'roughness', kind: 'roughness', engine: 'roughness' },
] as const satisfies readonly { field: string; kind: QuantityKind; engine: string }[]

export type QuantityFieldPath = (typeof QUANTITY_FIELDS)[number]['field']

function quantity(kind: QuantityKind, si: number | undefined, system: UnitSystem): QuantityValue {
  const unit = defaultUnit(kind, system)
  return { value: si === undefined ? undefined : tidy(fromSI(kind, si, unit), 6), unit }
}

/** A new case: air at 20 °C and one standard atmosphere, 1 % intensity, growth ratio 1.2, a mid-size budget. */
export function defaultCaseFormValues(system: UnitSystem): CaseFormValues {
  return {
    regime: 'external',
    fluid: {
      medium: 'air',
      temperature: quantity('temperature', 293.15, system),
      pressure: quantity('pressure', 101325, system),
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
  }
}

/** A saved case back into form values, shown in the given unit system. */
export function caseFormValuesFrom(input: CaseInput | CaseInputDraft, system: UnitSystem): CaseFormValues {
  const base = defaultCaseFormValues(system)
  const fluid = input.fluid
  return {
    ...base,
    regime: input.regime,
    fluid: {
      medium: fluid.medium,
      temperature: quantity('temperature', fluid.temperatureK ?? (fluid.medium === 'custom' ? undefined : 293.15), system),
      pressure: quantity('pressure', fluid.pressurePa ?? (fluid.medium === 'air' ? 101325 : undefined), system),
      density: quantity('density', fluid.density, system),
      viscosity: quantity('viscosity', fluid.viscosity, system),
    },
    velocity: quantity('velocity', input.velocity, system),
    length: quantity('length', input.length, system),
    roughness: quantity('roughness', input.roughness, system),
    turbulenceIntensityPercent: input.turbulenceIntensity === undefined ? 1 : tidy(input.turbulenceIntensity * 100, 6),
    geometry: input.geometry,
    separation: input.separation,
    physics: { ...base.physics, ...input.physics },
    quantities: [...input.quantities],
    budget: { ...input.budget },
    yPlusTarget: input.yPlusTarget,
    growthRatio: input.growthRatio ?? 1.2,
  }
}

function si(kind: QuantityKind, q: QuantityValue | undefined): number | undefined {
  if (!q || q.value === undefined || q.value === null || (typeof q.value === 'number' && Number.isNaN(q.value))) {
    // NaN (a half-typed number) goes through so the engine can say it is not a number.
    return q && typeof q.value === 'number' ? q.value : undefined
  }
  return toSI(kind, q.value, q.unit)
}

function optional(value: number | undefined): number | undefined {
  return value === null || value === undefined ? undefined : value
}

/**
 * The form's values as the engine's input, in SI. Only the properties the chosen fluid uses are
 * sent (air: temperature and pressure; water: temperature; custom: density and viscosity);
 * roughness for any wall.
 */
export function toCaseInputDraft(values: CaseFormValues): CaseInputDraft {
  // Missing groups become empty ones, so the engine names each missing field.
  const fluid = values.fluid ?? ({} as CaseFormValues['fluid'])
  const budget = values.budget ?? ({} as CaseFormValues['budget'])
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
  if (parts[0] === 'caseInput') parts.shift()
  // Errors inside a list belong to the list field (e.g. a quantity of interest).
  const firstIndex = parts.findIndex((p) => /^\d+$/.test(p))
  const path = (firstIndex === -1 ? parts : parts.slice(0, firstIndex)).join('.')
  return ENGINE_TO_FORM[path] ?? path
}

/** Engine validation of the form's values, its issues placed at the form's fields. */
export type CaseValidation = { ok: true; input: CaseInput; draft: CaseInputDraft } | { ok: false; errors: Record<string, string> }

export function validateCaseForm(values: CaseFormValues): CaseValidation {
  const draft = toCaseInputDraft(values)
  const result = caseInputSchema.safeParse(draft)
  if (result.success) return { ok: true, input: result.data, draft }
  const errors: Record<string, string> = {}
  for (const issue of result.error.issues) {
    const path = formPathFor(issue.path)
    errors[path] ??= issue.message
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
