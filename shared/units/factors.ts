/**
 * Each catalogue unit (by its `expr`) as a linear map to its quantity's SI unit:
 * SI value = value × factor + offset. Exact definitions from NIST Special Publication 811 (2008),
 * appendix B.8 / B.9, unless noted; tests/unit/shared/units/factors.spec.ts checks every one
 * against mathjs's own unit definitions. A closed list of numbers instead of a unit parser keeps
 * the questionnaire's scripts small (mathjs's unit system alone is some 70 kB of gzip).
 */
export interface LinearUnit {
  factor: number
  offset?: number
}

const INCH = 0.0254 // international inch, exact
const FOOT = 0.3048 // international foot, exact
const POUND = 0.45359237 // avoirdupois pound, kg, exact
const STANDARD_GRAVITY = 9.80665 // m/s², exact (psi is a pound-force per square inch)

export const LINEAR_UNITS: Readonly<Record<string, LinearUnit>> = {
  // length and roughness, to m
  'm': { factor: 1 },
  'mm': { factor: 1e-3 },
  'um': { factor: 1e-6 },
  'in': { factor: INCH },
  'ft': { factor: FOOT },
  // velocity, to m/s; the international knot is 1852 m per hour
  'm/s': { factor: 1 },
  'km/h': { factor: 1000 / 3600 },
  'ft/s': { factor: FOOT },
  'knot': { factor: 1852 / 3600 },
  // temperature, absolute, to K: T/K = t/°C + 273.15 = (t/°F + 459.67)/1.8
  'K': { factor: 1 },
  'degC': { factor: 1, offset: 273.15 },
  'degF': { factor: 1 / 1.8, offset: 459.67 / 1.8 },
  // pressure (and stress), to Pa
  'Pa': { factor: 1 },
  'kPa': { factor: 1e3 },
  'bar': { factor: 1e5 },
  'psi': { factor: (POUND * STANDARD_GRAVITY) / (INCH * INCH) },
  // stress, to Pa: a pound-force per square foot
  'lbf/ft^2': { factor: (POUND * STANDARD_GRAVITY) / (FOOT * FOOT) },
  // dynamic viscosity, to Pa s; 1 P = 0.1 Pa s
  'Pa s': { factor: 1 },
  'mPa s': { factor: 1e-3 },
  'cP': { factor: 1e-3 },
  // density, to kg/m³
  'kg/m^3': { factor: 1 },
  'lbm/ft^3': { factor: POUND / (FOOT * FOOT * FOOT) },
}
