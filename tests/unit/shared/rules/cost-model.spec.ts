import { describe, expect, it } from 'vitest'
import { caseInputSchema, type CaseInput, type CaseInputDraft } from '#shared/rules/case-input'
import { costCaseFor } from '#shared/rules/cost-case'
import {
  RANS_CORE_SECONDS_PER_CELL_ITERATION,
  UNCERTAINTY,
  approachCost,
  bounded,
  coreSecondsPerCellStep,
} from '#shared/rules/cost-model'
import { flowPhysics } from '#shared/rules/flow-physics'
import {
  DNS_MEAN_WALL_NORMAL_SPACING_PLUS,
  DNS_SPANWISE_SPACING_PLUS,
  DNS_STREAMWISE_SPACING_PLUS,
} from '#shared/rules/mesh-resolving'
import { APPROACH_IDS, type ApproachId, type WallTreatment } from '#shared/rules/approaches'

/** A custom fluid with nu = 1e-5 m2/s and L = 1 m, so Re = U / 1e-5. */
function caseAt(reynolds: number, overrides: Partial<CaseInputDraft> = {}): CaseInput {
  return caseInputSchema.parse({
    regime: 'external',
    fluid: { medium: 'custom', density: 1, viscosity: 1e-5 },
    velocity: reynolds * 1e-5,
    length: 1,
    geometry: 'streamlined',
    separation: 'none',
    quantities: ['forces'],
    budget: { coreHours: 1e4, cores: 128, wallClockHours: 100 },
    ...overrides,
  })
}

const ownTreatment = (approach: ApproachId, treatment: WallTreatment = 'resolved'): WallTreatment => (approach === 'wmles' ? 'wall-model' : treatment)

function costOf(approach: ApproachId, input: CaseInput, treatment: WallTreatment = 'resolved') {
  return approachCost(approach, costCaseFor(input, flowPhysics(input)), ownTreatment(approach, treatment), input.budget)
}

const AIR_NU = 1.506e-5
const air = (overrides: Partial<CaseInputDraft>) =>
  caseInputSchema.parse({ fluid: { medium: 'air' }, quantities: ['statistics'], budget: { coreHours: 1e5, cores: 1024, wallClockHours: 500 }, ...overrides } as CaseInputDraft)

describe('Reynolds-number scaling of the wall layers (Choi & Moin 2012, Phys. Fluids 24, 011702)', () => {
  const exponent = (approach: ApproachId) => Math.log10(costOf(approach, caseAt(1e9)).cells / costOf(approach, caseAt(1e8)).cells)

  it('a decade of Re at 1e8-1e9 multiplies DNS cells by about 10^(37/14), WRLES by 10^(13/7) and WMLES by 10 (within 0.15 in the exponent)', () => {
    expect(Math.abs(exponent('dns') - 37 / 14)).toBeLessThan(0.15)
    expect(Math.abs(exponent('wrles') - 13 / 7)).toBeLessThan(0.15)
    expect(Math.abs(exponent('wmles') - 1)).toBeLessThan(0.15)
  })

  it('orders cells DNS > WRLES > WMLES > RANS for a wing-like case at Re = 1e7, RANS near 1e7 (Spalart 2000, Int. J. Heat Fluid Flow 21, 252, from memory: RANS 1e7 points for a wing)', () => {
    const input = caseAt(1e7)
    const [dns, wrles, wmles, rans] = (['dns', 'wrles', 'wmles', 'rans'] as const).map((id) => costOf(id, input).cells) as [number, number, number, number]
    expect(dns).toBeGreaterThan(wrles)
    expect(wrles).toBeGreaterThan(wmles)
    expect(wmles).toBeGreaterThan(rans)
    expect(rans).toBeGreaterThan(1e6)
    expect(rans).toBeLessThan(3e7)
  })
})

describe('published meshes', () => {
  it('the DNS point density matches Kim, Moin & Moser 1987 within 2x (JFM 177, 133: 192 x 129 x 160 points in a 4pi x 2 x 4pi/3 box at Re_tau = 180)', () => {
    const boxWallUnits = 4 * Math.PI * 180 * (2 * 180) * ((4 * Math.PI) / 3) * 180
    const ours = boxWallUnits / (DNS_STREAMWISE_SPACING_PLUS * DNS_MEAN_WALL_NORMAL_SPACING_PLUS * DNS_SPANWISE_SPACING_PLUS)
    expect(ours / (192 * 129 * 160)).toBeGreaterThan(0.5)
    expect(ours / (192 * 129 * 160)).toBeLessThan(2)
  })

  it('a plane channel entered by its hydraulic diameter: Re_tau 180 at Re_Dh = 11200, and DNS cells within 2x of Kim, Moin & Moser (4.0e6) and 3x of Wilcox (0.088 Re_2h)^(9/4) (Turbulence Modeling for CFD)', () => {
    const input = air({ regime: 'internal', velocity: (11200 * AIR_NU) / 0.04, length: 0.04, geometry: 'duct', separation: 'none', domain: { crossSection: 'channel' } })
    const physics = flowPhysics(input)
    expect(physics.wall.deltaPlus).toBeGreaterThan(170)
    expect(physics.wall.deltaPlus).toBeLessThan(195)
    const cells = costOf('dns', input).cells
    expect(cells / (192 * 129 * 160)).toBeGreaterThan(0.5)
    expect(cells / (192 * 129 * 160)).toBeLessThan(2)
    const wilcox = (0.088 * 5600) ** 2.25
    expect(cells / wilcox).toBeGreaterThan(1 / 3)
    expect(cells / wilcox).toBeLessThan(3)
  })

  it('circular cylinder at Re 3900: wall-resolved LES within the 1e6-4e7 points of published LES, DNS finer, neither floored (Kravchenko & Moin 2000; Parnaudeau et al. 2008, Phys. Fluids 20, 085101)', () => {
    const input = air({ regime: 'external', velocity: (3900 * AIR_NU) / 0.01, length: 0.01, geometry: 'bluff', separation: 'massive', domain: { dimensions: '2d' } })
    const wrles = costOf('wrles', input)
    const dns = costOf('dns', input)
    expect(wrles.cells).toBeGreaterThan(1e6)
    expect(wrles.cells).toBeLessThan(4e7)
    expect(dns.cells).toBeGreaterThan(2 * wrles.cells)
    expect(dns.coreHours).toBeGreaterThan(2 * wrles.coreHours)
    // published LES of this flow took of order 1e3-1e4 core-hours on today's hardware (common practice, no source)
    expect(wrles.coreHours).toBeGreaterThan(100)
    expect(wrles.coreHours).toBeLessThan(1e5)
  })

  it('a ventilated room described as a 2 x 3 x 3 m box: about ten times fewer RANS cells than the 10-diameter default (common practice: rooms take about 1e6 cells)', () => {
    const room = { regime: 'internal' as const, velocity: 0.5, length: 3, geometry: 'complex' as const, separation: 'massive' as const, quantities: ['pressure' as const] }
    const plain = costOf('rans', air(room), 'blended').cells
    const described = costOf('rans', air({ ...room, domain: { lengthRatio: 2, crossSection: 'duct' } }), 'blended').cells
    expect(plain / described).toBeGreaterThan(3)
    expect(described).toBeGreaterThan(3e5)
    expect(described).toBeLessThan(5e6)
  })

  it('a 2-D aerofoil is priced in 2-D for RANS (1e4-1e6 cells) and span-periodic for LES (common practice, no source)', () => {
    const flat = caseAt(6e6, { domain: { dimensions: '2d' } })
    const solid = caseAt(6e6)
    expect(costOf('rans', flat).cells).toBeGreaterThan(1e4)
    expect(costOf('rans', flat).cells).toBeLessThan(1e6)
    expect(costOf('rans', flat).twoDimensional).toBe(true)
    expect(costOf('rans', solid).cells).toBeGreaterThan(30 * costOf('rans', flat).cells)
    expect(costOf('wmles', flat).twoDimensional).toBe(false)
    expect(costOf('wmles', flat).cells).toBeLessThan(costOf('wmles', solid).cells)
  })
})

describe('cost realism and bookkeeping', () => {
  it('at Re = 1e8 external, DNS and wall-resolved LES need more than 1e9 core-hours for every geometry and separation (Choi & Moin 2012 scaling)', () => {
    for (const geometry of ['streamlined', 'bluff', 'duct', 'rotating', 'complex'] as const) {
      for (const separation of ['none', 'mild', 'massive'] as const) {
        const input = caseAt(1e8, { geometry, separation })
        expect(costOf('dns', input).coreHours).toBeGreaterThan(1e9)
        expect(costOf('wrles', input).coreHours).toBeGreaterThan(1e9)
      }
    }
  })

  it('wall functions and the blended treatment need fewer RANS cells than a resolved wall (Launder & Spalding 1974: first cell in the log layer)', () => {
    const input = caseAt(1e7)
    expect(costOf('rans', input, 'wall-function').cells).toBeLessThan(costOf('rans', input, 'blended').cells)
    expect(costOf('rans', input, 'blended').cells).toBeLessThan(costOf('rans', input, 'resolved').cells)
  })

  it('core-hours = cells x (steps x inner iterations x cost per cell-step + RANS start), wall-clock = core-hours / cores, feasible within both budgets', () => {
    const input = caseAt(1e6, { separation: 'massive', geometry: 'bluff', budget: { coreHours: 1e4, cores: 100, wallClockHours: 10 } })
    for (const approach of APPROACH_IDS) {
      const cost = costOf(approach, input)
      const start = approach === 'urans' ? 8000 * RANS_CORE_SECONDS_PER_CELL_ITERATION : 0
      expect(cost.coreHours).toBeCloseTo((cost.cells * (cost.timeSteps * coreSecondsPerCellStep(approach, cost.innerIterations) + start)) / 3600, 6)
      expect(cost.wallClockHours).toBeCloseTo(cost.coreHours / 100, 9)
      expect(cost.feasible).toBe(cost.coreHours <= 1e4 && cost.wallClockHours <= 10)
    }
  })

  it('every estimate carries its range: cells x3 (resolving) or x2 (modelled), steps x2, core-hours the combined factor exp(sqrt(sum ln^2)) (our uncertainty budget)', () => {
    const input = caseAt(1e6)
    const resolving = costOf('wmles', input)
    expect(resolving.ranges.cells.low).toBeCloseTo(resolving.cells / 3, 6)
    expect(resolving.ranges.cells.high).toBeCloseTo(resolving.cells * 3, 6)
    const factor = Math.exp(Math.sqrt(Math.log(3) ** 2 + Math.log(2) ** 2 + Math.log(UNCERTAINTY.rate) ** 2))
    expect(resolving.uncertainty.coreHours).toBeCloseTo(factor, 12)
    expect(resolving.ranges.coreHours.high / resolving.coreHours).toBeCloseTo(factor, 9)
    const modelled = costOf('rans', input)
    expect(modelled.uncertainty.cells).toBe(2)
    expect(modelled.uncertainty.coreHours).toBeLessThan(factor)
  })

  it('stays finite at the edge of the input range (Re = 1e20)', () => {
    const input = caseInputSchema.parse({ ...caseAt(1), fluid: { medium: 'custom', density: 1e5, viscosity: 1e-7 }, velocity: 1e4, length: 1e4 })
    expect(flowPhysics(input).reynolds).toBeCloseTo(1e20, -6)
    for (const approach of APPROACH_IDS) {
      const cost = costOf(approach, input)
      for (const value of [cost.cells, cost.timeSteps, cost.coreHours, cost.wallClockHours, cost.memoryGB, cost.budgetRatio]) {
        expect(Number.isFinite(value)).toBe(true)
      }
    }
    expect(bounded(Number.POSITIVE_INFINITY)).toBe(Number.MAX_VALUE)
    expect(() => bounded(Number.NaN)).toThrow(/NaN/)
  })
})
