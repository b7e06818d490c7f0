/**
 * Reading a number an engineer typed, strictly: a decimal with an optional exponent ("12", "0.5",
 * ".5", "1e5", "2.5E-3"), nothing else. JavaScript's Number() would take "0x10" as 16, "1 000"
 * (after removing spaces) as 1000 and "" as 0; here each of those is refused with a message that
 * says what to type instead, so no value is guessed.
 */

export type ParsedNumber =
  | { ok: true; value: number | undefined }
  | { ok: false; message: string }

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/
const DECIMAL_COMMA = /^[+-]?\d+,\d+$/
const GROUPED = /^[+-]?\d{1,3}([ ,_\u00a0\u202f']\d{3})+(\.\d+)?$/

/** The text of a number field; empty text is "not given" (undefined), never zero. */
export function parseNumber(text: string, options: { integer?: boolean } = {}): ParsedNumber {
  const trimmed = text.trim().replace(/\u2212/g, '-')
  if (trimmed === '') return { ok: true, value: undefined }
  if (DECIMAL.test(trimmed)) {
    const value = Number(trimmed)
    if (!Number.isFinite(value)) return { ok: false, message: `${trimmed} is too large to compute with.` }
    if (options.integer && !Number.isInteger(value)) return { ok: false, message: 'Enter a whole number.' }
    return { ok: true, value }
  }
  if (/^[+-]?0[xXbBoO]/.test(trimmed)) {
    return { ok: false, message: 'Enter a decimal number; hexadecimal, binary and octal are not read.' }
  }
  if (GROUPED.test(trimmed)) {
    const plain = trimmed.replace(/[ ,_\u00a0\u202f']/g, '')
    return { ok: false, message: `Enter the digits without separators: ${plain}.` }
  }
  if (DECIMAL_COMMA.test(trimmed)) {
    return { ok: false, message: `Use a point for decimals: ${trimmed.replace(',', '.')}.` }
  }
  return { ok: false, message: 'Enter a number, e.g. 12, 0.5 or 1e5.' }
}
