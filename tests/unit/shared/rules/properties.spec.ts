import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { WALL_TREATMENTS_BY_APPROACH, type ApproachId } from '#shared/rules/approaches'
import { advise } from '#shared/rules/advise'
import { caseInputSchema, type CaseInputDraft } from '#shared/rules/case-input'
import { costCaseFor } from '#shared/rules/cost-case'
import { approachCost } from '#shared/rules/cost-model'
import { flowPhysics } from '#shared/rules/flow-physics'
import { nonFiniteNumbers, validCase } from './arbitraries'

/** fast-check properties run many cases; on a shared machine they take longer than the default 5 s. */
const PROPERTY_TIMEOUT = 60_000

// Properties the cost model and the ranking must keep (our requirements, no source).

const MODELLED: readonly ApproachId[] = ['hybrid', 'urans', 'rans', 'laminar']

/** Cost of one approach with a wall treatment it allows. */
function costs(draft: CaseInputDraft, approach: ApproachId, treatmentIndex: number) {
  const input = caseInputSchema.parse(draft)
  const physics = flowPhysics(input)
  const treatments = WALL_TREATMENTS_BY_APPROACH[approach]
  const treatment = treatments[treatmentIndex % treatments.length]!
  return { physics, cost: approachCost(approach, costCaseFor(input, physics), treatment, input.budget) }
}

/** The regime a monotonicity check holds fixed: flow state, boundary layer, wake, Mach regime, roughness regime. */
function regimeKey(physics: ReturnType<typeof flowPhysics>): string {
  const { regime } = physics
  return [regime.state, regime.boundaryLayer, regime.wake, regime.mach, regime.strouhal, physics.roughness?.regime ?? 'smooth', physics.application.application].join('/')
}

const atLeast = (larger: number, smaller: number) => expect(larger).toBeGreaterThanOrEqual(smaller * (1 - 1e-6))

describe('cost properties over valid cases (fast-check)', () => {
  it('for each approach at a fixed wall treatment and regime, cells and core-hours never fall as Re rises (through the length; through the velocity for liquids)', () => {
    fc.assert(
      fc.property(
        validCase,
        fc.double({ min: 1.05, max: 10, noNaN: true }),
        fc.constantFrom<ApproachId>('dns', 'wrles', 'wmles', 'hybrid', 'urans', 'rans', 'laminar'),
        fc.nat(3),
        fc.boolean(),
        (draft, factor, approach, treatmentIndex, byVelocity) => {
          const liquid = draft.fluid.medium !== 'air'
          const larger = byVelocity && liquid
            ? { ...draft, velocity: Math.min(1e4, (draft.velocity as number) * factor) }
            : { ...draft, length: Math.min(1e4, (draft.length as number) * factor) }
          // Geometrically similar cases: no absolute roughness height, y+, frequency, span or area carried across scales.
          const scaleFree = { roughness: undefined, roughnessLength: undefined, yPlusTarget: undefined, lowestFrequencyHz: undefined }
          const domain = draft.domain ? { ...draft.domain, span: undefined, wettedArea: undefined } : undefined
          const base = { ...draft, ...scaleFree, domain }
          const bigger = { ...larger, ...scaleFree, domain }
          const low = costs(base, approach, treatmentIndex)
          const high = costs(bigger, approach, treatmentIndex)
          fc.pre(high.physics.reynolds > low.physics.reynolds && regimeKey(low.physics) === regimeKey(high.physics))
          atLeast(high.cost.cells, low.cost.cells)
          atLeast(high.cost.coreHours, low.cost.coreHours)
        },
      ),
      { numRuns: 400 },
    )
  }, PROPERTY_TIMEOUT)

  it('for the same case DNS >= wall-resolved LES >= wall-modelled LES, in cells and in core-hours', () => {
    fc.assert(
      fc.property(validCase, (draft) => {
        const dns = costs(draft, 'dns', 0).cost
        const wrles = costs(draft, 'wrles', 0).cost
        const wmles = costs(draft, 'wmles', 0).cost
        atLeast(dns.cells, wrles.cells)
        atLeast(wrles.cells, wmles.cells)
        atLeast(dns.coreHours, wrles.coreHours)
        atLeast(wrles.coreHours, wmles.coreHours)
      }),
      { numRuns: 300 },
    )
  }, PROPERTY_TIMEOUT)

  it('URANS never costs fewer core-hours than steady RANS with the same wall treatment', () => {
    fc.assert(
      fc.property(validCase, fc.nat(3), (draft, treatmentIndex) => {
        atLeast(costs(draft, 'urans', treatmentIndex).cost.coreHours, costs(draft, 'rans', treatmentIndex).cost.coreHours)
      }),
      { numRuns: 300 },
    )
  }, PROPERTY_TIMEOUT)

  it('every modelled approach reports its layers and every unsteady one its time step, simulated time and flow-throughs', () => {
    fc.assert(
      fc.property(validCase, (draft) => {
        for (const approach of MODELLED) expect(costs(draft, approach, 0).cost.layers).toBeGreaterThanOrEqual(1)
        for (const approach of ['dns', 'wrles', 'wmles', 'hybrid', 'urans'] as const) {
          const { cost } = costs(draft, approach, 0)
          expect(cost.timeStep).toBeGreaterThan(0)
          expect(cost.simulatedTime).toBeGreaterThan(0)
          expect(cost.flowThroughs).toBeGreaterThan(0)
        }
      }),
      { numRuns: 100 },
    )
  }, PROPERTY_TIMEOUT)
})

describe('advice properties over valid cases (fast-check)', () => {
  it('no score moves more than 10 points for a budget 10% larger or smaller', () => {
    fc.assert(
      fc.property(validCase, fc.constantFrom(0.9, 1.1), (draft, factor) => {
        const scaled = {
          ...draft,
          budget: { ...draft.budget, coreHours: draft.budget.coreHours * factor, wallClockHours: draft.budget.wallClockHours * factor },
        }
        const before = new Map(advise(draft).approaches.map((entry) => [entry.id, entry.score]))
        for (const entry of advise(scaled).approaches) expect(Math.abs(entry.score - before.get(entry.id)!)).toBeLessThanOrEqual(10)
      }),
      { numRuns: 200 },
    )
  }, PROPERTY_TIMEOUT)

  it('never returns NaN or Infinity, lists the six turbulence approaches (and a laminar solution only for laminar or transitional flow), and gives every cost its range', () => {
    fc.assert(
      fc.property(validCase, (draft) => {
        const advice = advise(draft)
        expect(nonFiniteNumbers(advice)).toEqual([])
        const ids = advice.approaches.map((entry) => entry.id)
        for (const id of ['dns', 'wrles', 'wmles', 'hybrid', 'urans', 'rans'] as const) expect(ids).toContain(id)
        expect(ids.includes('laminar')).toBe(advice.regime.state !== 'turbulent')
        for (const entry of advice.approaches) {
          expect(entry.ranges.coreHours.low).toBeLessThanOrEqual(entry.coreHours)
          expect(entry.ranges.coreHours.high).toBeGreaterThanOrEqual(entry.coreHours)
        }
      }),
      { numRuns: 200 },
    )
  }, PROPERTY_TIMEOUT)

  it('the budget statement is consistent: fits when the top-scored fits, otherwise the recommendation is the best that fits, or the top when none does', () => {
    fc.assert(
      fc.property(validCase, (draft) => {
        const advice = advise(draft)
        const top = advice.approaches[0]!
        const fitting = advice.approaches.find((entry) => entry.feasible)
        expect(advice.budget.adequate).toBe(top.id)
        if (top.feasible) expect(advice.budget.status).toBe('fits')
        else if (fitting) {
          expect(advice.budget.status).toBe('fallback')
          expect(advice.recommendation.approach).toBe(fitting.id)
          expect(advice.cautions).toContain(advice.budget.summary)
        } else {
          expect(advice.budget.status).toBe('none-fits')
          expect(advice.recommendation.approach).toBe(top.id)
          expect(advice.budget.summary).toMatch(/^No approach fits the budget/)
        }
      }),
      { numRuns: 150 },
    )
  }, PROPERTY_TIMEOUT)
})
