import { describe, expect, it } from 'vitest'
import { advise } from '#shared/rules/index'
import {
  FULLY_ROUGH_LOG_LAW_CONSTANT,
  roughnessLogLawShift,
  roughnessRegime,
  roughnessReynolds,
  sandGrainFromRoughnessLength,
} from '#shared/rules/roughness'
import { colebrookFriction, fullyRoughPlateSkinFriction, roughPlateSkinFriction, schlichtingSkinFriction } from '#shared/rules/skin-friction'

const relative = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected)

describe('roughness Reynolds number and regimes (Nikuradse 1933, via Schlichting; from memory)', () => {
  it('k_s+ = k_s u_tau / nu: 100 micrometres at u_tau = 0.5 m/s in air (nu 1.5e-5) is k_s+ = 3.3 (our arithmetic)', () => {
    expect(roughnessReynolds(1e-4, 0.5, 1.5e-5)).toBeCloseTo(3.333, 3)
  })

  it('smooth below 5, transitional 5-70, fully rough above 70', () => {
    expect([4, 5, 69, 70, 1000].map(roughnessRegime)).toEqual(['smooth', 'transitional', 'transitional', 'fully-rough', 'fully-rough'])
  })

  it('the log-law shift is zero when smooth and equals the fully rough law u+ = ln(y/k_s)/kappa + 8.5 when fully rough (Nikuradse)', () => {
    expect(roughnessLogLawShift(4)).toBe(0)
    const kPlus = 500
    // smooth law minus rough law at any y: (ln y+ /k + 5.0) - (ln(y+/k_s+)/k + 8.5) = ln(k_s+)/k + 5.0 - 8.5
    expect(roughnessLogLawShift(kPlus)).toBeCloseTo(Math.log(kPlus) / 0.41 + 5 - FULLY_ROUGH_LOG_LAW_CONSTANT, 12)
    expect(roughnessLogLawShift(30)).toBeGreaterThan(0)
    expect(roughnessLogLawShift(30)).toBeLessThan(roughnessLogLawShift(70))
  })

  it('terrain: k_s = 9.793 z0 / C_s (Blocken, Stathopoulos & Carmeliet 2007, from memory), about 30 z0 with C_s = 0.327', () => {
    expect(relative(sandGrainFromRoughnessLength(0.1), 2.995)).toBeLessThan(0.01)
    expect(sandGrainFromRoughnessLength(0.1, 0.5)).toBeCloseTo(1.9586, 4)
  })
})

describe('rough-wall friction laws', () => {
  it('fully rough plate Cf = (2.87 + 1.58 log10(x/k_s))^-2.5: 0.00391 at x/k_s = 1e4 (Schlichting, from memory; our arithmetic: 9.19^-2.5)', () => {
    expect(relative(fullyRoughPlateSkinFriction(1e4), (2.87 + 1.58 * 4) ** -2.5)).toBeLessThan(1e-12)
    expect(relative(fullyRoughPlateSkinFriction(1e4), 0.00391)).toBeLessThan(0.01)
  })

  it('a rough plate is never smoother than a smooth one and tends to the fully rough value at high Re (Schlichting)', () => {
    expect(roughPlateSkinFriction(1e9, 1e4)).toBeCloseTo(fullyRoughPlateSkinFriction(1e4), 12)
    expect(roughPlateSkinFriction(1e5, 1e8)).toBeCloseTo(Math.max(schlichtingSkinFriction(1e5), fullyRoughPlateSkinFriction(1e8)), 12)
  })

  it('Colebrook-White with k/D = 0.001 at Re 1e7 gives f = 0.0197 (Moody 1944 chart, fully rough line; from memory)', () => {
    expect(relative(colebrookFriction(1e7, 0.001), 0.0197)).toBeLessThan(0.02)
  })
})

describe('roughness in the advice', () => {
  const budget = { coreHours: 2e4, cores: 256, wallClockHours: 100 }

  it('a hydraulically smooth pipe (k_s+ about 4) is not warned as rough (Nikuradse)', () => {
    // water pipe D = 0.1 m at 2 m/s: u_tau is about 0.08 m/s, so k_s = 50 micrometres gives k_s+ about 4
    const advice = advise({ regime: 'internal', fluid: { medium: 'water' }, velocity: 2, length: 0.1, roughness: 50e-6, geometry: 'duct', separation: 'none', quantities: ['pressure'], budget })
    expect(advice.roughness!.roughnessPlus).toBeGreaterThan(2)
    expect(advice.roughness!.roughnessPlus).toBeLessThan(5)
    expect(advice.roughness!.regime).toBe('smooth')
    expect(advice.trace.find((entry) => entry.rule === 'rough-walls')!.fired).toBe(false)
  })

  it('a ship hull and terrain under wind are accepted as rough walls and get rough-wall functions (ITTC: a coated hull is transitionally rough at full scale; Blocken et al. 2007)', () => {
    const hull = advise({ regime: 'external', fluid: { medium: 'water' }, velocity: 12, length: 200, roughness: 150e-6, geometry: 'streamlined', separation: 'none', quantities: ['forces'], budget })
    expect(hull.roughness!.regime).toBe('transitional')
    expect(hull.recommendation.wallTreatment).toBe('rough-wall-function')
    const building = advise({ regime: 'external', fluid: { medium: 'air' }, velocity: 10, length: 100, roughnessLength: 0.3, geometry: 'complex', separation: 'massive', quantities: ['pressure'], budget })
    expect(building.roughness!.regime).toBe('fully-rough')
    expect(building.recommendation.wallTreatment).toBe('rough-wall-function')
    expect(building.roughness!.roughnessLength).toBe(0.3)
    expect(building.roughness!.sandGrainHeight).toBeCloseTo(sandGrainFromRoughnessLength(0.3), 12)
    expect(building.cautions.join(' ')).toMatch(/C_s = 0.5 needs k_s/)
  })
})
