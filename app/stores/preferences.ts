import { defineStore } from 'pinia'
import { ref } from 'vue'
import { UNIT_SYSTEMS, defaultUnit, type QuantityKind, type UnitSystem } from '#shared/units'

const STORAGE_KEY = 'eddyledger.unitSystem'

/**
 * The engineer's unit system, kept in this browser only. The server renders SI; the stored choice
 * is read after mounting (load()), so hydration matches and forms then convert their fields.
 */
export const usePreferencesStore = defineStore('preferences', () => {
  const unitSystem = ref<UnitSystem>('SI')
  const loaded = ref(false)

  function load() {
    if (!import.meta.client || loaded.value) return
    loaded.value = true
    try {
      const stored = window.localStorage.getItem(STORAGE_KEY)
      if (stored && (UNIT_SYSTEMS as readonly string[]).includes(stored)) unitSystem.value = stored as UnitSystem
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
