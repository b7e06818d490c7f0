import { describe, expect, it } from 'vitest'
import { advise } from '#shared/rules/index'
import { BUFFET_STROUHAL, STROUHAL, classifyRegime, machRegime, sheddingStrouhal } from '#shared/rules/regime'

const pipe = { regime: 'internal' as const, geometry: 'duct' as const, separation: 'none' as const }
const plate = { regime: 'external' as const, geometry: 'streamlined' as const, separation: 'none' as const }
const cylinder = { regime: 'external' as const, geometry: 'bluff' as const, separation: 'massive' as const }

describe('regime thresholds', () => {
  it('pipe: laminar below Re_D 2300, transitional to 4000, turbulent above (Reynolds 1883; common practice; Avila et al. 2011, Science 333, 192)', () => {
    expect(classifyRegime(pipe, 2000, null).state).toBe('laminar')
    expect(classifyRegime(pipe, 3000, null).state).toBe('transitional')
    expect(classifyRegime(pipe, 5000, null).state).toBe('turbulent')
    expect(classifyRegime(pipe, 3000, null).basis).toBe('pipe')
  })

  it('flat plate and aerofoil: turbulent from Re_x 5e5 (Schlichting, from memory), laminar below 3e4 (Carmichael 1981, NASA CR-165803, from memory)', () => {
    expect(classifyRegime(plate, 1e4, 0.01).state).toBe('laminar')
    expect(classifyRegime(plate, 6e4, 0.01).state).toBe('transitional')
    expect(classifyRegime(plate, 4.9e5, 0.01).state).toBe('transitional')
    expect(classifyRegime(plate, 6e6, 0.01).state).toBe('turbulent')
  })

  it('circular-cylinder wake: steady below 47, laminar periodic to 190, three-dimensional above, turbulent shear layers from about 1000 (Williamson 1996, Annu. Rev. Fluid Mech. 28, 477)', () => {
    expect(classifyRegime(cylinder, 30, null).wake).toBe('steady')
    expect(classifyRegime(cylinder, 100, null)).toMatchObject({ state: 'laminar', wake: 'periodic-laminar' })
    expect(classifyRegime(cylinder, 250, null)).toMatchObject({ state: 'transitional', wake: 'three-dimensional' })
    expect(classifyRegime(cylinder, 3900, null)).toMatchObject({ state: 'turbulent', wake: 'turbulent', boundaryLayer: 'laminar' })
  })

  it('cylinder boundary layer: laminar to the drag crisis near 2e5, turbulent beyond 5e5 (Achenbach 1968; Roshko 1961)', () => {
    expect(classifyRegime(cylinder, 1e5, null).boundaryLayer).toBe('laminar')
    expect(classifyRegime(cylinder, 3e5, null).boundaryLayer).toBe('transitional')
    expect(classifyRegime(cylinder, 1e6, null).boundaryLayer).toBe('turbulent')
  })

  it('Mach regimes: incompressible below 0.3, transonic from 0.7, supersonic from 1.2, hypersonic from 5 (Anderson, from memory)', () => {
    expect(machRegime(null)).toBe('incompressible')
    expect([0.2, 0.5, 0.85, 2, 6].map(machRegime)).toEqual(['incompressible', 'subsonic-compressible', 'transonic', 'supersonic', 'hypersonic'])
  })
})

describe('Strouhal numbers', () => {
  it('circular cylinder: about 0.164 at Re 100 (Williamson 1996 measures 0.164; Roshko 1954: 0.212 - 4.5/Re = 0.167), within 0.01', () => {
    expect(Math.abs(sheddingStrouhal(100, 'bluff')! - 0.164)).toBeLessThan(0.01)
    expect(Math.abs(sheddingStrouhal(100, 'bluff')! - (0.212 - 4.5 / 100))).toBeLessThan(0.01)
  })

  it('circular cylinder: about 0.21 at Re 3900 (Parnaudeau et al. 2008, Phys. Fluids 20, 085101: 0.208), 0.27 above Re 3.5e6 (Roshko 1961, JFM 10, 345)', () => {
    expect(Math.abs(sheddingStrouhal(3900, 'bluff')! - 0.208)).toBeLessThan(0.005)
    expect(sheddingStrouhal(1e7, 'bluff')).toBe(0.27)
    expect(sheddingStrouhal(30, 'bluff')).toBeNull()
  })

  it('sharp-edged bodies shed at about 0.13 (square cylinder, Lyn et al. 1995, JFM 304, 285: 0.132)', () => {
    expect(Math.abs(STROUHAL.sharpEdged - 0.132)).toBeLessThan(0.005)
    expect(sheddingStrouhal(2.2e4, 'complex')).toBe(STROUHAL.sharpEdged)
  })

  it('transonic buffet on an aerofoil: about 0.066 on the chord (Jacquin et al. 2009, AIAA J. 47, 1985: 69 Hz, c = 0.23 m, U = 240 m/s, from memory)', () => {
    expect(Math.abs(BUFFET_STROUHAL - (69 * 0.23) / 240)).toBeLessThan(0.003)
    expect(classifyRegime({ regime: 'external', geometry: 'streamlined', separation: 'mild' }, 3e6, 0.73).strouhal).toBe(BUFFET_STROUHAL)
  })
})

describe('the regime in the advice', () => {
  const budget = { coreHours: 1000, cores: 64, wallClockHours: 48 }

  it('a pipe at Re_D 3000 is flagged transitional, with a caution, and offered a laminar solution and transition-aware methods (not a fully turbulent model)', () => {
    const advice = advise({ ...pipe, fluid: { medium: 'water' }, velocity: (3000 * 1.004e-6) / 0.05, length: 0.05, quantities: ['pressure'], budget })
    expect(advice.regime.state).toBe('transitional')
    expect(advice.regime.summary).toMatch(/^Transitional at Re = 3,00\d \(duct flow/)
    expect(advice.cautions.join(' ')).toMatch(/Transitional Reynolds number/)
    expect(advice.approaches.map((entry) => entry.id)).toContain('laminar')
    const chosen = advice.approaches.find((entry) => entry.id === advice.recommendation.approach)!
    expect(['dns', 'wrles', 'laminar'].includes(chosen.id) || /transition/.test(chosen.model)).toBe(true)
  })

  it('a cylinder at Re 100 gets a laminar solution, not a turbulence model (Williamson 1996)', () => {
    const advice = advise({ ...cylinder, fluid: { medium: 'air' }, velocity: (100 * 1.506e-5) / 0.01, length: 0.01, quantities: ['forces'], budget })
    expect(advice.recommendation.approach).toBe('laminar')
    expect(advice.recommendation.model).toMatch(/laminar/)
    expect(advice.cautions.join(' ')).toMatch(/Laminar flow/)
  })
})
