/**
 * The flow's scales for one case: fluid properties, Reynolds and Mach numbers, the regime,
 * Kolmogorov estimates, the domain, skin friction, roughness and wall units of the reference wall.
 */
import { readApplication, type ApplicationReading } from './application'
import type { CaseInput } from './case-input'
import { resolveDomain, type Domain } from './domain'
import { DEFAULT_PRESSURE, airReferenceState, fluidState, type FluidState, type ReferenceState } from './fluid-properties'
import { ductThickness, laminarPlateThickness, turbulentPlateThickness, wallUnits, type WallUnits } from './near-wall'
import { PLATE_TRANSITION_REYNOLDS, classifyRegime, type FlowRegime } from './regime'
import { roughnessFigures, sandGrainFromRoughnessLength, type RoughnessFigures } from './roughness'
import { blasiusSkinFriction, channelSkinFriction, flatPlateSkinFriction, pipeSkinFriction, roughPlateSkinFriction } from './skin-friction'

export interface FlowPhysics {
  fluid: FluidState
  velocity: number
  reynolds: number
  /** Re_L = turbulence intensity x Re, the large-eddy Reynolds number */
  reynoldsTurbulent: number
  mach: number | null
  /** eta = L Re^(-3/4) with the dissipation rate U^3/L of the energetic eddies, m */
  kolmogorovLength: number
  /** Re_L^(9/4): grid points to resolve every eddy in a box of size L */
  kolmogorovCells: number
  /** k_s / D (internal) or k_s / L (external); 0 when smooth */
  relativeRoughness: number
  domain: Domain
  regime: FlowRegime
  application: ApplicationReading
  /** wall units of the reference wall (compressible: Eckert's reference temperature) */
  wall: WallUnits
  /** air only: the reference and wall states behind the wall figures */
  reference: ReferenceState | null
  roughness: RoughnessFigures | null
  /** where the turbulent boundary layer starts on the reference wall, as a fraction of L (external) */
  turbulentStart: number
  /** thickness of the boundary layer where it separates, i.e. of the separated shear layer's origin, m */
  separationThickness: number
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

function sandGrainHeight(input: CaseInput): number {
  if (input.roughnessLength !== undefined) return sandGrainFromRoughnessLength(input.roughnessLength)
  return input.roughness ?? 0
}

interface WallBasis {
  skinFriction: number
  boundaryLayerThickness: number
}

/** Skin friction and thickness of the reference wall at the (reference-state) Reynolds number. */
function wallBasis(input: CaseInput, domain: Domain, regime: FlowRegime, reynolds: number, roughness: number): WallBasis {
  if (input.regime === 'internal') {
    const relative = roughness / input.length
    const channel = domain.crossSection === 'channel' && relative === 0
    return {
      skinFriction: channel ? channelSkinFriction(reynolds) : pipeSkinFriction(reynolds, relative),
      boundaryLayerThickness: ductThickness(input.length, domain.crossSection ?? 'pipe'),
    }
  }
  if (regime.boundaryLayer === 'laminar') {
    return {
      skinFriction: blasiusSkinFriction(reynolds),
      boundaryLayerThickness: Math.min(laminarPlateThickness(input.length, reynolds), input.length),
    }
  }
  return {
    skinFriction: roughness > 0 ? roughPlateSkinFriction(reynolds, input.length / roughness) : flatPlateSkinFriction(reynolds),
    boundaryLayerThickness: Math.min(turbulentPlateThickness(input.length, reynolds), input.length),
  }
}

/** Everything the engine derives from the case before weighing approaches. `velocity` can be overridden for Reynolds-number sweeps. */
export function flowPhysics(input: CaseInput, velocity = input.velocity): FlowPhysics {
  const fluid = fluidState(input.fluid)
  const reynolds = reynoldsNumber(fluid.density, velocity, input.length, fluid.viscosity)
  const mach = fluid.speedOfSound === null ? null : velocity / fluid.speedOfSound
  const domain = resolveDomain(input)
  const regime = classifyRegime(input, reynolds, mach)
  const reference = mach === null ? null : airReferenceState(fluid, input.fluid.pressurePa ?? DEFAULT_PRESSURE, mach, input.wallTemperatureK)
  const referenceReynolds = reference ? reynoldsNumber(reference.density, velocity, input.length, reference.viscosity) : reynolds
  const roughness = sandGrainHeight(input)
  const basis = wallBasis(input, domain, regime, referenceReynolds, roughness)
  const wall = wallUnits({
    skinFriction: basis.skinFriction,
    boundaryLayerThickness: basis.boundaryLayerThickness,
    density: reference ? reference.wallDensity : fluid.density,
    kinematicViscosity: reference ? reference.wallKinematicViscosity : fluid.kinematicViscosity,
    velocity,
    shearDensity: reference ? reference.density : undefined,
  })
  const reynoldsTurbulent = input.turbulenceIntensity * reynolds
  const external = input.regime === 'external'
  return {
    fluid,
    velocity,
    reynolds,
    reynoldsTurbulent,
    mach,
    kolmogorovLength: kolmogorovLength(input.length, reynoldsTurbulent),
    kolmogorovCells: kolmogorovCells(reynoldsTurbulent),
    relativeRoughness: roughness / input.length,
    domain,
    regime,
    application: readApplication(input),
    wall,
    reference,
    roughness: roughness > 0 ? roughnessFigures(roughness, input.roughnessLength ?? null, wall.frictionVelocity, wall.viscousLength * wall.frictionVelocity) : null,
    turbulentStart: external ? Math.min(1, PLATE_TRANSITION_REYNOLDS / reynolds) : 0,
    separationThickness:
      external && regime.boundaryLayer === 'laminar'
        ? Math.min(laminarPlateThickness(input.length, reynolds), input.length)
        : Math.min(turbulentPlateThickness(input.length, reynolds), basis.boundaryLayerThickness),
  }
}
