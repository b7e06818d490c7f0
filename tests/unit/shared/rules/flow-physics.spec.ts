import { describe, expect, it } from 'vitest'
import { caseInputSchema } from '#shared/rules/case-input'
import { flowPhysics, kolmogorovCells, kolmogorovLength, reynoldsNumber } from '#shared/rules/flow-physics'

const relative = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected)

const airCase = (velocity: number, length: number) =>
  caseInputSchema.parse({
    regime: 'external',
    fluid: { medium: 'air' },
    velocity,
    length,
    geometry: 'streamlined',
    separation: 'none',
    quantities: ['forces'],
    budget: { coreHours: 1000, cores: 16, wallClockHours: 24 },
  })

describe('flow scales', () => {
  it('Re = rho U L / mu (definition)', () => {
    expect(reynoldsNumber(1000, 2, 0.5, 1e-3)).toBeCloseTo(1e6, 6)
  })

  it('air at 20 C, 15 m/s over 1 m gives Re of about 1e6 (handbook nu = 1.51e-5 m2/s, from memory)', () => {
    expect(relative(flowPhysics(airCase(15, 1)).reynolds, 15 / 1.51e-5)).toBeLessThan(0.01)
  })

  it('the large-eddy Reynolds number is about 1% of Re at the default intensity (common practice, no source)', () => {
    const physics = flowPhysics(airCase(15, 1))
    expect(physics.reynoldsTurbulent / physics.reynolds).toBeCloseTo(0.01, 12)
  })

  it('at Re = 1e6 resolving every eddy takes about Re_L^(9/4) = 1e9 points (common practice, no source; Pope, Turbulent Flows 2000, sec. 9.1)', () => {
    expect(relative(kolmogorovCells(0.01 * 1e6), 1e9)).toBeLessThan(1e-9)
  })

  it('the Kolmogorov length is L Re_L^(-3/4): 1 mm for L = 1 m at Re_L = 1e4 (Kolmogorov 1941; Pope 2000, sec. 6.1)', () => {
    expect(relative(kolmogorovLength(1, 1e4), 1e-3)).toBeLessThan(1e-9)
  })

  it('Mach is about 1 at 343 m/s in air at 20 C, and null for water (textbook speed of sound, from memory)', () => {
    expect(flowPhysics(airCase(343, 1)).mach).toBeGreaterThan(0.99)
    expect(flowPhysics(airCase(343, 1)).mach).toBeLessThan(1.01)
    const water = caseInputSchema.parse({ ...airCase(1, 1), fluid: { medium: 'water' } })
    expect(flowPhysics(water).mach).toBeNull()
  })

  it('a pipe boundary layer is the radius, D/2 (definition of the engine)', () => {
    const pipe = caseInputSchema.parse({ ...airCase(10, 0.2), regime: 'internal', geometry: 'duct' })
    expect(flowPhysics(pipe).wall.boundaryLayerThickness).toBe(0.1)
  })

  it('smooth pipe at Re_D = 1e4 has Re_tau of about 310 (Colebrook 1939 friction; Re_tau = Re_D sqrt(f/8)/2, our arithmetic)', () => {
    const nu = 1.5e-5
    const pipe = caseInputSchema.parse({
      ...airCase(1, 1),
      regime: 'internal',
      geometry: 'duct',
      fluid: { medium: 'custom', density: 1, viscosity: nu },
      velocity: 1e4 * nu,
    })
    const physics = flowPhysics(pipe)
    expect(physics.reynolds).toBeCloseTo(1e4, 6)
    expect(physics.wall.deltaPlus).toBeGreaterThan(300)
    expect(physics.wall.deltaPlus).toBeLessThan(320)
  })
})
