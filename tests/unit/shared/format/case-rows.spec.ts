import { describe, expect, it } from 'vitest'
import { advise } from '#shared/rules'
import { caseRows, revisionDiff, type RevisionForDiff } from '#shared/format/case-rows'
import { defaultCaseFormValues, enteredOf, inUnitSystem, validateCaseForm, type CaseFormValues } from '#shared/schemas/case-form'
import type { UnitSystem } from '#shared/units'

function revision(values: CaseFormValues, unitSystem: UnitSystem): RevisionForDiff {
  const checked = validateCaseForm(values)
  if (!checked.ok) throw new Error(JSON.stringify(checked.errors))
  return { unitSystem, entered: enteredOf(values), caseInput: checked.input, advice: advise(checked.input), requested: null }
}

const imperialHull = () => {
  const values = defaultCaseFormValues('imperial')
  values.fluid.medium = 'water'
  values.fluid.temperature.value = 59
  values.velocity.value = 24
  values.length.value = 98
  return values
}

describe('a case as rows in the units it was typed in', () => {
  it('lists the inputs as typed, not converted to SI', () => {
    const r = revision(imperialHull(), 'imperial')
    const rows = Object.fromEntries(caseRows(r.entered, r.caseInput, 'imperial').map(row => [row.key, row.text]))
    expect(rows.temperature).toBe('59\u202f°F')
    expect(rows.velocity).toBe('24\u202fft/s')
    expect(rows.length).toBe('98\u202fft')
    expect(rows.medium).toBe('Water')
    expect(rows.coreHours).toBe('20,000\u202fcore-h')
    expect(rows.turbulenceIntensity).toBe('1\u202f%')
  })
  it('marks what the engine assumed (ISO 2533: 101,325 Pa = 14.6959 psi)', () => {
    const values = defaultCaseFormValues('imperial')
    values.velocity.value = 50
    values.length.value = 3
    values.fluid.pressure.value = undefined
    const r = revision(values, 'imperial')
    const pressure = caseRows(r.entered, r.caseInput, 'imperial').find(row => row.key === 'pressure')!
    expect(pressure.assumed).toBe(true)
    expect(pressure.text).toBe('14.6959\u202fpsi (one standard atmosphere, assumed)')
  })
})

describe('the revision diff', () => {
  it('names the fields that changed and what the advice then did (Re = U L / nu doubles with U)', () => {
    const before = revision(imperialHull(), 'imperial')
    const changed = imperialHull()
    changed.velocity.value = 48
    changed.separation = 'massive'
    const after = revision(changed, 'imperial')
    const diff = revisionDiff(before, after)
    expect(diff.inputs.map(c => c.key)).toEqual(['separation', 'velocity'])
    expect(diff.inputs.find(c => c.key === 'velocity')).toMatchObject({ before: '24\u202fft/s', after: '48\u202fft/s' })
    expect(diff.advice.map(c => c.key)).toContain('reynolds')
  })
  it('a case re-typed in other units is not a change, except for the unit system itself (NIST SP 811 B.8)', () => {
    const before = revision(imperialHull(), 'imperial')
    const metric = inUnitSystem(imperialHull(), 'si')
    const after = revision(metric, 'si')
    const diff = revisionDiff(before, after)
    expect(diff.inputs.map(c => c.key)).toEqual(['unitSystem'])
    expect(diff.advice).toEqual([])
  })
})
