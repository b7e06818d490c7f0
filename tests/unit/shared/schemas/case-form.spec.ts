import { describe, expect, it } from 'vitest'
import { advise } from '#shared/rules'
import {
  assumptionsOf,
  caseFormValuesFrom,
  convertQuantityValue,
  enteredCaseSchema,
  enteredOf,
  inUnitSystem,
  defaultCaseFormValues,
  formPathFor,
  toCaseInputDraft,
  validateCaseForm,
} from '#shared/schemas/case-form'

describe('the questionnaire values and the engine input', () => {
  it('the defaults are air at 20 °C and 101.325 kPa, 1 % intensity, growth ratio 1.2 (ISO 2533 standard atmosphere pressure)', () => {
    const values = defaultCaseFormValues('si')
    expect(values.fluid.temperature).toEqual({ value: 20, unit: 'degC' })
    expect(values.fluid.pressure).toEqual({ value: 101.325, unit: 'kPa' })
    const imperial = defaultCaseFormValues('imperial')
    // 20 °C = 68 °F and 101.325 kPa = 14.6959 psi (NIST SP 811 B.8, B.9)
    expect(imperial.fluid.temperature).toEqual({ value: 68, unit: 'degF' })
    expect(imperial.fluid.pressure.value).toBeCloseTo(14.6959, 4)
  })

  it('converts imperial inputs to SI for the engine (NIST SP 811: 1 ft = 0.3048 m, 1 psi = 6894.757 Pa)', () => {
    const values = defaultCaseFormValues('imperial')
    values.velocity.value = 100 // ft/s
    values.length.value = 10 // ft
    const draft = toCaseInputDraft(values)
    expect(draft.velocity).toBeCloseTo(30.48, 10)
    expect(draft.length).toBeCloseTo(3.048, 10)
    expect(draft.fluid.temperatureK).toBeCloseTo(293.15, 9)
    // the form shows 14.6959 psi (six figures), within 1 Pa of the standard atmosphere
    expect(Math.abs(draft.fluid.pressurePa! - 101325)).toBeLessThan(1)
    expect(draft.turbulenceIntensity).toBeCloseTo(0.01, 12)
    expect(draft).not.toHaveProperty('roughness')
  })

  it('sends only the properties the chosen fluid uses', () => {
    const values = defaultCaseFormValues('si')
    values.fluid.medium = 'custom'
    values.fluid.density.value = 850
    values.fluid.viscosity = { value: 30, unit: 'cP' }
    const draft = toCaseInputDraft(values)
    expect(draft.fluid).toEqual({ medium: 'custom', density: 850, viscosity: 0.03 })
  })

  it('the same case in SI and in imperial units gets the same advice (unit conversion only)', () => {
    const metric = defaultCaseFormValues('si')
    metric.velocity.value = 30.48
    metric.length.value = 3.048
    const imperial = defaultCaseFormValues('imperial')
    imperial.velocity.value = 100
    imperial.length.value = 10
    const a = advise(toCaseInputDraft(metric))
    const b = advise(toCaseInputDraft(imperial))
    // equal to the six figures the form keeps for the default pressure
    expect(b.reynolds / a.reynolds).toBeCloseTo(1, 5)
    expect(b.recommendation).toEqual(a.recommendation)
  })

  it("places the engine's messages at the form fields", () => {
    const values = defaultCaseFormValues('si')
    values.length.value = 1
    values.quantities = []
    const result = validateCaseForm(values)
    expect(result.ok).toBe(false)
    if (result.ok) return
    expect(result.errors['velocity.value']).toBe('Velocity is required.')
    expect(result.errors['quantities']).toMatch(/at least one/)
    expect(result.errors['length.value']).toBeUndefined()

    // The cross-field checks run once every field has a value of the right kind.
    const custom = defaultCaseFormValues('si')
    custom.fluid.medium = 'custom'
    custom.velocity.value = 5
    custom.length.value = 1
    const second = validateCaseForm(custom)
    expect(second.ok).toBe(false)
    if (second.ok) return
    expect(second.errors['fluid.density.value']).toBe('Density is required for a custom fluid.')
    expect(second.errors['fluid.viscosity.value']).toBe('Dynamic viscosity is required for a custom fluid.')
  })

  it('maps route error keys to form paths', () => {
    expect(formPathFor('caseInput.fluid.temperatureK')).toBe('fluid.temperature.value')
    expect(formPathFor('caseInput.turbulenceIntensity')).toBe('turbulenceIntensityPercent')
    expect(formPathFor('caseInput.quantities.0')).toBe('quantities')
    expect(formPathFor('caseInput.budget.cores')).toBe('budget.cores')
  })

  it('a saved case comes back into the form in the chosen units', () => {
    const values = defaultCaseFormValues('si')
    values.velocity.value = 30
    values.length.value = 2
    const check = validateCaseForm(values)
    expect(check.ok).toBe(true)
    if (!check.ok) return
    const back = caseFormValuesFrom(check.input, 'imperial')
    // 30 m/s = 98.4252 ft/s (NIST SP 811 B.8, 1 ft = 0.3048 m)
    expect(back.velocity.value).toBeCloseTo(98.4252, 3)
    expect(back.velocity.unit).toBe('ft/s')
    expect(toCaseInputDraft(back).velocity).toBeCloseTo(30, 4)
  })

  it('a unit switch keeps the physical value', () => {
    // 100 km/h = 27.7778 m/s (NIST SP 811 B.8)
    expect(convertQuantityValue('velocity', { value: 100, unit: 'km/h' }, 'm/s').value).toBeCloseTo(27.7778, 4)
    expect(convertQuantityValue('velocity', { value: undefined, unit: 'km/h' }, 'm/s')).toEqual({ value: undefined, unit: 'm/s' })
  })
})

describe('the questionnaire speaks in the units the engineer typed', () => {
  it("states the engine's SI limits in the field's own units (NIST SP 811: 1 ft/s = 0.3048 m/s)", () => {
    const values = defaultCaseFormValues('imperial')
    values.velocity.value = 40000 // ft/s, above the engine's 1e4 m/s
    values.length.value = 10
    const result = validateCaseForm(values)
    expect(result.ok).toBe(false)
    if (result.ok) return
    // 1e4 m/s / 0.3048 = 32,808.4 ft/s
    expect(result.errors['velocity.value']).toBe('Velocity above 32,808.4\u202fft/s is outside the range this engine handles.')
  })
  it('the percent field speaks in percent, not as a fraction', () => {
    const values = defaultCaseFormValues('si')
    values.velocity.value = 10
    values.length.value = 1
    values.turbulenceIntensityPercent = 60
    const result = validateCaseForm(values)
    expect(result.ok).toBe(false)
    if (!result.ok) expect(result.errors.turbulenceIntensityPercent).toBe('Turbulence intensity must be at most 50\u202f%.')
  })
  it('the water range in °F (0 °C = 32 °F, 100 °C = 212 °F; NIST SP 811 B.9)', () => {
    const values = defaultCaseFormValues('imperial')
    values.fluid.medium = 'water'
    values.fluid.temperature.value = 250
    values.velocity.value = 10
    values.length.value = 3
    const result = validateCaseForm(values)
    expect(result.ok).toBe(false)
    if (!result.ok) expect(result.errors['fluid.temperature.value']).toBe('Water is covered as a liquid from 32\u202f°F to 212\u202f°F at ordinary pressure.')
  })
  it('an emptied temperature is refused, not silently 20 °C', () => {
    const values = defaultCaseFormValues('si')
    values.velocity.value = 10
    values.length.value = 1
    values.fluid.temperature.value = undefined
    const result = validateCaseForm(values)
    expect(result.ok).toBe(false)
    if (!result.ok) expect(result.errors['fluid.temperature.value']).toMatch(/Temperature is required for air/)
  })
  it('says what is assumed for fields left empty (ISO 2533 standard atmosphere 101,325 Pa = 14.6959 psi)', () => {
    const values = defaultCaseFormValues('imperial')
    values.fluid.pressure.value = undefined
    values.turbulenceIntensityPercent = undefined
    values.growthRatio = undefined
    const notes = assumptionsOf(values, 'imperial')
    expect(notes['fluid.pressure.value']).toBe('Left empty: one standard atmosphere, 14.6959\u202fpsi, is assumed.')
    expect(notes.turbulenceIntensityPercent).toBe('Left empty: 1\u202f% is assumed.')
    expect(notes.growthRatio).toBe('Left empty: a growth ratio of 1.2 is assumed.')
  })
})

describe("the engineer's own choice", () => {
  const base = () => {
    const values = defaultCaseFormValues('si')
    values.velocity.value = 10
    values.length.value = 1
    return values
  }
  it('refuses a y+ target that contradicts the requested treatment (viscous sublayer y+ < 5, Pope 2000 sec. 7.1; log layer 30-300, common practice)', () => {
    const values = base()
    values.yPlusTarget = 1000
    values.requested = { approach: '', wallTreatment: 'resolved', reason: 'The client asks for a resolved wall throughout.' }
    const result = validateCaseForm(values)
    expect(result.ok).toBe(false)
    if (!result.ok) expect(result.errors.yPlusTarget).toMatch(/contradicts the wall treatment you requested/)
    values.yPlusTarget = 1
    expect(validateCaseForm(values).ok).toBe(true)
    // Wall-resolved LES implies a resolved wall even when no treatment is named.
    values.requested = { approach: 'wrles', wallTreatment: '', reason: 'The client asks for a resolved wall throughout.' }
    values.yPlusTarget = 50
    expect(validateCaseForm(values).ok).toBe(false)
  })
  it('a choice needs a reason, and a treatment its approach goes with', () => {
    const values = base()
    values.requested = { approach: 'rans', wallTreatment: '', reason: 'short' }
    const result = validateCaseForm(values)
    expect(result.ok).toBe(false)
    if (!result.ok) expect(result.errors['requested.reason']).toMatch(/at least a sentence/)
    values.requested = { approach: 'dns', wallTreatment: 'wall-function', reason: 'As the reviewer asked in the override.' }
    const second = validateCaseForm(values)
    expect(second.ok).toBe(false)
    if (!second.ok) expect(second.errors['requested.wallTreatment']).toMatch(/goes with/)
  })
  it('without a choice, a y+ target out of band is only the engine\'s caution', () => {
    const values = base()
    values.yPlusTarget = 1000
    expect(validateCaseForm(values).ok).toBe(true)
  })
})

describe('the typed values as a route reads them', () => {
  it('accepts the form values, checks the units, and turns null into empty', () => {
    const values = enteredOf(defaultCaseFormValues('imperial'))
    const parsed = enteredCaseSchema.safeParse(JSON.parse(JSON.stringify({ ...values, yPlusTarget: null })))
    expect(parsed.success).toBe(true)
    if (parsed.success) expect(parsed.data.yPlusTarget).toBeUndefined()
    const wrongUnit = enteredCaseSchema.safeParse({ ...values, velocity: { value: 3, unit: 'psi' } })
    expect(wrongUnit.success).toBe(false)
  })
  it('converts every field to another system and back (NIST SP 811 B.8, B.9)', () => {
    const values = defaultCaseFormValues('si')
    values.velocity.value = 30.48
    const imperial = inUnitSystem(values, 'imperial')
    expect(imperial.velocity).toEqual({ value: 100, unit: 'ft/s' })
    expect(imperial.fluid.temperature).toEqual({ value: 68, unit: 'degF' })
    expect(inUnitSystem(imperial, 'si').velocity).toEqual({ value: 30.48, unit: 'm/s' })
  })
})
