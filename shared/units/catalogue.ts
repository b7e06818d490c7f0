/** The units each dimensional field of the questionnaire accepts, and the default per unit system. */

export const QUANTITY_KINDS = ['length', 'velocity', 'temperature', 'pressure', 'viscosity', 'density', 'roughness', 'stress'] as const
export type QuantityKind = (typeof QUANTITY_KINDS)[number]

/** A decision keeps the system its case was typed in; the engine always works in SI. */
export const UNIT_SYSTEMS = ['si', 'imperial'] as const
export type UnitSystem = (typeof UNIT_SYSTEMS)[number]

export const UNIT_SYSTEM_LABELS: Readonly<Record<UnitSystem, string>> = { si: 'SI units', imperial: 'Imperial units' }

/** A stored or remembered unit-system name, older spellings included ("SI"); null when unknown. */
export function unitSystemOf(value: unknown): UnitSystem | null {
  if (typeof value !== 'string') return null
  const lower = value.toLowerCase()
  return (UNIT_SYSTEMS as readonly string[]).includes(lower) ? (lower as UnitSystem) : null
}

export interface UnitOption {
  /** our id, stored in forms and preferences */
  id: string
  /** what the engineer reads */
  label: string
  /** the unit as mathjs parses it */
  expr: string
}

export interface QuantityCatalogue {
  label: string
  /** the unit the engine works in */
  si: string
  units: readonly UnitOption[]
  defaults: Record<UnitSystem, string>
}

export const UNIT_CATALOGUE: Readonly<Record<QuantityKind, QuantityCatalogue>> = {
  length: {
    label: 'Length',
    si: 'm',
    units: [
      { id: 'm', label: 'm', expr: 'm' },
      { id: 'mm', label: 'mm', expr: 'mm' },
      { id: 'in', label: 'in', expr: 'in' },
      { id: 'ft', label: 'ft', expr: 'ft' },
    ],
    defaults: { si: 'm', imperial: 'ft' },
  },
  velocity: {
    label: 'Velocity',
    si: 'm/s',
    units: [
      { id: 'm/s', label: 'm/s', expr: 'm/s' },
      { id: 'km/h', label: 'km/h', expr: 'km/h' },
      { id: 'ft/s', label: 'ft/s', expr: 'ft/s' },
      { id: 'kn', label: 'kn', expr: 'knot' },
    ],
    defaults: { si: 'm/s', imperial: 'ft/s' },
  },
  temperature: {
    label: 'Temperature',
    si: 'K',
    units: [
      { id: 'K', label: 'K', expr: 'K' },
      { id: 'degC', label: '°C', expr: 'degC' },
      { id: 'degF', label: '°F', expr: 'degF' },
    ],
    defaults: { si: 'degC', imperial: 'degF' },
  },
  pressure: {
    label: 'Pressure',
    si: 'Pa',
    units: [
      { id: 'Pa', label: 'Pa', expr: 'Pa' },
      { id: 'kPa', label: 'kPa', expr: 'kPa' },
      { id: 'bar', label: 'bar', expr: 'bar' },
      { id: 'psi', label: 'psi', expr: 'psi' },
    ],
    defaults: { si: 'kPa', imperial: 'psi' },
  },
  viscosity: {
    label: 'Dynamic viscosity',
    si: 'Pa s',
    units: [
      { id: 'Pa s', label: 'Pa·s', expr: 'Pa s' },
      { id: 'mPa s', label: 'mPa·s', expr: 'mPa s' },
      { id: 'cP', label: 'cP', expr: 'cP' },
    ],
    defaults: { si: 'Pa s', imperial: 'cP' },
  },
  density: {
    label: 'Density',
    si: 'kg/m^3',
    units: [
      { id: 'kg/m3', label: 'kg/m³', expr: 'kg/m^3' },
      { id: 'lb/ft3', label: 'lb/ft³', expr: 'lbm/ft^3' },
    ],
    defaults: { si: 'kg/m3', imperial: 'lb/ft3' },
  },
  roughness: {
    label: 'Roughness',
    si: 'm',
    units: [
      { id: 'm', label: 'm', expr: 'm' },
      { id: 'mm', label: 'mm', expr: 'mm' },
      { id: 'um', label: 'µm', expr: 'um' },
      { id: 'in', label: 'in', expr: 'in' },
    ],
    defaults: { si: 'mm', imperial: 'in' },
  },
  // Wall shear stress in the near-wall figures; pounds-force per square foot in imperial.
  stress: {
    label: 'Stress',
    si: 'Pa',
    units: [
      { id: 'Pa', label: 'Pa', expr: 'Pa' },
      { id: 'psf', label: 'lbf/ft²', expr: 'lbf/ft^2' },
    ],
    defaults: { si: 'Pa', imperial: 'psf' },
  },
}

export function unitOption(kind: QuantityKind, unit: string): UnitOption {
  const option = UNIT_CATALOGUE[kind].units.find((u) => u.id === unit)
  if (!option) throw new Error(`${UNIT_CATALOGUE[kind].label} has no unit "${unit}".`)
  return option
}

export function unitLabel(kind: QuantityKind, unit: string): string {
  return unitOption(kind, unit).label
}

export function defaultUnit(kind: QuantityKind, system: UnitSystem): string {
  return UNIT_CATALOGUE[kind].defaults[system]
}

export function isUnitOf(kind: QuantityKind, unit: string): boolean {
  return UNIT_CATALOGUE[kind].units.some((u) => u.id === unit)
}
