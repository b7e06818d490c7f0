/**
 * Cautions computed from the case's numbers rather than written in the rules: the budget, a y+
 * override, a wall model without a log layer, a first cell as tall as the layer, roughness, fluid
 * properties given but not used, an inferred application and a planar domain.
 */
import { WALL_TREATMENT_LABELS, type WallTreatment } from './approaches'
import type { ApproachAdvice, BudgetAdvice, WallFigures } from './advice-types'
import type { Application, CaseInput } from './case-input'
import type { FlowPhysics } from './flow-physics'
import { formatNumber } from './format'
import { BLENDED_Y_PLUS_BAND, RESOLVED_Y_PLUS, WALL_FUNCTION_Y_PLUS_BAND } from './near-wall'
import { ROUGHNESS_LENGTH_COEFFICIENT } from './roughness'
import { ownYPlusTarget } from './wall-figures'

const APPLICATION_PHRASES: Readonly<Record<Application, string>> = {
  general: 'a general flow',
  atmospheric: 'wind in the atmospheric boundary layer around a structure',
  indoor: 'air flow in a room',
  marine: 'flow around a ship hull',
  turbomachinery: 'flow through rotating machinery',
  swirl: 'a strongly swirling flow',
  jet: 'a jet or mixing layer',
}

export interface CautionContext {
  input: CaseInput
  physics: FlowPhysics
  chosen: ApproachAdvice
  wall: WallFigures
  budget: BudgetAdvice
}

function outOfBand(treatment: WallTreatment, yPlus: number): string | null {
  if (treatment === 'resolved' && yPlus > RESOLVED_Y_PLUS) return 'a resolved wall wants the first cell centre at y+ ≤ 1.'
  if ((treatment === 'wall-function' || treatment === 'rough-wall-function') && (yPlus < WALL_FUNCTION_Y_PLUS_BAND.min || yPlus > WALL_FUNCTION_Y_PLUS_BAND.max)) {
    return 'log-law functions want the first cell centre between y+ = 30 and 300.'
  }
  if (treatment === 'blended' && (yPlus < BLENDED_Y_PLUS_BAND.min || yPlus > BLENDED_Y_PLUS_BAND.max)) return 'the blended treatment is meant for y+ from about 0.1 to 300.'
  return null
}

function yPlusCautions({ input, physics, chosen }: CautionContext): string[] {
  if (input.yPlusTarget === undefined) return []
  const own = ownYPlusTarget(physics, chosen.wallTreatment, chosen.id)
  const cautions = [
    `The y+ target of ${formatNumber(input.yPlusTarget)} you set replaces the treatment's own ${formatNumber(own)} in the wall figures; the approach costs keep each treatment's own target.`,
  ]
  const problem = outOfBand(chosen.wallTreatment, input.yPlusTarget)
  if (problem) cautions.push(`A y+ of ${formatNumber(input.yPlusTarget)} does not suit ${WALL_TREATMENT_LABELS[chosen.wallTreatment].toLowerCase()}: ${problem}`)
  return cautions
}

function roughnessCautions({ physics, wall }: CautionContext): string[] {
  const roughness = physics.roughness
  if (!roughness) return []
  const regime = roughness.regime === 'fully-rough' ? 'fully rough' : roughness.regime === 'transitional' ? 'transitionally rough' : 'hydraulically smooth'
  const cautions = [
    `Roughness: k_s = ${formatNumber(roughness.sandGrainHeight)} m gives k_s+ = ${formatNumber(roughness.roughnessPlus)}, ${regime} (smooth below 5, fully rough above 70; Nikuradse 1933).`,
  ]
  if (roughness.roughnessLength !== null) {
    cautions.push(
      `The roughness length z0 = ${formatNumber(roughness.roughnessLength)} m was converted to k_s = 9.793 z0 / C_s with C_s = 0.327 (k_s ≈ 30 z0, Blocken et al. 2007); a solver whose rough-wall function fixes C_s = 0.5 needs k_s = ${formatNumber((ROUGHNESS_LENGTH_COEFFICIENT * roughness.roughnessLength) / 0.5)} m.`,
    )
  }
  if (roughness.regime !== 'smooth' && wall.firstCellCentre < roughness.sandGrainHeight && wall.wallTreatment !== 'resolved') {
    cautions.push(
      `The first cell centre (${formatNumber(wall.firstCellCentre)} m) lies below the roughness height: a rough-wall function needs it above k_s; coarsen the first cell or model the roughness elements.`,
    )
  }
  return cautions
}

function meshCautions({ physics, chosen, wall }: CautionContext): string[] {
  const cautions: string[] = []
  if (chosen.wallTreatment === 'wall-model' && physics.wall.deltaPlus < 300) {
    cautions.push('The boundary layer is under 300 wall units thick, so it has no log layer for a wall model to take its input from; resolve the wall instead.')
  }
  if (wall.firstCellHeight >= wall.boundaryLayerThickness) {
    cautions.push('The first cell at this y+ would be as tall as the boundary layer itself; resolve the wall or check the inputs.')
  }
  return cautions
}

function inputCautions({ input, physics }: CautionContext): string[] {
  const cautions: string[] = []
  if (input.fluid.medium !== 'custom' && (input.fluid.density !== undefined || input.fluid.viscosity !== undefined)) {
    cautions.push(
      `The density or viscosity you gave is not used: ${input.fluid.medium} properties are computed from temperature${input.fluid.medium === 'air' ? ' and pressure' : ''}. Choose a custom fluid to use your own.`,
    )
  }
  const { application } = physics
  if (!application.given && application.application !== 'general') {
    cautions.push(`Read from the inputs as ${APPLICATION_PHRASES[application.application]}, whose published practice the advice follows; set the application explicitly if that is wrong.`)
  }
  if (physics.domain.planar) {
    cautions.push(
      `Planar case: steady and unsteady RANS and a laminar solution are counted in two dimensions; scale-resolving and hybrid methods run span-periodic over ${formatNumber(physics.domain.span)} m, which must hold the largest spanwise eddies.`,
    )
  }
  return cautions
}

export function computedCautions(context: CautionContext): string[] {
  const budget = context.budget.status === 'fits' ? [] : [context.budget.summary]
  return [...budget, ...yPlusCautions(context), ...meshCautions(context), ...roughnessCautions(context), ...inputCautions(context)]
}
