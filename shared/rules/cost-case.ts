/**
 * One case as the cost model sees it: the flow's scales, the domain and what the run must deliver.
 * Built once per case (and per velocity in a Reynolds-number sweep); treat it as immutable, the
 * mesh estimates are cached per object.
 */
import type { CaseInput, Quantity } from './case-input'
import type { Domain, Geometry } from './domain'
import type { FlowPhysics } from './flow-physics'
import type { WallUnits } from './near-wall'
import type { FlowState, WakeState } from './regime'

export type Separation = CaseInput['separation']

export interface CostCase {
  /** the scale-resolving meshes, filled in on first use (mesh-resolving.ts) */
  resolvingMeshes?: Record<'dns' | 'wrles' | 'wmles', { cells: number; finestCell: number }>
  regime: CaseInput['regime']
  geometry: Geometry
  separation: Separation
  quantities: readonly Quantity[]
  reynolds: number
  /** reference length: wall length or body size (external), hydraulic diameter (internal), m */
  length: number
  /** m/s */
  velocity: number
  mach: number | null
  /** wall units of the case's reference wall */
  wall: WallUnits
  growthRatio: number
  domain: Domain
  flowState: FlowState
  boundaryLayerState: FlowState
  wake: WakeState
  /** shedding Strouhal number, or null */
  strouhal: number | null
  /** start of the turbulent boundary layer as a fraction of L (external) */
  turbulentStart: number
  /** boundary-layer thickness where the flow separates, m */
  separationThickness: number
  /** k_s+ of the walls (0 when smooth) */
  roughnessPlus: number
  /** separation fixed by sharp edges (complex bodies, buildings): LES need not resolve the thin layer that separates */
  sharpEdged: boolean
  lowestFrequencyHz: number | null
  timeIntegration: 'explicit' | 'implicit' | null
}

export function costCaseFor(input: CaseInput, physics: FlowPhysics): CostCase {
  return {
    regime: input.regime,
    geometry: input.geometry,
    separation: input.separation,
    quantities: input.quantities,
    reynolds: physics.reynolds,
    length: input.length,
    velocity: physics.velocity,
    mach: physics.mach,
    wall: physics.wall,
    growthRatio: input.growthRatio,
    domain: physics.domain,
    flowState: physics.regime.state,
    boundaryLayerState: physics.regime.boundaryLayer,
    wake: physics.regime.wake,
    strouhal: physics.regime.strouhal,
    turbulentStart: physics.turbulentStart,
    separationThickness: physics.separationThickness,
    roughnessPlus: physics.roughness?.roughnessPlus ?? 0,
    sharpEdged: input.geometry === 'complex' || physics.application.application === 'atmospheric',
    lowestFrequencyHz: input.lowestFrequencyHz ?? null,
    timeIntegration: input.timeIntegration ?? null,
    resolvingMeshes: undefined,
  }
}
