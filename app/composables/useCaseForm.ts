import type { ComputedRef, InjectionKey, Ref } from 'vue'
import { useForm } from 'vee-validate'
import { toTypedSchema } from '@vee-validate/zod'
import type { CaseInput } from '#shared/rules'
import {
  QUANTITY_FIELDS,
  assumptionsOf,
  caseFormSchema,
  convertQuantityValue,
  defaultCaseFormValues,
  enteredOf,
  formPathFor,
  quantityAt,
  toCaseInputDraft,
  validateCaseForm,
  type CaseFormValues,
  type EnteredCase,
} from '#shared/schemas/case-form'
import type { RequestedChoiceInput } from '#shared/schemas/requested-choice'
import { defaultUnit, type UnitSystem } from '#shared/units'

/** A case the form has checked: the engine's SI input for a preview, and what a route stores. */
export interface CheckedCase {
  input: CaseInput
  entered: EnteredCase
  unitSystem: UnitSystem
  requested?: RequestedChoiceInput
}

/** What the fields of the questionnaire read from their form: notes on assumed values, the unit system. */
export interface CaseFormContext {
  assumptions: ComputedRef<Record<string, string>>
  unitSystem: Ref<UnitSystem>
}
export const CASE_FORM: InjectionKey<CaseFormContext> = Symbol('case form')

/** The note beside a field on what the engine assumes when it is left empty. */
export function useAssumption(path: MaybeRefOrGetter<string>) {
  const context = inject(CASE_FORM, null)
  return computed(() => context?.assumptions.value[toValue(path)] ?? '')
}

/** A stable fingerprint of the case (in SI) and the engineer's choice: a unit switch alone is no change. */
function fingerprint(values: CaseFormValues) {
  return JSON.stringify([toCaseInputDraft(values), values.requested])
}

/**
 * The questionnaire's state: the values with their units (vee-validate, checked by the engine's
 * schema in SI), the unit system and its conversion, the notes on assumed values, the mapping of
 * a route's field errors, and whether anything changed since it was loaded or saved.
 */
export function useCaseForm(options: { initial?: CaseFormValues; unitSystem?: UnitSystem }) {
  const preferences = usePreferencesStore()
  const unitSystem = ref<UnitSystem>(options.unitSystem ?? preferences.unitSystem)
  const { values, errors, setFieldValue, setErrors, validate, resetForm } = useForm<CaseFormValues>({
    validationSchema: toTypedSchema(caseFormSchema),
    initialValues: options.initial ?? defaultCaseFormValues(unitSystem.value),
    // A field hidden by a choice (pressure for water, roughness for external flow) keeps its value.
    keepValuesOnUnmount: true,
  })

  // A switch of unit system converts every dimensional field, keeping its physical value; a
  // restored draft arrives in its own units and is not converted.
  let restoring = false
  watch(unitSystem, (system) => {
    if (restoring) return
    for (const { field, kind } of QUANTITY_FIELDS) {
      const current = quantityAt(values, field)
      const unit = defaultUnit(kind, system)
      if (current.unit !== unit) setFieldValue(field, convertQuantityValue(kind, current, unit), false)
    }
  })

  const baseline = ref('')
  const isDirty = computed(() => baseline.value !== '' && fingerprint(values) !== baseline.value)
  /** Takes the present values as the saved state (after loading, restoring or saving). */
  function markClean() {
    baseline.value = fingerprint(values)
  }

  onMounted(async () => {
    preferences.load()
    // A new case starts in the system the engineer last used; a saved one keeps its own.
    if (!options.initial && !options.unitSystem) unitSystem.value = preferences.unitSystem
    await nextTick()
    markClean()
  })

  const assumptions = computed(() => assumptionsOf(values, unitSystem.value))
  provide(CASE_FORM, { assumptions, unitSystem })

  /** Puts a kept draft back: its values in its own units, as they were. */
  async function restore(draft: CaseFormValues, system: UnitSystem) {
    restoring = true
    unitSystem.value = system
    resetForm({ values: draft })
    await nextTick()
    restoring = false
  }

  /** Validates every field and moves focus to the first one in error; the checked case when all pass. */
  async function validateCase(): Promise<CheckedCase | null> {
    const result = await validate()
    const checked = result.valid ? validateCaseForm(values) : null
    if (!checked?.ok) {
      await nextTick()
      document.querySelector<HTMLElement>('[data-testid="case-form"] [aria-invalid="true"]')?.focus()
      return null
    }
    const snapshot = structuredClone(toRaw(values)) as CaseFormValues
    const { approach, wallTreatment, reason } = snapshot.requested
    return {
      input: checked.input,
      entered: enteredOf(snapshot),
      unitSystem: unitSystem.value,
      ...(approach || wallTreatment ? { requested: { approach, wallTreatment, reason } } : {}),
    }
  }

  /** Per-field errors from a route ("entered.velocity.value", "caseInput.fluid.density", "requested.reason") at their fields. */
  function setServerErrors(fieldErrors: Record<string, string[]>) {
    const mapped: Record<string, string> = {}
    for (const [key, messages] of Object.entries(fieldErrors)) {
      const message = messages[0] ?? 'Invalid value.'
      if (key.startsWith('requested.')) mapped[key] = message
      else if (key.startsWith('caseInput') || key.startsWith('entered')) mapped[formPathFor(key)] = message
    }
    setErrors(mapped)
    return Object.keys(mapped).length
  }

  return { values, errors, unitSystem, isDirty, markClean, restore, validateCase, setServerErrors }
}

/** What a page reaches through the form's template ref (refs arrive unwrapped). */
export interface CaseFormHandle {
  validateCase: () => Promise<CheckedCase | null>
  setServerErrors: (fieldErrors: Record<string, string[]>) => number
  restore: (values: CaseFormValues, system: UnitSystem) => Promise<void>
  markClean: () => void
  isDirty: boolean
  unitSystem: UnitSystem
}
