/**
 * Numbers as a CFD engineer reads them: significant figures, not fifteen digits; scientific
 * notation for cell counts and core-hours; a unit beside every value.
 */

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
}

function groupThousands(digits: string): string {
  const [whole, fraction] = digits.split('.')
  const grouped = whole!.replace(/\B(?=(\d{3})+(?!\d))/g, ',')
  return fraction === undefined ? grouped : `${grouped}.${fraction}`
}

/** `value` to `significant` figures; scientific notation outside 1e-3 .. 1e6. */
export function formatSig(value: number | null | undefined, significant = 3): string {
  if (value === null || value === undefined || Number.isNaN(value)) return '—'
  if (!Number.isFinite(value)) return value > 0 ? '∞' : '−∞'
  if (value === 0) return '0'
  const magnitude = Math.abs(value)
  if (magnitude >= 1e6 || magnitude < 1e-3) return formatSci(value, significant)
  const rounded = Number(value.toPrecision(significant))
  // toPrecision may leave trailing zeros that are not significant; Number() drops them.
  const text = magnitude >= 1000 ? groupThousands(String(Math.round(rounded))) : String(rounded)
  return text.replace('-', '−')
}

/** Scientific notation with a superscript exponent: 2.25×10⁷. Numbers from 1 to 1000 stay plain. */
export function formatSci(value: number | null | undefined, significant = 3): string {
  if (value === null || value === undefined || Number.isNaN(value)) return '—'
  if (!Number.isFinite(value)) return value > 0 ? '∞' : '−∞'
  if (value === 0) return '0'
  const [mantissaText, exponentText] = value.toExponential(Math.max(0, significant - 1)).split('e')
  const exponent = Number(exponentText)
  const mantissa = String(Number(mantissaText)).replace('-', '−')
  if (exponent >= 0 && exponent < 3) return String(Number(value.toPrecision(significant))).replace('-', '−')
  const power = String(exponent).split('').map((c) => SUPERSCRIPT[c] ?? c).join('')
  return `${mantissa}×10${power}`
}

/** A value and its unit, separated by a thin no-break space. */
export function formatQuantity(value: number | null | undefined, unit: string, significant = 3): string {
  const text = formatSig(value, significant)
  return unit && text !== '—' ? `${text}\u202f${unit}` : text
}

/** A fraction as a percentage: 0.012 -> "1.2 %". */
export function formatPercent(fraction: number | null | undefined, significant = 2): string {
  if (fraction === null || fraction === undefined || Number.isNaN(fraction)) return '—'
  return formatQuantity(fraction * 100, '%', significant)
}

/** Hours, in days when long: 9.75 h, 80.6 d. */
export function formatDuration(hours: number | null | undefined): string {
  if (hours === null || hours === undefined || Number.isNaN(hours)) return '—'
  if (hours >= 72) return formatQuantity(hours / 24, 'd')
  return formatQuantity(hours, 'h')
}

/**
 * A timestamp to the minute, in UTC: the same on the server and in every browser (no hydration
 * mismatch), and unambiguous in an audit trail.
 */
export function formatDateTime(iso: string | Date | null | undefined): string {
  if (!iso) return '—'
  const date = typeof iso === 'string' ? new Date(iso) : iso
  if (Number.isNaN(date.getTime())) return '—'
  const text = date.toLocaleString('en-GB', {
    year: 'numeric', month: 'short', day: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: 'UTC',
  })
  return `${text} UTC`
}
