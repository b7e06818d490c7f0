import { describe, expect, it } from 'vitest'
import { advise } from '#shared/rules'
import {
  caseFormValuesFrom,
  convertQuantityValue,
  defaultCaseFormValues,
  formPathFor,
  toCaseInputDraft,
  validateCaseForm,
} from '#shared/schemas/case-form'

describe('the questionnaire values and the engine input', () => {
  it('the defaults are air at 20 °C and 101.325 kPa, 1 % intensity, growth ratio 1.2 (ISO 2533 standard atmosphere pressure)', () => {
    const values = defaultCaseFormValues('SI')
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
    const values = defaultCaseFormValues('SI')
    values.fluid.medium = 'custom'
    values.fluid.density.value = 850
    values.fluid.viscosity = { value: 30, unit: 'cP' }
    const draft = toCaseInputDraft(values)
    expect(draft.fluid).toEqual({ medium: 'custom', density: 850, viscosity: 0.03 })
  })

  it('the same case in SI and in imperial units gets the same advice (unit conversion only)', () => {
    const metric = defaultCaseFormValues('SI')
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
    const values = defaultCaseFormValues('SI')
    values.length.value = 1
    values.quantities = []
    const result = validateCaseForm(values)
    expect(result.ok).toBe(false)
    if (result.ok) return
    expect(result.errors['velocity.value']).toBe('Velocity is required.')
    expect(result.errors['quantities']).toMatch(/at least one/)
    expect(result.errors['length.value']).toBeUndefined()

    // The cross-field checks run once every field has a value of the right kind.
    const custom = defaultCaseFormValues('SI')
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
    const values = defaultCaseFormValues('SI')
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
