// The total of a keyset list as the pages show it.

/** "12", or "about 100,000" when the server estimated the total. */
export function formatTotal(page: { total: number; totalIsEstimate: boolean } | null | undefined) {
  if (!page) return ''
  const n = page.total.toLocaleString('en-GB')
  return page.totalIsEstimate ? `about ${n}` : n
}
