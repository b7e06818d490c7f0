import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  KARMAN_CONSTANT,
  LOG_LAW_CONSTANT,
  frictionVelocity,
  layersToThickness,
  spaldingUPlus,
  spaldingYPlus,
  turbulentPlateThickness,
  laminarPlateThickness,
  ductThickness,
  wallModelExchangeYPlus,
  wallDistance,
  wallShearStress,
  yPlusTargetFor,
} from '#shared/rules/near-wall'

const relative = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected)

describe('law of the wall (Spalding 1961, J. Appl. Mech. 28, 455)', () => {
  it('is u+ = y+ in the viscous sublayer (textbook law of the wall)', () => {
    expect(relative(spaldingUPlus(1), 1)).toBeLessThan(0.01)
    expect(relative(spaldingUPlus(0.2), 0.2)).toBeLessThan(1e-3)
  })

  it('is the log law u+ = ln(y+)/0.41 + 5.0 at y+ = 100 to 1000 within 1% (textbook kappa and B, from memory)', () => {
    for (const yPlus of [100, 300, 1000]) {
      expect(relative(spaldingUPlus(yPlus), Math.log(yPlus) / KARMAN_CONSTANT + LOG_LAW_CONSTANT)).toBeLessThan(0.01)
    }
  })

  it('lies below both asymptotes in the buffer layer at y+ = 10 (textbook: the buffer layer blends them)', () => {
    const uPlus = spaldingUPlus(10)
    expect(uPlus).toBeLessThan(10)
    expect(uPlus).toBeLessThan(Math.log(10) / KARMAN_CONSTANT + LOG_LAW_CONSTANT)
  })

  it('inverts exactly (round trip, property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 1e5, noNaN: true }), (yPlus) => {
        expect(relative(spaldingYPlus(spaldingUPlus(yPlus)), yPlus)).toBeLessThan(1e-9)
      }),
      { numRuns: 200 },
    )
  })
})

describe('wall units', () => {
  it('tau_w = Cf rho U^2 / 2 and u_tau = U sqrt(Cf/2) (definitions; textbook)', () => {
    const shear = wallShearStress(0.004, 1000, 2)
    expect(shear).toBeCloseTo(8, 12)
    expect(frictionVelocity(shear, 1000)).toBeCloseTo(2 * Math.sqrt(0.002), 12)
  })

  it('y = y+ nu / u_tau: worked example, y+ = 1 with nu = 1.5e-5 m2/s and u_tau = 0.5 m/s is 30 micrometres (our arithmetic)', () => {
    expect(wallDistance(1, 1.5e-5, 0.5)).toBeCloseTo(3e-5, 15)
  })

  it('one turbulent plate thickness, 0.16 x Re_x^-1/7 (White, from memory): 0.0222 x at Re_x = 1e6, within 6% of the 1/5-power 0.37 x Re_x^-1/5 there (textbook, from memory)', () => {
    expect(relative(turbulentPlateThickness(1, 1e6), 0.02222)).toBeLessThan(1e-3)
    expect(relative(turbulentPlateThickness(1, 1e6), 0.37 * 1e6 ** -0.2)).toBeLessThan(0.06)
  })

  it('laminar (Blasius) thickness 5.0 x Re_x^-1/2: 5 mm on 1 m at Re_x = 1e6 (textbook, from memory)', () => {
    expect(laminarPlateThickness(1, 1e6)).toBeCloseTo(0.005, 12)
  })

  it('a duct layer is the radius of a pipe and the half-height of a plane channel, h = D_h / 4 (D_h = 4h between two walls)', () => {
    expect(ductThickness(0.1, 'pipe')).toBe(0.05)
    expect(ductThickness(0.04, 'channel')).toBe(0.01)
  })
})

describe('y+ targets', () => {
  it('resolved wall: the first cell centre at y+ = 1 for RANS (common practice, no source), a first cell one wall unit tall for DNS and wall-resolved LES (Georgiadis, Rizzetta & Fureby 2010: y1+ < 1)', () => {
    expect(yPlusTargetFor('resolved', 5000)).toBe(1)
    expect(yPlusTargetFor('resolved', 5000, 'rans')).toBe(1)
    expect(2 * yPlusTargetFor('resolved', 5000, 'dns')).toBeLessThanOrEqual(1)
    expect(2 * yPlusTargetFor('resolved', 5000, 'wrles')).toBeLessThanOrEqual(1)
  })

  it('blended treatment: planned at the top of the sublayer, y+ = 5 (our choice, no source)', () => {
    expect(yPlusTargetFor('blended', 5000)).toBe(5)
  })

  it('rough-wall functions keep the first cell centre above the roughness, y+ >= k_s+, inside the log layer (Blocken et al. 2007, from memory)', () => {
    expect(yPlusTargetFor('rough-wall-function', 1e5, 'rans', 500)).toBe(500)
    expect(yPlusTargetFor('rough-wall-function', 1e5, 'rans', 10)).toBe(yPlusTargetFor('wall-function', 1e5))
    expect(yPlusTargetFor('rough-wall-function', 2000, 'rans', 5000)).toBe(200)
  })

  it('standard wall functions: inside 30-300 for every delta+ (Launder & Spalding 1974; common practice band)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e7, noNaN: true }), (deltaPlus) => {
        const target = yPlusTargetFor('wall-function', deltaPlus)
        expect(target).toBeGreaterThanOrEqual(30)
        expect(target).toBeLessThanOrEqual(300)
      }),
      { numRuns: 200 },
    )
  })

  it('standard wall functions stay below the log-layer top 0.1 delta+ whenever there is room (textbook log-layer extent)', () => {
    for (const deltaPlus of [400, 1000, 5000, 1e5]) {
      expect(yPlusTargetFor('wall-function', deltaPlus)).toBeLessThan(0.1 * deltaPlus)
    }
  })

  it('wall model: cells of delta/20, first centre at delta/40 (Larsson et al. 2016: delta/15-delta/30), input taken at 0.1 delta and never below y+ = 30 (Kawai & Larsson 2012: 0.1-0.2 delta)', () => {
    expect(yPlusTargetFor('wall-model', 40000)).toBe(1000)
    expect(wallModelExchangeYPlus(40000)).toBe(4000)
    expect(wallModelExchangeYPlus(500)).toBe(50)
    expect(wallModelExchangeYPlus(200)).toBe(30)
    // the exchange point lies several cells off the wall, which avoids the log-layer mismatch
    expect(wallModelExchangeYPlus(40000) / yPlusTargetFor('wall-model', 40000)).toBeGreaterThanOrEqual(4)
  })
})

describe('layers to the boundary-layer edge', () => {
  it('is the smallest geometric series that reaches the thickness (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-7, max: 1e-2, noNaN: true }),
        fc.double({ min: 1e-3, max: 1, noNaN: true }),
        fc.double({ min: 1.01, max: 2, noNaN: true }),
        (firstCell, thickness, growth) => {
          fc.pre(firstCell < thickness)
          const layers = layersToThickness(firstCell, thickness, growth)
          const reach = (n: number) => (firstCell * (growth ** n - 1)) / (growth - 1)
          expect(reach(layers)).toBeGreaterThanOrEqual(thickness * (1 - 1e-9))
          expect(reach(layers - 1)).toBeLessThan(thickness)
        },
      ),
      { numRuns: 200 },
    )
  })

  it('worked example: 1 mm first cell, growth 1.2, 10 mm layer needs 7 cells (1 + 1.2 + ... + 1.2^6 = 12.9 mm; our arithmetic)', () => {
    expect(layersToThickness(1e-3, 1e-2, 1.2)).toBe(7)
  })

  it('is one cell when the first cell is already as tall as the layer', () => {
    expect(layersToThickness(0.02, 0.01, 1.2)).toBe(1)
  })
})
