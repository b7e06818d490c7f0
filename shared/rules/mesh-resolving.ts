/**
 * Meshes of the scale-resolving approaches (DNS, wall-resolved and wall-modelled LES): the wall
 * layers, counted by integrating the local grid-point density along the reference wall (as
 * Choi & Moin 2012, Phys. Fluids 24, 011702, did for a flat plate) or, inside a duct, in wall
 * units of the developed flow; plus the separated region, wake and free shear layers, counted by
 * geometry class and kind of separation. The finest streamwise cell of each mesh sets its time step.
 */
import type { CostCase, Separation } from './cost-case'
import type { Geometry } from './domain'
import { WALL_MODEL_CELLS_PER_THICKNESS } from './near-wall'
import { flatPlateSkinFriction } from './skin-friction'

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
/** Wall-resolved LES cells across the inner layer: from a first cell one wall unit tall growing about 10% a cell (our arithmetic). */
export const WRLES_WALL_NORMAL_CELLS = 60
/** Laminar boundary layers: cells across the layer, and wall-parallel cells per layer thickness (our choice, no source). */
export const LAMINAR_LAYER_CELLS_ACROSS = 20
export const LAMINAR_LAYER_WALL_PARALLEL_PER_THICKNESS = 4

/** LES of a separated shear layer: about eight cells across the boundary layer it leaves the wall as (common practice, no source). */
export const SHEAR_LAYER_CELLS = 8
/** The separated region is never resolved coarser than L/40 (common practice, no source). */
export const MIN_REGION_CELLS_PER_LENGTH = 40
/** DNS spacing in the separated region and wake: three Kolmogorov lengths (Moin & Mahesh 1998, Annu. Rev. Fluid Mech. 30, 539: resolution of order eta suffices; from memory). */
export const DNS_KOLMOGOROV_SPACING = 3
/** The wake beyond the near region is meshed four times coarser, and never coarser than L/10 (common practice, no source). */
export const WAKE_COARSENING = 4
export const MAX_WAKE_SPACING_PER_LENGTH = 0.1
/**
 * Where sharp edges fix the separation (complex bodies, buildings), LES of the separated region and
 * of the walls needs no cell finer than L/200: the thin layer that separates is not resolved, its
 * growth does not move the separation (common practice for building and vehicle LES, no source).
 */
export const SHARP_EDGE_CELLS_PER_LENGTH = 200
/** Hybrid RANS-LES resolves its focus region twice as coarsely as LES (common practice, no source). */
export const HYBRID_REGION_COARSENING = 2
/**
 * Volumes of the near separated region (fine) and of the wake, in L x L x span (internal: L^3 and
 * capped at the domain), by kind of separation: mild separation a bubble of 0.1 and a short wake;
 * massive separation shear layers in about L^3 and a wake some 10 L long and 3 L high (our
 * assumptions, no source; the cell range carries them).
 */
export const REGION_VOLUMES: Readonly<Record<Separation, { fine: number; wake: number }>> = {
  none: { fine: 0, wake: 0 },
  mild: { fine: 0.1, wake: 1 },
  massive: { fine: 1, wake: 30 },
}
/** Complex bodies and rotating machinery separate in more places (our assumption, no source). */
export const REGION_GEOMETRY_FACTOR: Readonly<Record<Geometry, number>> = { streamlined: 1, bluff: 1, duct: 1, rotating: 2, complex: 2 }
/** No three-dimensional turbulent simulation is meaningful below this many cells (a minimal flow unit is of this order; common practice, no source). */
export const MIN_RESOLVING_CELLS = 1e5

export type ResolvingId = 'dns' | 'wrles' | 'wmles'

export interface ResolvedMesh {
  cells: number
  /** the finest streamwise cell, m: it sets the time step */
  finestCell: number
}

interface LayerDensity {
  dns: number
  wrles: number
  wmles: number
}

/** Wall-resolved LES inner layer: cells per unit wall area with viscous length l. */
function innerLayerDensity(viscous: number): number {
  return WRLES_WALL_NORMAL_CELLS / (WRLES_STREAMWISE_SPACING_PLUS * WRLES_SPANWISE_SPACING_PLUS * viscous * viscous)
}

/**
 * Wall-modelled LES: cells per unit wall area, delta/20 in each direction but never finer along
 * the wall than wall-resolved LES would be (where it would be, the mesh is wall-resolved anyway).
 */
function outerLayerDensity(delta: number, viscous: number, floor = 0): number {
  const cell = Math.max(delta / WALL_MODEL_CELLS_PER_THICKNESS, floor)
  return WALL_MODEL_CELLS_PER_THICKNESS / (Math.max(cell, WRLES_STREAMWISE_SPACING_PLUS * viscous) * Math.max(cell, WRLES_SPANWISE_SPACING_PLUS * viscous))
}

/** Cells per unit wall area of each method where the layer is delta thick and the viscous length is l. */
function layerDensity(delta: number, viscous: number, floor: number): LayerDensity {
  const wmles = outerLayerDensity(delta, viscous, floor)
  const wrles = innerLayerDensity(viscous) + outerLayerDensity(delta, viscous)
  const dns = delta / (DNS_STREAMWISE_SPACING_PLUS * DNS_MEAN_WALL_NORMAL_SPACING_PLUS * DNS_SPANWISE_SPACING_PLUS * viscous ** 3)
  return { dns: Math.max(dns, wrles), wrles, wmles }
}

// 8-point Gauss-Legendre nodes and weights on [-1, 1].
const GAUSS_NODES = [-0.9602898565, -0.7966664774, -0.5255324099, -0.1834346425, 0.1834346425, 0.5255324099, 0.7966664774, 0.9602898565]
const GAUSS_WEIGHTS = [0.1012285363, 0.2223810345, 0.3137066459, 0.3626837834, 0.3626837834, 0.3137066459, 0.2223810345, 0.1012285363]

/** Integral of the layer densities over the turbulent part of the plate, per unit span (quadrature in ln x). */
function turbulentPlateIntegral(flow: CostCase): LayerDensity {
  const total = { dns: 0, wrles: 0, wmles: 0 }
  const start = flow.turbulentStart
  if (start >= 1) return total
  const { wall } = flow
  const endFriction = flatPlateSkinFriction(flow.reynolds)
  const half = -Math.log(start) / 2
  for (let index = 0; index < GAUSS_NODES.length; index++) {
    const ratio = Math.exp(half * (GAUSS_NODES[index]! - 1))
    const viscous = wall.viscousLength * Math.sqrt(endFriction / flatPlateSkinFriction(flow.reynolds * ratio))
    const density = layerDensity(wall.boundaryLayerThickness * ratio ** (6 / 7), viscous, sharpEdgeFloor(flow))
    const weight = GAUSS_WEIGHTS[index]! * half * ratio * flow.length
    total.dns += weight * density.dns
    total.wrles += weight * density.wrles
    total.wmles += weight * density.wmles
  }
  return total
}

/** Finest streamwise wall cell of each method where the turbulent layer starts (delta smallest, l smallest). */
function wallFinest(delta: number, viscous: number, floor: number): LayerDensity {
  return {
    dns: DNS_STREAMWISE_SPACING_PLUS * viscous,
    wrles: WRLES_STREAMWISE_SPACING_PLUS * viscous,
    wmles: Math.max(delta / WALL_MODEL_CELLS_PER_THICKNESS, WRLES_STREAMWISE_SPACING_PLUS * viscous, floor),
  }
}

/** The coarsest cell LES needs near sharp edges, m (0 where the separation is not fixed by edges). */
function sharpEdgeFloor(flow: CostCase): number {
  return flow.sharpEdged ? flow.length / SHARP_EDGE_CELLS_PER_LENGTH : 0
}

interface WallPart {
  cells: LayerDensity
  finest: LayerDensity
}

/** External flow: the turbulent part of the wetted area, and the laminar part ahead of it. */
function externalWall(flow: CostCase): WallPart {
  const span = flow.domain.wettedArea / flow.length
  const turbulent = turbulentPlateIntegral(flow)
  const start = Math.min(1, flow.turbulentStart)
  const startViscous = flow.wall.viscousLength * Math.sqrt(flatPlateSkinFriction(flow.reynolds) / flatPlateSkinFriction(flow.reynolds * start))
  // Where the turbulent layer would start (the trailing edge while the whole plate is laminar), so
  // the laminar part is meshed alike on either side of the onset: the count does not jump there.
  const turbulentFinest = wallFinest(flow.wall.boundaryLayerThickness * start ** (6 / 7), startViscous, sharpEdgeFloor(flow))
  const laminarThickness = 5 * start * flow.length * (flow.reynolds * start) ** -0.5
  const cells = { dns: 0, wrles: 0, wmles: 0 }
  const finest = { dns: Infinity, wrles: Infinity, wmles: Infinity }
  for (const id of ['dns', 'wrles', 'wmles'] as const) {
    const spacing = Math.max(laminarThickness / LAMINAR_LAYER_WALL_PARALLEL_PER_THICKNESS, turbulentFinest[id])
    cells[id] = span * (turbulent[id] + (start * flow.length * LAMINAR_LAYER_CELLS_ACROSS) / (spacing * spacing))
    finest[id] = start < 1 ? turbulentFinest[id] : spacing
  }
  return { cells, finest }
}

/** Internal flow: the developed duct counted in wall units over the domain. */
function internalWall(flow: CostCase): WallPart {
  const { wall, domain } = flow
  const delta = wall.boundaryLayerThickness
  const viscous = wall.viscousLength
  // The outer and core cells fill the volume; the inner layer covers the wetted area.
  const wmles = (domain.volume / delta) * outerLayerDensity(delta, viscous, sharpEdgeFloor(flow))
  const wrles = domain.wettedArea * innerLayerDensity(viscous) + (domain.volume / delta) * outerLayerDensity(delta, viscous)
  const dns = domain.volume / (DNS_STREAMWISE_SPACING_PLUS * DNS_MEAN_WALL_NORMAL_SPACING_PLUS * DNS_SPANWISE_SPACING_PLUS * viscous ** 3)
  return {
    cells: { dns: Math.max(dns, wrles), wrles, wmles },
    finest: wallFinest(delta, viscous, sharpEdgeFloor(flow)),
  }
}

/** Spacing in the near separated region for each method, m. */
export function regionSpacing(flow: CostCase): LayerDensity & { hybrid: number } {
  const coarsest = flow.length / MIN_REGION_CELLS_PER_LENGTH
  const les = Math.min(Math.max(flow.separationThickness / SHEAR_LAYER_CELLS, sharpEdgeFloor(flow)), coarsest)
  const kolmogorov = flow.length * flow.reynolds ** -0.75
  return {
    dns: Math.min(les, DNS_KOLMOGOROV_SPACING * kolmogorov),
    wrles: les,
    wmles: les,
    hybrid: Math.min(HYBRID_REGION_COARSENING * les, coarsest),
  }
}

/** Cells of the separated region and wake at a given near-region spacing. */
export function regionCells(flow: CostCase, spacing: number): number {
  const volumes = REGION_VOLUMES[flow.separation]
  if (volumes.fine === 0) return 0
  const factor = REGION_GEOMETRY_FACTOR[flow.geometry]
  const external = flow.regime === 'external'
  const unit = flow.length * flow.length * (external ? flow.domain.span : flow.length)
  const fine = Math.min(factor * volumes.fine * unit, external ? Infinity : flow.domain.volume)
  const wake = Math.min(factor * volumes.wake * unit, external ? Infinity : Math.max(0, flow.domain.volume - fine))
  const wakeSpacing = Math.min(WAKE_COARSENING * spacing, MAX_WAKE_SPACING_PER_LENGTH * flow.length)
  return fine / spacing ** 3 + wake / wakeSpacing ** 3
}

function meshOf(id: ResolvingId, flow: CostCase, wall: WallPart, spacing: LayerDensity): ResolvedMesh {
  const separated = REGION_VOLUMES[flow.separation].fine > 0
  return {
    cells: Math.max(MIN_RESOLVING_CELLS, wall.cells[id] + regionCells(flow, spacing[id])),
    finestCell: separated ? Math.min(wall.finest[id], spacing[id]) : wall.finest[id],
  }
}

/** The meshes of DNS, wall-resolved and wall-modelled LES for a case (kept on the case object after the first call). */
export function resolvingMeshes(flow: CostCase): Record<ResolvingId, ResolvedMesh> {
  const cached = flow.resolvingMeshes
  if (cached) return cached
  const wall = flow.regime === 'external' ? externalWall(flow) : internalWall(flow)
  const spacing = regionSpacing(flow)
  const meshes = { dns: meshOf('dns', flow, wall, spacing), wrles: meshOf('wrles', flow, wall, spacing), wmles: meshOf('wmles', flow, wall, spacing) }
  flow.resolvingMeshes = meshes
  return meshes
}
