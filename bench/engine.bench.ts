/**
 * Engine benchmark: median microseconds per advise() over 1,000 varied valid cases, against a bare
 * json-logic apply loop over the same rules on the same facts, in one run.
 * Run with `npm run bench:engine`. Target: advise() within 3x of the bare loop. Times are CPU
 * time of this process, medians over interleaved rounds.
 */
import jsonLogic, { type RulesLogic } from 'json-logic-js'
import { APPROACH_IDS, type ApproachId } from '../shared/rules/approaches'
import { adviseParsed, advise } from '../shared/rules/advise'
import { treatmentStage } from '../shared/rules/advise-treatments'
import { APPLICATIONS, QUANTITIES, caseInputSchema, type CaseInput, type CaseInputDraft } from '../shared/rules/case-input'
import { costCaseFor } from '../shared/rules/cost-case'
import { approachCost, type ApproachCost } from '../shared/rules/cost-model'
import { buildPhysicsFacts, withCostFacts, type Facts } from '../shared/rules/facts'
import { flowPhysics } from '../shared/rules/flow-physics'
import { RULESET } from '../shared/rules/ruleset'

const CASE_COUNT = 1000

/** A small deterministic generator (mulberry32), so every run measures the same cases. */
function generator(seed: number): () => number {
  let state = seed >>> 0
  return () => {
    state = (state + 0x6d2b79f5) >>> 0
    let t = state
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

const random = generator(20250601)
const pick = <T>(values: readonly T[]): T => values[Math.floor(random() * values.length)]!
const logUniform = (min: number, max: number) => 10 ** (min + (max - min) * random())
const chance = (p: number) => random() < p

function fluid(): CaseInputDraft['fluid'] {
  const kind = pick(['air', 'air', 'water', 'custom'] as const)
  if (kind === 'air') return { medium: 'air', temperatureK: 200 + 600 * random(), pressurePa: logUniform(3.5, 6.5) }
  if (kind === 'water') return { medium: 'water', temperatureK: 275 + 95 * random() }
  return { medium: 'custom', density: logUniform(-1, 3.5), viscosity: logUniform(-5.5, 0) }
}

/** One varied case: regime, fluid, geometry, separation, physics, quantities and Re from about 1e1 to 1e10, with the optional 2.0 fields half the time. */
function variedCase(): CaseInputDraft {
  const regime = pick(['external', 'internal'] as const)
  const length = logUniform(-2.5, 2.5)
  const draft: CaseInputDraft = {
    regime,
    fluid: fluid(),
    velocity: logUniform(-2, 2.7),
    length,
    turbulenceIntensity: 0.001 + 0.1 * random(),
    geometry: pick(['streamlined', 'bluff', 'duct', 'rotating', 'complex'] as const),
    separation: pick(['none', 'mild', 'massive'] as const),
    physics: { transition: chance(0.1), heatTransfer: chance(0.25), rotation: chance(0.15), buoyancy: chance(0.1), acoustics: chance(0.1) },
    quantities: [...new Set([pick(QUANTITIES), pick(QUANTITIES)])],
    budget: { coreHours: logUniform(1, 8), cores: Math.ceil(logUniform(0, 4.5)), wallClockHours: logUniform(0.5, 3.5) },
    growthRatio: 1.1 + 0.2 * random(),
  }
  if (chance(0.2)) draft.roughness = (regime === 'internal' ? 0.02 : 0.01) * random() * length
  if (chance(0.5)) {
    draft.domain = {
      dimensions: pick(['3d', '2d', 'axisymmetric', 'span-periodic'] as const),
      lengthRatio: logUniform(0, 1.5),
      ...(regime === 'internal' ? { crossSection: pick(['pipe', 'channel', 'duct'] as const) } : {}),
    }
  }
  if (chance(0.2)) draft.lowestFrequencyHz = logUniform(-1, 3)
  if (chance(0.1)) draft.timeIntegration = pick(['explicit', 'implicit'] as const)
  if (chance(0.1)) draft.application = pick(APPLICATIONS)
  if (chance(0.1)) draft.yPlusTarget = logUniform(-0.5, 2)
  return draft
}

const cases: CaseInputDraft[] = []
while (cases.length < CASE_COUNT) {
  const draft = variedCase()
  if (caseInputSchema.safeParse(draft).success) cases.push(draft)
}
const parsedCases: CaseInput[] = cases.map((draft) => caseInputSchema.parse(draft))

/** The facts each case's rules see: the physics, and the costs with the treatments the treatment stage chose. */
const factsPerCase: Facts[] = parsedCases.map((input) => {
  const physics = flowPhysics(input)
  const physicsFacts = buildPhysicsFacts(input, physics)
  const { treatments } = treatmentStage(physicsFacts)
  const flow = costCaseFor(input, physics)
  const costs = Object.fromEntries(APPROACH_IDS.map((id) => [id, approachCost(id, flow, treatments[id], input.budget)])) as Record<ApproachId, ApproachCost>
  return withCostFacts(physicsFacts, input.budget, costs)
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

/**
 * Mean microseconds per call of `work(index)` over all cases, `repeats` times over, in CPU time of
 * this process (user + system): the machine is shared, and wall-clock time would measure the
 * neighbours as much as the engine.
 */
function timeOnce(work: (index: number) => unknown, repeats: number): number {
  let sink = 0
  const start = process.cpuUsage()
  for (let repeat = 0; repeat < repeats; repeat++) {
    for (let index = 0; index < cases.length; index++) sink += work(index) ? 1 : 0
  }
  const used = process.cpuUsage(start)
  if (sink < 0) console.log(sink)
  return (used.user + used.system) / (repeats * cases.length)
}

/** What advise() asks of json-logic, and nothing else: every expression once, on the case's facts. */
function bareJsonLogic(index: number): boolean {
  const facts = factsPerCase[index]!
  let fired = false
  for (const expression of expressions) fired = jsonLogic.truthy(jsonLogic.apply(expression as RulesLogic, facts)) || fired
  return fired
}

// Interleaved rounds, so both sides see the same machine load; medians over rounds.
const rounds = 15
const repeats = 2
for (let round = 0; round < 2; round++) {
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
const ratio = median(ratioSamples)
const recommended = new Map<string, number>()
for (const input of parsedCases) {
  const id = adviseParsed(input).recommendation.approach
  recommended.set(id, (recommended.get(id) ?? 0) + 1)
}

console.log(`cases: ${cases.length} varied valid cases, rules: ${RULESET.rules.length}, json-logic expressions: ${expressions.length}`)
console.log(`recommended: ${[...recommended].map(([id, count]) => `${id} ${count}`).join(', ')}`)
console.log(`bare json-logic apply loop:      ${median(bareSamples).toFixed(2)} µs median per case`)
console.log(`advise() incl. schema parse:     ${median(fullSamples).toFixed(2)} µs median per case`)
console.log(`advise() on parsed input:        ${median(parsedSamples).toFixed(2)} µs median per case`)
console.log(`ratio advise / bare json-logic:  ${ratio.toFixed(2)}x median of ${rounds} interleaved rounds (target <= 3x) ${ratio <= 3 ? 'OK' : 'OVER TARGET'}`)
