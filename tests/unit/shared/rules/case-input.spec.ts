import { describe, expect, it } from 'vitest'
import { ZodError } from 'zod'
import { caseInputSchema, parseCaseInput, type CaseInputDraft } from '#shared/rules/case-input'

const valid: CaseInputDraft = {
  regime: 'internal',
  fluid: { medium: 'water', temperatureK: 293.15 },
  velocity: 1,
  length: 0.1,
  geometry: 'duct',
  separation: 'none',
  quantities: ['pressure'],
  budget: { coreHours: 1000, cores: 32, wallClockHours: 24 },
}

/** Issues of a failed parse as "path: message". */
function issues(input: unknown): string[] {
  const result = caseInputSchema.safeParse(input)
  if (result.success) return []
  return result.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`)
}

function withChange(change: (draft: Record<string, any>) => void): unknown {
  const draft = structuredClone(valid) as Record<string, any>
  change(draft)
  return draft
}

describe('caseInputSchema', () => {
  it('accepts a valid case and applies the defaults (turbulence intensity 0.01, growth ratio 1.2, no extra physics)', () => {
    const parsed = caseInputSchema.parse(valid)
    expect(parsed.turbulenceIntensity).toBe(0.01)
    expect(parsed.growthRatio).toBe(1.2)
    expect(parsed.physics).toEqual({ transition: false, heatTransfer: false, rotation: false, buoyancy: false, acoustics: false })
  })

  it.each([
    ['velocity', -1, 'velocity: Velocity must be greater than zero.'],
    ['velocity', 0, 'velocity: Velocity must be greater than zero.'],
    ['velocity', Number.NaN, 'velocity: Velocity must be a number in m/s.'],
    ['velocity', Number.POSITIVE_INFINITY, 'velocity: Velocity must be a finite number.'],
    ['velocity', '3', 'velocity: Velocity must be a number in m/s.'],
    ['length', 0, 'length: Length must be greater than zero.'],
  ])('rejects %s = %s with a per-field message', (field, value, message) => {
    expect(issues(withChange((draft) => (draft[field] = value)))).toContain(message)
  })

  it('names each missing field', () => {
    const found = issues({})
    for (const expected of [
      'regime: Flow regime must be one of: external, internal.',
      'fluid: Fluid is required.',
      'velocity: Velocity is required.',
      'length: Length is required.',
      'quantities: Choose at least one quantity of interest.',
      'budget: Budget is required.',
    ]) {
      expect(found).toContain(expected)
    }
  })

  it('rejects budget fields that are zero, negative or fractional cores', () => {
    const found = issues(withChange((draft) => (draft.budget = { coreHours: 0, cores: 2.5, wallClockHours: -1 })))
    expect(found).toContain('budget.coreHours: Core-hour budget must be greater than zero.')
    expect(found).toContain('budget.cores: Cores must be a whole number.')
    expect(found).toContain('budget.wallClockHours: Wall-clock budget must be greater than zero.')
  })

  it('needs at least one quantity of interest, each from the list', () => {
    expect(issues(withChange((draft) => (draft.quantities = [])))).toContain('quantities: Choose at least one quantity of interest.')
    expect(issues(withChange((draft) => (draft.quantities = ['lift'])))[0]).toMatch(/^quantities\.0: Each quantity must be one of/)
  })

  it('needs density and viscosity for a custom fluid, on their own fields', () => {
    const found = issues(withChange((draft) => (draft.fluid = { medium: 'custom' })))
    expect(found).toContain('fluid.density: Density is required for a custom fluid.')
    expect(found).toContain('fluid.viscosity: Dynamic viscosity is required for a custom fluid.')
  })

  it('keeps water liquid: 273.15-373.15 K (Kell 1975 range at ordinary pressure)', () => {
    expect(issues(withChange((draft) => (draft.fluid.temperatureK = 400)))[0]).toMatch(/^fluid\.temperatureK: Water is covered as a liquid/)
    expect(issues(withChange((draft) => (draft.fluid.temperatureK = 300)))).toEqual([])
  })

  it("keeps air within Sutherland's range, about 100-1900 K (White, Viscous Fluid Flow)", () => {
    const found = issues(withChange((draft) => (draft.fluid = { medium: 'air', temperatureK: 2500 })))
    expect(found[0]).toMatch(/^fluid\.temperatureK: Sutherland's law for air holds/)
  })

  it('accepts roughness for any wall: internal up to k/D = 0.05 (Moody 1944 chart range), external below half the length (our limit)', () => {
    expect(issues(withChange((draft) => (draft.roughness = 1e-4)))).toEqual([])
    expect(issues(withChange((draft) => (draft.roughness = 0.01)))[0]).toMatch(/^roughness: Relative roughness/)
    expect(issues(withChange((draft) => ((draft.regime = 'external'), (draft.roughness = 1e-4))))).toEqual([])
    expect(issues(withChange((draft) => ((draft.regime = 'external'), (draft.roughness = 0.06))))[0]).toMatch(/^roughness: Roughness above 0.5/)
    expect(issues(withChange((draft) => (draft.roughness = -1)))).toContain('roughness: Roughness cannot be negative.')
  })

  it('accepts an aerodynamic roughness length z0 for external flow only, and not together with k_s', () => {
    const external = (change: (draft: Record<string, any>) => void) =>
      withChange((draft) => {
        draft.regime = 'external'
        draft.length = 100
        change(draft)
      })
    expect(issues(external((draft) => (draft.roughnessLength = 0.3)))).toEqual([])
    expect(issues(external((draft) => ((draft.roughnessLength = 0.3), (draft.roughness = 0.01))))[0]).toMatch(/either the sand-grain roughness height or the roughness length/)
    expect(issues(withChange((draft) => (draft.roughnessLength = 0.001)))[0]).toMatch(/^roughnessLength: The roughness length z0 describes terrain/)
  })

  it('accepts the optional domain, frequency, wall temperature, time integration, swirl number and application, and keeps old cases valid without them', () => {
    expect(
      issues(
        withChange((draft) => {
          draft.domain = { dimensions: '2d', lengthRatio: 20, span: 0.5, wettedArea: 2, crossSection: 'channel' }
          draft.lowestFrequencyHz = 5
          draft.wallTemperatureK = 350
          draft.timeIntegration = 'implicit'
          draft.swirlNumber = 0.8
          draft.application = 'swirl'
        }),
      ),
    ).toEqual([])
    expect(issues(withChange((draft) => (draft.domain = { dimensions: '4d' })))[0]).toMatch(/^domain\.dimensions: Domain dimensions must be one of/)
    expect(issues(withChange((draft) => (draft.domain = { lengthRatio: 0 })))[0]).toMatch(/^domain\.lengthRatio: Domain length must be greater than zero/)
    expect(issues(withChange((draft) => ((draft.regime = 'external'), (draft.domain = { crossSection: 'pipe' }))))[0]).toMatch(/cross-section describes internal flow/)
    expect(issues(withChange((draft) => (draft.domain = { span: 1, colour: 'red' })))[0]).toMatch(/^domain: Unrecognized key/)
    expect(caseInputSchema.parse(valid).domain).toBeUndefined()
  })

  it('bounds turbulence intensity to (0, 0.5], growth ratio to [1.01, 2] and y+ to (0, 1000]', () => {
    expect(issues(withChange((draft) => (draft.turbulenceIntensity = 0)))).toContain(
      'turbulenceIntensity: Turbulence intensity must be greater than zero.',
    )
    expect(issues(withChange((draft) => (draft.turbulenceIntensity = 0.6)))).toContain(
      'turbulenceIntensity: Turbulence intensity must be at most 0.5 (50%).',
    )
    expect(issues(withChange((draft) => (draft.growthRatio = 1)))).toContain('growthRatio: Growth ratio must be at least 1.01.')
    expect(issues(withChange((draft) => (draft.growthRatio = 2.5)))).toContain('growthRatio: Growth ratio must be at most 2.')
    expect(issues(withChange((draft) => (draft.yPlusTarget = 0)))).toContain('yPlusTarget: Target y+ must be greater than zero.')
    expect(issues(withChange((draft) => (draft.yPlusTarget = 2000)))).toContain('yPlusTarget: Target y+ must be at most 1000.')
  })

  it('rejects unknown choices with the list of allowed ones', () => {
    expect(issues(withChange((draft) => (draft.separation = 'some')))).toContain('separation: Separation must be one of: none, mild, massive.')
  })
})

describe('parseCaseInput, the engine\'s fast parse', () => {
  it('gives the same result as caseInputSchema for valid cases and the same issues for invalid ones (property)', () => {
    const samples: unknown[] = [
      valid,
      {},
      { ...valid, velocity: -1 },
      { ...valid, fluid: { medium: 'custom' } },
      { ...valid, fluid: { medium: 'water', temperatureK: 400 } },
      { ...valid, roughness: 0.01 },
      { ...valid, regime: 'external', domain: { crossSection: 'pipe' } },
      { ...valid, regime: 'external', length: 10, roughnessLength: 0.1, roughness: 0.01 },
    ]
    for (const sample of samples) {
      const reference = caseInputSchema.safeParse(sample)
      let fast: unknown
      let error: unknown
      try {
        fast = parseCaseInput(sample)
      } catch (caught) {
        error = caught
      }
      if (reference.success) expect(fast).toEqual(reference.data)
      else {
        expect(error).toBeInstanceOf(ZodError)
        expect((error as ZodError).issues.map((found) => `${found.path.join('.')}: ${found.message}`)).toEqual(
          reference.error.issues.map((found) => `${found.path.join('.')}: ${found.message}`),
        )
      }
    }
  })
})
