/**
 * Pages of a keyset list (?cursor=&limit= -> { items, nextCursor, total, totalIsEstimate }): the
 * cursors of the pages seen so far, so Previous steps back and Next goes on from the last row.
 */
export function useKeysetPages(limit: number) {
  // cursors[i] is where page i+2 starts; the first page has none.
  const cursors = ref<string[]>([])
  const cursor = computed(() => cursors.value.at(-1))
  const index = computed(() => cursors.value.length)
  return {
    cursor,
    /** Zero-based page number, for "rows 21-40". */
    index,
    first: computed(() => index.value * limit + 1),
    next(nextCursor: string | null | undefined) {
      if (nextCursor) cursors.value = [...cursors.value, nextCursor]
    },
    previous() {
      cursors.value = cursors.value.slice(0, -1)
    },
    reset() {
      cursors.value = []
    },
  }
}
