import type { ComputedRef, InjectionKey, Ref } from 'vue'
import { UNIT_SYSTEMS, type UnitSystem } from '#shared/units'

/**
 * The unit-system switch of a form: the chosen system, the choice remembered for the next new
 * case, and the arrow keys of a radio group. A case being revised opens in its own system.
 */
export function useUnitSystem(system: Ref<UnitSystem>) {
  const preferences = usePreferencesStore()

  function choose(next: UnitSystem) {
    system.value = next
    preferences.setUnitSystem(next)
  }

  /** Arrow keys move to the other system and keep focus on the checked option. */
  function step(event: KeyboardEvent) {
    choose(UNIT_SYSTEMS.find(s => s !== system.value)!)
    const group = (event.currentTarget as HTMLElement).parentElement
    nextTick(() => group?.querySelector<HTMLElement>('[aria-checked="true"]')?.focus())
  }

  return { systems: UNIT_SYSTEMS, choose, step }
}

/** The unit system figures are shown in: the decision's own where a page provides it, else the engineer's last choice. */
export const DISPLAY_UNITS: InjectionKey<Ref<UnitSystem>> = Symbol('display unit system')

export function provideDisplayUnits(system: Ref<UnitSystem> | ComputedRef<UnitSystem>) {
  provide(DISPLAY_UNITS, system as Ref<UnitSystem>)
}

export function useDisplayUnits(): Ref<UnitSystem> {
  const provided = inject(DISPLAY_UNITS, null)
  if (provided) return provided
  const preferences = usePreferencesStore()
  onMounted(() => preferences.load())
  return computed(() => preferences.unitSystem) as Ref<UnitSystem>
}
