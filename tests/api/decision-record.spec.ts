// The case as typed, kept beside the engine's SI case: unit system and typed values stored with
// each revision, checked by the engine in SI with messages in the typed units, and the
// engineer's own approach or wall treatment recorded against the engine's, costed.
import { beforeAll, describe, expect, it } from 'vitest'
import { advise, caseInputSchema, costFor } from '../../shared/rules'
import { defaultCaseFormValues, enteredOf, toCaseInputDraft, type EnteredCase } from '../../shared/schemas/case-form'
import { type ApiClient, signIn } from '../support/api-client'
import { DUCT_CASE, createDraft, projectIds, uniqueTitle } from '../support/decisions'

let engineer: ApiClient
let auditor: ApiClient
let project: Record<string, number>

/** Our own imperial case: the KB-101 ferry hull as the client's drawings give it, 59 °F water, 24 ft/s, 98 ft. */
function imperialHull(): EnteredCase {
  const values = enteredOf(defaultCaseFormValues('imperial'))
  values.fluid.medium = 'water'
  values.fluid.temperature = { value: 59, unit: 'degF' }
  values.velocity = { value: 24, unit: 'ft/s' }
  values.length = { value: 98, unit: 'ft' }
  values.budget = { coreHours: 20000, cores: 256, wallClockHours: 72 }
  return values
}

beforeAll(async () => {
  ;[engineer, auditor] = await Promise.all(['engineer', 'auditor'].map(signIn))
  project = await projectIds(engineer)
})

describe('a case saved as typed', () => {
  it('keeps the unit system and the typed values beside the SI case the engine used (NIST SP 811: 1 ft = 0.3048 m)', async () => {
    const entered = imperialHull()
    const res = await engineer.post(`/api/projects/${project['KB-101']}/decisions`, { title: uniqueTitle('Imperial hull'), entered, unitSystem: 'imperial' })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const d = res.body.decision
    expect(d.unitSystem).toBe('imperial')
    expect(d.entered.velocity).toEqual({ value: 24, unit: 'ft/s' })
    expect(d.entered.fluid.temperature).toEqual({ value: 59, unit: 'degF' })
    expect(d.caseInput.velocity).toBeCloseTo(24 * 0.3048, 12)
    expect(d.caseInput.length).toBeCloseTo(98 * 0.3048, 12)
    // 59 °F = 288.15 K (NIST SP 811 B.9)
    expect(d.caseInput.fluid.temperatureK).toBeCloseTo(288.15, 9)
    expect(d.advice).toEqual(JSON.parse(JSON.stringify(advise(toCaseInputDraft(entered)))))

    // Each revision keeps its own; a revision typed in SI says so.
    const revised = await engineer.put(`/api/decisions/${d.id}`, {
      version: d.version, unitSystem: 'si',
      entered: { ...entered, velocity: { value: 8, unit: 'm/s' } },
    })
    expect(revised.status, JSON.stringify(revised.body)).toBe(200)
    expect(revised.body.decision.unitSystem).toBe('si')
    const first = (await auditor.get(`/api/decisions/${d.id}/revisions/1`)).body.revision
    const second = (await auditor.get(`/api/decisions/${d.id}/revisions/2`)).body.revision
    expect(first).toMatchObject({ unitSystem: 'imperial', entered: { velocity: { value: 24, unit: 'ft/s' } } })
    expect(second).toMatchObject({ unitSystem: 'si', entered: { velocity: { value: 8, unit: 'm/s' } } })
    const events = (await auditor.get(`/api/decisions/${d.id}/events`)).body.events
    expect(events.map((e: { payload: { unitSystem?: string } }) => e.payload.unitSystem)).toEqual(['imperial', 'si'])
  })

  it('stores a case sent in SI only as typed in SI', async () => {
    const d = await createDraft(engineer, project['KB-102']!)
    expect(d.unitSystem).toBe('si')
    expect(d.entered.velocity).toEqual({ value: DUCT_CASE.velocity, unit: 'm/s' })
    // 295 K = 21.85 °C (NIST SP 811 B.9)
    expect(d.entered.fluid.temperature.value).toBeCloseTo(21.85, 9)
  })

  it('answers limits in the typed units, and refuses typed values that disagree with the SI case', async () => {
    const entered = { ...imperialHull(), velocity: { value: 40000, unit: 'ft/s' } }
    const tooFast = await engineer.post(`/api/projects/${project['KB-101']}/decisions`, { title: uniqueTitle('Too fast'), entered, unitSystem: 'imperial' })
    expect(tooFast.status).toBe(400)
    // 1e4 m/s = 32,808.4 ft/s (NIST SP 811 B.8)
    expect(tooFast.body.data.fieldErrors['entered.velocity.value']).toEqual(['Velocity above 32,808.4\u202fft/s is outside the range this engine handles.'])

    const wrongUnit = await engineer.post(`/api/projects/${project['KB-101']}/decisions`, {
      title: uniqueTitle('Wrong unit'), entered: { ...imperialHull(), velocity: { value: 24, unit: 'psi' } },
    })
    expect(wrongUnit.status).toBe(400)
    expect(Object.keys(wrongUnit.body.data.fieldErrors)).toEqual(['entered.velocity.unit'])

    const mismatch = await engineer.post(`/api/projects/${project['KB-101']}/decisions`, {
      title: uniqueTitle('Mismatch'), entered: imperialHull(), caseInput: { ...toCaseInputDraft(imperialHull()), velocity: 24 },
    })
    expect(mismatch.status).toBe(400)
    expect(mismatch.body.data.fieldErrors.caseInput[0]).toMatch(/does not match the values as entered/)

    const nothing = await engineer.post(`/api/projects/${project['KB-101']}/decisions`, { title: uniqueTitle('No case') })
    expect(nothing.status).toBe(400)
    expect(nothing.body.data.fieldErrors.caseInput[0]).toMatch(/A case is required/)
  })
})

describe("the engineer's own choice", () => {
  it('is recorded against the engine\'s, costed for its approach and treatment, and stands for the decision in lists', async () => {
    // The supply duct: the engine recommends steady RANS with a resolved wall; the team means to
    // run unsteady RANS with log-law wall functions.
    const requested = { approach: 'urans', wallTreatment: 'wall-function', reason: 'The fan pulsation matters for the client; we run unsteady.' }
    const res = await engineer.post(`/api/projects/${project['KB-102']}/decisions`, { title: uniqueTitle('Duct, own choice'), caseInput: DUCT_CASE, requested })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const d = res.body.decision
    expect(d.advice.recommendation.approach).toBe('rans')
    const input = caseInputSchema.parse(DUCT_CASE)
    // The record keeps the figures of the engine's costFor for the pair (the one costing function).
    const full = costFor(input, 'urans', 'wall-function')
    const cost = {
      cells: full.cells, timeSteps: full.timeSteps, coreHours: full.coreHours, wallClockHours: full.wallClockHours,
      memoryGB: full.memoryGB, feasible: full.feasible, layers: full.layers,
    }
    expect(d.requested).toEqual({ ...requested, figures: expect.objectContaining({ approach: 'urans', wallTreatment: 'wall-function', cost: JSON.parse(JSON.stringify(cost)) }) })
    expect(d.requested.figures.wall.wallTreatment).toBe('wall-function')
    const row = (await engineer.get(`/api/projects/${project['KB-102']}/decisions?limit=100`)).body.items.find((x: { id: number }) => x.id === d.id)
    expect(row).toMatchObject({ approach: 'urans', model: d.advice.approaches.find((a: { id: string }) => a.id === 'urans').model })
    expect(row.coreHours).toBeCloseTo(cost.coreHours, 9)
  })

  it('refuses a y+ target that contradicts the requested wall treatment (viscous sublayer: y+ below 5, Pope 2000 sec. 7.1)', async () => {
    const requested = { wallTreatment: 'resolved', reason: 'The wall heat flux must be resolved for this client.' }
    const inSi = await engineer.post(`/api/projects/${project['KB-102']}/decisions`, {
      title: uniqueTitle('Contradiction'), caseInput: { ...DUCT_CASE, yPlusTarget: 1000 }, requested,
    })
    expect(inSi.status).toBe(400)
    expect(inSi.body.data.fieldErrors['caseInput.yPlusTarget'][0]).toMatch(/contradicts the wall treatment you requested/)
    const typed = await engineer.post(`/api/projects/${project['KB-101']}/decisions`, {
      title: uniqueTitle('Contradiction'), entered: { ...imperialHull(), yPlusTarget: 1000 }, unitSystem: 'imperial', requested,
    })
    expect(typed.status).toBe(400)
    expect(typed.body.data.fieldErrors['entered.yPlusTarget'][0]).toMatch(/contradicts/)
    // Without a requested treatment the same target is the engine's caution only.
    const caution = await engineer.post(`/api/projects/${project['KB-102']}/decisions`, { title: uniqueTitle('Caution only'), caseInput: { ...DUCT_CASE, yPlusTarget: 1000 } })
    expect(caution.status).toBe(201)
  })

  it('needs a reason, and a treatment its approach can use', async () => {
    const short = await engineer.post(`/api/projects/${project['KB-102']}/decisions`, {
      title: uniqueTitle('No reason'), caseInput: DUCT_CASE, requested: { approach: 'urans', reason: 'why not' },
    })
    expect(short.status).toBe(400)
    expect(Object.keys(short.body.data.fieldErrors)).toEqual(['requested.reason'])
    const mismatched = await engineer.post(`/api/projects/${project['KB-102']}/decisions`, {
      title: uniqueTitle('Mismatched'), caseInput: DUCT_CASE, requested: { approach: 'dns', wallTreatment: 'wall-function', reason: 'As the reviewer asked in the override.' },
    })
    expect(mismatched.status).toBe(400)
    expect(Object.keys(mismatched.body.data.fieldErrors)).toEqual(['requested.wallTreatment'])
    // A treatment alone that the engine's approach cannot use: the approach must be chosen too.
    const treatmentOnly = await engineer.post(`/api/projects/${project['KB-102']}/decisions`, {
      title: uniqueTitle('Treatment only'), caseInput: DUCT_CASE, requested: { wallTreatment: 'wall-model', reason: 'We want the wall modelled as in the last job.' },
    })
    expect(treatmentOnly.status).toBe(400)
    expect(treatmentOnly.body.data.fieldErrors['requested.approach'][0]).toMatch(/does not go with/)
  })
})
