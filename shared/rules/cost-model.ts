/**
 * Cells, time steps, core-hours, wall-clock time and memory of each approach for one case, each
 * with an uncertainty range, against the budget. The meshes come from mesh-resolving.ts and
 * mesh-modelled.ts, the steps from time-model.ts. All of this is an estimate for planning; the
 * constants say where each comes from.
 */
import { RESOLVING_APPROACHES, type ApproachId, type WallTreatment } from './approaches'
import type { CostCase } from './cost-case'
import { modelledMesh } from './mesh-modelled'
import { resolvingMeshes } from './mesh-resolving'
import { yPlusTargetFor } from './near-wall'
import {
  HYBRID_INNER_ITERATIONS,
  IMPLICIT_RESOLVING_CFL,
  RANS_ITERATIONS,
  RESOLVING_CFL,
  STEADY_LAMINAR_ITERATIONS,
  URANS_CFL,
  URANS_INNER_ITERATIONS,
  acousticFactor,
  periodicTime,
  resolvingTime,
  steadyPlan,
  unsteadyPlan,
  type TimePlan,
} from './time-model'

/** Core-seconds per cell per step of DNS, LES and laminar solutions, pressure solve or Runge-Kutta stages included (from memory: 1e-5 to 5e-5 for finite-volume codes). */
export const RESOLVING_CORE_SECONDS_PER_CELL_STEP = 2e-5
/** Core-seconds per cell per implicit iteration with a two-equation model (from memory: 1e-5 to 5e-5). */
export const RANS_CORE_SECONDS_PER_CELL_ITERATION = 3e-5
/** Memory per cell of explicit or segregated solvers, bytes (from memory: about 1 kB). */
export const RESOLVING_BYTES_PER_CELL = 1000
/** Memory per cell of implicit RANS, URANS and hybrid solvers with their matrices, bytes (from memory: 1-2 kB). */
export const IMPLICIT_BYTES_PER_CELL = 2000
/** Below about this many cells per core, parallel efficiency usually drops (from memory). */
export const MIN_CELLS_PER_CORE = 1e4

/**
 * Uncertainty of each estimate as a factor either way (our judgement, no source): cells of
 * scale-resolving and hybrid meshes x3 (wetted area and separated volume are assumed), of RANS and
 * laminar meshes x2; steps x2 (CFL and the averaging a study needs); core-seconds per cell-step
 * x2.5 (1e-5 to 5e-5 across codes and hardware); memory x2. Core-hours and wall-clock combine them
 * as independent factors: exp(sqrt(sum of ln^2)).
 */
export const UNCERTAINTY = {
  resolvingCells: 3,
  modelledCells: 2,
  steps: 2,
  rate: 2.5,
  memory: 2,
} as const

export interface Budget {
  coreHours: number
  cores: number
  wallClockHours: number
}

export interface Range {
  low: number
  high: number
}

export interface ApproachCost extends TimePlan {
  cells: number
  /** physical steps (iterations for steady solutions), inner iterations not included */
  timeSteps: number
  coreHours: number
  wallClockHours: number
  memoryGB: number
  feasible: boolean
  /** the larger of core-hours over budget and wall-clock over budget */
  budgetRatio: number
  /** modelled approaches: the near-wall layers counted */
  layers: number | null
  /** the y+ of the first cell centre the mesh was counted with */
  yPlusTarget: number
  /** the finest streamwise cell, m */
  finestCell: number
  /** solved one cell deep (2-D or axisymmetric) */
  twoDimensional: boolean
  /** the factor either way of each estimate */
  uncertainty: { cells: number; timeSteps: number; coreHours: number; memoryGB: number }
  ranges: { cells: Range; timeSteps: Range; coreHours: Range; wallClockHours: Range; memoryGB: Range }
}

/** Keeps a result finite: huge stays huge, never Infinity or NaN. */
export function bounded(value: number): number {
  if (Number.isNaN(value)) throw new Error('Cost model produced NaN; check the case input.')
  return Math.min(Math.max(value, 0), Number.MAX_VALUE)
}

interface Plan {
  cells: number
  layers: number | null
  yPlusTarget: number
  finestCell: number
  twoDimensional: boolean
  time: TimePlan
  /** iterations paid at the RANS rate before the unsteady run (URANS starts from a converged RANS) */
  startIterations: number
}

// Plans are built field by field: object spreads are slow in this hot path.
function planOf(cells: number, layers: number | null, yPlusTarget: number, finestCell: number, twoDimensional: boolean, time: TimePlan, startIterations: number): Plan {
  return { cells, layers, yPlusTarget, finestCell, twoDimensional, time, startIterations }
}

function resolvingPlan(approach: 'dns' | 'wrles' | 'wmles', flow: CostCase, yPlusTarget: number): Plan {
  const mesh = resolvingMeshes(flow)[approach]
  const time = unsteadyPlan(flow, resolvingTime(flow), RESOLVING_CFL, mesh.finestCell, acousticFactor(approach, flow), 1)
  return planOf(mesh.cells, null, yPlusTarget, mesh.finestCell, false, time, 0)
}

function laminarSteady(flow: CostCase): boolean {
  return flow.wake === 'steady' || (flow.wake === 'none' && flow.flowState === 'laminar')
}

function modelledTime(approach: ApproachId, flow: CostCase, finestCell: number): TimePlan {
  if (approach === 'rans') return steadyPlan(RANS_ITERATIONS[flow.separation])
  if (approach === 'urans') return unsteadyPlan(flow, periodicTime(flow), URANS_CFL, finestCell, 1, URANS_INNER_ITERATIONS)
  if (approach === 'hybrid') return unsteadyPlan(flow, resolvingTime(flow), IMPLICIT_RESOLVING_CFL, finestCell, 1, HYBRID_INNER_ITERATIONS)
  if (laminarSteady(flow)) return steadyPlan(STEADY_LAMINAR_ITERATIONS)
  return unsteadyPlan(flow, periodicTime(flow), IMPLICIT_RESOLVING_CFL, finestCell, 1, 1)
}

function modelledPlan(approach: ApproachId, flow: CostCase, wallTreatment: WallTreatment, yPlusTarget?: number): Plan {
  const mesh = modelledMesh(approach, flow, wallTreatment, yPlusTarget)
  const start = approach === 'urans' ? RANS_ITERATIONS[flow.separation] : 0
  return planOf(mesh.cells, mesh.layers, mesh.yPlusTarget, mesh.finestCell, mesh.planar, modelledTime(approach, flow, mesh.finestCell), start)
}

/** Core-seconds per cell per physical step (per iteration for steady solutions), inner iterations included. */
export function coreSecondsPerCellStep(approach: ApproachId, innerIterations: number): number {
  if (RESOLVING_APPROACHES.has(approach) || approach === 'laminar') return RESOLVING_CORE_SECONDS_PER_CELL_STEP * innerIterations
  return RANS_CORE_SECONDS_PER_CELL_ITERATION * innerIterations
}

export function bytesPerCell(approach: ApproachId): number {
  return RESOLVING_APPROACHES.has(approach) || approach === 'laminar' ? RESOLVING_BYTES_PER_CELL : IMPLICIT_BYTES_PER_CELL
}

/** The plan (mesh and time) of one approach; `yPlusTarget` overrides the treatment's own for modelled approaches. */
export function approachPlan(approach: ApproachId, flow: CostCase, wallTreatment: WallTreatment, yPlusTarget?: number): Plan {
  if (approach === 'dns' || approach === 'wrles' || approach === 'wmles') {
    const target = yPlusTarget ?? resolvingYPlus(approach, flow)
    return resolvingPlan(approach, flow, target)
  }
  return modelledPlan(approach, flow, wallTreatment, yPlusTarget)
}

function resolvingYPlus(approach: 'dns' | 'wrles' | 'wmles', flow: CostCase): number {
  return yPlusTargetFor(approach === 'wmles' ? 'wall-model' : 'resolved', flow.wall.deltaPlus, approach)
}

function band(value: number, factor: number): Range {
  return { low: bounded(value / factor), high: bounded(value * factor) }
}

/** Independent factors combined: exp(sqrt(sum of ln^2)). */
export function combinedFactor(factors: readonly number[]): number {
  let sum = 0
  for (const factor of factors) sum += Math.log(factor) ** 2
  return Math.exp(Math.sqrt(sum))
}

/** Core-hour factors of resolving (and hybrid) and of modelled approaches, computed once. */
const HOURS_FACTOR_RESOLVING = combinedFactor([UNCERTAINTY.resolvingCells, UNCERTAINTY.steps, UNCERTAINTY.rate])
const HOURS_FACTOR_MODELLED = combinedFactor([UNCERTAINTY.modelledCells, UNCERTAINTY.steps, UNCERTAINTY.rate])

/** Full cost of one approach against the budget. */
export function approachCost(approach: ApproachId, flow: CostCase, wallTreatment: WallTreatment, budget: Budget, yPlusTarget?: number): ApproachCost {
  const plan = approachPlan(approach, flow, wallTreatment, yPlusTarget)
  const { time } = plan
  const rate = coreSecondsPerCellStep(approach, time.innerIterations)
  const coreSeconds = plan.cells * (time.steps * rate + plan.startIterations * RANS_CORE_SECONDS_PER_CELL_ITERATION)
  const coreHours = bounded(coreSeconds / 3600)
  const wallClockHours = bounded(coreHours / budget.cores)
  const resolving = RESOLVING_APPROACHES.has(approach) || approach === 'hybrid'
  const cellFactor = resolving ? UNCERTAINTY.resolvingCells : UNCERTAINTY.modelledCells
  const hoursFactor = resolving ? HOURS_FACTOR_RESOLVING : HOURS_FACTOR_MODELLED
  const memoryGB = bounded((plan.cells * bytesPerCell(approach)) / 1e9)
  return {
    timeStep: time.timeStep,
    simulatedTime: time.simulatedTime,
    flowThroughs: time.flowThroughs,
    periods: time.periods,
    steps: time.steps,
    innerIterations: time.innerIterations,
    cfl: time.cfl,
    acousticFactor: time.acousticFactor,
    cells: bounded(plan.cells),
    timeSteps: bounded(time.steps),
    coreHours,
    wallClockHours,
    memoryGB,
    feasible: coreHours <= budget.coreHours && wallClockHours <= budget.wallClockHours,
    budgetRatio: bounded(Math.max(coreHours / budget.coreHours, wallClockHours / budget.wallClockHours)),
    layers: plan.layers,
    yPlusTarget: plan.yPlusTarget,
    finestCell: plan.finestCell,
    twoDimensional: plan.twoDimensional,
    uncertainty: { cells: cellFactor, timeSteps: UNCERTAINTY.steps, coreHours: hoursFactor, memoryGB: UNCERTAINTY.memory },
    ranges: {
      cells: band(plan.cells, cellFactor),
      timeSteps: band(time.steps, UNCERTAINTY.steps),
      coreHours: band(coreHours, hoursFactor),
      wallClockHours: band(wallClockHours, hoursFactor),
      memoryGB: band(memoryGB, UNCERTAINTY.memory),
    },
  }
}
