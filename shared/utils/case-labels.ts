/** What the questionnaire calls each choice, and the help beside each field (our own words). */
import type { Quantity } from '../rules'

export const REGIME_LABELS = { external: 'External flow', internal: 'Internal flow' } as const

export const GEOMETRY_LABELS = {
  streamlined: 'Streamlined body (wing, hull, blade)',
  bluff: 'Bluff body (vehicle, building, cylinder)',
  duct: 'Duct or pipe',
  rotating: 'Rotating machinery',
  complex: 'Complex assembly',
} as const

export const SEPARATION_LABELS = {
  none: 'None expected',
  mild: 'Mild, local and closed',
  massive: 'Massive (stall, bluff-body wake)',
} as const

export const MEDIUM_LABELS = { air: 'Air', water: 'Water', custom: 'Other fluid' } as const

export const PHYSICS_LABELS = {
  transition: 'Laminar-turbulent transition',
  heatTransfer: 'Heat transfer at walls',
  rotation: 'Rotation or strong swirl',
  buoyancy: 'Buoyancy',
  acoustics: 'Acoustics (noise sources)',
} as const

export const QUANTITY_LABELS: Record<Quantity, string> = {
  forces: 'Forces and moments',
  pressure: 'Surface pressure',
  'heat-transfer': 'Heat transfer',
  'unsteady-loads': 'Unsteady loads',
  noise: 'Noise',
  mixing: 'Mixing',
  statistics: 'Turbulence statistics',
}

export const CASE_HELP = {
  regime:
    'External: flow around a body in open surroundings. Internal: flow through a duct or pipe. It picks the skin-friction correlation (flat plate or pipe) and the boundary-layer thickness.',
  geometry:
    'The kind of body. It sets how much wall area the mesh must cover and whether vortex shedding is expected.',
  separation:
    'How much of the flow you expect to leave the wall. Separated regions are where steady RANS is least trusted and scale-resolving methods earn their cost.',
  medium:
    'Air and water properties are computed from temperature (and pressure for air). Choose another fluid to give density and viscosity yourself.',
  temperature: 'Static temperature of the oncoming or bulk flow. Sets the viscosity (and, for air, the density and speed of sound).',
  pressure: 'Static pressure, absolute. Used for the density of air (ideal gas).',
  density: 'Density of the fluid at the flow conditions.',
  viscosity: 'Dynamic viscosity at the flow conditions (1 cP = 1 mPa·s).',
  velocity: 'Free-stream velocity (external) or bulk velocity (internal). Enters the Reynolds and Mach numbers and the time step.',
  lengthExternal: 'Reference length along the flow: body length or chord. The Reynolds number and the boundary-layer thickness are based on it.',
  lengthInternal: 'Hydraulic diameter of the duct or pipe. The Reynolds number and the friction factor are based on it.',
  roughness: 'Equivalent sand-grain roughness of the wall, for internal flow. Leave empty for a smooth wall.',
  turbulenceIntensity:
    'Turbulence intensity of the incoming flow, in percent of the velocity. Sets the large-eddy Reynolds number (intensity × Re) and the Kolmogorov estimates.',
  physics: 'Physics that change which approach is trusted. Each one ticked can fire rules in the reasoning.',
  quantities: 'What the simulation must deliver. Mean forces suit RANS; unsteady loads, noise and statistics need time-resolved methods.',
  coreHours: 'Total compute you can spend on this case, in core-hours (cores × hours).',
  cores: 'Cores you can run on at once. With the core-hours it gives the wall-clock time.',
  wallClockHours: 'Longest elapsed time you can wait for the result, in hours.',
  yPlusTarget:
    'Optional. The y+ of the first cell centre you want; left empty, each wall treatment uses its own (≈1 resolved, ≈30-100 wall functions).',
  growthRatio: 'Ratio of successive cell heights away from the wall. Sets how many layers reach the boundary-layer edge.',
  requestedApproach:
    'Optional. The approach you mean to use if it is not the engine\'s, e.g. what a reviewer asked for. The record shows it beside the engine\'s recommendation, costed.',
  requestedWallTreatment:
    'Optional. The near-wall treatment you mean to use. A target y+ above must suit it: a resolved wall below 5, log-law wall functions from 30 to 300, a wall model from 30.',
  requestedReason: 'Why you choose differently from the engine: a sentence for the reviewer.',
} as const

/** Names of the figures a case and its advice are shown with (our own words). */
export const FIGURE_LABELS = {
  reynolds: 'Reynolds number',
  reynoldsTurbulent: 'Large-eddy Reynolds number',
  mach: 'Mach number',
} as const
