import { approveSchema, requestChangesSchema } from '#shared/schemas/decisions'
import type { ChoiceFigures } from '#shared/types/decisions'
import type { DecisionPermissions, DecisionView } from '~/utils/api-types'
import type { ApiErrorInfo } from './useApiError'

type ActionName = 'submit' | 'approve' | 'requestChanges' | 'supersede'
/** The actions that close or hand on a decision, asked about once more before they are sent. */
type Confirmable = 'submit' | 'approve' | 'supersede'

const PATHS: Record<ActionName, string> = {
  submit: 'submit',
  approve: 'approve',
  requestChanges: 'request-changes',
  supersede: 'supersede',
}

const DONE: Record<ActionName, string> = {
  submit: 'Submitted: the reviewers of the project have been told. It stays readable; revising waits until a reviewer sends it back.',
  approve: 'Approved: the decision is closed and the author has been told.',
  requestChanges: 'Sent back to the author as a draft, with your request; the author has been told.',
  supersede: 'A new draft supersedes this decision.',
}

/**
 * The review step of a decision: what the signed-in user may do (computed by the server with the
 * rules that guard the routes), one loading flag per action, the confirmation of the actions that
 * close or hand on a decision, the comment, what happened, and a refusal. The component binds these.
 */
export function useDecisionActions(decision: () => DecisionView, permissions: () => DecisionPermissions, changed: () => void) {
  const loading = reactive<Record<ActionName, boolean>>({ submit: false, approve: false, requestChanges: false, supersede: false })
  const busy = computed(() => Object.values(loading).some(Boolean))
  const confirming = ref<Confirmable | null>(null)
  const showOverride = ref(false)
  const comment = ref('')
  const commentError = ref('')
  const done = ref('')
  const error = ref<ApiErrorInfo | null>(null)

  const canSubmit = computed(() => permissions().canSubmit)
  const canReview = computed(() => permissions().canReview)
  const canSupersede = computed(() => permissions().canSupersede)

  const override = computed(() => decision().override)
  /** The override's own figures; an override recorded before its cost was kept shows the engine's cost of that approach. */
  const overrideFigures = computed((): (ChoiceFigures & { model: string }) | null => {
    const o = override.value
    if (!o) return null
    const entry = decision().advice.approaches.find(a => a.id === o.approach)
    const cost = o.cost ?? (entry
      ? { cells: entry.cells, timeSteps: entry.timeSteps, coreHours: entry.coreHours, wallClockHours: entry.wallClockHours, memoryGB: entry.memoryGB, feasible: entry.feasible, layers: null }
      : null)
    return cost ? { approach: o.approach, wallTreatment: o.wallTreatment, wall: o.wall, cost, model: o.model } : null
  })
  const ruleTitle = (id: string) => decision().advice.trace.find(entry => entry.rule === id)?.title ?? id

  // A new version (someone acted) closes what was open; another decision (after superseding) starts clean.
  watch(() => decision().version, () => {
    showOverride.value = false
    confirming.value = null
  })
  watch(() => decision().id, () => {
    done.value = ''
    comment.value = ''
    commentError.value = ''
    error.value = null
  })

  async function post(name: ActionName, body: Record<string, unknown>) {
    loading[name] = true
    error.value = null
    done.value = ''
    try {
      const result = await $fetch<{ decision: { id: number } }>(`/api/decisions/${decision().id}/${PATHS[name]}`, {
        method: 'POST', body: { ...body, version: decision().version },
      })
      done.value = DONE[name]
      comment.value = ''
      confirming.value = null
      changed()
      return result.decision
    } catch (e) {
      error.value = apiErrorInfo(e)
      confirming.value = null
      return null
    } finally {
      loading[name] = false
    }
  }

  function commentChecked(schema: typeof approveSchema | typeof requestChangesSchema, text: string | undefined) {
    const parsed = schema.safeParse({ version: decision().version, comment: text })
    commentError.value = parsed.success ? '' : (parsed.error.flatten().fieldErrors as Record<string, string[]>).comment?.[0] ?? ''
    return parsed.success
  }

  /** First press asks; the confirmation sends. */
  function ask(action: Confirmable) {
    if (action === 'approve' && !commentChecked(approveSchema, comment.value.trim() || undefined)) return
    done.value = ''
    confirming.value = action
  }
  function cancel() {
    confirming.value = null
  }

  const submit = () => post('submit', {})
  function approve() {
    const text = comment.value.trim() || undefined
    if (!commentChecked(approveSchema, text)) return
    return post('approve', text ? { comment: text } : {})
  }
  function requestChanges() {
    const text = comment.value.trim()
    if (!commentChecked(requestChangesSchema, text)) return
    return post('requestChanges', { comment: text })
  }
  async function supersede() {
    const created = await post('supersede', {})
    if (created) await navigateTo(`/decisions/${created.id}`)
  }
  function overridden() {
    showOverride.value = false
    done.value = 'Overridden: your choice, its recomputed mesh and cost, and your reason are on the record; the author has been told.'
    changed()
  }
  function reload() {
    error.value = null
    changed()
  }

  return {
    loading, busy, confirming, showOverride, comment, commentError, done, error,
    canSubmit, canReview, canSupersede, override, overrideFigures, ruleTitle,
    ask, cancel, submit, approve, requestChanges, supersede, overridden, reload,
  }
}
