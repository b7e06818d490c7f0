import type { Ref } from 'vue'

// Digit-group spaces and underscores ("20 000", "1_000") are accepted as an engineer types them.
const normalise = (text: string) => text.trim().replace(/[\s_]/g, '')
const show = (n: number | null | undefined) => (n === undefined || n === null ? '' : String(n))

/**
 * The text of a number field, kept as typed ("1e5", "20 000") while the form holds the number;
 * programmatic changes (a unit-system switch, a reset) replace the text.
 */
export function useNumberText(value: Ref<number | null | undefined>) {
  const text = ref(show(value.value))
  watch(value, (next) => {
    const typed = normalise(text.value)
    const same = next === undefined || next === null ? typed === '' : Number(typed) === next
    if (!same) text.value = show(next)
  })
  function onInput(event: Event) {
    text.value = (event.target as HTMLInputElement).value
    const typed = normalise(text.value)
    value.value = typed === '' ? undefined : Number(typed)
  }
  return { text, onInput }
}
