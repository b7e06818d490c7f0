/**
 * The flow regime of a case from published thresholds: whether the flow is laminar, transitional
 * or turbulent (by the reference wall or wake it is judged on), the state of the boundary layer,
 * the state of a bluff-body wake, the Mach regime, and the shedding Strouhal number.
 */

import { PIPE_TRANSITION_REYNOLDS, PLATE_TRANSITION_REYNOLDS } from './skin-friction'

export type FlowState = 'laminar' | 'transitional' | 'turbulent'
export type WakeState = 'none' | 'steady' | 'periodic-laminar' | 'three-dimensional' | 'turbulent'
export type MachRegime = 'incompressible' | 'subsonic-compressible' | 'transonic' | 'supersonic' | 'hypersonic'
/** What the classification was judged on. */
export type RegimeBasis = 'pipe' | 'plate' | 'bluff-wake'

export { PLATE_TRANSITION_REYNOLDS }
/** Pipe flow: laminar below Re_D of about 2300 (Reynolds 1883; common practice). */
export const PIPE_LAMINAR_REYNOLDS = PIPE_TRANSITION_REYNOLDS
/** Pipe flow: fully turbulent above Re_D of about 4000; puffs and slugs between (common practice; Avila et al. 2011, Science 333, 192). */
export const PIPE_TURBULENT_REYNOLDS = 4000
/**
 * Low-Reynolds-number aerofoils and plates: below a chord Reynolds number of about 3e4 the
 * boundary layer stays laminar and a laminar separation seldom reattaches (Carmichael 1981,
 * NASA CR-165803; from memory).
 */
export const PLATE_LAMINAR_REYNOLDS = 3e4
/** Circular-cylinder wake: steady below Re of about 47 (Williamson 1996, Annu. Rev. Fluid Mech. 28, 477). */
export const WAKE_STEADY_REYNOLDS = 47
/** Circular-cylinder wake: periodic and two-dimensional up to about Re 190, three-dimensional above (same source). */
export const WAKE_THREE_DIMENSIONAL_REYNOLDS = 190
/** Circular-cylinder wake: the separated shear layers turn turbulent from about Re 1000-1200 (Bloor 1964; Williamson 1996). */
export const WAKE_TURBULENT_REYNOLDS = 1000
/** Circular cylinder: the boundary layer starts to turn turbulent before separation at the drag crisis, Re of about 2e5 (Achenbach 1968; Roshko 1961; from memory). */
export const DRAG_CRISIS_REYNOLDS = 2e5
/** Circular cylinder: transcritical flow, turbulent boundary layer and regular shedding again, above Re of about 3.5e6 (Roshko 1961, JFM 10, 345). */
export const TRANSCRITICAL_REYNOLDS = 3.5e6

/** Mach regimes (Anderson, Modern Compressible Flow; common practice): density changes exceed about 5% above Mach 0.3. */
export const MACH_COMPRESSIBLE = 0.3
/** Local supersonic pockets and shocks appear from a free-stream Mach number of about 0.7 on aerofoils (critical Mach number; from memory). */
export const MACH_TRANSONIC = 0.7
export const MACH_SUPERSONIC = 1.2
/** Hypersonic from about Mach 5 (Anderson, Hypersonic and High-Temperature Gas Dynamics; from memory). */
export const MACH_HYPERSONIC = 5
/** Shock buffet on aerofoils and wings between about Mach 0.7 and 0.95 (Jacquin et al. 2009, AIAA J. 47, 1985; from memory). */
export const BUFFET_MACH_RANGE = { min: 0.7, max: 0.95 } as const

/**
 * Shedding Strouhal numbers f L / U, one representative value per wake regime: laminar periodic
 * shedding 0.16 (Roshko 1954, NACA TN 3169: St = 0.212 - 4.5/Re gives 0.167 at Re 100; Williamson
 * 1996 measures 0.164); subcritical 0.21 (Roshko 1954: 0.212 - 2.7/Re; about 0.21 at Re 3900);
 * critical, scattered from 0.2 to 0.45, taken at its lower end 0.2 (the longer period); transcritical
 * 0.27 (Roshko 1961, checked); sharp-edged bodies 0.13 (square cylinder, Lyn et al. 1995, JFM 304, 285;
 * Okajima 1982, JFM 123, 379; from memory).
 */
export const STROUHAL = {
  laminarShedding: 0.16,
  subcritical: 0.21,
  critical: 0.2,
  transcritical: 0.27,
  sharpEdged: 0.13,
} as const
/** Transonic shock buffet on aerofoils: about 0.066 on the chord (OAT15A, Jacquin et al. 2009, AIAA J. 47, 1985: about 69 Hz; from memory). */
export const BUFFET_STROUHAL = 0.066

export interface RegimeInput {
  regime: 'external' | 'internal'
  geometry: 'streamlined' | 'bluff' | 'duct' | 'rotating' | 'complex'
  separation: 'none' | 'mild' | 'massive'
}

export interface FlowRegime {
  /** laminar, transitional or turbulent, judged on `basis` */
  state: FlowState
  boundaryLayer: FlowState
  wake: WakeState
  basis: RegimeBasis
  mach: MachRegime
  /** the shedding Strouhal number when the body sheds vortices, else null */
  strouhal: number | null
  /** the thresholds the state was judged against, for the advice's explanation */
  thresholds: { laminarBelow: number; turbulentAbove: number }
}

export function machRegime(mach: number | null): MachRegime {
  if (mach === null || mach < MACH_COMPRESSIBLE) return 'incompressible'
  if (mach < MACH_TRANSONIC) return 'subsonic-compressible'
  if (mach < MACH_SUPERSONIC) return 'transonic'
  return mach < MACH_HYPERSONIC ? 'supersonic' : 'hypersonic'
}

/** Bluff bodies, and complex bodies separating massively, are judged on their wake. */
function judgedOnWake(input: RegimeInput): boolean {
  if (input.regime === 'internal') return false
  return input.geometry === 'bluff' || (input.geometry === 'complex' && input.separation === 'massive')
}

function stateBetween(reynolds: number, laminarBelow: number, turbulentAbove: number): FlowState {
  if (reynolds < laminarBelow) return 'laminar'
  return reynolds < turbulentAbove ? 'transitional' : 'turbulent'
}

function wakeState(reynolds: number): WakeState {
  if (reynolds < WAKE_STEADY_REYNOLDS) return 'steady'
  if (reynolds < WAKE_THREE_DIMENSIONAL_REYNOLDS) return 'periodic-laminar'
  return reynolds < WAKE_TURBULENT_REYNOLDS ? 'three-dimensional' : 'turbulent'
}

/** Shedding Strouhal number of a bluff wake at this Reynolds number, or null when it does not shed. */
export function sheddingStrouhal(reynolds: number, geometry: RegimeInput['geometry']): number | null {
  if (reynolds < WAKE_STEADY_REYNOLDS) return null
  if (reynolds < WAKE_THREE_DIMENSIONAL_REYNOLDS) return STROUHAL.laminarShedding
  if (geometry === 'complex') return STROUHAL.sharpEdged
  if (reynolds < DRAG_CRISIS_REYNOLDS) return STROUHAL.subcritical
  return reynolds < TRANSCRITICAL_REYNOLDS ? STROUHAL.critical : STROUHAL.transcritical
}

function bluffRegime(reynolds: number, input: RegimeInput, mach: MachRegime): FlowRegime {
  return {
    state: stateBetween(reynolds, WAKE_THREE_DIMENSIONAL_REYNOLDS, WAKE_TURBULENT_REYNOLDS),
    boundaryLayer: stateBetween(reynolds, DRAG_CRISIS_REYNOLDS, PLATE_TRANSITION_REYNOLDS),
    wake: wakeState(reynolds),
    basis: 'bluff-wake',
    mach,
    strouhal: sheddingStrouhal(reynolds, input.geometry),
    thresholds: { laminarBelow: WAKE_THREE_DIMENSIONAL_REYNOLDS, turbulentAbove: WAKE_TURBULENT_REYNOLDS },
  }
}

/**
 * The regime of a case at Reynolds number `reynolds` (built on the reference length: hydraulic
 * diameter inside, body length or diameter outside).
 */
export function classifyRegime(input: RegimeInput, reynolds: number, mach: number | null): FlowRegime {
  const compressibility = machRegime(mach)
  if (judgedOnWake(input)) return bluffRegime(reynolds, input, compressibility)
  const internal = input.regime === 'internal'
  const laminarBelow = internal ? PIPE_LAMINAR_REYNOLDS : PLATE_LAMINAR_REYNOLDS
  const turbulentAbove = internal ? PIPE_TURBULENT_REYNOLDS : PLATE_TRANSITION_REYNOLDS
  const state = stateBetween(reynolds, laminarBelow, turbulentAbove)
  const separated = !internal && input.separation === 'massive'
  const buffet =
    !internal && (input.geometry === 'streamlined' || input.geometry === 'rotating') && input.separation !== 'none' &&
    mach !== null && mach >= BUFFET_MACH_RANGE.min && mach <= BUFFET_MACH_RANGE.max
  return {
    state,
    boundaryLayer: state,
    wake: separated ? wakeState(reynolds) : 'none',
    basis: internal ? 'pipe' : 'plate',
    mach: compressibility,
    strouhal: buffet ? BUFFET_STROUHAL : separated ? sheddingStrouhal(reynolds, input.geometry) : null,
    thresholds: { laminarBelow, turbulentAbove },
  }
}
