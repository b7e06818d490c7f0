import { readFile } from 'node:fs/promises'
import { expect, test } from '@playwright/test'
import { gotoHydrated, keepScreenshot, signInAs, signOut } from '../support/e2e'

const CSV_HEADER = 'project,decision,title,status,approach,model,wall treatment,engine recommended,author,reviewer,override reason,'
  + 'created,submitted,reviewed,last change,ruleset version,engine version,revisions,events,chain valid,chain broken at event,last hash,'
  + 'wall checks,latest wall check in band,latest wall check verdict,latest wall check review,latest wall check sha256,'
  + 'grid studies,latest fine-grid GCI,CPU runs,actual core-hours,estimated core-hours of the runs,retracted records,'
  + 'unit system,estimated core-hours of the decision,core-hour budget'

test('the team lead reads the overview: figures, the method chart, the project table and a project filter', async ({ page }) => {
  await signInAs(page, 'lead')
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Overview' }).click()
  await expect(page).toHaveURL(/\/overview$/)
  await page.waitForLoadState('networkidle')
  // The page shows what the API answers for the same filter.
  const all = await (await page.request.get('/api/overview')).json()
  expect(all.decisions.total).toBeGreaterThan(0)
  await expect(page.getByTestId('figure-decisions')).toHaveText(String(all.decisions.total))
  await expect(page.getByTestId('figure-over-budget')).toHaveText(String(all.compute.overBudget))
  await expect(page.getByTestId('overview-method-chart').locator('canvas')).toBeVisible()
  await expect(page.getByTestId('overview-method-chart')).toHaveAttribute('aria-label', /Bar chart of decisions by the approach/)
  await expect(page.getByTestId('overview-project-table').locator('tbody tr')).toHaveCount(Math.min(15, all.compute.projects.length))
  await expect(page.getByTestId('overview-cautions')).toContainText(/order-of-magnitude/)
  await keepScreenshot(page, 'lead-overview')

  // Sorting by project code, ascending then descending.
  const codes = () => page.getByTestId('overview-project-table').locator('tbody tr td:first-child a').allTextContents()
  await page.getByTestId('overview-sort-code').click()
  const sorted = [...all.compute.projects.map((p: { code: string }) => p.code)].sort()
  // The table shows the first 15 of the order (more on request, tested below).
  await expect.poll(codes).toEqual(sorted.slice(0, 15))
  await page.getByTestId('overview-sort-code').click()
  await expect.poll(codes).toEqual([...sorted].reverse().slice(0, 15))

  // One project: the figures follow, and the address keeps the filter.
  const kb103 = all.compute.projects.find((p: { code: string }) => p.code === 'KB-103')
  await page.getByTestId('overview-project').selectOption(String(kb103.id))
  await expect(page).toHaveURL(new RegExp(`projectId=${kb103.id}`))
  await expect(page.getByTestId('figure-decisions')).toHaveText(String(kb103.decisions))
  await expect(page.getByTestId('overview-project-table').locator('tbody tr')).toHaveCount(1)

  // A range with no decisions shows the empty state, not an error.
  await page.getByTestId('overview-from').fill('2001-01-01')
  await page.getByTestId('overview-to').fill('2001-01-31')
  await expect(page.getByTestId('overview-empty')).toBeVisible()
})

test('with many projects the overview lists the first 15 in the chosen order, and all on request', async ({ page }) => {
  // More projects than the table shows at first, made by the administrator.
  await signInAs(page, 'admin')
  const existing = (await (await page.request.get('/api/projects')).json()).projects.length as number
  for (let i = existing; i < 17; i++) {
    const res = await page.request.post('/api/projects', { data: { code: `OV-${900 + i}`, name: `Overview paging study ${i}` } })
    expect(res.status()).toBe(201)
  }
  await signOut(page)

  await signInAs(page, 'lead')
  await gotoHydrated(page, '/overview')
  const all = (await (await page.request.get('/api/overview')).json()).compute.projects as { code: string }[]
  expect(all.length).toBeGreaterThan(15)
  const rows = page.getByTestId('overview-project-table').locator('tbody tr')
  const codes = () => rows.locator('td:first-child a').allTextContents()
  await expect(rows).toHaveCount(15)
  await expect(page.getByTestId('overview-projects-shown')).toHaveText(`15 of ${all.length} projects, in the order chosen above`)

  // Sorting orders every project, not only the rows shown.
  await page.getByTestId('overview-sort-code').click()
  const sorted = all.map(p => p.code).sort()
  await expect.poll(codes).toEqual(sorted.slice(0, 15))
  await page.getByTestId('overview-projects-toggle').click()
  await expect(page.getByTestId('overview-projects-toggle')).toHaveAttribute('aria-expanded', 'true')
  await expect.poll(codes).toEqual(sorted)
  await page.getByTestId('overview-projects-toggle').click()
  await expect(rows).toHaveCount(15)
})

test('QA opens the audit, verifies the chains on the page, follows a decision and downloads the CSV', async ({ page }) => {
  await signInAs(page, 'auditor')
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Audit' }).click()
  await expect(page).toHaveURL(/\/audit$/)
  await gotoHydrated(page, '/audit')
  const rows = page.getByTestId('audit-table').locator('tbody tr')
  await expect(rows.first()).toBeVisible()
  const count = await rows.count()

  await page.getByTestId('verify-page').click()
  await expect(page.getByTestId('verify-summary')).toContainText(`Verified ${count} chains`)
  await expect(page.getByTestId('verify-summary')).toContainText(`${count} intact`)
  const results = page.getByTestId('audit-table').getByTestId('chain-result')
  await expect(results).toHaveCount(count)
  for (const text of await results.allTextContents()) expect(text).toMatch(/^chain intact \(\d+ events?\)$/)
  await expect(page.getByTestId('audit-table')).toContainText('verified just now')
  await keepScreenshot(page, 'audit')

  // The CSV of the whole list.
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('audit-csv').click()])
  expect(download.suggestedFilename()).toMatch(/^eddyledger-audit-\d{4}-\d{2}-\d{2}\.csv$/)
  const csv = (await readFile((await download.path())!, 'utf8')).replace(/^\uFEFF/, '')
  const lines = csv.trimEnd().split('\r\n')
  expect(lines[0]).toBe(CSV_HEADER)
  expect(lines.length - 1).toBeGreaterThanOrEqual(count)

  // The search narrows the list to the decisions whose number, title or author match. It is kept in
  // the address (wait for that before reading the rows), so the filtered audit survives a reload.
  const number = (await rows.nth(1).getAttribute('data-testid'))!.replace('audit-row-', '')
  const authors = async () => new Set((await rows.locator('td:nth-child(4)').allTextContents()).map(t => t.trim()))
  await page.getByTestId('audit-search').fill(`#${number}`)
  await expect(page).toHaveURL(new RegExp(`/audit\\?q=%23${number}$`))
  await expect(rows).toHaveCount(1)
  await expect(page.getByTestId(`audit-row-${number}`)).toBeVisible()
  await expect(page.getByTestId('page-position')).toContainText(/of 1 decision/)
  // Too short to search: a hint, and the list unfiltered rather than an error.
  await page.getByTestId('audit-search').fill('Li')
  await expect(page.getByTestId('audit-search-hint')).toHaveText(/decision number, or at least 3 characters/)
  await expect(page).toHaveURL(/\/audit$/)
  await expect(rows).toHaveCount(count)
  await page.getByTestId('audit-search').fill('Lindqvist')
  await expect(page.getByTestId('audit-search-hint')).toHaveCount(0)
  await expect(page).toHaveURL(/\/audit\?q=Lindqvist$/)
  await expect.poll(authors).toEqual(new Set(['Tomas Lindqvist']))
  await gotoHydrated(page, page.url())
  await expect(page.getByTestId('audit-search')).toHaveValue('Lindqvist')
  expect(await authors()).toEqual(new Set(['Tomas Lindqvist']))
  await page.getByTestId('audit-search').fill('')
  await expect(page).toHaveURL(/\/audit$/)
  await expect(rows).toHaveCount(count)

  // Each row links to its decision page.
  const first = rows.first().getByRole('link')
  const title = await first.textContent()
  await first.click()
  await expect(page).toHaveURL(/\/decisions\/\d+$/)
  await expect(page.getByTestId('decision-title')).toHaveText(title!.trim())
})
