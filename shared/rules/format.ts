/**
 * Numbers in the advice's sentences: three significant figures, thousands separated by commas,
 * scientific notation (one decimal) for the very large or small. Plain arithmetic rather than
 * locale formatting, so browser and server write the same text, and quickly.
 */
function groupThousands(integer: number): string {
  const digits = String(integer)
  let grouped = ''
  for (let index = 0; index < digits.length; index++) {
    if (index > 0 && (digits.length - index) % 3 === 0) grouped += ','
    grouped += digits[index]
  }
  return grouped
}

export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return value > 0 ? 'more than 1e308' : String(value)
  if (value === 0) return '0'
  const sign = value < 0 ? '-' : ''
  const magnitude = Math.abs(value)
  if (magnitude >= 1e5 || magnitude < 1e-3) {
    let exponent = Math.floor(Math.log10(magnitude))
    // Two significant digits as an integer from 10 to 99, e.g. 32 for 3.2.
    let digits = Math.round((magnitude / 10 ** exponent) * 10)
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
  if (magnitude >= 1000) return sign + groupThousands(Math.round(magnitude))
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
  const scale = 10 ** (Math.floor(Math.log10(Math.abs(value))) - digits + 1)
  return Math.round(value / scale) * scale
}

/** "about 5e6 (2e6 to 1e7)": an estimate rounded to its band, with its range. */
export function formatEstimate(value: number, range: { low: number; high: number }, uncertaintyFactor: number): string {
  const round = (v: number) => formatNumber(roundToBand(v, uncertaintyFactor))
  return `about ${round(value)} (${round(range.low)} to ${round(range.high)})`
}
