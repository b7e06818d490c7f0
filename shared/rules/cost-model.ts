/**
 * Cells, time steps, core-hours and memory of each approach for one case.
 *
 * External flow (a boundary layer on a body): DNS, wall-resolved and wall-modelled LES follow the
 * Reynolds-number scaling of Choi & Moin 2012 (Phys. Fluids 24, 011702): N ~ Re^(37/14),
 * Re^(13/7) and Re, from integrating the grid-point density along a flat plate whose skin friction
 * and thickness follow 1/7-power laws, times a wetted-area factor for the geometry.
 * Internal flow (duct or pipe): a fully developed pipe of DOMAIN_DIAMETERS diameters counted in
 * wall units from the Colebrook-White friction velocity.
 * Hybrid RANS-LES: a RANS mesh plus an LES focus region for the separated flow. RANS and URANS:
 * surface cells times the near-wall layers plus off-wall cells.
 *
 * All of this is an order-of-magnitude estimate; the constants below say where each comes from.
 */
import type { ApproachId, WallTreatment } from './approaches'
import { layersToThickness, yPlusTargetFor, type WallUnits } from './near-wall'

export type Regime = 'external' | 'internal'
export type Geometry = 'streamlined' | 'bluff' | 'duct' | 'rotating' | 'complex'
export type Separation = 'none' | 'mild' | 'massive'

/**
 * Wetted area relative to the reference wall: L^2 for external flow (2 = both faces of a surface
 * as wide as it is long), a straight pipe of DOMAIN_DIAMETERS diameters for internal flow. Our
 * assumptions (common practice, no source); a real geometry can differ by several times.
 */
export const GEOMETRY_AREA_FACTOR: Readonly<Record<Geometry, number>> = {
  streamlined: 2,
  bluff: 3,
  duct: 1,
  rotating: 4,
  complex: 6,
}

/** Internal domain length in hydraulic diameters: a periodic pipe or a development length of that order (common practice, no source). */
export const DOMAIN_DIAMETERS = 10

/** 1/7-power-law local skin friction Cf = 0.027 Re_x^-1/7 (White, Fluid Mechanics; from memory). Used only for the scaling integrals. */
export const POWER_LAW_SKIN_FRICTION = 0.027
/** 1/7-power-law boundary-layer thickness delta/x = 0.16 Re_x^-1/7 (White, Fluid Mechanics; from memory). Used only for the scaling integrals. */
export const POWER_LAW_THICKNESS = 0.16
/** Reynolds number where the turbulent layer starts, Re_x0 (transition near 5e5; Schlichting, common practice). */
export const TURBULENT_START_REYNOLDS = 5e5

/** DNS streamwise spacing, wall units (Kim, Moin & Moser 1987, JFM 177, 133 used about 12; Georgiadis et al. 2010: 10-15). */
export const DNS_STREAMWISE_SPACING_PLUS = 12
/** DNS spanwise spacing, wall units (Kim, Moin & Moser 1987: about 7; Georgiadis et al. 2010: about 5; we take 6). */
export const DNS_SPANWISE_SPACING_PLUS = 6
/** DNS mean wall-normal spacing over the layer, wall units (Kim, Moin & Moser 1987: 129 points over 2 x 180 wall units, about 2.8; we take 3). */
export const DNS_MEAN_WALL_NORMAL_SPACING_PLUS = 3
/** Wall-resolved LES streamwise spacing, wall units (finer end of 50-150, Georgiadis, Rizzetta & Fureby 2010, AIAA J. 48; from memory). */
export const WRLES_STREAMWISE_SPACING_PLUS = 50
/** Wall-resolved LES spanwise spacing, wall units (finer end of 15-40, same source; from memory). */
export const WRLES_SPANWISE_SPACING_PLUS = 15
/** Wall-resolved LES cells across the layer: from y+ below 1 growing about 10% a cell to delta+ of a few thousand (our arithmetic). */
export const WRLES_WALL_NORMAL_CELLS = 60
/** Wall-modelled LES cells per boundary-layer thickness in each direction (Larsson et al. 2016, Mech. Eng. Rev. 3: delta/15 to delta/30). */
export const WMLES_CELLS_PER_THICKNESS = 20

/** Convective CFL number of DNS and LES time steps (common practice, no source: explicit or semi-implicit schemes run near 0.5). */
export const RESOLVING_CFL = 0.5
/** Hybrid RANS-LES: focus-region cells per body length (external) (common practice, no source). */
export const HYBRID_FOCUS_CELLS_PER_LENGTH = 200
/** Hybrid RANS-LES: focus-region cells per hydraulic diameter (internal) (common practice, no source). */
export const HYBRID_FOCUS_CELLS_PER_DIAMETER = 40
/** Hybrid RANS-LES: CFL number in the focus region with implicit time stepping (common practice, no source). */
export const HYBRID_CFL = 1
/** Share of the reference volume (L^3, or the internal domain) that the hybrid method resolves as LES, by separation (our assumption, no source). */
export const HYBRID_FOCUS_VOLUME_FRACTION: Readonly<Record<Separation, number>> = { none: 0.05, mild: 0.25, massive: 1 }

/** Flow-through times to wash out the start and converge statistics, by separation: about 10 for attached layers, and some 8 shedding cycles of about 5 L/U (Strouhal number near 0.2) when massively separated (common practice, no source). */
export const FLOW_THROUGHS: Readonly<Record<Separation, number>> = { none: 10, mild: 20, massive: 40 }
/** Internal domains are averaged over twice as many flow-throughs, about 200 D/U when attached: duct statistics converge slowly (common practice, no source). */
export const INTERNAL_FLOW_THROUGH_FACTOR = 2
/** URANS time steps per convective time L/U (external) or D/U (internal): some 250 per shedding period (common practice, no source). */
export const URANS_STEPS_PER_CONVECTIVE_TIME = 50
/** URANS inner (dual-time) iterations per time step (common practice, no source). */
export const URANS_INNER_ITERATIONS = 5
/** Steady RANS iterations to converge forces, by separation (common practice, no source: 1e3-1e4). */
export const RANS_ITERATIONS: Readonly<Record<Separation, number>> = { none: 3000, mild: 5000, massive: 8000 }

/** External RANS surface spacing: cells per body length along each surface direction (common practice, no source). */
export const RANS_SURFACE_CELLS_PER_LENGTH = 250
/** Internal RANS surface spacing: cells per hydraulic diameter (common practice, no source). */
export const RANS_SURFACE_CELLS_PER_DIAMETER = 40
/** Cells away from the wall layers per surface cell: far field and wake (external) (common practice, no source). */
export const RANS_OFF_WALL_CELLS_EXTERNAL = 30
/** Cells away from the wall layers per surface cell: the duct core (internal): about the cross-section's cells over its perimeter's at 40 per diameter (our arithmetic). */
export const RANS_OFF_WALL_CELLS_INTERNAL = 10

/** Core-seconds per cell per time step of DNS and LES, pressure solve or Runge-Kutta stages included (from memory: 1e-5 to 5e-5 for finite-volume codes). */
export const RESOLVING_CORE_SECONDS_PER_CELL_STEP = 2e-5
/** Core-seconds per cell per implicit RANS iteration with a two-equation model (from memory: 1e-5 to 5e-5). */
export const RANS_CORE_SECONDS_PER_CELL_ITERATION = 3e-5
/** Memory per cell of explicit or segregated scale-resolving solvers, bytes (from memory: about 1 kB). */
export const RESOLVING_BYTES_PER_CELL = 1000
/** Memory per cell of implicit RANS, URANS and hybrid solvers with their matrices, bytes (from memory: 1-2 kB). */
export const IMPLICIT_BYTES_PER_CELL = 2000
/** No useful three-dimensional turbulence simulation has fewer cells; the resolving counts are floored here (common practice, no source). */
export const MIN_MESH_CELLS = 1e4
/** Below about this many cells per core, parallel efficiency usually drops (from memory). */
export const MIN_CELLS_PER_CORE = 1e4

/** Viscous length over x on the power-law plate: l/x = 1/(sqrt(Cf/2) Re_x^(13/14)); this is 1/sqrt(Cf/2). */
const VISCOUS_LENGTH_COEFFICIENT = 1 / Math.sqrt(POWER_LAW_SKIN_FRICTION / 2)
/**
 * Integrals over a plate of length L and span L (our derivation, the same form as Choi & Moin 2012):
 * DNS: N = int delta / (dx+ dy+ dz+ l^3) dx L = (14/23) (c_delta / c_l^3) Re^(37/14) / (dx+ dy+ dz+);
 * WRLES inner layer: N = int Ny / (dx+ dz+ l^2) dx L = (7/6) Ny Re^(13/7) / (c_l^2 dx+ dz+);
 * WMLES: N = int n^3 / delta^2 dx L from x0 = (7/5) (n^3 / c_delta^2) Re^(2/7) ((Re/Re_x0)^(5/7) - 1).
 */
const DNS_PLATE_COEFFICIENT =
  ((14 / 23) * POWER_LAW_THICKNESS) /
  VISCOUS_LENGTH_COEFFICIENT ** 3 /
  (DNS_STREAMWISE_SPACING_PLUS * DNS_MEAN_WALL_NORMAL_SPACING_PLUS * DNS_SPANWISE_SPACING_PLUS)
const WRLES_PLATE_COEFFICIENT =
  ((7 / 6) * WRLES_WALL_NORMAL_CELLS) /
  (VISCOUS_LENGTH_COEFFICIENT ** 2 * WRLES_STREAMWISE_SPACING_PLUS * WRLES_SPANWISE_SPACING_PLUS)
const WMLES_PLATE_COEFFICIENT = ((7 / 5) * WMLES_CELLS_PER_THICKNESS ** 3) / POWER_LAW_THICKNESS ** 2
/** Below twice Re_x0 the WMLES bracket is held at its value there, so the count keeps rising with Re. */
const WMLES_BRACKET_FLOOR = 2 ** (5 / 7) - 1

export const PLATE_SCALING = {
  dns: { coefficient: DNS_PLATE_COEFFICIENT, exponent: 37 / 14 },
  wrles: { coefficient: WRLES_PLATE_COEFFICIENT, exponent: 13 / 7 },
  wmles: { coefficient: WMLES_PLATE_COEFFICIENT, exponent: 1 },
} as const

/** One case as the cost model sees it. Treat it as immutable: results are cached per object. */
export interface CostCase {
  regime: Regime
  geometry: Geometry
  separation: Separation
  reynolds: number
  /** wall length (external) or hydraulic diameter (internal), m */
  length: number
  /** m/s */
  velocity: number
  /** wall units of the case's reference wall */
  wall: WallUnits
  growthRatio: number
}

export interface Budget {
  coreHours: number
  cores: number
  wallClockHours: number
}

export interface ApproachCost {
  cells: number
  timeSteps: number
  coreHours: number
  wallClockHours: number
  memoryGB: number
  feasible: boolean
  /** the larger of core-hours over budget and wall-clock over budget */
  budgetRatio: number
  /** RANS-family approaches: the near-wall layers counted */
  layers: number | null
}

interface Resolution {
  cells: number
  /** time steps per flow-through of the domain */
  stepsPerFlowThrough: number
}

/** Keeps a result finite: huge stays huge, never Infinity or NaN. */
export function bounded(value: number): number {
  if (Number.isNaN(value)) throw new Error('Cost model produced NaN; check the case input.')
  return Math.min(Math.max(value, 0), Number.MAX_VALUE)
}

/**
 * DNS, WRLES and WMLES on developing boundary layers: a plate of Reynolds number `re` whose span is
 * `spanRatio` times its length. Steps per flow-through come from the smallest cells, where the
 * turbulent layer starts: L / l(x0) = Re / (c_l Re_x0^(1/14)), L / delta(x0) = Re / (c_delta Re_x0^(6/7)).
 */
function plateLevels(re: number, spanRatio: number): Record<'dns' | 'wrles' | 'wmles', Resolution> {
  const start = Math.min(TURBULENT_START_REYNOLDS, re)
  const bracket = Math.max((re / TURBULENT_START_REYNOLDS) ** (5 / 7) - 1, WMLES_BRACKET_FLOOR)
  const wmlesCells = spanRatio * WMLES_PLATE_COEFFICIENT * re ** (2 / 7) * bracket
  const lengthOverViscous = re / (VISCOUS_LENGTH_COEFFICIENT * start ** (1 / 14))
  const lengthOverThickness = re / (POWER_LAW_THICKNESS * start ** (6 / 7))
  return {
    dns: {
      cells: spanRatio * DNS_PLATE_COEFFICIENT * re ** (37 / 14),
      stepsPerFlowThrough: lengthOverViscous / (RESOLVING_CFL * DNS_STREAMWISE_SPACING_PLUS),
    },
    wrles: {
      cells: spanRatio * WRLES_PLATE_COEFFICIENT * re ** (13 / 7) + wmlesCells,
      stepsPerFlowThrough: lengthOverViscous / (RESOLVING_CFL * WRLES_STREAMWISE_SPACING_PLUS),
    },
    wmles: {
      cells: wmlesCells,
      stepsPerFlowThrough: (lengthOverThickness * WMLES_CELLS_PER_THICKNESS) / RESOLVING_CFL,
    },
  }
}

/** DNS, WRLES and WMLES of a fully developed pipe of DOMAIN_DIAMETERS diameters, counted in wall units. */
function pipeLevels(flow: CostCase): Record<'dns' | 'wrles' | 'wmles', Resolution> {
  const diameterPlus = flow.length / flow.wall.viscousLength
  const domainPlus = DOMAIN_DIAMETERS * diameterPlus
  const coreCells = (Math.PI / 4) * DOMAIN_DIAMETERS * (2 * WMLES_CELLS_PER_THICKNESS) ** 3
  return {
    dns: {
      cells:
        ((Math.PI / 4) * diameterPlus * diameterPlus * domainPlus) /
        (DNS_STREAMWISE_SPACING_PLUS * DNS_MEAN_WALL_NORMAL_SPACING_PLUS * DNS_SPANWISE_SPACING_PLUS),
      stepsPerFlowThrough: domainPlus / (RESOLVING_CFL * DNS_STREAMWISE_SPACING_PLUS),
    },
    wrles: {
      cells:
        (Math.PI * diameterPlus * domainPlus * WRLES_WALL_NORMAL_CELLS) /
          (WRLES_STREAMWISE_SPACING_PLUS * WRLES_SPANWISE_SPACING_PLUS) +
        coreCells,
      stepsPerFlowThrough: domainPlus / (RESOLVING_CFL * WRLES_STREAMWISE_SPACING_PLUS),
    },
    wmles: {
      cells: coreCells,
      stepsPerFlowThrough: (DOMAIN_DIAMETERS * 2 * WMLES_CELLS_PER_THICKNESS) / RESOLVING_CFL,
    },
  }
}

/**
 * The resolution (cells and steps per flow-through) of DNS, WRLES and WMLES. External: the plate
 * scaling times the wetted-area factor. Internal: the walls carry layers developing from the
 * inlet (a plate 10 D long and pi D wide) and the duct must be resolved at least as finely as when
 * fully developed, so each count is the larger of the two. A coarser method never needs more cells
 * than a finer one; where it would, it is that finer one. Counts are floored at MIN_MESH_CELLS.
 */
/** The larger of the developing-layer count and the fully developed pipe count (times its area factor). */
function largerOf(developing: Resolution, developed: Resolution, area: number): Resolution {
  return {
    cells: Math.max(developing.cells, area * developed.cells),
    stepsPerFlowThrough: Math.max(developing.stepsPerFlowThrough, developed.stepsPerFlowThrough),
  }
}

function atLeastMinimumMesh(level: Resolution): Resolution {
  return { cells: Math.max(level.cells, MIN_MESH_CELLS), stepsPerFlowThrough: level.stepsPerFlowThrough }
}

const resolvingLevelsCache = new WeakMap<CostCase, Record<'dns' | 'wrles' | 'wmles', Resolution>>()

function resolvingLevels(flow: CostCase): Record<'dns' | 'wrles' | 'wmles', Resolution> {
  const cached = resolvingLevelsCache.get(flow)
  if (cached) return cached
  const levels = computeResolvingLevels(flow)
  resolvingLevelsCache.set(flow, levels)
  return levels
}

function computeResolvingLevels(flow: CostCase): Record<'dns' | 'wrles' | 'wmles', Resolution> {
  const area = GEOMETRY_AREA_FACTOR[flow.geometry]
  let levels: Record<'dns' | 'wrles' | 'wmles', Resolution>
  if (flow.regime === 'external') {
    levels = plateLevels(flow.reynolds, area)
  } else {
    const developing = plateLevels(DOMAIN_DIAMETERS * flow.reynolds, (area * Math.PI) / DOMAIN_DIAMETERS)
    const developed = pipeLevels(flow)
    levels = {
      dns: largerOf(developing.dns, developed.dns, area),
      wrles: largerOf(developing.wrles, developed.wrles, area),
      wmles: largerOf(developing.wmles, developed.wmles, area),
    }
  }
  const dns = atLeastMinimumMesh(levels.dns)
  let wrles = atLeastMinimumMesh(levels.wrles)
  let wmles = atLeastMinimumMesh(levels.wmles)
  if (wrles.cells > dns.cells) wrles = dns
  if (wmles.cells > wrles.cells) wmles = wrles
  return { dns, wrles, wmles }
}

/** Near-wall layers up to the boundary-layer edge for a wall treatment at its own y+ target. */
export function nearWallLayers(flow: CostCase, wallTreatment: WallTreatment): number {
  const firstCellHeight = 2 * yPlusTargetFor(wallTreatment, flow.wall.deltaPlus) * flow.wall.viscousLength
  return layersToThickness(firstCellHeight, flow.wall.boundaryLayerThickness, flow.growthRatio)
}

/** Surface cells and off-wall cells per surface cell of the RANS mesh. */
function ransSurface(flow: CostCase): { surfaceCells: number; offWallCells: number } {
  const area = GEOMETRY_AREA_FACTOR[flow.geometry]
  if (flow.regime === 'external') {
    return { surfaceCells: area * RANS_SURFACE_CELLS_PER_LENGTH ** 2, offWallCells: RANS_OFF_WALL_CELLS_EXTERNAL }
  }
  return {
    surfaceCells: area * Math.PI * DOMAIN_DIAMETERS * RANS_SURFACE_CELLS_PER_DIAMETER ** 2,
    offWallCells: RANS_OFF_WALL_CELLS_INTERNAL,
  }
}

/** Cells of the hybrid method's LES focus region. */
function hybridFocusCells(flow: CostCase): number {
  const share = GEOMETRY_AREA_FACTOR[flow.geometry] * HYBRID_FOCUS_VOLUME_FRACTION[flow.separation]
  if (flow.regime === 'external') return share * HYBRID_FOCUS_CELLS_PER_LENGTH ** 3
  return share * (Math.PI / 4) * DOMAIN_DIAMETERS * HYBRID_FOCUS_CELLS_PER_DIAMETER ** 3
}

/** Convective times L/U (external) or D/U (internal) in one flow-through of the domain. */
function convectiveTimesPerFlowThrough(regime: Regime): number {
  return regime === 'external' ? 1 : DOMAIN_DIAMETERS
}

/** Cells and time steps (iterations for steady RANS) of one approach. */
export function approachResolution(
  approach: ApproachId,
  flow: CostCase,
  wallTreatment: WallTreatment,
): { cells: number; timeSteps: number; layers: number | null } {
  const flowThroughs = FLOW_THROUGHS[flow.separation] * (flow.regime === 'internal' ? INTERNAL_FLOW_THROUGH_FACTOR : 1)
  if (approach === 'dns' || approach === 'wrles' || approach === 'wmles') {
    const level = resolvingLevels(flow)[approach]
    return { cells: level.cells, timeSteps: Math.max(1, Math.ceil(flowThroughs * level.stepsPerFlowThrough)), layers: null }
  }
  const layers = nearWallLayers(flow, wallTreatment)
  const { surfaceCells, offWallCells } = ransSurface(flow)
  const ransCells = surfaceCells * (layers + offWallCells)
  if (approach === 'rans') return { cells: ransCells, timeSteps: RANS_ITERATIONS[flow.separation], layers }
  if (approach === 'urans') {
    const steps = flowThroughs * convectiveTimesPerFlowThrough(flow.regime) * URANS_STEPS_PER_CONVECTIVE_TIME
    return { cells: ransCells, timeSteps: steps, layers }
  }
  const focusCellsPerFlowThrough =
    flow.regime === 'external'
      ? HYBRID_FOCUS_CELLS_PER_LENGTH
      : DOMAIN_DIAMETERS * HYBRID_FOCUS_CELLS_PER_DIAMETER
  return {
    cells: ransCells + hybridFocusCells(flow),
    timeSteps: Math.ceil((flowThroughs * focusCellsPerFlowThrough) / HYBRID_CFL),
    layers,
  }
}

/** Core-seconds per cell per time step (per iteration for steady RANS). */
export function coreSecondsPerCellStep(approach: ApproachId): number {
  if (approach === 'rans') return RANS_CORE_SECONDS_PER_CELL_ITERATION
  if (approach === 'urans' || approach === 'hybrid') return RANS_CORE_SECONDS_PER_CELL_ITERATION * URANS_INNER_ITERATIONS
  return RESOLVING_CORE_SECONDS_PER_CELL_STEP
}

export function bytesPerCell(approach: ApproachId): number {
  return approach === 'dns' || approach === 'wrles' || approach === 'wmles' ? RESOLVING_BYTES_PER_CELL : IMPLICIT_BYTES_PER_CELL
}

/** Full cost of one approach against the budget. */
export function approachCost(approach: ApproachId, flow: CostCase, wallTreatment: WallTreatment, budget: Budget): ApproachCost {
  const { cells, timeSteps, layers } = approachResolution(approach, flow, wallTreatment)
  const coreHours = bounded((cells * timeSteps * coreSecondsPerCellStep(approach)) / 3600)
  const wallClockHours = bounded(coreHours / budget.cores)
  const budgetRatio = bounded(Math.max(coreHours / budget.coreHours, wallClockHours / budget.wallClockHours))
  return {
    cells: bounded(cells),
    timeSteps: bounded(timeSteps),
    coreHours,
    wallClockHours,
    memoryGB: bounded((cells * bytesPerCell(approach)) / 1e9),
    feasible: coreHours <= budget.coreHours && wallClockHours <= budget.wallClockHours,
    budgetRatio,
    layers,
  }
}
