import type { Ref } from 'vue'

/**
 * Sorting by one column and filtering by free text, for client-side tables.
 * @param rows the rows
 * @param searchable the columns the filter text is matched against (case-insensitive)
 * @param initial the column sorted first (ascending)
 */
export function useSortFilter<T extends object>(rows: Ref<T[] | null | undefined>, searchable: (keyof T)[], initial: keyof T & string) {
  const sortKey = ref<string>(initial)
  const sortDir = ref<'asc' | 'desc'>('asc')
  const filter = ref('')

  function toggleSort(column: string) {
    if (sortKey.value === column) sortDir.value = sortDir.value === 'asc' ? 'desc' : 'asc'
    else { sortKey.value = column; sortDir.value = 'asc' }
  }

  const visible = computed(() => {
    const needle = filter.value.trim().toLowerCase()
    const list = (rows.value ?? []).filter(r => !needle || searchable.some(k => String(r[k] ?? '').toLowerCase().includes(needle)))
    const key = sortKey.value as keyof T
    const sign = sortDir.value === 'asc' ? 1 : -1
    return [...list].sort((a, b) => {
      const x = a[key], y = b[key]
      if (typeof x === 'number' && typeof y === 'number') return sign * (x - y)
      return sign * String(x ?? '').localeCompare(String(y ?? ''))
    })
  })

  return { sortKey, sortDir, filter, toggleSort, visible }
}
