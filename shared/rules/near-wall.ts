/**
 * Wall units and the near-wall mesh: friction velocity, wall distance of a given y+, boundary-layer
 * thickness (one formula for the wall figures and the cost model), the y+ target of each wall
 * treatment and the number of prism layers up to the boundary-layer edge. Spalding's law of the
 * wall is here for checks and plots.
 */
import type { ApproachId, WallTreatment } from './approaches'

/**
 * Turbulent flat-plate thickness delta/x = 0.16 Re_x^-1/7 (1/7-power-law profile with the
 * 1/7-power friction law; White, Fluid Mechanics; from memory). The one boundary-layer thickness of
 * the engine: it is closer than 0.37 Re_x^-1/5 at high Reynolds numbers, where that one falls too fast.
 */
export const TURBULENT_PLATE_THICKNESS_COEFFICIENT = 0.16
export const TURBULENT_PLATE_THICKNESS_EXPONENT = -1 / 7
/** Laminar (Blasius) thickness delta99/x = 5.0 Re_x^-1/2 (Blasius 1908; textbook, from memory). */
export const LAMINAR_PLATE_THICKNESS_COEFFICIENT = 5
/** Von Karman constant for the log law (textbook value 0.41, e.g. Pope, Turbulent Flows 2000). */
export const KARMAN_CONSTANT = 0.41
/** Log-law additive constant B (textbook value 5.0-5.2; we use 5.0, e.g. Pope, Turbulent Flows 2000). */
export const LOG_LAW_CONSTANT = 5.0

/** A resolved viscous sublayer puts the first cell centre at y+ of about 1 or below (common practice for RANS, no source). */
export const RESOLVED_Y_PLUS = 1
/**
 * DNS and wall-resolved LES: the first cell at most one wall unit tall, its centre at y+ = 0.5
 * (Georgiadis, Rizzetta & Fureby 2010, AIAA J. 48: y1+ < 1; Kim, Moin & Moser 1987 put the first
 * point well below 1; from memory).
 */
export const RESOLVING_FIRST_CELL_Y_PLUS = 0.5
/**
 * Blended treatments hold from the sublayer to the log layer; the mesh is planned with the first
 * cell centre at the top of the viscous sublayer, y+ = 5, and anything from 1 to 300 is handled
 * (our choice, no source; Popovac & Hanjalić 2007, Flow Turbul. Combust. 78, 177 for the treatment).
 */
export const BLENDED_Y_PLUS = 5
export const BLENDED_Y_PLUS_BAND = { min: 0.1, max: 300 } as const
/** Log-law wall functions (Launder & Spalding 1974) want the first cell centre in the log layer, commonly 30 <= y+ <= 300 (common practice, no source). */
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
 * et al. 2016, Mech. Eng. Rev. 3), so the first cell centre sits at delta/40.
 */
export const WALL_MODEL_CELLS_PER_THICKNESS = 20
/**
 * The wall model takes its input (the exchange or matching point) at 0.1 delta, in the log layer
 * and several cells off the wall, which avoids the log-layer mismatch (Kawai & Larsson 2012,
 * Phys. Fluids 24, 015105: 0.1-0.2 delta; from memory).
 */
export const WALL_MODEL_EXCHANGE_FRACTION = 0.1
/** Lowest exchange height of an equilibrium wall model, wall units: the start of the log layer (textbook). */
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

/** Turbulent flat-plate boundary-layer thickness delta = 0.16 x Re_x^-1/7, m. */
export function turbulentPlateThickness(length: number, reynolds: number): number {
  return TURBULENT_PLATE_THICKNESS_COEFFICIENT * length * reynolds ** TURBULENT_PLATE_THICKNESS_EXPONENT
}

/** Laminar flat-plate boundary-layer thickness delta99 = 5.0 x Re_x^-1/2, m. */
export function laminarPlateThickness(length: number, reynolds: number): number {
  return LAMINAR_PLATE_THICKNESS_COEFFICIENT * length * reynolds ** -0.5
}

/**
 * The thickness of the wall layer of a duct: the radius of a pipe, half the side of a square duct
 * (both D_h / 2), the half-height h = D_h / 4 of a plane channel (D_h = 4h between two walls).
 */
export function ductThickness(hydraulicDiameter: number, crossSection: 'pipe' | 'channel' | 'duct'): number {
  return crossSection === 'channel' ? hydraulicDiameter / 4 : hydraulicDiameter / 2
}

/**
 * Wall units from a skin-friction coefficient. `density` and `kinematicViscosity` are the wall's;
 * `shearDensity` (default: the wall density) is the density the coefficient is referred to, e.g.
 * Eckert's reference density for compressible boundary layers.
 */
export function wallUnits(args: {
  skinFriction: number
  density: number
  kinematicViscosity: number
  velocity: number
  boundaryLayerThickness: number
  shearDensity?: number | undefined
}): WallUnits {
  const shear = wallShearStress(args.skinFriction, args.shearDensity ?? args.density, args.velocity)
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

function wallFunctionYPlus(deltaPlus: number): number {
  const logLayerTop = LOG_LAYER_TOP_FRACTION * deltaPlus
  const middle = Math.sqrt(WALL_FUNCTION_Y_PLUS_BAND.min * logLayerTop)
  return Math.min(WALL_FUNCTION_Y_PLUS_PREFERRED_MAX, Math.max(WALL_FUNCTION_Y_PLUS_BAND.min, middle))
}

/**
 * The y+ of the first cell centre that a wall treatment aims at, given delta+. DNS and wall-resolved
 * LES put it lower than RANS. A rough-wall function keeps the first cell centre above the roughness
 * elements (y+ >= k_s+, Blocken et al. 2007), up to the top of the log layer.
 */
export function yPlusTargetFor(wallTreatment: WallTreatment, deltaPlus: number, approach?: ApproachId, roughnessPlus = 0): number {
  if (wallTreatment === 'resolved') return approach === 'dns' || approach === 'wrles' ? RESOLVING_FIRST_CELL_Y_PLUS : RESOLVED_Y_PLUS
  if (wallTreatment === 'wall-function') return wallFunctionYPlus(deltaPlus)
  if (wallTreatment === 'rough-wall-function') {
    const ceiling = Math.max(WALL_FUNCTION_Y_PLUS_BAND.min, LOG_LAYER_TOP_FRACTION * deltaPlus)
    return Math.max(wallFunctionYPlus(deltaPlus), Math.min(roughnessPlus, ceiling))
  }
  if (wallTreatment === 'blended') return BLENDED_Y_PLUS
  return deltaPlus / (2 * WALL_MODEL_CELLS_PER_THICKNESS)
}

/** Laminar boundary layers: the first cell at most a twentieth of the layer (our choice, no source). */
export const LAMINAR_FIRST_CELL_FRACTION = 1 / 20

/** First-cell-centre y+ of a laminar solution: y+ = 1 or lower, so that 20 cells fit across the layer. */
export function laminarYPlusTarget(deltaPlus: number): number {
  return Math.min(RESOLVED_Y_PLUS, (LAMINAR_FIRST_CELL_FRACTION * deltaPlus) / 2)
}

/** Exchange (matching) height of the wall-stress model, wall units: 0.1 delta, never below the log layer's start. */
export function wallModelExchangeYPlus(deltaPlus: number): number {
  return Math.max(WALL_MODEL_MIN_Y_PLUS, WALL_MODEL_EXCHANGE_FRACTION * deltaPlus)
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
