import type { Ref } from 'vue'
import { parseNumber } from '#shared/format/parse'

const show = (n: number | null | undefined) => (n === undefined || n === null || Number.isNaN(n) ? '' : String(n))

/**
 * The text of a number field, kept as typed ("1e5", "0.5") while the form holds the number. Text
 * that is not a plain decimal ("0x10", "1 000", "1,5") is refused with its own message, and the
 * form holds NaN so nothing is saved from it; programmatic changes (a unit switch, a draft
 * restored) replace the text.
 */
export function useNumberText(value: Ref<number | null | undefined>, options: { integer?: boolean } = {}) {
  const text = ref(show(value.value))
  const parseError = ref('')
  watch(value, (next) => {
    if (Number.isNaN(next)) return
    const parsed = parseNumber(text.value, options)
    const same = parsed.ok && (parsed.value ?? undefined) === (next ?? undefined)
    if (!same) {
      text.value = show(next)
      parseError.value = ''
    }
  })
  function onInput(event: Event) {
    text.value = (event.target as HTMLInputElement).value
    const parsed = parseNumber(text.value, options)
    parseError.value = parsed.ok ? '' : parsed.message
    value.value = parsed.ok ? parsed.value : Number.NaN
  }
  return { text, parseError, onInput }
}
