import { describe, expect, it } from 'vitest'
import { RULESET, advise, type CaseInputDraft } from '#shared/rules/index'

// One rule, one test: for every rule of the ruleset a case that fires it and one that does not.
// Each test names the rule's own source (printed from the ruleset), as the rule itself does.

const AIR_NU = 1.506e-5
const budget = { coreHours: 5000, cores: 128, wallClockHours: 100 }

/** Attached external air flow at Re 1e7 on a 10 m wall, forces only: the plain case most rules leave alone. */
const plain: CaseInputDraft = {
  regime: 'external',
  fluid: { medium: 'air' },
  velocity: 15,
  length: (1e7 * AIR_NU) / 15,
  geometry: 'streamlined',
  separation: 'none',
  quantities: ['forces'],
  budget,
}
const withPlain = (overrides: Partial<CaseInputDraft>): CaseInputDraft => ({ ...plain, ...overrides })
/** External air at a Mach number, Re near 1e7. */
const atMach = (mach: number, overrides: Partial<CaseInputDraft> = {}) => withPlain({ velocity: mach * 343.2, length: (1e7 * AIR_NU) / (mach * 343.2), ...overrides })
const cylinder = (reynolds: number): CaseInputDraft => withPlain({ geometry: 'bluff', separation: 'massive', length: 0.01, velocity: (reynolds * AIR_NU) / 0.01 })
const pipe = (reynolds: number, overrides: Partial<CaseInputDraft> = {}): CaseInputDraft => ({
  regime: 'internal',
  fluid: { medium: 'water' },
  length: 0.05,
  velocity: (reynolds * 1.004e-6) / 0.05,
  geometry: 'duct',
  separation: 'none',
  quantities: ['pressure'],
  budget,
  ...overrides,
})
const building = (overrides: Partial<CaseInputDraft> = {}): CaseInputDraft => ({
  regime: 'external',
  fluid: { medium: 'air' },
  velocity: 10,
  length: 100,
  roughnessLength: 0.3,
  geometry: 'complex',
  separation: 'massive',
  quantities: ['pressure'],
  budget,
  ...overrides,
})
const channel180 = (overrides: Partial<CaseInputDraft> = {}): CaseInputDraft => ({
  regime: 'internal',
  fluid: { medium: 'air' },
  length: 0.04,
  velocity: (11200 * AIR_NU) / 0.04,
  geometry: 'duct',
  separation: 'none',
  domain: { crossSection: 'channel' },
  quantities: ['statistics'],
  budget: { coreHours: 1e7, cores: 4096, wallClockHours: 1000 },
  ...overrides,
})
const lowRe = withPlain({ velocity: 1, length: (1e5 * AIR_NU) / 1 })

const CASES: Record<string, { fires: CaseInputDraft; quiet: CaseInputDraft }> = {
  // treatment stage
  'blended-wall-where-y-plus-varies': { fires: withPlain({ geometry: 'bluff', separation: 'massive' }), quiet: plain },
  'high-reynolds-wall-functions': { fires: withPlain({ fluid: { medium: 'water' }, velocity: 10, length: 100 }), quiet: plain },
  'rough-walls-need-rough-wall-functions': { fires: building(), quiet: plain },
  'smooth-surface-separation-needs-resolved-wall': { fires: withPlain({ separation: 'mild' }), quiet: plain },
  'shocks-need-resolved-wall': { fires: atMach(0.8), quiet: plain },
  'heat-transfer-needs-resolved-wall': { fires: withPlain({ physics: { heatTransfer: true } }), quiet: plain },
  'transition-needs-resolved-wall': { fires: withPlain({ physics: { transition: true } }), quiet: plain },
  'no-log-layer-for-wall-functions': { fires: lowRe, quiet: plain },
  // scoring stage
  'attached-boundary-layers-suit-rans': { fires: plain, quiet: withPlain({ separation: 'massive' }) },
  'attached-aerodynamics-sst': { fires: plain, quiet: pipe(1e5) },
  'mild-separation': { fires: withPlain({ separation: 'mild' }), quiet: plain },
  'massive-separation-favours-resolving': { fires: withPlain({ separation: 'massive' }), quiet: plain },
  'bluff-bodies-shed-vortices': { fires: withPlain({ geometry: 'bluff', separation: 'massive' }), quiet: plain },
  'planar-shedding-suits-urans': {
    fires: { ...cylinder(1e5), domain: { dimensions: '2d' } },
    quiet: cylinder(1e5),
  },
  'mean-values-of-three-dimensional-bodies': { fires: withPlain({ separation: 'mild' }), quiet: withPlain({ separation: 'mild', quantities: ['unsteady-loads'] }) },
  'unsteady-quantities-need-unsteady-methods': { fires: withPlain({ quantities: ['unsteady-loads'] }), quiet: plain },
  'broadband-noise-needs-resolved-turbulence': { fires: withPlain({ quantities: ['noise'] }), quiet: plain },
  'turbulence-statistics-need-resolved-eddies': { fires: withPlain({ quantities: ['statistics'] }), quiet: plain },
  'canonical-internal-flow-dns': { fires: channel180(), quiet: channel180({ quantities: ['pressure'] }) },
  'turbulent-mixing': { fires: withPlain({ quantities: ['mixing'] }), quiet: plain },
  'heat-transfer-model': { fires: withPlain({ quantities: ['heat-transfer'] }), quiet: plain },
  'rotation-and-curvature': { fires: withPlain({ geometry: 'rotating' }), quiet: plain },
  'strong-swirl-needs-reynolds-stress-model': { fires: pipe(1e5, { physics: { rotation: true } }), quiet: pipe(1e5) },
  'laminar-turbulent-transition': { fires: withPlain({ physics: { transition: true } }), quiet: plain },
  buoyancy: { fires: withPlain({ physics: { buoyancy: true } }), quiet: plain },
  'atmospheric-flows-realizable-k-epsilon': { fires: building(), quiet: plain },
  'peak-wind-loads-need-les': { fires: building({ quantities: ['unsteady-loads'] }), quiet: building() },
  'indoor-air-realizable-k-epsilon': {
    fires: { ...pipe(1e5), fluid: { medium: 'air' }, geometry: 'complex', length: 3, velocity: 0.5 },
    quiet: pipe(1e5),
  },
  'free-shear-flows-suit-les': { fires: withPlain({ application: 'jet', separation: 'massive' }), quiet: plain },
  'ship-hulls': { fires: withPlain({ fluid: { medium: 'water' }, velocity: 10, length: 100 }), quiet: plain },
  'laminar-flow-needs-no-model': { fires: cylinder(100), quiet: plain },
  'transitional-flow-needs-transition-aware-methods': { fires: pipe(3000), quiet: plain },
  'subcritical-bluff-body': { fires: cylinder(3900), quiet: cylinder(1e6) },
  'drag-crisis': { fires: cylinder(3e5), quiet: cylinder(3900) },
  compressibility: { fires: atMach(0.5), quiet: plain },
  'transonic-shocks': { fires: atMach(0.8), quiet: atMach(0.5) },
  'transonic-buffet': { fires: atMach(0.8, { separation: 'mild' }), quiet: atMach(0.8) },
  'supersonic-flow': { fires: atMach(2), quiet: atMach(0.8) },
  'hypersonic-flow': {
    fires: withPlain({ fluid: { medium: 'air', temperatureK: 200, pressurePa: 1000 }, velocity: 1700, length: 1 }),
    quiet: atMach(2),
  },
  'rough-walls': { fires: withPlain({ fluid: { medium: 'water' }, velocity: 12, length: 200, roughness: 150e-6 }), quiet: plain },
  'thick-layers-suit-wall-modelled-les': { fires: plain, quiet: lowRe },
  'short-log-layer-for-wall-model': { fires: lowRe, quiet: plain },
  'direct-simulation-within-reach': { fires: channel180(), quiet: plain },
  'budget-trade-off': { fires: plain, quiet: channel180({ budget: { coreHours: 1e12, cores: 1e6, wallClockHours: 1e6 } }) },
}

function fired(ruleId: string, input: CaseInputDraft): boolean {
  const entry = advise(input).trace.find((candidate) => candidate.rule === ruleId)
  if (!entry) throw new Error(`Rule ${ruleId} is not in the trace.`)
  return entry.fired
}

describe('every rule of the ruleset has a case that fires it and one that does not', () => {
  it('covers every rule, and no rule that is not in the ruleset', () => {
    expect(Object.keys(CASES).sort()).toEqual(RULESET.rules.map((rule) => rule.id).sort())
  })

  for (const rule of RULESET.rules) {
    const cases = CASES[rule.id]
    it(`${rule.id} (${rule.stage}; source: ${rule.source})`, () => {
      expect(cases, `no test cases for rule ${rule.id}`).toBeDefined()
      expect(fired(rule.id, cases!.fires)).toBe(true)
      expect(fired(rule.id, cases!.quiet)).toBe(false)
      expect(rule.source.length).toBeGreaterThan(10)
    })
  }
})
