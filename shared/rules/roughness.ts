/**
 * Wall roughness: the equivalent sand-grain height k_s (given directly, or from the aerodynamic
 * roughness length z0 of terrain), its Reynolds number k_s+ = k_s u_tau / nu, the smooth,
 * transitional and fully rough regimes, and the log-law shift a rough wall function applies.
 */
import { KARMAN_CONSTANT, LOG_LAW_CONSTANT } from './near-wall'

/** Hydraulically smooth below k_s+ of about 5 (Nikuradse 1933, via Schlichting, Boundary-Layer Theory; from memory). */
export const SMOOTH_ROUGHNESS_PLUS = 5
/** Fully rough above k_s+ of about 70 (same source). */
export const FULLY_ROUGH_ROUGHNESS_PLUS = 70
/** Additive constant of the fully rough log law u+ = ln(y/k_s)/kappa + 8.5 (Nikuradse 1933, via Schlichting; from memory). */
export const FULLY_ROUGH_LOG_LAW_CONSTANT = 8.5
/**
 * Conversion of the aerodynamic roughness length to a sand-grain height for a rough wall function,
 * k_s = 9.793 z0 / C_s (Blocken, Stathopoulos & Carmeliet 2007, Atmos. Environ. 41, 238; from
 * memory). The coefficient is exp(kappa B) with kappa = 0.4187 and B = 5.45 of that derivation.
 */
export const ROUGHNESS_LENGTH_COEFFICIENT = 9.793
/**
 * The roughness constant C_s used with it. 0.327 makes k_s = 29.9 z0, the fully rough log law's own
 * equivalence k_s ~ 30 z0 (from memory); solvers whose wall function fixes C_s = 0.5 need
 * k_s = 19.6 z0 instead, which the advice states.
 */
export const ROUGHNESS_CONSTANT = 0.327

export type RoughnessRegime = 'smooth' | 'transitional' | 'fully-rough'

export interface RoughnessFigures {
  /** equivalent sand-grain height k_s, m */
  sandGrainHeight: number
  /** the aerodynamic roughness length it came from, m; null when k_s was given */
  roughnessLength: number | null
  /** k_s+ = k_s u_tau / nu */
  roughnessPlus: number
  regime: RoughnessRegime
  /** log-law shift Delta B of the rough wall, wall units (0 when smooth) */
  logLawShift: number
}

/** Sand-grain height from the aerodynamic roughness length, k_s = 9.793 z0 / C_s (Blocken et al. 2007). */
export function sandGrainFromRoughnessLength(roughnessLength: number, roughnessConstant = ROUGHNESS_CONSTANT): number {
  return (ROUGHNESS_LENGTH_COEFFICIENT * roughnessLength) / roughnessConstant
}

/** Roughness Reynolds number k_s+ = k_s u_tau / nu. */
export function roughnessReynolds(sandGrainHeight: number, frictionVelocity: number, kinematicViscosity: number): number {
  return (sandGrainHeight * frictionVelocity) / kinematicViscosity
}

export function roughnessRegime(roughnessPlus: number): RoughnessRegime {
  if (roughnessPlus < SMOOTH_ROUGHNESS_PLUS) return 'smooth'
  return roughnessPlus < FULLY_ROUGH_ROUGHNESS_PLUS ? 'transitional' : 'fully-rough'
}

/**
 * Downward shift of the log law by roughness, Delta B. Fully rough: ln(k_s+)/kappa + B - 8.5, the
 * difference between the smooth law and Nikuradse's rough law. Transitional: that value scaled by
 * sin(pi/2 g), g = log(k_s+/5)/log(70/5), the blending used by Cebeci & Bradshaw 1977 (Momentum
 * Transfer in Boundary Layers; from memory). Smooth: 0.
 */
export function roughnessLogLawShift(roughnessPlus: number): number {
  if (roughnessPlus < SMOOTH_ROUGHNESS_PLUS) return 0
  const fullyRough = Math.log(roughnessPlus) / KARMAN_CONSTANT + LOG_LAW_CONSTANT - FULLY_ROUGH_LOG_LAW_CONSTANT
  if (roughnessPlus >= FULLY_ROUGH_ROUGHNESS_PLUS) return fullyRough
  const blend = Math.log(roughnessPlus / SMOOTH_ROUGHNESS_PLUS) / Math.log(FULLY_ROUGH_ROUGHNESS_PLUS / SMOOTH_ROUGHNESS_PLUS)
  return Math.max(0, fullyRough) * Math.sin((Math.PI / 2) * blend)
}

export function roughnessFigures(
  sandGrainHeight: number,
  roughnessLength: number | null,
  frictionVelocity: number,
  kinematicViscosity: number,
): RoughnessFigures {
  const roughnessPlus = roughnessReynolds(sandGrainHeight, frictionVelocity, kinematicViscosity)
  return {
    sandGrainHeight,
    roughnessLength,
    roughnessPlus,
    regime: roughnessRegime(roughnessPlus),
    logLawShift: roughnessLogLawShift(roughnessPlus),
  }
}
