import type { Ref } from 'vue'

/**
 * Guidance links inside `root` (the advice shown beside a form) open in a new tab, so reading an
 * article never navigates away from unsaved work; each link says so to screen readers. Links
 * rendered later (a new preview) are caught too.
 */
export function useGuidanceBeside(root: Ref<HTMLElement | null>) {
  const NOTE = ' (opens in a new tab)'
  function mark(container: HTMLElement) {
    for (const link of container.querySelectorAll<HTMLAnchorElement>('a[href^="/guidance"]')) {
      if (link.target === '_blank') continue
      link.target = '_blank'
      link.rel = 'noopener'
      link.setAttribute('aria-label', `${link.textContent?.trim() ?? 'Guidance'}${NOTE}`)
    }
  }
  let observer: MutationObserver | undefined
  watch(root, (container) => {
    observer?.disconnect()
    if (!container) return
    mark(container)
    observer = new MutationObserver(() => mark(container))
    observer.observe(container, { childList: true, subtree: true })
  }, { flush: 'post' })
  onBeforeUnmount(() => observer?.disconnect())
}
