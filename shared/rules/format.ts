/**
 * Numbers in the advice's sentences: three significant figures, thousands separated by commas,
 * scientific notation (one decimal) for the very large or small. Plain arithmetic rather than
 * locale formatting, so browser and server write the same text, and quickly.
 */
/** Powers of ten from 1e-330 to 1e310, exact as decimal literals: a lookup is much faster than 10 ** n. */
const POW10_OFFSET = 330
const POW10 = new Float64Array(641)
for (let exponent = -POW10_OFFSET; exponent <= 310; exponent++) POW10[exponent + POW10_OFFSET] = Number(`1e${exponent}`)

/** 10^exponent for an integer exponent. */
export function pow10(exponent: number): number {
  return POW10[exponent + POW10_OFFSET] ?? 10 ** exponent
}

/** An integer from 1,000 to 99,999 with its thousands separated. */
function groupThousands(integer: number): string {
  const thousands = Math.floor(integer / 1000)
  const rest = integer - thousands * 1000
  return `${thousands},${rest < 10 ? '00' : rest < 100 ? '0' : ''}${rest}`
}

export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return value > 0 ? 'more than 1e308' : String(value)
  if (value === 0) return '0'
  const sign = value < 0 ? '-' : ''
  const magnitude = Math.abs(value)
  if (magnitude >= 1e5 || magnitude < 1e-3) {
    let exponent = Math.floor(Math.log10(magnitude))
    // Two significant digits as an integer from 10 to 99, e.g. 32 for 3.2.
    let digits = Math.round((magnitude / pow10(exponent)) * 10)
    if (digits >= 100) {
      digits = Math.round(digits / 10)
      exponent += 1
    } else if (digits < 10) {
      digits *= 10
      exponent -= 1
    }
    const tenths = digits % 10
    return `${sign}${(digits - tenths) / 10}${tenths ? `.${tenths}` : ''}e${exponent}`
  }
  if (magnitude >= 1000) {
    const rounded = Math.round(magnitude)
    return sign + (rounded >= 1e5 ? formatNumber(rounded) : groupThousands(rounded))
  }
  const factor = magnitude >= 100 ? 1 : magnitude >= 10 ? 10 : magnitude >= 1 ? 100 : magnitude >= 0.1 ? 1e3 : magnitude >= 0.01 ? 1e4 : 1e5
  return sign + String(Math.round(magnitude * factor) / factor)
}

/** A signed score change, e.g. "+25" or "-10". */
export function formatScoreChange(change: number): string {
  return change > 0 ? `+${change}` : String(change)
}

/** Significant figures an estimate deserves: one when it is uncertain by a factor of 3 or more, two otherwise. */
export function significantFiguresFor(uncertaintyFactor: number): number {
  return uncertaintyFactor >= 3 ? 1 : 2
}

/** A value rounded to the significant figures its uncertainty allows (see significantFiguresFor). */
export function roundToBand(value: number, uncertaintyFactor: number): number {
  if (!Number.isFinite(value) || value === 0) return value
  const digits = significantFiguresFor(uncertaintyFactor)
  const scale = pow10(Math.floor(Math.log10(Math.abs(value))) - digits + 1)
  return Math.round(value / scale) * scale
}

/** "about 5e6 (2e6 to 1e7)": an estimate rounded to its band, with its range. */
export function formatEstimate(value: number, range: { low: number; high: number }, uncertaintyFactor: number): string {
  const central = formatNumber(roundToBand(value, uncertaintyFactor))
  const low = formatNumber(roundToBand(range.low, uncertaintyFactor))
  const high = formatNumber(roundToBand(range.high, uncertaintyFactor))
  return `about ${central} (${low} to ${high})`
}
