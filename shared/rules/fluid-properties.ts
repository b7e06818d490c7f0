/**
 * Density and dynamic viscosity of the fluids the engine knows, in SI units.
 *
 * Air: Sutherland's law and the ideal gas. Water: IAPWS R12-08 viscosity with Kell's 1975 density
 * of liquid water at one atmosphere. A custom fluid brings its own density and viscosity.
 */

/** Sutherland's law reference viscosity of air, Pa s (Sutherland 1893; constants as tabulated in White, Viscous Fluid Flow). */
export const SUTHERLAND_REFERENCE_VISCOSITY = 1.716e-5
/** Sutherland's law reference temperature, K (same source). */
export const SUTHERLAND_REFERENCE_TEMPERATURE = 273.15
/** Sutherland's constant for air, K (same source). */
export const SUTHERLAND_CONSTANT = 110.4
/** Range in which Sutherland's law describes air well, K (White, Viscous Fluid Flow: roughly 100-1900 K). */
export const SUTHERLAND_TEMPERATURE_RANGE = { min: 100, max: 1900 } as const

/** Specific gas constant of dry air, J/(kg K) (standard value, e.g. ISO 2533 standard atmosphere). */
export const AIR_GAS_CONSTANT = 287.05
/** Ratio of specific heats of air (diatomic ideal gas, textbook value). */
export const AIR_HEAT_CAPACITY_RATIO = 1.4

/** Default temperature when none is given: 20 C, K (our choice: the usual laboratory reference). */
export const DEFAULT_TEMPERATURE = 293.15
/** Default pressure when none is given: one standard atmosphere, Pa (ISO 2533). */
export const DEFAULT_PRESSURE = 101325

/** Liquid-water range covered here, K: 0-100 C at ordinary pressure (Kell 1975 holds 0-150 C at 1 atm). */
export const WATER_TEMPERATURE_RANGE = { min: 273.15, max: 373.15 } as const

/** IAPWS R12-08 reference temperature, K (Huber et al. 2009, J. Phys. Chem. Ref. Data 38, 101). */
const IAPWS_REFERENCE_TEMPERATURE = 647.096
/** IAPWS R12-08 reference density, kg/m3 (same source). */
const IAPWS_REFERENCE_DENSITY = 322
/** IAPWS R12-08 reference viscosity, Pa s: the formulation gives micro-pascal seconds (same source). */
const IAPWS_REFERENCE_VISCOSITY = 1e-6
/** IAPWS R12-08 dilute-gas coefficients H_0..H_3 (same source, Table 1). */
const IAPWS_DILUTE_COEFFICIENTS = [1.67752, 2.20462, 0.6366564, -0.241605] as const
/**
 * IAPWS R12-08 residual coefficients H_ij, i = 0..5 (rows), j = 0..6 (columns), zeros where the
 * release has none (same source, Table 2).
 */
const IAPWS_RESIDUAL_COEFFICIENTS: readonly (readonly number[])[] = [
  [0.520094, 0.222531, -0.281378, 0.161913, -0.0325372, 0, 0],
  [0.0850895, 0.999115, -0.906851, 0.257399, 0, 0, 0],
  [-1.08374, 1.88797, -0.772479, 0, 0, 0, 0],
  [-0.289555, 1.26613, -0.489837, 0, 0.0698452, 0, -0.00435673],
  [0, 0, -0.25704, 0, 0, 0.00872102, 0],
  [0, 0.120573, 0, 0, 0, 0, -0.000593264],
]

/** Kell 1975 (J. Chem. Eng. Data 20, 97) numerator coefficients, t in C, result in kg/m3. */
const KELL_NUMERATOR = [999.83952, 16.945176, -7.9870401e-3, -46.170461e-6, 105.56302e-9, -280.54253e-12] as const
/** Kell 1975 denominator coefficient, 1/C (same source). */
const KELL_DENOMINATOR = 16.87985e-3

/** Dynamic viscosity of air by Sutherland's law, Pa s. */
export function airViscosity(temperatureK: number): number {
  const ratio = temperatureK / SUTHERLAND_REFERENCE_TEMPERATURE
  return (
    SUTHERLAND_REFERENCE_VISCOSITY *
    ratio ** 1.5 *
    ((SUTHERLAND_REFERENCE_TEMPERATURE + SUTHERLAND_CONSTANT) / (temperatureK + SUTHERLAND_CONSTANT))
  )
}

/** Density of air as an ideal gas, kg/m3. */
export function airDensity(temperatureK: number, pressurePa: number): number {
  return pressurePa / (AIR_GAS_CONSTANT * temperatureK)
}

/** Speed of sound in air as an ideal gas, m/s. */
export function airSpeedOfSound(temperatureK: number): number {
  return Math.sqrt(AIR_HEAT_CAPACITY_RATIO * AIR_GAS_CONSTANT * temperatureK)
}

/** Density of liquid water at one atmosphere by Kell's 1975 formula, kg/m3 (t from 0 to 150 C). */
export function waterDensity(temperatureK: number): number {
  const t = temperatureK - 273.15
  let numerator = 0
  for (let i = KELL_NUMERATOR.length - 1; i >= 0; i--) numerator = numerator * t + KELL_NUMERATOR[i]!
  return numerator / (1 + KELL_DENOMINATOR * t)
}

/**
 * Dynamic viscosity of water by IAPWS R12-08 without the critical enhancement (which the release
 * says may be omitted for industrial use), Pa s.
 */
export function waterViscosityIapws(temperatureK: number, density: number): number {
  const reducedTemperature = temperatureK / IAPWS_REFERENCE_TEMPERATURE
  const reducedDensity = density / IAPWS_REFERENCE_DENSITY

  let diluteSum = 0
  for (let i = 0; i < IAPWS_DILUTE_COEFFICIENTS.length; i++) {
    diluteSum += IAPWS_DILUTE_COEFFICIENTS[i]! / reducedTemperature ** i
  }
  const diluteGas = (100 * Math.sqrt(reducedTemperature)) / diluteSum

  const temperatureTerm = 1 / reducedTemperature - 1
  const densityTerm = reducedDensity - 1
  let residualSum = 0
  let temperaturePower = 1
  for (const row of IAPWS_RESIDUAL_COEFFICIENTS) {
    let densityPower = 1
    for (const coefficient of row) {
      residualSum += coefficient * temperaturePower * densityPower
      densityPower *= densityTerm
    }
    temperaturePower *= temperatureTerm
  }
  const residual = Math.exp(reducedDensity * residualSum)

  return diluteGas * residual * IAPWS_REFERENCE_VISCOSITY
}

export interface FluidState {
  medium: 'air' | 'water' | 'custom'
  /** kg/m3 */
  density: number
  /** dynamic viscosity, Pa s */
  viscosity: number
  /** kinematic viscosity, m2/s */
  kinematicViscosity: number
  /** m/s; air only */
  speedOfSound: number | null
  /** K; null for a custom fluid */
  temperatureK: number | null
}

export interface FluidDescription {
  medium: 'air' | 'water' | 'custom'
  temperatureK?: number | undefined
  pressurePa?: number | undefined
  density?: number | undefined
  viscosity?: number | undefined
}

/**
 * Properties of the case's fluid. For air and water they are computed from temperature (and
 * pressure for air); supplied density and viscosity are used only for a custom fluid.
 */
export function fluidState(fluid: FluidDescription): FluidState {
  if (fluid.medium === 'custom') {
    if (fluid.density === undefined || fluid.viscosity === undefined) {
      throw new Error('A custom fluid needs both density and viscosity.')
    }
    return {
      medium: 'custom',
      density: fluid.density,
      viscosity: fluid.viscosity,
      kinematicViscosity: fluid.viscosity / fluid.density,
      speedOfSound: null,
      temperatureK: null,
    }
  }
  const temperatureK = fluid.temperatureK ?? DEFAULT_TEMPERATURE
  if (fluid.medium === 'air') {
    const { min, max } = SUTHERLAND_TEMPERATURE_RANGE
    if (!(temperatureK >= min && temperatureK <= max)) {
      throw new RangeError(`Air temperature ${temperatureK} K is outside Sutherland's range of ${min}-${max} K.`)
    }
    const density = airDensity(temperatureK, fluid.pressurePa ?? DEFAULT_PRESSURE)
    const viscosity = airViscosity(temperatureK)
    return {
      medium: 'air',
      density,
      viscosity,
      kinematicViscosity: viscosity / density,
      speedOfSound: airSpeedOfSound(temperatureK),
      temperatureK,
    }
  }
  const { min, max } = WATER_TEMPERATURE_RANGE
  if (!(temperatureK >= min && temperatureK <= max)) {
    throw new RangeError(`Water temperature ${temperatureK} K is outside the liquid range of ${min}-${max} K.`)
  }
  const density = waterDensity(temperatureK)
  const viscosity = waterViscosityIapws(temperatureK, density)
  return {
    medium: 'water',
    density,
    viscosity,
    kinematicViscosity: viscosity / density,
    speedOfSound: null,
    temperatureK,
  }
}

/** Prandtl number of air near room temperature (textbook value 0.71-0.72; from memory). */
export const AIR_PRANDTL = 0.72
/** Turbulent recovery factor r = Pr^(1/3) (common practice; from memory). */
export const TURBULENT_RECOVERY_FACTOR = AIR_PRANDTL ** (1 / 3)

/** Adiabatic wall temperature T_aw = T_e (1 + r (gamma - 1)/2 M^2), K (textbook; from memory). */
export function adiabaticWallTemperature(edgeTemperature: number, mach: number, recovery = TURBULENT_RECOVERY_FACTOR): number {
  return edgeTemperature * (1 + (recovery * (AIR_HEAT_CAPACITY_RATIO - 1) * mach * mach) / 2)
}

/** Eckert's reference temperature T* = T_e + 0.5 (T_w - T_e) + 0.22 (T_aw - T_e), K (Eckert 1955, J. Aeronaut. Sci. 22, 585; from memory). */
export function eckertReferenceTemperature(edgeTemperature: number, wallTemperature: number, adiabaticWall: number): number {
  return edgeTemperature + 0.5 * (wallTemperature - edgeTemperature) + 0.22 * (adiabaticWall - edgeTemperature)
}

export interface ReferenceState {
  /** Eckert's reference temperature, K */
  temperatureK: number
  /** wall temperature, K (adiabatic when not given) */
  wallTemperatureK: number
  /** density and viscosity at the reference temperature (skin friction) */
  density: number
  viscosity: number
  /** density and kinematic viscosity at the wall (wall units) */
  wallDensity: number
  wallKinematicViscosity: number
}

/**
 * Properties of air for the compressible wall figures: skin friction at Eckert's reference
 * temperature and wall units at the wall temperature, at the free-stream pressure (boundary-layer
 * approximation). Clamped to Sutherland's range.
 */
function withinSutherland(temperatureK: number): number {
  return Math.min(SUTHERLAND_TEMPERATURE_RANGE.max, Math.max(SUTHERLAND_TEMPERATURE_RANGE.min, temperatureK))
}

export function airReferenceState(fluid: FluidState, pressurePa: number, mach: number, wallTemperatureK?: number): ReferenceState {
  const edge = fluid.temperatureK ?? DEFAULT_TEMPERATURE
  const adiabatic = adiabaticWallTemperature(edge, mach)
  const wall = withinSutherland(wallTemperatureK ?? adiabatic)
  const reference = withinSutherland(eckertReferenceTemperature(edge, wall, adiabatic))
  const wallDensity = airDensity(wall, pressurePa)
  return {
    temperatureK: reference,
    wallTemperatureK: wall,
    density: airDensity(reference, pressurePa),
    viscosity: airViscosity(reference),
    wallDensity,
    wallKinematicViscosity: airViscosity(wall) / wallDensity,
  }
}
