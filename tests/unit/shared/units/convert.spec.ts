import { describe, expect, it } from 'vitest'
import { convertUnit, fromSI, tidy, toSI } from '#shared/units/convert'
import { QUANTITY_KINDS, UNIT_CATALOGUE, UNIT_SYSTEMS, defaultUnit, isUnitOf } from '#shared/units/catalogue'

// Conversion factors from NIST Special Publication 811 (2008 edition), appendix B.8 / B.9,
// "Guide for the Use of the International System of Units", unless noted otherwise.
const close = (actual: number, expected: number, relative = 1e-6) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(Math.abs(expected) * relative)

describe('length and roughness to SI', () => {
  it('1 in = 0.0254 m exactly (NIST SP 811 B.8, international inch)', () => {
    expect(toSI('length', 1, 'in')).toBeCloseTo(0.0254, 15)
    expect(toSI('roughness', 1, 'in')).toBeCloseTo(0.0254, 15)
  })
  it('1 ft = 0.3048 m exactly (NIST SP 811 B.8, international foot)', () => {
    expect(toSI('length', 1, 'ft')).toBeCloseTo(0.3048, 15)
  })
  it('1 mm = 1e-3 m and 1 µm = 1e-6 m (SI prefixes, NIST SP 811 sec. 4.3)', () => {
    expect(toSI('length', 250, 'mm')).toBeCloseTo(0.25, 15)
    close(toSI('roughness', 45, 'um'), 45e-6, 1e-12)
  })
})

describe('velocity to SI', () => {
  it('1 ft/s = 0.3048 m/s (NIST SP 811 B.8)', () => close(toSI('velocity', 1, 'ft/s'), 0.3048, 1e-12))
  it('1 km/h = 1/3.6 m/s = 0.2777778 m/s (NIST SP 811 B.8)', () => close(toSI('velocity', 36, 'km/h'), 10, 1e-12))
  it('1 kn = 1852/3600 m/s = 0.5144444 m/s (NIST SP 811 B.8, international knot)', () =>
    close(toSI('velocity', 1, 'kn'), 1852 / 3600, 1e-12))
})

describe('temperature to SI, absolute', () => {
  it('t/°C + 273.15 = T/K (NIST SP 811 sec. 4.2.1.1): 20 °C = 293.15 K', () => close(toSI('temperature', 20, 'degC'), 293.15, 1e-12))
  it('T/K = (t/°F + 459.67)/1.8 (NIST SP 811 B.9): 68 °F = 293.15 K, 32 °F = 273.15 K', () => {
    close(toSI('temperature', 68, 'degF'), 293.15, 1e-12)
    close(toSI('temperature', 32, 'degF'), 273.15, 1e-12)
  })
  it('-40 °F and -40 °C are the same temperature (follows from NIST SP 811 B.9)', () =>
    close(convertUnit('temperature', -40, 'degF', 'degC'), -40, 1e-12))
  it('back from K: 300 K = 80.33 °F (NIST SP 811 B.9)', () => close(fromSI('temperature', 300, 'degF'), 80.33, 1e-9))
})

describe('pressure, viscosity and density to SI', () => {
  it('1 psi = 6894.757 Pa (NIST SP 811 B.8: 6.894 757 E+03)', () => close(toSI('pressure', 1, 'psi'), 6894.757, 1e-7))
  it('1 bar = 1e5 Pa and 101.325 kPa = 1 standard atmosphere (NIST SP 811 B.8)', () => {
    close(toSI('pressure', 1, 'bar'), 1e5, 1e-12)
    close(toSI('pressure', 101.325, 'kPa'), 101325, 1e-12)
  })
  it('1 cP = 1e-3 Pa s (NIST SP 811 B.8: centipoise 1.0 E-03 Pa s)', () => {
    close(toSI('viscosity', 1, 'cP'), 1e-3, 1e-12)
    close(toSI('viscosity', 1, 'mPa s'), 1e-3, 1e-12)
    close(fromSI('viscosity', 1.002e-3, 'cP'), 1.002, 1e-12)
  })
  it('1 lb/ft³ = 16.01846 kg/m³ (NIST SP 811 B.8: 1.601 846 E+01)', () => close(toSI('density', 1, 'lb/ft3'), 16.01846, 1e-6))
})

describe('round trips and the catalogue', () => {
  it('every unit converts to SI and back to the same value (consistency, no source)', () => {
    for (const kind of QUANTITY_KINDS) {
      for (const unit of UNIT_CATALOGUE[kind].units) {
        close(fromSI(kind, toSI(kind, 12.5, unit.id), unit.id), 12.5, 1e-12)
      }
    }
  })
  it('each system names a default unit that the quantity offers', () => {
    for (const kind of QUANTITY_KINDS) for (const system of UNIT_SYSTEMS) expect(isUnitOf(kind, defaultUnit(kind, system))).toBe(true)
    expect(defaultUnit('velocity', 'imperial')).toBe('ft/s')
    expect(defaultUnit('temperature', 'imperial')).toBe('degF')
  })
  it('an unknown unit is refused with a message naming the quantity', () => {
    expect(() => toSI('velocity', 1, 'furlong/fortnight')).toThrow(/Velocity has no unit/)
  })
  it('tidy removes float noise but keeps the value', () => {
    expect(tidy(67.99999999999997)).toBe(68)
    // The literal is the float an ft -> m conversion gives, noise digits and all.
    // eslint-disable-next-line no-loss-of-precision
    expect(tidy(0.30480000000000004)).toBe(0.3048)
  })
})
