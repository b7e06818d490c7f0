import type { Ref } from 'vue'

export const LEAVE_MESSAGE = 'This case has changes that are not saved. Leave the page? A draft stays in this browser and comes back when you return to the form.'

/**
 * Asks before unsaved work is left behind: a route change inside the app (confirm dialog) and a
 * closed or reloaded tab (the browser's own question). Saving first sets `dirty` false.
 */
export function useUnsavedGuard(dirty: Ref<boolean>) {
  onBeforeRouteLeave(() => {
    if (dirty.value && !window.confirm(LEAVE_MESSAGE)) return false
  })
  function beforeUnload(event: BeforeUnloadEvent) {
    if (!dirty.value) return
    event.preventDefault()
    // Older browsers show the question only when returnValue is set.
    event.returnValue = ''
  }
  onMounted(() => window.addEventListener('beforeunload', beforeUnload))
  onBeforeUnmount(() => window.removeEventListener('beforeunload', beforeUnload))
}
