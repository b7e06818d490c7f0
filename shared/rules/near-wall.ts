/**
 * Wall units and the near-wall mesh: friction velocity, wall distance of a given y+, boundary-layer
 * thickness, the y+ target of each wall treatment and the number of prism layers up to the
 * boundary-layer edge. Spalding's law of the wall is here for checks and plots.
 */
import type { WallTreatment } from './approaches'

/** Turbulent flat-plate thickness delta/x = 0.37 Re_x^-1/5 (1/7-power-law profile; Prandtl, textbook, e.g. Schlichting). */
export const TURBULENT_PLATE_THICKNESS_COEFFICIENT = 0.37
/** Von Karman constant for the log law (textbook value 0.41, e.g. Pope, Turbulent Flows 2000). */
export const KARMAN_CONSTANT = 0.41
/** Log-law additive constant B (textbook value 5.0-5.2; we use 5.0, e.g. Pope, Turbulent Flows 2000). */
export const LOG_LAW_CONSTANT = 5.0

/** A resolved viscous sublayer puts the first cell centre at y+ of about 1 or below (common practice, no source; see Georgiadis et al. 2010 for LES). */
export const RESOLVED_Y_PLUS = 1
/** Standard wall functions (Launder & Spalding 1974) want the first cell centre in the log layer, commonly 30 <= y+ <= 300 (common practice, no source). */
export const WALL_FUNCTION_Y_PLUS_BAND = { min: 30, max: 300 } as const
/**
 * Our pick inside the wall-function band: the geometric middle of the log layer, which spans
 * y+ = 30 to about 0.1 delta+ (textbook), kept at or below 100 so a few cells sit in the log
 * layer (common practice, no source).
 */
export const WALL_FUNCTION_Y_PLUS_PREFERRED_MAX = 100
/** Upper edge of the log layer as a fraction of the boundary-layer thickness (textbook: 0.1-0.2 delta; we take the lower value). */
export const LOG_LAYER_TOP_FRACTION = 0.1
/**
 * Wall-modelled LES: cells of about delta/20 near the wall (guidance delta/15 to delta/30, Larsson
 * et al. 2016, Mech. Eng. Rev. 3), the wall model matched at the first cell centre, i.e. at
 * delta/40; never below y+ = 30 so the matching point stays in the log layer.
 */
export const WALL_MODEL_CELLS_PER_THICKNESS = 20
/** Lowest matching height of an equilibrium wall model, wall units: the start of the log layer (textbook). */
export const WALL_MODEL_MIN_Y_PLUS = 30

export interface WallUnits {
  skinFriction: number
  /** Pa */
  wallShearStress: number
  /** m/s */
  frictionVelocity: number
  /** viscous length nu / u_tau, m */
  viscousLength: number
  /** m */
  boundaryLayerThickness: number
  /** boundary-layer thickness in wall units (the friction Reynolds number Re_tau for a pipe) */
  deltaPlus: number
}

/** Wall shear stress tau_w = Cf rho U^2 / 2, Pa. */
export function wallShearStress(skinFriction: number, density: number, velocity: number): number {
  return 0.5 * skinFriction * density * velocity * velocity
}

/** Friction velocity u_tau = sqrt(tau_w / rho), m/s. */
export function frictionVelocity(wallShear: number, density: number): number {
  return Math.sqrt(wallShear / density)
}

/** Wall distance of a given y+: y = y+ nu / u_tau, m. */
export function wallDistance(yPlus: number, kinematicViscosity: number, frictionVel: number): number {
  return (yPlus * kinematicViscosity) / frictionVel
}

/** Turbulent flat-plate boundary-layer thickness delta = 0.37 x Re_x^-1/5, m. */
export function turbulentPlateThickness(length: number, reynolds: number): number {
  return TURBULENT_PLATE_THICKNESS_COEFFICIENT * length * reynolds ** -0.2
}

export function wallUnits(args: {
  skinFriction: number
  density: number
  kinematicViscosity: number
  velocity: number
  boundaryLayerThickness: number
}): WallUnits {
  const shear = wallShearStress(args.skinFriction, args.density, args.velocity)
  const uTau = frictionVelocity(shear, args.density)
  const viscousLength = args.kinematicViscosity / uTau
  return {
    skinFriction: args.skinFriction,
    wallShearStress: shear,
    frictionVelocity: uTau,
    viscousLength,
    boundaryLayerThickness: args.boundaryLayerThickness,
    deltaPlus: args.boundaryLayerThickness / viscousLength,
  }
}

/** The y+ of the first cell centre that a wall treatment aims at, given delta+. */
export function yPlusTargetFor(wallTreatment: WallTreatment, deltaPlus: number): number {
  if (wallTreatment === 'resolved') return RESOLVED_Y_PLUS
  if (wallTreatment === 'wall-function') {
    const logLayerTop = LOG_LAYER_TOP_FRACTION * deltaPlus
    const middle = Math.sqrt(WALL_FUNCTION_Y_PLUS_BAND.min * logLayerTop)
    return Math.min(WALL_FUNCTION_Y_PLUS_PREFERRED_MAX, Math.max(WALL_FUNCTION_Y_PLUS_BAND.min, middle))
  }
  return Math.max(WALL_MODEL_MIN_Y_PLUS, deltaPlus / (2 * WALL_MODEL_CELLS_PER_THICKNESS))
}

/**
 * Cells from the wall to a distance `thickness` when the first cell is `firstCellHeight` tall and
 * each next one `growthRatio` times taller: the smallest n with h1 (r^n - 1)/(r - 1) >= thickness.
 */
export function layersToThickness(firstCellHeight: number, thickness: number, growthRatio: number): number {
  if (!(firstCellHeight > 0) || firstCellHeight >= thickness) return 1
  const layers = Math.ceil(Math.log(1 + (thickness * (growthRatio - 1)) / firstCellHeight) / Math.log(growthRatio) - 1e-9)
  return Math.max(1, layers)
}

/** Spalding's single formula for the law of the wall, y+ as a function of u+ (Spalding 1961, J. Appl. Mech. 28, 455). */
export function spaldingYPlus(uPlus: number, kappa = KARMAN_CONSTANT, constant = LOG_LAW_CONSTANT): number {
  const ku = kappa * uPlus
  return uPlus + Math.exp(-kappa * constant) * (Math.exp(ku) - 1 - ku - (ku * ku) / 2 - (ku * ku * ku) / 6)
}

/** u+ at a given y+ by inverting Spalding's formula (Newton's method; it is monotonic in u+). */
export function spaldingUPlus(yPlus: number, kappa = KARMAN_CONSTANT, constant = LOG_LAW_CONSTANT): number {
  let uPlus = yPlus < 10 ? yPlus : Math.log(yPlus) / kappa + constant
  for (let step = 0; step < 50; step++) {
    const ku = kappa * uPlus
    const residual = spaldingYPlus(uPlus, kappa, constant) - yPlus
    const slope = 1 + Math.exp(-kappa * constant) * kappa * (Math.exp(ku) - 1 - ku - (ku * ku) / 2)
    const next = uPlus - residual / slope
    if (Math.abs(next - uPlus) < 1e-12 * Math.max(1, Math.abs(next))) return next
    uPlus = next
  }
  return uPlus
}
