import { getCoreRowModel, getSortedRowModel, useVueTable, type ColumnDef, type SortingState } from '@tanstack/vue-table'

/** A client-sorted @tanstack/vue-table over reactive rows, with its sorting kept in a ref. */
export function useSortableTable<Row>(rows: () => Row[], columns: ColumnDef<Row, any>[], initialSorting: SortingState = []) {
  const sorting = ref<SortingState>(initialSorting)
  return useVueTable({
    get data() {
      return rows()
    },
    columns,
    state: {
      get sorting() {
        return sorting.value
      },
    },
    onSortingChange: (updater) => {
      sorting.value = typeof updater === 'function' ? updater(sorting.value) : updater
    },
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  })
}
