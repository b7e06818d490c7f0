/**
 * The flow's scales for one case: fluid properties, Reynolds and Mach numbers, Kolmogorov
 * estimates, skin friction and wall units of the reference wall.
 */
import type { CaseInput } from './case-input'
import { fluidState, type FluidState } from './fluid-properties'
import { flatPlateSkinFriction, pipeSkinFriction } from './skin-friction'
import { turbulentPlateThickness, wallUnits, type WallUnits } from './near-wall'

export interface FlowPhysics {
  fluid: FluidState
  reynolds: number
  /** Re_L = turbulence intensity x Re, the Reynolds number of the large eddies */
  reynoldsTurbulent: number
  mach: number | null
  /** eta = L Re_L^(-3/4), m */
  kolmogorovLength: number
  /** Re_L^(9/4): grid points to resolve every eddy in a box of size L */
  kolmogorovCells: number
  /** k/D, internal flow only; 0 when smooth */
  relativeRoughness: number
  wall: WallUnits
}

/** Reynolds number Re = rho U L / mu. */
export function reynoldsNumber(density: number, velocity: number, length: number, viscosity: number): number {
  return (density * velocity * length) / viscosity
}

/** Kolmogorov length from the large-eddy Reynolds number: eta = L Re_L^(-3/4) (Kolmogorov 1941; Pope, Turbulent Flows 2000, sec. 6.1). */
export function kolmogorovLength(length: number, reynoldsTurbulent: number): number {
  return length * reynoldsTurbulent ** -0.75
}

/** Grid points to resolve all scales in isotropic turbulence, N ~ Re_L^(9/4) (Pope, Turbulent Flows 2000, sec. 9.1). */
export function kolmogorovCells(reynoldsTurbulent: number): number {
  return reynoldsTurbulent ** 2.25
}

/** Everything the engine derives from the case before weighing approaches. `velocity` can be overridden for Reynolds-number sweeps. */
export function flowPhysics(input: CaseInput, velocity = input.velocity): FlowPhysics {
  const fluid = fluidState(input.fluid)
  const reynolds = reynoldsNumber(fluid.density, velocity, input.length, fluid.viscosity)
  const reynoldsTurbulent = input.turbulenceIntensity * reynolds
  const relativeRoughness = input.regime === 'internal' ? (input.roughness ?? 0) / input.length : 0
  const skinFriction =
    input.regime === 'external' ? flatPlateSkinFriction(reynolds) : pipeSkinFriction(reynolds, relativeRoughness)
  const boundaryLayerThickness =
    input.regime === 'external' ? Math.min(turbulentPlateThickness(input.length, reynolds), input.length) : input.length / 2
  return {
    fluid,
    reynolds,
    reynoldsTurbulent,
    mach: fluid.speedOfSound === null ? null : velocity / fluid.speedOfSound,
    kolmogorovLength: kolmogorovLength(input.length, reynoldsTurbulent),
    kolmogorovCells: kolmogorovCells(reynoldsTurbulent),
    relativeRoughness,
    wall: wallUnits({
      skinFriction,
      density: fluid.density,
      kinematicViscosity: fluid.kinematicViscosity,
      velocity,
      boundaryLayerThickness,
    }),
  }
}
