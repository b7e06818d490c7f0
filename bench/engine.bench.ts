/**
 * Engine benchmark: median microseconds per advise() over a spread of cases, against a bare
 * json-logic apply loop over the same rules on the same facts, in one run.
 * Run with `npm run bench:engine`. Target: advise() within 3x of the bare loop.
 */
import jsonLogic, { type RulesLogic } from 'json-logic-js'
import { performance } from 'node:perf_hooks'
import { APPROACH_IDS, defaultWallTreatments } from '../shared/rules/approaches'
import { adviseParsed, advise, costCaseFor } from '../shared/rules/advise'
import { caseInputSchema, type CaseInput, type CaseInputDraft } from '../shared/rules/case-input'
import { approachCost, type ApproachCost } from '../shared/rules/cost-model'
import { buildFacts, type Facts } from '../shared/rules/facts'
import { flowPhysics } from '../shared/rules/flow-physics'
import { RULESET } from '../shared/rules/ruleset'

const budget = { coreHours: 5e4, cores: 512, wallClockHours: 200 }

/** A spread of cases: regimes, fluids, geometries, separation, physics and Reynolds numbers from 1e3 to 1e9. */
const cases: CaseInputDraft[] = []
const geometries = ['streamlined', 'bluff', 'duct', 'rotating', 'complex'] as const
const separations = ['none', 'mild', 'massive'] as const
const quantitySets = [['forces'], ['unsteady-loads', 'pressure'], ['statistics'], ['heat-transfer'], ['noise', 'mixing']] as const
for (let index = 0; index < 60; index++) {
  const regime = index % 2 === 0 ? 'external' : 'internal'
  const fluid = index % 3 === 0 ? { medium: 'water' as const } : { medium: 'air' as const }
  cases.push({
    regime,
    fluid,
    velocity: 10 ** ((index % 7) / 2 - 1),
    length: regime === 'external' ? 10 ** ((index % 5) / 2 - 1) : 0.05 * (1 + (index % 4)),
    geometry: geometries[index % geometries.length]!,
    separation: separations[index % separations.length]!,
    physics: { transition: index % 11 === 0, heatTransfer: index % 4 === 0, rotation: index % 6 === 0, buoyancy: false, acoustics: index % 9 === 0 },
    quantities: [...quantitySets[index % quantitySets.length]!],
    budget,
  })
}
const parsedCases: CaseInput[] = cases.map((draft) => caseInputSchema.parse(draft))

/** The facts each case's rules see (treatment stage, with default wall treatments). */
const factsPerCase: Facts[] = parsedCases.map((input) => {
  const physics = flowPhysics(input)
  const costCase = costCaseFor(input, physics)
  const treatments = defaultWallTreatments()
  const costs = Object.fromEntries(
    APPROACH_IDS.map((id) => [id, approachCost(id, costCase, treatments[id], input.budget)]),
  ) as Record<(typeof APPROACH_IDS)[number], ApproachCost>
  return buildFacts(input, physics, costs)
})

/** Every json-logic expression in the ruleset: each condition and each computed score change. */
const expressions: unknown[] = RULESET.rules.flatMap((rule) => [
  rule.when,
  ...Object.values(rule.effects.scores ?? {}).filter((change) => typeof change !== 'number'),
])

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b)
  const middle = Math.floor(sorted.length / 2)
  return sorted.length % 2 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2
}

/** Mean microseconds per call of `work(index)` over all cases, `repeats` times over. */
function timeOnce(work: (index: number) => unknown, repeats: number): number {
  let sink = 0
  const start = performance.now()
  for (let repeat = 0; repeat < repeats; repeat++) {
    for (let index = 0; index < cases.length; index++) sink += work(index) ? 1 : 0
  }
  const elapsed = performance.now() - start
  if (sink < 0) console.log(sink)
  return (elapsed * 1000) / (repeats * cases.length)
}

/** What advise() asks of json-logic, and nothing else: every expression once, on the case's facts. */
function bareJsonLogic(index: number): boolean {
  const facts = factsPerCase[index]!
  let fired = false
  for (const expression of expressions) fired = jsonLogic.truthy(jsonLogic.apply(expression as RulesLogic, facts)) || fired
  return fired
}

// Interleaved rounds, so both sides see the same machine load; medians over rounds.
const rounds = 21
const repeats = 15
for (let round = 0; round < 3; round++) {
  timeOnce(bareJsonLogic, repeats)
  timeOnce((index) => advise(cases[index]!), repeats)
}
const bareSamples: number[] = []
const fullSamples: number[] = []
const parsedSamples: number[] = []
const ratioSamples: number[] = []
for (let round = 0; round < rounds; round++) {
  const bareTime = timeOnce(bareJsonLogic, repeats)
  const fullTime = timeOnce((index) => advise(cases[index]!), repeats)
  parsedSamples.push(timeOnce((index) => adviseParsed(parsedCases[index]!), repeats))
  bareSamples.push(bareTime)
  fullSamples.push(fullTime)
  ratioSamples.push(fullTime / bareTime)
}
const bare = median(bareSamples)
const full = median(fullSamples)
const parsed = median(parsedSamples)
const ratio = median(ratioSamples)

console.log(`cases: ${cases.length}, rules: ${RULESET.rules.length}, json-logic expressions: ${expressions.length}`)
console.log(`bare json-logic apply loop:      ${bare.toFixed(2)} µs median per case`)
console.log(`advise() incl. schema parse:     ${full.toFixed(2)} µs median per case`)
console.log(`advise() on parsed input:        ${parsed.toFixed(2)} µs median per case`)
console.log(`ratio advise / bare json-logic:  ${ratio.toFixed(2)}x median of ${rounds} interleaved rounds (target <= 3x) ${ratio <= 3 ? 'OK' : 'OVER TARGET'}`)
