/**
 * Meshes of the modelled approaches: steady and unsteady RANS (surface cells times near-wall
 * layers plus off-wall cells), hybrid RANS-LES (a 3-D RANS mesh plus its LES focus region) and a
 * laminar solution (the same layout with the laminar boundary layer resolved). Planar cases
 * (2-D, axisymmetric, span-periodic) are one cell deep for RANS, URANS and laminar solutions.
 */
import type { ApproachId, WallTreatment } from './approaches'
import type { CostCase } from './cost-case'
import { laminarYPlusTarget, layersToThickness, yPlusTargetFor } from './near-wall'
import { regionCells, regionSpacing } from './mesh-resolving'

/** External RANS surface spacing: cells per reference length along each surface direction (common practice, no source). */
export const RANS_SURFACE_CELLS_PER_LENGTH = 250
/** Internal RANS surface spacing: cells per hydraulic diameter (common practice, no source). */
export const RANS_SURFACE_CELLS_PER_DIAMETER = 40
/** Cells away from the wall layers per surface cell: far field and wake (external 3-D) (common practice, no source). */
export const RANS_OFF_WALL_CELLS_EXTERNAL = 30
/** The duct core per surface cell: about the cross-section's cells over its perimeter's at 40 per diameter (our arithmetic). */
export const RANS_OFF_WALL_CELLS_INTERNAL = 10
/** A 2-D mesh carries its far field in the plane: some 100 cells per surface cell out to the far boundary (common practice, no source). */
export const RANS_OFF_WALL_CELLS_PLANAR = 100

export interface ModelledMesh {
  cells: number
  /** near-wall layers up to the boundary-layer edge */
  layers: number
  /** the finest streamwise cell, m */
  finestCell: number
  /** one cell deep */
  planar: boolean
  yPlusTarget: number
}

/** A laminar solution needs no finer surface spacing than its boundary layer's thickness allows, and no coarser than L/60 (our choice, no source). */
export const LAMINAR_MIN_SURFACE_CELLS_PER_LENGTH = 60

function surfaceSpacing(flow: CostCase, approach?: ApproachId): number {
  const modelled = flow.length / (flow.regime === 'external' ? RANS_SURFACE_CELLS_PER_LENGTH : RANS_SURFACE_CELLS_PER_DIAMETER)
  if (approach !== 'laminar') return modelled
  return Math.min(Math.max(modelled, flow.wall.boundaryLayerThickness), flow.length / LAMINAR_MIN_SURFACE_CELLS_PER_LENGTH)
}

/** Near-wall layers up to the boundary-layer edge for a wall treatment at a y+ target. */
export function nearWallLayers(flow: CostCase, yPlusTarget: number): number {
  const firstCellHeight = 2 * yPlusTarget * flow.wall.viscousLength
  return layersToThickness(firstCellHeight, flow.wall.boundaryLayerThickness, flow.growthRatio)
}

/**
 * Surface cells and off-wall cells per surface cell; `planar` for a 2-D mesh. A hybrid run of a
 * planar case is span-periodic, its span divided at the focus-region spacing (`spanSpacing`).
 */
function surfaceLayout(flow: CostCase, planar: boolean, spacing: number, spanSpacing?: number): { surface: number; offWall: number } {
  if (planar) return { surface: flow.domain.perimeter / spacing, offWall: RANS_OFF_WALL_CELLS_PLANAR }
  const offWall = flow.regime === 'external' ? RANS_OFF_WALL_CELLS_EXTERNAL : RANS_OFF_WALL_CELLS_INTERNAL
  if (spanSpacing !== undefined && flow.domain.planar) {
    return { surface: (flow.domain.perimeter / spacing) * (flow.domain.span / Math.max(spacing, spanSpacing)), offWall }
  }
  return { surface: flow.domain.wettedArea / (spacing * spacing), offWall }
}

/**
 * The mesh of a modelled approach with a wall treatment at a y+ target (default: the treatment's
 * own). Hybrid methods always run three-dimensional, with the LES focus region added.
 */
export function modelledMesh(approach: ApproachId, flow: CostCase, wallTreatment: WallTreatment, yPlusTarget?: number): ModelledMesh {
  const target = yPlusTarget ?? (approach === 'laminar' ? laminarYPlusTarget(flow.wall.deltaPlus) : yPlusTargetFor(wallTreatment, flow.wall.deltaPlus, approach, flow.roughnessPlus))
  const layers = nearWallLayers(flow, target)
  const spacing = surfaceSpacing(flow, approach)
  if (approach !== 'hybrid') {
    const { surface, offWall } = surfaceLayout(flow, flow.domain.planar, spacing)
    return { cells: surface * (layers + offWall), layers, finestCell: spacing, planar: flow.domain.planar, yPlusTarget: target }
  }
  const focus = regionSpacing(flow).hybrid
  const { surface, offWall } = surfaceLayout(flow, false, spacing, focus)
  const base = surface * (layers + offWall)
  const focusCells = regionCells(flow, focus)
  return {
    cells: base + focusCells,
    layers,
    // Implicit RANS regions are not held to the CFL limit; the LES focus region is.
    finestCell: focusCells > 0 ? focus : spacing,
    planar: false,
    yPlusTarget: target,
  }
}
