/**
 * Numbers as Eddyledger writes them, on screen, in the PDF record, in CSV and in mail: one rule,
 * so that a figure reads the same everywhere.
 *
 * - Scientific notation with a superscript power of ten (2.5×10⁵) from 100,000 up and below 0.001;
 *   plain digits between, with commas between thousands (25,000).
 * - Significant figures say how well a number is known: the engineer's own inputs as typed (up to
 *   six figures), figures computed from them by correlations (Re, y+, first-cell height) to three,
 *   and the cost model's order-of-magnitude estimates (cells, time steps, core-hours, wall-clock,
 *   memory) to two.
 * - A unit beside every dimensional value, after a narrow no-break space; durations in hours, as
 *   the budget is given.
 * Plain arithmetic, not locale formatting: browser and server write the same text.
 */

/** Significant figures for each kind of number (common practice, no source). */
export const FIGURES = { input: 6, derived: 3, estimate: 2 } as const

/** Narrow no-break space between a value and its unit. */
export const UNIT_SPACE = '\u202f'

const SCIENTIFIC_FROM = 1e5
const SCIENTIFIC_BELOW = 1e-3

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
}

function groupThousands(digits: string): string {
  const [whole, fraction] = digits.split('.')
  const grouped = whole!.replace(/\B(?=(\d{3})+(?!\d))/g, ',')
  return fraction === undefined ? grouped : `${grouped}.${fraction}`
}

function missing(value: number | null | undefined): value is null | undefined {
  return value === null || value === undefined || Number.isNaN(value)
}

/** Mantissa and power of ten of a rounded value, e.g. 251234 at 3 figures -> ["2.51", 5]. */
function scientificParts(value: number, figures: number): [string, number] {
  const [mantissa, exponent] = Math.abs(value).toExponential(Math.max(0, figures - 1)).split('e')
  return [String(Number(mantissa)), Number(exponent)]
}

/** A number to `figures` significant figures, by the one rule above. */
export function formatNumber(value: number | null | undefined, figures: number = FIGURES.derived): string {
  if (missing(value)) return '—'
  if (!Number.isFinite(value)) return value > 0 ? '∞' : '−∞'
  if (value === 0) return '0'
  const sign = value < 0 ? '−' : ''
  const rounded = Math.abs(Number(value.toPrecision(figures)))
  if (rounded >= SCIENTIFIC_FROM || rounded < SCIENTIFIC_BELOW) {
    const [mantissa, exponent] = scientificParts(value, figures)
    const power = String(exponent).split('').map((c) => SUPERSCRIPT[c] ?? c).join('')
    return `${sign}${mantissa}×10${power}`
  }
  const text = rounded >= 1000 ? groupThousands(String(rounded)) : String(rounded)
  return sign + text
}

/** Three significant figures unless told: a computed figure. */
export function formatSig(value: number | null | undefined, figures: number = FIGURES.derived): string {
  return formatNumber(value, figures)
}

/** The same rule as formatSig; kept for callers that spell out that a count may be large. */
export function formatSci(value: number | null | undefined, figures: number = FIGURES.derived): string {
  return formatNumber(value, figures)
}

/** An order-of-magnitude estimate of the cost model: two significant figures. */
export function formatEstimate(value: number | null | undefined): string {
  return formatNumber(value, FIGURES.estimate)
}

/** An input as the engineer gave it: up to six significant figures, nothing rounded away that was typed. */
export function formatInput(value: number | null | undefined): string {
  return formatNumber(value, FIGURES.input)
}

/** A value and its unit: "0.0123 mm". */
export function formatQuantity(value: number | null | undefined, unit: string, figures: number = FIGURES.derived): string {
  const text = formatNumber(value, figures)
  return unit && text !== '—' ? `${text}${UNIT_SPACE}${unit}` : text
}

/** A fraction as a percentage: 0.012 -> "1.2 %". */
export function formatPercent(fraction: number | null | undefined, figures = 2): string {
  if (missing(fraction)) return '—'
  return formatQuantity(fraction * 100, '%', figures)
}

/** Elapsed time in hours, the unit of the wall-clock budget; an estimate, so two figures. */
export function formatDuration(hours: number | null | undefined, figures: number = FIGURES.estimate): string {
  return formatQuantity(hours, 'h', figures)
}

/**
 * A number for a machine to read (CSV): rounded to `figures`, no thousands separators, a plain
 * "e" exponent where JavaScript writes one; empty when missing.
 */
export function formatPlain(value: number | null | undefined, figures: number = FIGURES.input): string {
  if (missing(value) || !Number.isFinite(value)) return ''
  return String(Number(value.toPrecision(figures)))
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
