/** The units each dimensional field of the questionnaire accepts, and the default per unit system. */

export const QUANTITY_KINDS = ['length', 'velocity', 'temperature', 'pressure', 'viscosity', 'density', 'roughness'] as const
export type QuantityKind = (typeof QUANTITY_KINDS)[number]

export const UNIT_SYSTEMS = ['SI', 'imperial'] as const
export type UnitSystem = (typeof UNIT_SYSTEMS)[number]

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
    defaults: { SI: 'm', imperial: 'ft' },
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
    defaults: { SI: 'm/s', imperial: 'ft/s' },
  },
  temperature: {
    label: 'Temperature',
    si: 'K',
    units: [
      { id: 'K', label: 'K', expr: 'K' },
      { id: 'degC', label: '°C', expr: 'degC' },
      { id: 'degF', label: '°F', expr: 'degF' },
    ],
    defaults: { SI: 'degC', imperial: 'degF' },
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
    defaults: { SI: 'kPa', imperial: 'psi' },
  },
  viscosity: {
    label: 'Dynamic viscosity',
    si: 'Pa s',
    units: [
      { id: 'Pa s', label: 'Pa·s', expr: 'Pa s' },
      { id: 'mPa s', label: 'mPa·s', expr: 'mPa s' },
      { id: 'cP', label: 'cP', expr: 'cP' },
    ],
    defaults: { SI: 'Pa s', imperial: 'cP' },
  },
  density: {
    label: 'Density',
    si: 'kg/m^3',
    units: [
      { id: 'kg/m3', label: 'kg/m³', expr: 'kg/m^3' },
      { id: 'lb/ft3', label: 'lb/ft³', expr: 'lbm/ft^3' },
    ],
    defaults: { SI: 'kg/m3', imperial: 'lb/ft3' },
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
    defaults: { SI: 'mm', imperial: 'in' },
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
