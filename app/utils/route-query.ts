// Filters kept in the page's address (the overview, the audit), so a filtered view can be shared.

/** A query parameter as text: '' when absent or repeated. */
export function queryText(value: unknown): string {
  return typeof value === 'string' ? value : ''
}

/** Only the filters that are set, for the address and the API query. */
export function setFilters<Filters extends Record<string, string>>(filters: Filters): Partial<Filters> {
  return Object.fromEntries(Object.entries(filters).filter(([, v]) => v)) as Partial<Filters>
}
