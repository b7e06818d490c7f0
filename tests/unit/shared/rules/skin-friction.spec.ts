import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  blasiusSkinFriction,
  channelSkinFriction,
  colebrookFriction,
  deanChannelSkinFriction,
  flatPlateSkinFriction,
  haalandFriction,
  pipeDarcyFriction,
  pipeSkinFriction,
  schlichtingSkinFriction,
} from '#shared/rules/skin-friction'

const relative = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected)

describe('flat plate', () => {
  it('Schlichting at Re_x = 1e6 is 3.745e-3 (Schlichting, Boundary-Layer Theory; hand calculation of (2 log10 1e6 - 0.65)^-2.3)', () => {
    expect(relative(schlichtingSkinFriction(1e6), 3.745e-3)).toBeLessThan(1e-3)
  })

  it('Schlichting agrees with the calibrated power law 0.0592 Re_x^-1/5 within 2% at Re_x = 1e6 (textbook, checked)', () => {
    expect(relative(schlichtingSkinFriction(1e6), 0.0592 * 1e6 ** -0.2)).toBeLessThan(0.02)
  })

  it("Schlichting agrees with White's 0.027 Re_x^-1/7 within 5% from 1e6 to 1e7 (White, Fluid Mechanics; from memory)", () => {
    for (const re of [1e6, 3e6, 1e7]) expect(relative(schlichtingSkinFriction(re), 0.027 * re ** (-1 / 7))).toBeLessThan(0.05)
  })

  it('Blasius laminar Cf = 0.664 Re_x^-1/2 gives 6.64e-4 at Re_x = 1e6 (Blasius 1908; textbook)', () => {
    expect(relative(blasiusSkinFriction(1e6), 6.64e-4)).toBeLessThan(1e-9)
  })

  it('takes the laminar value only where it is the larger (they cross near Re_x = 1e3; our arithmetic)', () => {
    expect(flatPlateSkinFriction(1e6)).toBe(schlichtingSkinFriction(1e6))
    expect(flatPlateSkinFriction(100)).toBe(blasiusSkinFriction(100))
  })

  it('falls monotonically with Re_x and stays finite and positive (property; common practice, no source)', () => {
    fc.assert(
      fc.property(fc.double({ min: -6, max: 20, noNaN: true }), (exponent) => {
        const re = 10 ** exponent
        const cf = flatPlateSkinFriction(re)
        expect(Number.isFinite(cf) && cf > 0).toBe(true)
        expect(flatPlateSkinFriction(re * 1.5)).toBeLessThan(cf)
      }),
      { numRuns: 200 },
    )
  })
})

describe('pipe', () => {
  it('smooth pipe at Re = 1e5 has a Darcy factor of 0.0180 (Moody 1944 chart and Colebrook 1939, from memory)', () => {
    expect(relative(colebrookFriction(1e5), 0.018)).toBeLessThan(0.01)
  })

  it('smooth pipe at Re = 1e5 agrees with Blasius f = 0.3164 Re^-1/4 within 2% (Blasius 1913, valid 4e3-1e5; from memory)', () => {
    expect(relative(colebrookFriction(1e5), 0.3164 * 1e5 ** -0.25)).toBeLessThan(0.02)
  })

  it('satisfies the Colebrook-White equation to 1e-12 (Colebrook 1939)', () => {
    fc.assert(
      fc.property(fc.double({ min: 3.4, max: 9, noNaN: true }), fc.double({ min: 0, max: 0.05, noNaN: true }), (exponent, roughness) => {
        const re = 10 ** exponent
        const f = colebrookFriction(re, roughness)
        const residual = 1 / Math.sqrt(f) + 2 * Math.log10(roughness / 3.7 + 2.51 / (re * Math.sqrt(f)))
        expect(Math.abs(residual)).toBeLessThan(1e-12 / Math.sqrt(f) + 1e-12)
      }),
      { numRuns: 200 },
    )
  })

  it('agrees with Haaland within 2% over Re 4e3-1e8 and k/D 0-0.01 (Haaland 1983, J. Fluids Eng. 105, 89)', () => {
    for (const re of [4e3, 1e4, 1e5, 1e6, 1e7, 1e8]) {
      for (const roughness of [0, 1e-5, 1e-4, 1e-3, 1e-2]) {
        expect(relative(colebrookFriction(re, roughness), haalandFriction(re, roughness))).toBeLessThan(0.02)
      }
    }
  })

  it('tends to the fully rough limit 1/sqrt(f) = -2 log10(k/(3.7 D)) at very high Re (Nikuradse 1933 via Colebrook 1939)', () => {
    const roughness = 0.01
    const limit = 1 / (2 * Math.log10(roughness / 3.7)) ** 2
    expect(relative(colebrookFriction(1e12, roughness), limit)).toBeLessThan(1e-4)
  })

  it('is laminar 64/Re below Re = 2300 (Hagen-Poiseuille; Reynolds 1883 for the threshold)', () => {
    expect(pipeDarcyFriction(1000)).toBeCloseTo(0.064, 12)
    expect(pipeSkinFriction(1000)).toBeCloseTo(0.016, 12)
  })

  it('roughness raises friction (Moody 1944 chart, from memory)', () => {
    expect(pipeDarcyFriction(1e6, 1e-3)).toBeGreaterThan(pipeDarcyFriction(1e6))
  })
})

describe('plane channel', () => {
  it("Dean's Cf = 0.073 Re_2h^-1/4 (Dean 1978, J. Fluids Eng. 100, 215) is within 3% of Kim, Moin & Moser 1987 at Re_b = 5600: Cf = 2 (Re_tau / (Re_b / 2))^2 = 8.27e-3 (our arithmetic from Re_tau = 180)", () => {
    expect(relative(deanChannelSkinFriction(5600), 2 * (180 / 2800) ** 2)).toBeLessThan(0.03)
  })

  it('is laminar Poiseuille flow, Cf = 12 / Re_2h, below Re_Dh = 2300 (textbook), and Dean above', () => {
    expect(channelSkinFriction(2000)).toBeCloseTo(12 / 1000, 15)
    expect(channelSkinFriction(11200)).toBeCloseTo(deanChannelSkinFriction(5600), 15)
  })
})
