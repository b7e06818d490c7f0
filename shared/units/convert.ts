/** Conversions between a questionnaire field's unit and the SI unit the engine works in (factors.ts). */
import { UNIT_CATALOGUE, unitOption, type QuantityKind } from './catalogue'
import { LINEAR_UNITS, type LinearUnit } from './factors'

function linear(expr: string): LinearUnit {
  const unit = LINEAR_UNITS[expr]
  if (!unit) throw new Error(`No conversion is defined for the unit "${expr}".`)
  return unit
}

const toBase = (value: number, expr: string) => {
  const { factor, offset = 0 } = linear(expr)
  return value * factor + offset
}
const fromBase = (value: number, expr: string) => {
  const { factor, offset = 0 } = linear(expr)
  return (value - offset) / factor
}

/** `value` in `unit` -> the engine's SI unit. Temperatures are absolute (°C and °F to K, offset included). */
export function toSI(kind: QuantityKind, value: number, unit: string): number {
  return fromBase(toBase(value, unitOption(kind, unit).expr), UNIT_CATALOGUE[kind].si)
}

/** An SI value of the quantity -> `unit`. */
export function fromSI(kind: QuantityKind, value: number, unit: string): number {
  return fromBase(toBase(value, UNIT_CATALOGUE[kind].si), unitOption(kind, unit).expr)
}

/** From one unit of the quantity to another. */
export function convertUnit(kind: QuantityKind, value: number, from: string, to: string): number {
  if (from === to) return value
  return fromBase(toBase(value, unitOption(kind, from).expr), unitOption(kind, to).expr)
}

/**
 * A converted value trimmed of float noise for showing in an input (68.00000000000001 -> 68).
 * Ten significant figures keep far more than any engineering input needs.
 */
export function tidy(value: number, significant = 10): number {
  if (!Number.isFinite(value) || value === 0) return value
  return Number(value.toPrecision(significant))
}
