import { describe, expect, it } from 'vitest'
import { advise } from '#shared/rules/advise'
import { conditionHolds, evaluateRule, evaluateStage } from '#shared/rules/evaluate-rules'
import type { Facts } from '#shared/rules/facts'
import { RULESET } from '#shared/rules/ruleset'
import type { Rule } from '#shared/rules/ruleset-schema'

const perApproach = <T>(value: T) => ({ dns: value, wrles: value, wmles: value, hybrid: value, urans: value, rans: value, laminar: value })

const budgetRatio = { ...perApproach(0.5), dns: 500, wrles: 5, rans: 1 }
const facts: Facts = {
  regime: 'external',
  geometry: 'streamlined',
  separation: 'none',
  reynolds: 1e7,
  logReynolds: 7,
  reynoldsTurbulent: 1e5,
  mach: 0.1,
  machRegime: 'incompressible',
  flowState: 'turbulent',
  boundaryLayerState: 'turbulent',
  wakeState: 'none',
  deltaPlus: 5000,
  roughnessPlus: 0,
  roughnessRegime: 'smooth',
  relativeRoughness: 0,
  application: 'general',
  swirl: 'none',
  dimensions: '3d',
  crossSection: 'none',
  physics: { transition: false, heatTransfer: false, rotation: false, buoyancy: false, acoustics: false },
  quantities: ['forces'],
  budget: { coreHours: 1000, cores: 64, wallClockHours: 48 },
  coreHours: perApproach(100),
  cells: perApproach(1e6),
  budgetRatio,
  budgetLog: Object.fromEntries(Object.entries(budgetRatio).map(([id, ratio]) => [id, Math.log10(ratio)])) as Facts['budgetLog'],
  feasible: { ...perApproach(true), dns: false, wrles: false },
}

const ruleById = (id: string) => RULESET.rules.find((rule) => rule.id === id)!

describe('evaluating rules with json-logic', () => {
  it('uses json-logic truthiness (an empty array is false) and "in" over the quantities list', () => {
    expect(conditionHolds([], facts)).toBe(false)
    expect(conditionHolds({ in: ['forces', { var: 'quantities' }] }, facts)).toBe(true)
    expect(conditionHolds({ in: ['noise', { var: 'quantities' }] }, facts)).toBe(false)
  })

  it('evaluates score expressions on the facts: the budget term is -50 per decade over budget, at most -60, and 0 within it (our rule)', () => {
    const outcome = evaluateRule(ruleById('budget-trade-off'), facts)
    expect(outcome.fired).toBe(true)
    const scores = outcome.effects.scores!
    expect(scores.dns).toBe(-60) // 500 times over: -135 floored
    expect(scores.wrles).toBeCloseTo(-50 * Math.log10(5), 10)
    expect(scores.rans).toBeCloseTo(0, 10) // exactly on budget
    expect(scores.wmles).toBe(0) // half the budget: no change
  })

  it('reports what a rule would apply even when it does not fire', () => {
    const outcome = evaluateRule(ruleById('massive-separation-favours-resolving'), facts)
    expect(outcome.fired).toBe(false)
    expect(outcome.effects.scores?.hybrid).toBe(25)
  })

  it('throws, naming the rule, when a score expression is not a number', () => {
    const broken = { ...ruleById('attached-boundary-layers-suit-rans'), id: 'broken', effects: { scores: { rans: { var: 'regime' } } } } as Rule
    expect(() => evaluateRule(broken, facts)).toThrow(/Rule "broken"/)
  })

  it('runs the rules of a stage in ruleset order', () => {
    const ids = evaluateStage(RULESET, 'scoring', facts).map((outcome) => outcome.rule.id)
    expect(ids).toEqual(RULESET.rules.filter((rule) => rule.stage === 'scoring').map((rule) => rule.id))
  })

  it('fires the rules a case calls for and no others in a plain attached case', () => {
    const advice = advise({
      regime: 'external',
      fluid: { medium: 'air' },
      velocity: 15,
      length: 10,
      geometry: 'streamlined',
      separation: 'none',
      quantities: ['forces'],
      budget: { coreHours: 5000, cores: 64, wallClockHours: 100 },
    })
    const fired = advice.trace.filter((entry) => entry.fired).map((entry) => entry.rule)
    expect(fired).toEqual(['attached-boundary-layers-suit-rans', 'attached-aerodynamics-sst', 'thick-layers-suit-wall-modelled-les', 'budget-trade-off'])
    expect(advice.trace.find((entry) => entry.rule === 'direct-simulation-within-reach')!.fired).toBe(false)
  })
})
