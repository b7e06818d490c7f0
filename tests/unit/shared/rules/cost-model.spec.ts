import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { APPROACH_IDS, type WallTreatment } from '../../../../shared/rules/approaches'
import { costCaseFor } from '../../../../shared/rules/advise'
import { caseInputSchema, type CaseInput } from '../../../../shared/rules/case-input'
import {
  DNS_MEAN_WALL_NORMAL_SPACING_PLUS,
  DNS_SPANWISE_SPACING_PLUS,
  DNS_STREAMWISE_SPACING_PLUS,
  PLATE_SCALING,
  WMLES_CELLS_PER_THICKNESS,
  approachCost,
  approachResolution,
  bounded,
  coreSecondsPerCellStep,
  type Geometry,
  type Separation,
} from '../../../../shared/rules/cost-model'
import { flowPhysics } from '../../../../shared/rules/flow-physics'

/**
 * A case of a custom fluid with nu = 1e-5 m2/s and L = 1 m, so Re = U / 1e-5. Built without the
 * schema so the scaling can be probed beyond the input bounds.
 */
function caseAt(reynolds: number, overrides: Partial<CaseInput> = {}) {
  const input: CaseInput = {
    regime: 'external',
    fluid: { medium: 'custom', density: 1, viscosity: 1e-5 },
    velocity: reynolds * 1e-5,
    length: 1,
    turbulenceIntensity: 0.01,
    geometry: 'streamlined',
    separation: 'none',
    physics: { transition: false, heatTransfer: false, rotation: false, buoyancy: false, acoustics: false },
    quantities: ['forces'],
    budget: { coreHours: 1e4, cores: 128, wallClockHours: 100 },
    growthRatio: 1.2,
    ...overrides,
  }
  return { input, flow: costCaseFor(input, flowPhysics(input)) }
}

const cellsOf = (approach: (typeof APPROACH_IDS)[number], reynolds: number, treatment: WallTreatment = 'resolved', overrides = {}) => {
  const { flow } = caseAt(reynolds, overrides)
  const own: WallTreatment = approach === 'wmles' ? 'wall-model' : treatment
  return approachResolution(approach, flow, own).cells
}

describe('Reynolds-number scaling of resolved approaches (Choi & Moin 2012, Phys. Fluids 24, 011702)', () => {
  it('ten-fold Re multiplies DNS, WRLES and WMLES cells by 10^(37/14), 10^(13/7) and 10 in the asymptotic range (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 8, max: 10, noNaN: true }), (exponent) => {
        const re = 10 ** exponent
        expect(cellsOf('dns', 10 * re) / cellsOf('dns', re)).toBeCloseTo(10 ** (37 / 14), 6)
        expect(Math.abs(cellsOf('wrles', 10 * re) / cellsOf('wrles', re) / 10 ** (13 / 7) - 1)).toBeLessThan(0.02)
        expect(Math.abs(cellsOf('wmles', 10 * re) / cellsOf('wmles', re) / 10 - 1)).toBeLessThan(0.05)
      }),
      { numRuns: 50 },
    )
  })

  it("our plate integrals reproduce Choi & Moin's coefficients: 54.7 n^3 for WMLES and 1.53e-4 for DNS per unit cell volume (Choi & Moin 2012, from memory)", () => {
    expect(PLATE_SCALING.wmles.coefficient / WMLES_CELLS_PER_THICKNESS ** 3).toBeCloseTo(54.7, 1)
    const cellVolume = DNS_STREAMWISE_SPACING_PLUS * DNS_MEAN_WALL_NORMAL_SPACING_PLUS * DNS_SPANWISE_SPACING_PLUS
    expect(PLATE_SCALING.dns.coefficient * cellVolume).toBeCloseTo(1.53e-4, 6)
  })

  it('cells never fall as Re rises, for every approach, regime and fixed wall treatment (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 2, max: 11, noNaN: true }),
        fc.double({ min: 1.01, max: 10, noNaN: true }),
        fc.constantFrom('external' as const, 'internal' as const),
        fc.constantFrom<WallTreatment>('resolved', 'wall-function'),
        (exponent, factor, regime, treatment) => {
          const re = 10 ** exponent
          const overrides = { regime, geometry: regime === 'internal' ? ('duct' as const) : ('streamlined' as const) }
          for (const approach of APPROACH_IDS) {
            expect(cellsOf(approach, re * factor, treatment, overrides)).toBeGreaterThanOrEqual(cellsOf(approach, re, treatment, overrides))
          }
        },
      ),
      { numRuns: 100 },
    )
  })

  it('orders cells DNS > WRLES > WMLES > hybrid > RANS for a wing-like case at Re = 1e7 (Spalart 2000, Int. J. Heat Fluid Flow 21, 252, from memory)', () => {
    const cells = APPROACH_IDS.map((approach) => cellsOf(approach, 1e7))
    const [dns, wrles, wmles, hybrid, urans, rans] = cells as [number, number, number, number, number, number]
    expect(dns).toBeGreaterThan(wrles)
    expect(wrles).toBeGreaterThan(wmles)
    expect(wmles).toBeGreaterThan(hybrid)
    expect(hybrid).toBeGreaterThan(rans)
    expect(urans).toBe(rans)
  })
})

describe('pipe and channel checks', () => {
  const pipe = { regime: 'internal' as const, geometry: 'duct' as const, quantities: ['statistics' as const] }

  it('DNS of a smooth pipe at Re_D = 1e4 needs a few 1e6 to 1e7 cells, within 3x of Wilcox channel estimate (0.088 Re)^(9/4) (Wilcox, Turbulence Modeling for CFD)', () => {
    const cells = cellsOf('dns', 1e4, 'resolved', pipe)
    expect(cells).toBeGreaterThan(1e6)
    expect(cells).toBeLessThan(1e8)
    const wilcox = (0.088 * 1e4) ** 2.25
    expect(cells / wilcox).toBeGreaterThan(1 / 3)
    expect(cells / wilcox).toBeLessThan(3)
  })

  it('the DNS point density matches Kim, Moin & Moser 1987 within 2x (JFM 177, 133: 192 x 129 x 160 points in a 4pi x 2 x 4pi/3 box at Re_tau = 180)', () => {
    const boxWallUnits = 4 * Math.PI * 180 * (2 * 180) * ((4 * Math.PI) / 3) * 180
    const ours = boxWallUnits / (DNS_STREAMWISE_SPACING_PLUS * DNS_MEAN_WALL_NORMAL_SPACING_PLUS * DNS_SPANWISE_SPACING_PLUS)
    const theirs = 192 * 129 * 160
    expect(ours / theirs).toBeGreaterThan(0.5)
    expect(ours / theirs).toBeLessThan(2)
  })

  it('pipe DNS at Re_D = 1e4 costs of order 1e2-1e5 core-hours (common practice, no source)', () => {
    const { input, flow } = caseAt(1e4, pipe)
    const cost = approachCost('dns', flow, 'resolved', input.budget)
    expect(cost.coreHours).toBeGreaterThan(1e2)
    expect(cost.coreHours).toBeLessThan(1e5)
  })
})

describe('cost realism and bookkeeping', () => {
  it('steady RANS of a streamlined body at Re = 1e7: 1e6-1e7 cells, 1e3-1e4 iterations, some hundreds of core-hours (common practice, no source)', () => {
    const { input, flow } = caseAt(1e7)
    const cost = approachCost('rans', flow, 'resolved', input.budget)
    expect(cost.cells).toBeGreaterThan(1e6)
    expect(cost.cells).toBeLessThan(1e7)
    expect(cost.timeSteps).toBeGreaterThanOrEqual(1e3)
    expect(cost.timeSteps).toBeLessThanOrEqual(1e4)
    expect(cost.coreHours).toBeGreaterThan(100)
    expect(cost.coreHours).toBeLessThan(5000)
  })

  it('at Re = 1e8 external, DNS and wall-resolved LES need more than 1e9 core-hours for every geometry and separation (Choi & Moin 2012 scaling)', () => {
    const geometries: Geometry[] = ['streamlined', 'bluff', 'duct', 'rotating', 'complex']
    const separations: Separation[] = ['none', 'mild', 'massive']
    for (const geometry of geometries) {
      for (const separation of separations) {
        const { input, flow } = caseAt(1e8, { geometry, separation })
        expect(approachCost('dns', flow, 'resolved', input.budget).coreHours).toBeGreaterThan(1e9)
        expect(approachCost('wrles', flow, 'resolved', input.budget).coreHours).toBeGreaterThan(1e9)
      }
    }
  })

  it('wall functions need fewer RANS cells than a resolved wall (Launder & Spalding 1974: first cell in the log layer)', () => {
    expect(cellsOf('rans', 1e7, 'wall-function')).toBeLessThan(cellsOf('rans', 1e7, 'resolved'))
  })

  it('core-hours = cells x steps x cost per cell-step; wall-clock = core-hours / cores; feasible within both budgets', () => {
    const { input, flow } = caseAt(1e6, { budget: { coreHours: 1e4, cores: 100, wallClockHours: 10 } })
    for (const approach of APPROACH_IDS) {
      const treatment: WallTreatment = approach === 'wmles' ? 'wall-model' : 'resolved'
      const cost = approachCost(approach, flow, treatment, input.budget)
      expect(cost.coreHours).toBeCloseTo((cost.cells * cost.timeSteps * coreSecondsPerCellStep(approach)) / 3600, 6)
      expect(cost.wallClockHours).toBeCloseTo(cost.coreHours / 100, 9)
      expect(cost.feasible).toBe(cost.coreHours <= 1e4 && cost.wallClockHours <= 10)
    }
  })

  it('stays finite at the edge of the input range (Re = 1e20)', () => {
    const input = caseInputSchema.parse({
      ...caseAt(1).input,
      fluid: { medium: 'custom', density: 1e5, viscosity: 1e-7 },
      velocity: 1e4,
      length: 1e4,
    })
    const flow = costCaseFor(input, flowPhysics(input))
    expect(flow.reynolds).toBeCloseTo(1e20, -6)
    for (const approach of APPROACH_IDS) {
      const cost = approachCost(approach, flow, approach === 'wmles' ? 'wall-model' : 'resolved', input.budget)
      for (const value of [cost.cells, cost.timeSteps, cost.coreHours, cost.wallClockHours, cost.memoryGB, cost.budgetRatio]) {
        expect(Number.isFinite(value)).toBe(true)
      }
    }
    expect(bounded(Number.POSITIVE_INFINITY)).toBe(Number.MAX_VALUE)
    expect(() => bounded(Number.NaN)).toThrow(/NaN/)
  })
})
