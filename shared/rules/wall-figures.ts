/**
 * The near-wall mesh a wall treatment implies for a case: target y+, first cell, layers to the
 * boundary-layer edge, the wall model's exchange height, in wall units of the reference wall.
 */
import type { ApproachId, WallTreatment } from './approaches'
import type { WallFigures } from './advice-types'
import { parseCaseInput, type CaseInput, type CaseInputDraft } from './case-input'
import { flowPhysics, type FlowPhysics } from './flow-physics'
import { laminarYPlusTarget, layersToThickness, wallModelExchangeYPlus, yPlusTargetFor } from './near-wall'

/** The y+ target a treatment aims at for an approach; a laminar solution also keeps 20 cells across its layer. */
export function ownYPlusTarget(physics: FlowPhysics, wallTreatment: WallTreatment, approach?: ApproachId): number {
  const { wall } = physics
  if (approach === 'laminar') return laminarYPlusTarget(wall.deltaPlus)
  return yPlusTargetFor(wallTreatment, wall.deltaPlus, approach, physics.roughness?.roughnessPlus ?? 0)
}

/** Near-wall figures of a computed flow for one wall treatment (and approach, which sets the resolved target). */
export function wallFigures(
  physics: FlowPhysics,
  wallTreatment: WallTreatment,
  growthRatio: number,
  yPlusTarget?: number,
  approach?: ApproachId,
): WallFigures {
  const { wall } = physics
  const target = yPlusTarget ?? ownYPlusTarget(physics, wallTreatment, approach)
  const firstCellCentre = target * wall.viscousLength
  const firstCellHeight = 2 * firstCellCentre
  return {
    wallTreatment,
    skinFriction: wall.skinFriction,
    wallShearStress: wall.wallShearStress,
    frictionVelocity: wall.frictionVelocity,
    yPlusTarget: target,
    firstCellCentre,
    firstCellHeight,
    boundaryLayerThickness: wall.boundaryLayerThickness,
    deltaPlus: wall.deltaPlus,
    growthRatio,
    layers: layersToThickness(firstCellHeight, wall.boundaryLayerThickness, growthRatio),
    exchangeHeight: wallTreatment === 'wall-model' ? wallModelExchangeYPlus(wall.deltaPlus) * wall.viscousLength : null,
    roughnessPlus: physics.roughness ? physics.roughness.roughnessPlus : null,
    referenceTemperatureK: physics.reference ? physics.reference.temperatureK : null,
  }
}

/**
 * The near-wall figures of a case recomputed for a given wall treatment, e.g. for a reviewer's
 * override: at `yPlusTarget` when given, otherwise at the treatment's own target (the case's
 * yPlusTarget belongs to the treatment advise() chose, so it is not carried over). `approach`
 * refines the resolved target (DNS and wall-resolved LES put the first cell lower than RANS).
 */
export function wallFor(
  input: CaseInput | CaseInputDraft,
  wallTreatment: WallTreatment,
  yPlusTarget?: number,
  approach?: ApproachId,
): WallFigures {
  const parsed = parseCaseInput(input)
  return wallFigures(flowPhysics(parsed), wallTreatment, parsed.growthRatio, yPlusTarget, approach)
}
