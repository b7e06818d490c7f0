/**
 * Skin-friction coefficients for the two reference walls of the engine: a flat plate (external
 * flow) and a straight pipe (internal flow). All coefficients are local Fanning (skin-friction)
 * coefficients Cf = tau_w / (rho U^2 / 2) unless a name says Darcy.
 */

/** Laminar-to-turbulent transition on a flat plate is commonly placed near Re_x = 5e5 (Schlichting, Boundary-Layer Theory; common practice). */
export const PLATE_TRANSITION_REYNOLDS = 5e5
/** Schlichting's turbulent local Cf is stated for Re_x below 1e9 (Schlichting, Boundary-Layer Theory). */
export const SCHLICHTING_MAX_REYNOLDS = 1e9
/**
 * Below this Re_x the laminar Blasius Cf exceeds Schlichting's turbulent one (they cross near
 * Re_x = 1e3; our arithmetic), and Schlichting's formula diverges at Re_x = 10^0.325.
 */
export const SCHLICHTING_MIN_REYNOLDS = 1e3
/** Pipe flow is laminar below Re_D of about 2300 (Reynolds 1883; common practice). */
export const PIPE_TRANSITION_REYNOLDS = 2300
/** Colebrook-White is used up to this relative roughness, the edge of the Moody chart (Moody 1944). */
export const MAX_RELATIVE_ROUGHNESS = 0.05

/** Schlichting's local turbulent flat-plate skin friction Cf = (2 log10 Re_x - 0.65)^-2.3 (Schlichting, Boundary-Layer Theory). */
export function schlichtingSkinFriction(reynoldsX: number): number {
  return (2 * Math.log10(reynoldsX) - 0.65) ** -2.3
}

/** Blasius laminar flat-plate local skin friction Cf = 0.664 Re_x^-1/2 (Blasius 1908; textbook). */
export function blasiusSkinFriction(reynoldsX: number): number {
  return 0.664 / Math.sqrt(reynoldsX)
}

/**
 * Local skin friction at the end of a flat plate of Reynolds number Re_x. Schlichting's turbulent
 * value, or the laminar Blasius value where that is larger (Re_x below about 1e3), so the wall
 * spacing derived from it errs on the fine side.
 */
export function flatPlateSkinFriction(reynoldsX: number): number {
  const laminar = blasiusSkinFriction(reynoldsX)
  if (reynoldsX <= SCHLICHTING_MIN_REYNOLDS) return laminar
  return Math.max(schlichtingSkinFriction(reynoldsX), laminar)
}

/** Haaland's explicit approximation to Colebrook-White, Darcy factor (Haaland 1983, J. Fluids Eng. 105, 89). */
export function haalandFriction(reynolds: number, relativeRoughness = 0): number {
  const inverseSqrt = -1.8 * Math.log10((relativeRoughness / 3.7) ** 1.11 + 6.9 / reynolds)
  return 1 / (inverseSqrt * inverseSqrt)
}

/**
 * Darcy friction factor from the Colebrook-White equation
 * 1/sqrt(f) = -2 log10(k/(3.7 D) + 2.51/(Re sqrt(f))) (Colebrook 1939), solved by Newton's method
 * on x = 1/sqrt(f) from Haaland's estimate. It converges in a handful of steps.
 */
export function colebrookFriction(reynolds: number, relativeRoughness = 0): number {
  const roughnessTerm = relativeRoughness / 3.7
  const viscousTerm = 2.51 / reynolds
  let x = 1 / Math.sqrt(haalandFriction(reynolds, relativeRoughness))
  for (let step = 0; step < 30; step++) {
    const argument = roughnessTerm + viscousTerm * x
    const residual = x + 2 * Math.log10(argument)
    const slope = 1 + (2 * viscousTerm) / (argument * Math.LN10)
    const next = x - residual / slope
    if (Math.abs(next - x) <= 1e-13 * Math.abs(next)) {
      x = next
      break
    }
    x = next
  }
  return 1 / (x * x)
}

/** Darcy friction factor of a pipe: laminar 64/Re below Re_D = 2300, Colebrook-White above (the transitional band is taken as turbulent, the finer-mesh choice). */
export function pipeDarcyFriction(reynolds: number, relativeRoughness = 0): number {
  if (reynolds < PIPE_TRANSITION_REYNOLDS) return 64 / reynolds
  return colebrookFriction(reynolds, relativeRoughness)
}

/** Fanning skin friction of a pipe, Cf = f/4. */
export function pipeSkinFriction(reynolds: number, relativeRoughness = 0): number {
  return pipeDarcyFriction(reynolds, relativeRoughness) / 4
}

/** Dean's correlation for plane-channel flow, Cf = 0.073 Re_2h^-1/4 with Re_2h = U_b 2h / nu (Dean 1978, J. Fluids Eng. 100, 215). */
export function deanChannelSkinFriction(reynoldsTwoHalfHeights: number): number {
  return 0.073 * reynoldsTwoHalfHeights ** -0.25
}

/**
 * Fanning skin friction of a plane channel from its hydraulic-diameter Reynolds number
 * (D_h = 4h, so Re_2h = Re_Dh / 2): laminar Poiseuille flow Cf = 12 / Re_2h below Re_Dh = 2300,
 * Dean's correlation above (the transitional band is taken as turbulent, the finer-mesh choice).
 */
export function channelSkinFriction(reynoldsHydraulic: number): number {
  const reynoldsTwoHalfHeights = reynoldsHydraulic / 2
  if (reynoldsHydraulic < PIPE_TRANSITION_REYNOLDS) return 12 / reynoldsTwoHalfHeights
  return Math.max(deanChannelSkinFriction(reynoldsTwoHalfHeights), 12 / reynoldsTwoHalfHeights)
}

/** Fully rough flat plate, local Cf = (2.87 + 1.58 log10(x/k_s))^-2.5 (Schlichting, Boundary-Layer Theory; from memory). */
export function fullyRoughPlateSkinFriction(lengthOverRoughness: number): number {
  return (2.87 + 1.58 * Math.log10(lengthOverRoughness)) ** -2.5
}

/**
 * Local skin friction at the end of a plate of Reynolds number Re_x with sand-grain roughness k_s:
 * the larger of the smooth value and the fully rough one, a common engineering approximation
 * (from memory) that is exact in the smooth and fully rough limits and conservative between.
 */
export function roughPlateSkinFriction(reynoldsX: number, lengthOverRoughness: number): number {
  const smooth = flatPlateSkinFriction(reynoldsX)
  if (!(lengthOverRoughness < 1e12)) return smooth
  return Math.max(smooth, fullyRoughPlateSkinFriction(Math.max(lengthOverRoughness, 2)))
}
