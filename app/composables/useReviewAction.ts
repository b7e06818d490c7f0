import type { ApiErrorInfo } from './useApiError'

// One review action at a time from a component: posts it, keeps the error, and tells a conflict
// (someone acted first, or the status moved on) from other refusals.
export function useReviewAction() {
  const busy = ref<string | null>(null)
  const error = ref<ApiErrorInfo | null>(null)
  const conflict = computed(() => error.value?.status === 409)

  async function run<T>(name: string, path: string, body: Record<string, unknown>): Promise<T | null> {
    busy.value = name
    error.value = null
    try {
      return await $fetch<T>(path, { method: 'POST', body }) as T
    } catch (e) {
      error.value = apiErrorInfo(e)
      return null
    } finally {
      busy.value = null
    }
  }

  function clear() { error.value = null }

  return { busy, error, conflict, run, clear }
}
