/**
 * The shape of an advice, as the browser shows it, the server stores it and the PDF prints it.
 * Fields of engine 1.0 keep their meaning; engine 2.0 added the regime, time step and simulated
 * time, ranges of every estimate, roughness and the budget explanation.
 */
import type { ApproachId, WallTreatment } from './approaches'
import type { Application } from './case-input'
import type { Range } from './cost-model'
import type { Dimensions } from './domain'
import type { RegimeBasis, FlowState, MachRegime, WakeState } from './regime'
import type { RoughnessRegime } from './roughness'
import type { Rule } from './ruleset-schema'
import type { AppliedEffects } from './evaluate-rules'

export type { Range }

export interface WallFigures {
  wallTreatment: WallTreatment
  skinFriction: number
  /** Pa */
  wallShearStress: number
  /** m/s */
  frictionVelocity: number
  yPlusTarget: number
  /** wall distance of the first cell centre at the target y+, m */
  firstCellCentre: number
  /** 2 x firstCellCentre for a cell-centred mesh, m */
  firstCellHeight: number
  /** m */
  boundaryLayerThickness: number
  /** boundary-layer thickness in wall units */
  deltaPlus: number
  growthRatio: number
  /** cells from the wall to the boundary-layer edge at the growth ratio */
  layers: number
  /** wall-modelled LES: height where the wall model takes its input (0.1 delta), m; otherwise null */
  exchangeHeight: number | null
  /** k_s+ of a rough wall, null when smooth */
  roughnessPlus: number | null
  /** air: Eckert's reference temperature the wall figures were evaluated at, K; otherwise null */
  referenceTemperatureK: number | null
}

export interface ApproachAdvice {
  id: ApproachId
  label: string
  score: number
  cells: number
  /** physical time steps (iterations for steady RANS and steady laminar solutions) */
  timeSteps: number
  coreHours: number
  wallClockHours: number
  memoryGB: number
  feasible: boolean
  /** the model this approach would use for this case */
  model: string
  /** the wall treatment its cost was counted with */
  wallTreatment: WallTreatment
  reasons: string[]
  /** the y+ of the first cell centre its mesh was counted with */
  yPlusTarget: number
  /** physical time step, s; null for steady solutions */
  timeStep: number | null
  /** simulated physical time, s; null for steady solutions */
  simulatedTime: number | null
  /** flow-throughs of the domain in the simulated time */
  flowThroughs: number | null
  /** shedding periods (or periods of the lowest frequency of interest) in the simulated time */
  periods: number | null
  /** inner iterations per physical step */
  innerIterations: number
  /** the larger of core-hours and wall-clock over their budgets */
  budgetRatio: number
  /** solved one cell deep (2-D or axisymmetric) */
  twoDimensional: boolean
  /** the factor either way of each estimate */
  uncertainty: { cells: number; timeSteps: number; coreHours: number; memoryGB: number }
  ranges: { cells: Range; timeSteps: Range; coreHours: Range; wallClockHours: Range; memoryGB: Range }
}

export interface TraceEntry {
  rule: string
  title: string
  stage: Rule['stage']
  fired: boolean
  effects: AppliedEffects
  why: string
  source: string
}

export interface RegimeAdvice {
  /** laminar, transitional or turbulent, judged on `basis` */
  state: FlowState
  boundaryLayer: FlowState
  wake: WakeState
  basis: RegimeBasis
  mach: MachRegime
  /** shedding Strouhal number used for the shedding period, or null */
  strouhal: number | null
  thresholds: { laminarBelow: number; turbulentAbove: number }
  application: Application
  /** true when the application came from the input, false when inferred */
  applicationGiven: boolean
  swirl: 'none' | 'weak' | 'strong'
  /** one sentence for the advice view */
  summary: string
}

export interface RoughnessAdvice {
  /** equivalent sand-grain height, m */
  sandGrainHeight: number
  /** the aerodynamic roughness length it came from, m, or null */
  roughnessLength: number | null
  roughnessPlus: number
  regime: RoughnessRegime
  /** log-law shift Delta B, wall units */
  logLawShift: number
}

export interface BudgetAdvice {
  /** fits: the best-scored approach fits; fallback: it does not and a lesser one does; none-fits: nothing fits */
  status: 'fits' | 'fallback' | 'none-fits'
  /** the best-scored approach, the one the physics asks for */
  adequate: ApproachId
  /** the approach recommended within the budget when the adequate one does not fit, or the cheapest when none does */
  fallback: ApproachId | null
  /** what the fallback gives up against the adequate approach */
  sacrifices: string[]
  summary: string
}

export interface DomainAdvice {
  dimensions: Dimensions
  crossSection: 'pipe' | 'channel' | 'duct' | null
  /** m */
  length: number
  /** span of the 3-D or span-periodic domain, m */
  span: number
  /** m2 */
  wettedArea: number
}

export interface Advice {
  reynolds: number
  /** large-eddy Reynolds number: turbulence intensity x Re */
  reynoldsTurbulent: number
  mach: number | null
  kolmogorovLength: number
  kolmogorovCells: number
  fluid: { density: number; viscosity: number; kinematicViscosity: number }
  approaches: ApproachAdvice[]
  recommendation: { approach: ApproachId; model: string; wallTreatment: WallTreatment; yPlusTarget: number }
  wall: WallFigures
  cautions: string[]
  trace: TraceEntry[]
  ruleset: { id: string; version: string }
  engineVersion: string
  regime: RegimeAdvice
  roughness: RoughnessAdvice | null
  budget: BudgetAdvice
  domain: DomainAdvice
}
