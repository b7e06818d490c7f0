import { describe, expect, it } from 'vitest'
import { advise, costFor, wallFor, type CaseInputDraft } from '#shared/rules/index'

const input: CaseInputDraft = {
  regime: 'external',
  fluid: { medium: 'air' },
  velocity: 40,
  length: 1.044,
  geometry: 'bluff',
  separation: 'massive',
  quantities: ['forces', 'pressure'],
  budget: { coreHours: 2e5, cores: 2048, wallClockHours: 300 },
}

describe('costFor, the cost of a reviewer override', () => {
  it("equals the advice's own figures for each approach with the treatment the advice chose", () => {
    const advice = advise(input)
    for (const entry of advice.approaches) {
      const cost = costFor(input, entry.id, entry.wallTreatment)
      expect(cost.cells).toBe(entry.cells)
      expect(cost.coreHours).toBe(entry.coreHours)
      expect(cost.timeStep).toBe(entry.timeStep)
      expect(cost.ranges).toEqual(entry.ranges)
    }
  })

  it('prices a different wall treatment or y+ for a modelled approach: a resolved wall needs more RANS cells than log-law wall functions (Launder & Spalding 1974)', () => {
    const resolved = costFor(input, 'rans', 'resolved')
    const functions = costFor(input, 'rans', 'wall-function')
    expect(resolved.cells).toBeGreaterThan(functions.cells)
    expect(costFor(input, 'rans', 'resolved', 0.5).cells).toBeGreaterThan(resolved.cells)
    expect(costFor(input, 'rans', 'resolved', 0.5).yPlusTarget).toBe(0.5)
  })
})

describe('wallFor, the near-wall figures of an override', () => {
  it('puts the first cell of DNS and wall-resolved LES one wall unit tall, below the RANS y+ = 1 (Georgiadis et al. 2010)', () => {
    expect(wallFor(input, 'resolved', undefined, 'dns').firstCellHeight).toBeCloseTo(wallFor(input, 'resolved').firstCellHeight / 2, 15)
  })

  it('gives the wall model its exchange height at 0.1 delta (Kawai & Larsson 2012), several cells off the wall', () => {
    const wall = wallFor(input, 'wall-model')
    expect(wall.exchangeHeight).toBeCloseTo(0.1 * wall.boundaryLayerThickness, 12)
    expect(wall.exchangeHeight! / wall.firstCellCentre).toBeGreaterThanOrEqual(4)
    expect(wallFor(input, 'resolved').exchangeHeight).toBeNull()
  })

  it('evaluates compressible wall figures at a reference temperature (Eckert 1955): at Mach 0.85 the first cell at y+ = 1 is taller than with free-stream properties', () => {
    const transonic: CaseInputDraft = { ...input, geometry: 'streamlined', separation: 'none', velocity: 0.85 * 343.2 }
    const wall = wallFor(transonic, 'resolved')
    expect(wall.referenceTemperatureK).toBeGreaterThan(293.15 * 1.05)
    const frozen = 1.506e-5 / wall.frictionVelocity // free-stream nu at 20 C with the same friction velocity
    expect(wall.firstCellCentre).toBeGreaterThan(frozen)
  })
})
