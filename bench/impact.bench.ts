/**
 * Impact-preview benchmark: 100,000 past decisions (generated, distinct inputs) replayed under the
 * published ruleset and an edited draft, as POST /api/rulesets/:id/impact does after reading them
 * from PostgreSQL (not included here). Two runs: decisions saved with the published version under
 * this engine (their stored advice stands in for that side), and decisions saved with an older
 * version (both sides computed). Run with `npm run bench:impact`.
 */
import { performance } from 'node:perf_hooks'
import { ENGINE_VERSION, RULESET, advise, caseInputSchema, compileRuleset, type CaseInputDraft } from '../shared/rules'
import { canonicalHash } from '../server/db/event-chain'
import { choiceOf } from '../server/utils/rulesets/cases'
import { createReplay, type StoredRevision } from '../server/utils/rulesets/replay'

const DECISIONS = Number(process.env.IMPACT_DECISIONS || 100_000)

// A small deterministic generator (LCG), so every run replays the same decisions.
let seed = 20_260_501
const random = () => ((seed = (seed * 1_664_525 + 1_013_904_223) >>> 0) / 2 ** 32)
const pick = <T>(items: readonly T[]) => items[Math.floor(random() * items.length)]!

function generatedCase(): CaseInputDraft {
  const regime = random() < 0.6 ? 'external' : 'internal'
  return {
    regime,
    fluid: random() < 0.5 ? { medium: 'air' } : { medium: 'water' },
    velocity: 10 ** (random() * 3 - 1),
    length: regime === 'external' ? 10 ** (random() * 3 - 1) : 0.02 + random(),
    geometry: pick(['streamlined', 'bluff', 'duct', 'rotating', 'complex'] as const),
    separation: pick(['none', 'mild', 'massive'] as const),
    physics: { transition: random() < 0.1, heatTransfer: random() < 0.2, rotation: random() < 0.1, buoyancy: random() < 0.05, acoustics: random() < 0.1 },
    quantities: [pick(['forces', 'pressure', 'heat-transfer', 'unsteady-loads', 'noise', 'statistics', 'mixing'] as const)],
    budget: { coreHours: 10 ** (2 + random() * 4), cores: pick([32, 128, 512, 2048]), wallClockHours: 10 + random() * 200 },
  }
}

const published = compileRuleset(JSON.parse(JSON.stringify(RULESET)))
const draftData = JSON.parse(JSON.stringify(RULESET))
draftData.version = '9.1.0'
draftData.rules.find((r: { id: string }) => r.id === 'attached-aerodynamics-sst').effects.models = { rans: 'Spalart-Allmaras', urans: 'Spalart-Allmaras' }
draftData.rules.find((r: { id: string }) => r.id === 'mild-separation').effects.models = { rans: 'realizable k-epsilon', urans: 'realizable k-epsilon' }
const draft = compileRuleset(draftData)

const started = performance.now()
const stored: StoredRevision[] = []
for (let index = 0; index < DECISIONS; index++) {
  const caseInput = caseInputSchema.parse(generatedCase())
  stored.push({
    decisionId: index + 1, caseInput, inputHash: canonicalHash(caseInput), rulesetId: RULESET.id, rulesetVersion: RULESET.version,
    engineVersion: ENGINE_VERSION, recommendation: choiceOf(advise(caseInput, { ruleset: published })),
  })
}
console.log(`set-up: ${DECISIONS} decisions saved with ${RULESET.id} ${RULESET.version} in ${((performance.now() - started) / 1000).toFixed(1)} s`)

// CPU time as well as wall time: on a shared machine the wall clock mostly measures the neighbours.
function run(label: string, decisions: StoredRevision[]) {
  const start = performance.now()
  const cpu = process.cpuUsage()
  const replay = createReplay(published, draft)
  let changes = 0
  for (const decision of decisions) if (replay.replay(decision)) changes++
  const seconds = (performance.now() - start) / 1000
  const used = process.cpuUsage(cpu)
  const cpuSeconds = (used.user + used.system) / 1e6
  console.log(`${label}: ${decisions.length} decisions, ${cpuSeconds.toFixed(2)} s CPU (${((cpuSeconds * 1e6) / decisions.length).toFixed(1)} µs each), ${seconds.toFixed(2)} s wall; ${changes} would change`)
}

run('saved with the published version', stored)
run('saved with an older version     ', stored.map(d => ({ ...d, rulesetVersion: '0.9.0' })))
