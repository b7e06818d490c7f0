import type { Ref } from 'vue'
import { unitSystemOf, type UnitSystem } from '#shared/units'
import type { CaseFormValues } from '#shared/schemas/case-form'
import type { CaseFormHandle } from './useCaseForm'

/** An unsaved case kept in this browser: the form as it was, the title and the notes. */
export interface CaseDraft {
  values: CaseFormValues
  unitSystem: UnitSystem
  title: string
  notes: string
  savedAt: string
}

const PREFIX = 'eddyledger.draft.'
const DELAY_MS = 400

function read(key: string): CaseDraft | null {
  try {
    const text = window.localStorage.getItem(PREFIX + key)
    if (!text) return null
    const draft = JSON.parse(text) as CaseDraft
    const system = unitSystemOf(draft.unitSystem)
    return system && draft.values && typeof draft.savedAt === 'string' ? { ...draft, unitSystem: system } : null
  } catch {
    return null
  }
}

/**
 * Keeps the form of an unsaved case in this browser's storage while the engineer types, so that
 * following a link, going back or closing the tab loses nothing; cleared once the case is saved.
 * `key` names the form: a new case of a project, or a revision of one version of a decision.
 */
export function useCaseDraft(key: Ref<string> | (() => string), current: () => Omit<CaseDraft, 'savedAt'> | null, dirty: Ref<boolean>) {
  const keyOf = () => (typeof key === 'function' ? key() : key.value)
  const restoredFrom = ref<string | null>(null)
  let timer: ReturnType<typeof setTimeout> | undefined

  function store() {
    const draft = current()
    if (!draft || !import.meta.client) return
    try {
      window.localStorage.setItem(PREFIX + keyOf(), JSON.stringify({ ...draft, savedAt: new Date().toISOString() }))
    } catch {
      // Storage full or blocked: the leave-page guard still protects the form.
    }
  }

  // Only a changed form is kept: opening a case and leaving it untouched stores nothing.
  watch([current, dirty], () => {
    clearTimeout(timer)
    if (dirty.value) timer = setTimeout(store, DELAY_MS)
  }, { deep: true })
  onBeforeUnmount(() => {
    clearTimeout(timer)
    if (dirty.value) store()
  })

  /** The kept draft, if any (read in the browser after mounting). */
  function take(): CaseDraft | null {
    if (!import.meta.client) return null
    const draft = read(keyOf())
    if (draft) restoredFrom.value = draft.savedAt
    return draft
  }

  /** After mounting: the kept draft, if any, back into the form, the title and the notes. */
  async function restoreInto(form: Ref<CaseFormHandle | null>, title: Ref<string>, notes: Ref<string>) {
    await nextTick()
    const kept = take()
    if (!kept || !form.value) return
    title.value = kept.title
    notes.value = kept.notes
    await form.value.restore(kept.values, kept.unitSystem)
  }

  function clear() {
    clearTimeout(timer)
    restoredFrom.value = null
    if (!import.meta.client) return
    try {
      window.localStorage.removeItem(PREFIX + keyOf())
    } catch {
      // Nothing kept.
    }
  }

  return { restoreInto, clear, store, restoredFrom }
}
