/**
 * The facts the rules see. json-logic reads them with {"var": "path"}; every path a rule may use is
 * listed in FACT_PATHS, and the ruleset schema rejects any other (a misspelt var would otherwise
 * read as null and silently never fire).
 *
 * Fields:
 * - regime: "external" | "internal"; geometry: "streamlined" | "bluff" | "duct" | "rotating" | "complex";
 *   separation: "none" | "mild" | "massive"
 * - reynolds: Re = rho U L / mu; logReynolds: log10 Re; reynoldsTurbulent: intensity x Re
 * - mach: U / a for air, null for water and custom fluids
 * - deltaPlus: boundary-layer thickness in wall units (Re_tau for a pipe)
 * - relativeRoughness: k/D (internal), 0 when smooth
 * - physics.transition | heatTransfer | rotation | buoyancy | acoustics: booleans
 * - quantities: array of the wanted quantities; test with {"in": ["noise", {"var": "quantities"}]}
 * - budget.coreHours | cores | wallClockHours
 * - coreHours.<approach>, cells.<approach>: the estimates per approach
 * - budgetRatio.<approach>: max(core-hours / budget, wall-clock / budget); above 1 is over budget
 * - feasible.<approach>: within both budgets
 * Treatment-stage rules see costs with each approach's default wall treatment; scoring rules see
 * costs with the treatments the treatment stage chose.
 */
import { APPROACH_IDS, type ApproachId } from './approaches'
import type { CaseInput, Quantity } from './case-input'
import type { ApproachCost } from './cost-model'
import type { FlowPhysics } from './flow-physics'

export interface Facts {
  regime: CaseInput['regime']
  geometry: CaseInput['geometry']
  separation: CaseInput['separation']
  reynolds: number
  logReynolds: number
  reynoldsTurbulent: number
  mach: number | null
  deltaPlus: number
  relativeRoughness: number
  physics: CaseInput['physics']
  quantities: Quantity[]
  budget: CaseInput['budget']
  coreHours: Record<ApproachId, number>
  cells: Record<ApproachId, number>
  budgetRatio: Record<ApproachId, number>
  feasible: Record<ApproachId, boolean>
}

const PER_APPROACH = ['coreHours', 'cells', 'budgetRatio', 'feasible'] as const

export const FACT_PATHS: ReadonlySet<string> = new Set([
  'regime',
  'geometry',
  'separation',
  'reynolds',
  'logReynolds',
  'reynoldsTurbulent',
  'mach',
  'deltaPlus',
  'relativeRoughness',
  'physics.transition',
  'physics.heatTransfer',
  'physics.rotation',
  'physics.buoyancy',
  'physics.acoustics',
  'quantities',
  'budget.coreHours',
  'budget.cores',
  'budget.wallClockHours',
  ...PER_APPROACH.flatMap((group) => APPROACH_IDS.map((id) => `${group}.${id}`)),
])

export function buildFacts(input: CaseInput, physics: FlowPhysics, costs: Record<ApproachId, ApproachCost>): Facts {
  const coreHours = {} as Record<ApproachId, number>
  const cells = {} as Record<ApproachId, number>
  const budgetRatio = {} as Record<ApproachId, number>
  const feasible = {} as Record<ApproachId, boolean>
  for (const id of APPROACH_IDS) {
    coreHours[id] = costs[id].coreHours
    cells[id] = costs[id].cells
    budgetRatio[id] = costs[id].budgetRatio
    feasible[id] = costs[id].feasible
  }
  return {
    regime: input.regime,
    geometry: input.geometry,
    separation: input.separation,
    reynolds: physics.reynolds,
    logReynolds: Math.log10(physics.reynolds),
    reynoldsTurbulent: physics.reynoldsTurbulent,
    mach: physics.mach,
    deltaPlus: physics.wall.deltaPlus,
    relativeRoughness: physics.relativeRoughness,
    physics: input.physics,
    quantities: input.quantities,
    budget: input.budget,
    coreHours,
    cells,
    budgetRatio,
    feasible,
  }
}
