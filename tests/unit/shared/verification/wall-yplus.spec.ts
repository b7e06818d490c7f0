import { describe, expect, it } from 'vitest'
import { yPlusTargetFor } from '#shared/rules/near-wall'
import { WallTally, bandFor, guessColumns, looksLikeData, parseArea, parseYPlus, verdictFor } from '#shared/verification/wall-yplus'

describe('the band of a signed-off wall treatment', () => {
  it('is 30 to 300 for log-law wall functions at their own target', () => {
    // Launder & Spalding 1974 wall functions, first cell in the log layer, 30 <= y+ <= 300 (common practice).
    const band = bandFor({ approach: 'rans', wallTreatment: 'wall-function', yPlusTarget: yPlusTargetFor('wall-function', 5000), deltaPlus: 5000 })
    expect([band.min, band.max, band.basis]).toEqual([30, 300, 'wall-function'])
  })

  it('is y+ at or below 1 for a resolved wall', () => {
    // First cell at y+ about 1 or below (common practice; Georgiadis et al. 2010 for LES).
    const band = bandFor({ approach: 'rans', wallTreatment: 'resolved', yPlusTarget: 1, deltaPlus: 2000 })
    expect([band.min, band.max]).toEqual([0, 1])
    // Wall-resolved LES aims lower (y+ = 0.5) but is judged on the same y+ <= 1 (Georgiadis et al. 2010).
    const les = bandFor({ approach: 'wrles', wallTreatment: 'resolved', yPlusTarget: yPlusTargetFor('resolved', 2000, 'wrles'), deltaPlus: 2000 })
    expect([les.min, les.max, les.basis]).toEqual([0, 1, 'resolved'])
  })

  it('sits about delta+/40 for a wall model', () => {
    // Cells of delta/20 at the wall (Larsson et al. 2016): first-cell y+ = 10000/40 = 250, within a
    // factor of two (common practice, no source).
    const band = bandFor({ approach: 'wmles', wallTreatment: 'wall-model', yPlusTarget: yPlusTargetFor('wall-model', 10_000, 'wmles'), deltaPlus: 10_000 })
    expect([band.min, band.max, band.basis]).toEqual([125, 500, 'wall-model'])
  })

  it('keeps the first cell of a rough wall above the roughness', () => {
    // y+ >= k_s+ for rough-wall functions (Blocken, Stathopoulos & Carmeliet 2007).
    const band = bandFor({ approach: 'rans', wallTreatment: 'rough-wall-function', yPlusTarget: yPlusTargetFor('rough-wall-function', 5000, 'rans', 80), deltaPlus: 5000, roughnessPlus: 80 })
    expect([band.min, band.max]).toEqual([80, 300])
  })

  it('follows a signed-off target of its own within a factor of two', () => {
    // A factor of two either way (common practice, no source).
    const band = bandFor({ approach: 'rans', wallTreatment: 'wall-function', yPlusTarget: 50, deltaPlus: 5000 })
    expect([band.min, band.max, band.basis]).toEqual([25, 100, 'target'])
  })
})

describe('wall statistics', () => {
  it('weights by face area', () => {
    // Exact binary fractions: 1 m² below, 2 m² inside, 1 m² above the 30-300 band (arithmetic).
    const t = new WallTally({ min: 30, max: 300 }, true)
    t.add(10, 1, 'hull')
    t.add(50, 1.5, 'hull')
    t.add(100, 0.5, 'rudder')
    t.add(400, 1, 'rudder')
    const r = t.result()
    expect([r.fractionBelow, r.fractionInBand, r.fractionAbove]).toEqual([0.25, 0.5, 0.25])
    expect(r.totalArea).toBe(4)
    const hull = r.patches.find(p => p.patch === 'hull')!
    expect([hull.faces, hull.fractionBelow, hull.fractionInBand]).toEqual([2, 0.4, 0.6])
    // area-weighted mean of the hull: (10 x 1 + 50 x 1.5) / 2.5 = 34
    expect(hull.meanYPlus).toBeCloseTo(34, 12)
    expect(r.histogram.fractions.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12)
    expect(r.histogram.edges[0]).toBeCloseTo(10, 9)
    expect(r.histogram.edges.at(-1)).toBeCloseTo(1000, 9)
  })

  it('counts faces when no area is given', () => {
    const t = new WallTally({ min: 30, max: 300 }, false)
    for (const y of [1, 40, 50, 60]) t.add(y)
    const r = t.result()
    expect(r.areaWeighted).toBe(false)
    expect(r.fractionInBand).toBe(0.75)
    expect(r.totalArea).toBeNull()
  })

  it('bins on a log axis, ten bins a decade', () => {
    const t = new WallTally({ min: 0, max: 1 }, false)
    t.add(0.5)
    t.add(0.55)
    t.add(2)
    const { edges, counts } = t.result().histogram
    expect(edges).toHaveLength(21)
    expect(edges[0]).toBeCloseTo(0.1, 12)
    // The axis starts at 10^-1; 0.5 lies in [10^-0.4, 10^-0.3) = [0.398, 0.501), 0.55 in the next bin, 2 in [10^0.3, 10^0.4).
    expect(counts[6]).toBe(1)
    expect(counts[7]).toBe(1)
    expect(counts[13]).toBe(1)
  })

  it('judges against the team threshold', () => {
    expect(verdictFor(0.9, 0.9)).toBe('pass')
    expect(verdictFor(0.8999, 0.9)).toBe('fail')
  })
})

describe('reading an export', () => {
  it('guesses columns and asks when unsure', () => {
    expect(guessColumns(['patch', 'y+', 'area'])).toEqual({ mapping: { patch: 'patch', yPlus: 'y+', area: 'area' }, ambiguous: [] })
    expect(guessColumns(['Wall Yplus', 'Face Area [m^2]', 'Boundary']).mapping).toEqual({ yPlus: 'Wall Yplus', area: 'Face Area [m^2]', patch: 'Boundary' })
    expect(guessColumns(['a1', 'b2']).ambiguous).toEqual(['yPlus'])
    expect(guessColumns(['yplus_min', 'yplus_max']).ambiguous).toEqual(['yPlus'])
    expect(looksLikeData(['1.2', '3e-4'])).toBe(true)
    expect(looksLikeData(['y+', '3'])).toBe(false)
  })

  it('reads values and says what is wrong with a bad one', () => {
    expect(parseYPlus(' 12.5 ')).toBe(12.5)
    expect(parseYPlus('abc')).toMatch(/not a number/)
    expect(parseYPlus('-1')).toMatch(/negative/)
    expect(parseArea('0')).toMatch(/not positive/)
  })
})
