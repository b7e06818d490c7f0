/** Conversions between a questionnaire field's unit and the SI unit the engine works in, by mathjs. */
import { UNIT_CATALOGUE, unitOption, type QuantityKind } from './catalogue'
import { math } from './math'

/** `value` in `unit` -> the engine's SI unit. Temperatures are absolute (°C and °F to K, offset included). */
export function toSI(kind: QuantityKind, value: number, unit: string): number {
  return math.unit(value, unitOption(kind, unit).expr).toNumber(UNIT_CATALOGUE[kind].si)
}

/** An SI value of the quantity -> `unit`. */
export function fromSI(kind: QuantityKind, value: number, unit: string): number {
  return math.unit(value, UNIT_CATALOGUE[kind].si).toNumber(unitOption(kind, unit).expr)
}

/** From one unit of the quantity to another. */
export function convertUnit(kind: QuantityKind, value: number, from: string, to: string): number {
  if (from === to) return value
  return math.unit(value, unitOption(kind, from).expr).toNumber(unitOption(kind, to).expr)
}

/**
 * A converted value trimmed of float noise for showing in an input (68.00000000000001 -> 68).
 * Ten significant figures keep far more than any engineering input needs.
 */
export function tidy(value: number, significant = 10): number {
  if (!Number.isFinite(value) || value === 0) return value
  return Number(value.toPrecision(significant))
}
