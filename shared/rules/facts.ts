/**
 * The facts the rules see. json-logic reads them with {"var": "path"}; every path a rule may use is
 * listed in FACT_PATHS, and the ruleset schema rejects any other (a misspelt var would otherwise
 * read as null and silently never fire).
 *
 * Physics facts (both stages):
 * - regime: "external" | "internal"; geometry: "streamlined" | "bluff" | "duct" | "rotating" | "complex";
 *   separation: "none" | "mild" | "massive"
 * - reynolds: Re = rho U L / mu; logReynolds: log10 Re; reynoldsTurbulent: intensity x Re
 * - mach: U / a for air, null for water and custom fluids; machRegime: "incompressible" |
 *   "subsonic-compressible" | "transonic" | "supersonic" | "hypersonic"
 * - flowState, boundaryLayerState: "laminar" | "transitional" | "turbulent";
 *   wakeState: "none" | "steady" | "periodic-laminar" | "three-dimensional" | "turbulent"
 * - deltaPlus: boundary-layer thickness in wall units (Re_tau inside a duct)
 * - roughnessPlus: k_s+ (0 when smooth); roughnessRegime: "smooth" | "transitional" | "fully-rough";
 *   relativeRoughness: k_s / L
 * - application: "general" | "atmospheric" | "indoor" | "marine" | "turbomachinery" | "swirl" | "jet";
 *   swirl: "none" | "weak" | "strong"
 * - dimensions: "3d" | "2d" | "axisymmetric" | "span-periodic"; crossSection: "pipe" | "channel" | "duct" | "none"
 * - physics.transition | heatTransfer | rotation | buoyancy | acoustics: booleans
 * - quantities: the wanted quantities; test with {"in": ["noise", {"var": "quantities"}]}
 * Cost facts (scoring stage only; costs are counted with the treatments the first stage chose):
 * - budget.coreHours | cores | wallClockHours
 * - coreHours.<approach>, cells.<approach>
 * - budgetRatio.<approach>: max(core-hours / budget, wall-clock / budget); above 1 is over budget
 * - budgetLog.<approach>: log10 of budgetRatio, for smooth score changes
 * - feasible.<approach>: within both budgets
 */
import { APPROACH_IDS, type ApproachId } from './approaches'
import type { Application, CaseInput, Quantity } from './case-input'
import type { ApproachCost } from './cost-model'
import type { FlowPhysics } from './flow-physics'

export interface PhysicsFacts {
  regime: CaseInput['regime']
  geometry: CaseInput['geometry']
  separation: CaseInput['separation']
  reynolds: number
  logReynolds: number
  reynoldsTurbulent: number
  mach: number | null
  machRegime: FlowPhysics['regime']['mach']
  flowState: FlowPhysics['regime']['state']
  boundaryLayerState: FlowPhysics['regime']['boundaryLayer']
  wakeState: FlowPhysics['regime']['wake']
  deltaPlus: number
  roughnessPlus: number
  roughnessRegime: 'smooth' | 'transitional' | 'fully-rough'
  relativeRoughness: number
  application: Application
  swirl: FlowPhysics['application']['swirl']
  dimensions: FlowPhysics['domain']['dimensions']
  crossSection: 'pipe' | 'channel' | 'duct' | 'none'
  physics: CaseInput['physics']
  quantities: Quantity[]
}

export interface Facts extends PhysicsFacts {
  budget: CaseInput['budget']
  coreHours: Record<ApproachId, number>
  cells: Record<ApproachId, number>
  budgetRatio: Record<ApproachId, number>
  budgetLog: Record<ApproachId, number>
  feasible: Record<ApproachId, boolean>
}

const PER_APPROACH = ['coreHours', 'cells', 'budgetRatio', 'budgetLog', 'feasible'] as const

export const PHYSICS_FACT_PATHS: ReadonlySet<string> = new Set([
  'regime', 'geometry', 'separation', 'reynolds', 'logReynolds', 'reynoldsTurbulent', 'mach', 'machRegime',
  'flowState', 'boundaryLayerState', 'wakeState', 'deltaPlus', 'roughnessPlus', 'roughnessRegime', 'relativeRoughness',
  'application', 'swirl', 'dimensions', 'crossSection',
  'physics.transition', 'physics.heatTransfer', 'physics.rotation', 'physics.buoyancy', 'physics.acoustics',
  'quantities',
])

export const COST_FACT_PATHS: ReadonlySet<string> = new Set([
  'budget.coreHours', 'budget.cores', 'budget.wallClockHours',
  ...PER_APPROACH.flatMap((group) => APPROACH_IDS.map((id) => `${group}.${id}`)),
])

export const FACT_PATHS: ReadonlySet<string> = new Set([...PHYSICS_FACT_PATHS, ...COST_FACT_PATHS])

export function buildPhysicsFacts(input: CaseInput, physics: FlowPhysics): PhysicsFacts {
  const { regime } = physics
  return {
    regime: input.regime,
    geometry: input.geometry,
    separation: input.separation,
    reynolds: physics.reynolds,
    logReynolds: Math.log10(physics.reynolds),
    reynoldsTurbulent: physics.reynoldsTurbulent,
    mach: physics.mach,
    machRegime: regime.mach,
    flowState: regime.state,
    boundaryLayerState: regime.boundaryLayer,
    wakeState: regime.wake,
    deltaPlus: physics.wall.deltaPlus,
    roughnessPlus: physics.roughness?.roughnessPlus ?? 0,
    roughnessRegime: physics.roughness?.regime ?? 'smooth',
    relativeRoughness: physics.relativeRoughness,
    application: physics.application.application,
    swirl: physics.application.swirl,
    dimensions: physics.domain.dimensions,
    crossSection: physics.domain.crossSection ?? 'none',
    physics: input.physics,
    quantities: input.quantities,
  }
}

/** The physics facts with the costs added, for the scoring stage. */
export function withCostFacts(facts: PhysicsFacts, budget: CaseInput['budget'], costs: Record<ApproachId, ApproachCost>): Facts {
  const coreHours = {} as Record<ApproachId, number>
  const cells = {} as Record<ApproachId, number>
  const budgetRatio = {} as Record<ApproachId, number>
  const budgetLog = {} as Record<ApproachId, number>
  const feasible = {} as Record<ApproachId, boolean>
  for (const id of APPROACH_IDS) {
    const cost = costs[id]
    coreHours[id] = cost.coreHours
    cells[id] = cost.cells
    budgetRatio[id] = cost.budgetRatio
    budgetLog[id] = Math.log10(Math.max(cost.budgetRatio, 1e-300))
    feasible[id] = cost.feasible
  }
  return {
    regime: facts.regime,
    geometry: facts.geometry,
    separation: facts.separation,
    reynolds: facts.reynolds,
    logReynolds: facts.logReynolds,
    reynoldsTurbulent: facts.reynoldsTurbulent,
    mach: facts.mach,
    machRegime: facts.machRegime,
    flowState: facts.flowState,
    boundaryLayerState: facts.boundaryLayerState,
    wakeState: facts.wakeState,
    deltaPlus: facts.deltaPlus,
    roughnessPlus: facts.roughnessPlus,
    roughnessRegime: facts.roughnessRegime,
    relativeRoughness: facts.relativeRoughness,
    application: facts.application,
    swirl: facts.swirl,
    dimensions: facts.dimensions,
    crossSection: facts.crossSection,
    physics: facts.physics,
    quantities: facts.quantities,
    budget,
    coreHours,
    cells,
    budgetRatio,
    budgetLog,
    feasible,
  }
}
