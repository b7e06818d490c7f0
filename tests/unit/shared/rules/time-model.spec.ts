import { describe, expect, it } from 'vitest'
import { caseInputSchema, type CaseInputDraft } from '#shared/rules/case-input'
import { costCaseFor } from '#shared/rules/cost-case'
import { approachCost } from '#shared/rules/cost-model'
import { flowPhysics } from '#shared/rules/flow-physics'
import { AVERAGING, RESOLVING_CFL, TRANSIENT, URANS_INNER_ITERATIONS, unsteadyPlan } from '#shared/rules/time-model'
import type { ApproachId, WallTreatment } from '#shared/rules/approaches'

const budget = { coreHours: 1e5, cores: 1024, wallClockHours: 500 }

function plan(approach: ApproachId, draft: Partial<CaseInputDraft>, treatment: WallTreatment = 'resolved') {
  const input = caseInputSchema.parse({
    regime: 'external',
    fluid: { medium: 'air' },
    velocity: 20,
    length: 1,
    geometry: 'streamlined',
    separation: 'none',
    quantities: ['forces'],
    budget,
    ...draft,
  } as CaseInputDraft)
  const flow = costCaseFor(input, flowPhysics(input))
  return { flow, cost: approachCost(approach, flow, approach === 'wmles' ? 'wall-model' : treatment, budget) }
}

describe('the CFL time step', () => {
  it('dt = CFL dx / U: worked example U = 10 m/s, dx = 1 mm, CFL 0.5 gives 5e-5 s (definition of the Courant number; our arithmetic)', () => {
    const { flow } = plan('wrles', { velocity: 10 })
    expect(unsteadyPlan(flow, 1, 0.5, 1e-3, 1, 1).timeStep).toBeCloseTo(5e-5, 15)
  })

  it('explicit compressible solvers divide the step by 1 + 1/M, the acoustic CFL (U + a) dt / dx (REFERENCES: acoustic CFL; Anderson, from memory)', () => {
    const mach = 0.5
    const velocity = mach * 343.2
    const explicit = plan('wmles', { velocity, timeIntegration: 'explicit' }).cost
    const implicit = plan('wmles', { velocity, timeIntegration: 'implicit' }).cost
    expect(explicit.acousticFactor).toBeCloseTo(1 + 1 / mach, 2)
    expect(implicit.acousticFactor).toBe(1)
    expect(implicit.timeStep! / explicit.timeStep!).toBeCloseTo(1 + 1 / mach, 2)
    expect((explicit.timeStep! * velocity * explicit.acousticFactor) / explicit.finestCell).toBeCloseTo(RESOLVING_CFL, 9)
    // below Mach 0.3 a pressure-based solver is assumed unless explicit is chosen
    expect(plan('wmles', { velocity: 20 }).cost.acousticFactor).toBe(1)
  })

  it('the hybrid step follows the velocity: twice the speed, about half the step (CFL on the focus cells)', () => {
    const slow = plan('hybrid', { geometry: 'bluff', separation: 'massive', velocity: 10 }).cost
    const fast = plan('hybrid', { geometry: 'bluff', separation: 'massive', velocity: 20 }).cost
    expect(slow.timeStep! / fast.timeStep!).toBeGreaterThan(1.8)
  })

  it('wall-modelled LES never needs more steps than wall-resolved LES (its finest cell is never finer)', () => {
    for (const velocity of [1, 10, 100]) {
      const wm = plan('wmles', { velocity, length: 2, quantities: ['statistics'] }).cost
      const wr = plan('wrles', { velocity, length: 2, quantities: ['statistics'] }).cost
      expect(wm.timeSteps).toBeLessThanOrEqual(wr.timeSteps)
      expect(wm.finestCell).toBeGreaterThanOrEqual(wr.finestCell)
    }
  })
})

describe('the simulated time', () => {
  it('statistics of a shedding cylinder: 10 transient periods and 50 averaged, with St = 0.21 (Roshko 1954; common practice)', () => {
    const { cost } = plan('wrles', { geometry: 'bluff', separation: 'massive', velocity: (3900 * 1.506e-5) / 0.01, length: 0.01, quantities: ['statistics'] })
    expect(cost.periods).toBeCloseTo(TRANSIENT.periods + AVERAGING.statistics.periods, 6)
    expect(cost.simulatedTime).toBeCloseTo((60 * 0.01) / (0.21 * ((3900 * 1.506e-5) / 0.01)), 9)
  })

  it('unsteady loads need 100 shedding periods, mean forces 20 (spectra and peaks converge slowly; common practice)', () => {
    const loads = plan('hybrid', { geometry: 'bluff', separation: 'massive', quantities: ['unsteady-loads'] }).cost
    const mean = plan('hybrid', { geometry: 'bluff', separation: 'massive', quantities: ['forces'] }).cost
    expect(loads.periods).toBeCloseTo(110, 6)
    expect(mean.periods).toBeCloseTo(30, 6)
  })

  it('a lowest frequency of interest sets 20 of its periods after the transient', () => {
    const { cost } = plan('wmles', { quantities: ['noise'], lowestFrequencyHz: 2, velocity: 20 })
    expect(cost.periods).toBeCloseTo(20 + (TRANSIENT.flowThroughs * 1) / 20 * 2, 6)
    expect(cost.simulatedTime).toBeCloseTo(10 + 3 / 20, 9)
  })

  it('attached statistics: 3 transient and 20 averaging flow-throughs of the domain', () => {
    const { cost } = plan('wmles', { quantities: ['statistics'], domain: { lengthRatio: 4 } })
    expect(cost.flowThroughs).toBeCloseTo(23, 9)
    expect(cost.periods).toBeNull()
  })
})

describe('URANS and steady RANS', () => {
  it('URANS counts its inner iterations and starts from the converged steady solution, so it never costs less than steady RANS (common practice: 5-20 inner iterations)', () => {
    for (const draft of [{}, { geometry: 'bluff' as const, separation: 'massive' as const }, { quantities: ['unsteady-loads' as const] }]) {
      const urans = plan('urans', draft).cost
      const rans = plan('rans', draft).cost
      expect(urans.innerIterations).toBe(URANS_INNER_ITERATIONS)
      expect(urans.coreHours).toBeGreaterThan(rans.coreHours)
    }
  })

  it('steady RANS reports iterations and no time step', () => {
    const { cost } = plan('rans', {})
    expect(cost.timeStep).toBeNull()
    expect(cost.simulatedTime).toBeNull()
    expect(cost.timeSteps).toBe(3000)
  })
})
