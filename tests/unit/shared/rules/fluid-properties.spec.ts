import { describe, expect, it } from 'vitest'
import {
  TURBULENT_RECOVERY_FACTOR,
  adiabaticWallTemperature,
  airDensity,
  airReferenceState,
  airSpeedOfSound,
  airViscosity,
  eckertReferenceTemperature,
  fluidState,
  waterDensity,
  waterViscosityIapws,
} from '#shared/rules/fluid-properties'

const relative = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected)

describe('air by Sutherland and the ideal gas', () => {
  it('viscosity at 20 C is 1.813e-5 Pa s (Sutherland 1893 with White, Viscous Fluid Flow constants; handbook tables give 1.81e-5, from memory)', () => {
    expect(relative(airViscosity(293.15), 1.8133e-5)).toBeLessThan(1e-4)
    expect(relative(airViscosity(293.15), 1.81e-5)).toBeLessThan(0.005)
  })

  it('equals the reference viscosity at the reference temperature (Sutherland 1893: mu(T0) = mu0)', () => {
    expect(airViscosity(273.15)).toBeCloseTo(1.716e-5, 12)
  })

  it('density at 20 C and 101325 Pa is 1.204 kg/m3 (ideal gas, R = 287.05 J/(kg K); handbook 1.204, from memory)', () => {
    expect(relative(airDensity(293.15, 101325), 1.2041)).toBeLessThan(1e-4)
  })

  it('kinematic viscosity at 20 C is about 1.51e-5 m2/s (handbook tables 1.51-1.52e-5, from memory)', () => {
    const air = fluidState({ medium: 'air' })
    expect(air.kinematicViscosity).toBeGreaterThan(1.49e-5)
    expect(air.kinematicViscosity).toBeLessThan(1.53e-5)
  })

  it('speed of sound at 20 C is about 343 m/s (textbook value, from memory)', () => {
    expect(airSpeedOfSound(293.15)).toBeGreaterThan(342)
    expect(airSpeedOfSound(293.15)).toBeLessThan(344)
  })

  it('rejects temperatures outside Sutherland range with a message (White, Viscous Fluid Flow: about 100-1900 K)', () => {
    expect(() => fluidState({ medium: 'air', temperatureK: 50 })).toThrow(/Sutherland/)
    expect(() => fluidState({ medium: 'air', temperatureK: 2500 })).toThrow(/Sutherland/)
  })
})

describe('water by IAPWS R12-08 and Kell 1975', () => {
  // IAPWS R12-08 (Huber et al. 2009, J. Phys. Chem. Ref. Data 38, 101), Table 4 verification values without the critical enhancement, micro-Pa s.
  const iapwsTable4: [number, number, number][] = [
    [298.15, 998, 889.7351],
    [298.15, 1200, 1437.649467],
    [373.15, 1000, 307.883622],
    [433.15, 1, 14.538324],
    [433.15, 1000, 217.685358],
    [873.15, 1, 32.619287],
    [873.15, 100, 35.802262],
    [873.15, 600, 77.430195],
    [1173.15, 1, 44.217245],
    [1173.15, 100, 47.640433],
    [1173.15, 400, 64.154608],
  ]
  it.each(iapwsTable4)('IAPWS R12-08 Table 4: T = %d K, rho = %d kg/m3 gives %d micro-Pa s', (temperature, density, expected) => {
    expect(relative(waterViscosityIapws(temperature, density) * 1e6, expected)).toBeLessThan(1e-7)
  })

  // Kell 1975, J. Chem. Eng. Data 20, 97: density of water at 1 atm.
  const kell: [number, number][] = [
    [0, 999.84],
    [4, 999.972],
    [20, 998.204],
    [25, 997.045],
    [40, 992.216],
    [100, 958.364],
  ]
  it.each(kell)('Kell 1975: density at %d C is %d kg/m3', (celsius, expected) => {
    expect(Math.abs(waterDensity(celsius + 273.15) - expected)).toBeLessThan(0.001)
  })

  it('density at 20 C agrees with the CIPM formula, 998.2067 kg/m3 (Tanaka et al. 2001, Metrologia 38, 301)', () => {
    expect(Math.abs(waterDensity(293.15) - 998.2067)).toBeLessThan(0.005)
  })

  it('has its density maximum near 4 C (Kell 1975)', () => {
    const at = (celsius: number) => waterDensity(celsius + 273.15)
    expect(at(4)).toBeGreaterThan(at(2))
    expect(at(4)).toBeGreaterThan(at(6))
  })

  it('viscosity at 20 C is 1.002e-3 Pa s (handbook value, from memory; IAPWS R12-08 gives 1.0016e-3)', () => {
    const water = fluidState({ medium: 'water', temperatureK: 293.15 })
    expect(relative(water.viscosity, 1.002e-3)).toBeLessThan(0.002)
    expect(relative(water.kinematicViscosity, 1.004e-6)).toBeLessThan(0.003)
  })

  it('rejects temperatures outside the liquid range with a message (Kell 1975 covers 0-150 C at 1 atm; we take 0-100 C)', () => {
    expect(() => fluidState({ medium: 'water', temperatureK: 260 })).toThrow(/liquid range/)
    expect(() => fluidState({ medium: 'water', temperatureK: 380 })).toThrow(/liquid range/)
  })
})

describe('custom fluid', () => {
  it('uses the given density and viscosity and has no speed of sound', () => {
    const oil = fluidState({ medium: 'custom', density: 870, viscosity: 0.03 })
    expect(oil.density).toBe(870)
    expect(oil.kinematicViscosity).toBeCloseTo(0.03 / 870, 15)
    expect(oil.speedOfSound).toBeNull()
  })

  it('needs both density and viscosity', () => {
    expect(() => fluidState({ medium: 'custom', density: 870 })).toThrow(/density and viscosity/)
  })
})

describe('compressible wall properties (reference-temperature method)', () => {
  it('adiabatic wall at Mach 0.85 and 288 K is about 325 K with a turbulent recovery factor of about 0.89 (r = Pr^(1/3); textbook, from memory)', () => {
    expect(TURBULENT_RECOVERY_FACTOR).toBeGreaterThan(0.88)
    expect(TURBULENT_RECOVERY_FACTOR).toBeLessThan(0.9)
    expect(Math.abs(adiabaticWallTemperature(288, 0.85) - 325)).toBeLessThan(1.5)
  })

  it("Eckert's T* = T_e + 0.5 (T_w - T_e) + 0.22 (T_aw - T_e): worked example 300, 400, 350 K gives 361 K (Eckert 1955, from memory; our arithmetic)", () => {
    expect(eckertReferenceTemperature(300, 400, 350)).toBeCloseTo(361, 12)
  })

  it('at Mach 0.85 over an adiabatic wall the wall kinematic viscosity is 15-25% above the free stream, several-fold at Mach 5 (our estimate from Sutherland and the ideal gas)', () => {
    const air = fluidState({ medium: 'air', temperatureK: 288 })
    const transonic = airReferenceState(air, 101325, 0.85)
    expect(transonic.wallKinematicViscosity / air.kinematicViscosity).toBeGreaterThan(1.15)
    expect(transonic.wallKinematicViscosity / air.kinematicViscosity).toBeLessThan(1.25)
    const cold = fluidState({ medium: 'air', temperatureK: 220 })
    const hypersonic = airReferenceState(cold, 2000, 5)
    expect(hypersonic.wallKinematicViscosity / cold.kinematicViscosity).toBeGreaterThan(4)
  })

  it('reduces to the free stream at low Mach over an adiabatic wall (T* within 0.1% at Mach 0.05)', () => {
    const air = fluidState({ medium: 'air' })
    const state = airReferenceState(air, 101325, 0.05)
    expect(Math.abs(state.temperatureK / 293.15 - 1)).toBeLessThan(1e-3)
  })
})
