import { defineStore } from 'pinia'
import { ref } from 'vue'
import { defaultUnit, unitSystemOf, type QuantityKind, type UnitSystem } from '#shared/units'

const STORAGE_KEY = 'eddyledger.unitSystem'

/**
 * The unit system the engineer last chose, kept in this browser only: a new case starts in it. A
 * saved decision keeps its own system (stored with it). The server renders SI; the stored choice is
 * read after mounting (load()), so hydration matches.
 */
export const usePreferencesStore = defineStore('preferences', () => {
  const unitSystem = ref<UnitSystem>('si')
  const loaded = ref(false)

  function load() {
    if (!import.meta.client || loaded.value) return
    loaded.value = true
    try {
      const stored = unitSystemOf(window.localStorage.getItem(STORAGE_KEY))
      if (stored) unitSystem.value = stored
    } catch {
      // Storage may be blocked (private mode, policy); SI stays the default.
    }
  }

  function setUnitSystem(system: UnitSystem) {
    unitSystem.value = system
    if (!import.meta.client) return
    try {
      window.localStorage.setItem(STORAGE_KEY, system)
    } catch {
      // Not kept, but still used for this visit.
    }
  }

  /** The unit a field of this quantity starts in. */
  function unitFor(kind: QuantityKind): string {
    return defaultUnit(kind, unitSystem.value)
  }

  return { unitSystem, loaded, load, setUnitSystem, unitFor }
})
