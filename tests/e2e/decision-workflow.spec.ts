import { expect, test, type Page } from '@playwright/test'
import { advise } from '../../shared/rules'
import { toSI } from '../../shared/units'
import { formatSci } from '../../shared/utils/format'
import { keepScreenshot, signInAs } from '../support/e2e'

// Our own scenario: the Kestrel Bay ferry hull (KB-101) at a second service speed, typed in
// imperial units as the client's drawings give them.
const CASE = { temperatureF: 59, velocityFtS: 24, lengthFt: 98 }

async function fillQuantity(page: Page, field: string, value: number) {
  const input = page.locator(`#field-${field}`)
  await input.fill(String(value))
  await input.blur()
}

test('an engineer describes a case in imperial units, previews the advice, saves it and finds the same figures on the decision page', async ({ page }) => {
  const browserErrors: string[] = []
  page.on('pageerror', (error) => browserErrors.push(`${error.message} ${error.stack?.split('\n').slice(1, 3).join(' ')}`))
  page.on('console', (message) => {
    if (message.type() === 'error') browserErrors.push(message.text())
  })
  await signInAs(page, 'engineer')
  await page.getByTestId('projects-table').getByRole('link', { name: 'Harbour ferry hull resistance' }).click()
  await expect(page.getByTestId('decisions-table')).toContainText('Ferry hull calm-water resistance')
  await page.getByTestId('new-case').click()
  await expect(page.getByRole('heading', { name: 'New case' })).toBeVisible()

  // Nothing typed yet: the live panel says what is missing.
  await expect(page.getByTestId('live-incomplete')).toContainText('Velocity is required.')

  await page.getByTestId('unit-system').getByRole('radio', { name: 'Imperial units' }).click()
  // 20 °C shown as 68 °F (NIST SP 811 B.9) and the units switched.
  await expect(page.locator('#field-fluid-temperature')).toHaveValue('68')
  await expect(page.getByTestId('field-fluid-temperature-unit')).toHaveValue('degF')
  await expect(page.getByTestId('field-velocity-unit')).toHaveValue('ft/s')

  await page.getByRole('radio', { name: 'Water' }).check()
  await fillQuantity(page, 'fluid-temperature', CASE.temperatureF)
  await fillQuantity(page, 'velocity', CASE.velocityFtS)
  await fillQuantity(page, 'length', CASE.lengthFt)
  await page.getByLabel('Expected separation').selectOption('mild')
  await page.getByRole('checkbox', { name: 'Surface pressure' }).check()

  // The browser's engine, for the same input in SI, is the reference for every figure below.
  const expected = advise({
    regime: 'external',
    fluid: { medium: 'water', temperatureK: toSI('temperature', CASE.temperatureF, 'degF') },
    velocity: toSI('velocity', CASE.velocityFtS, 'ft/s'),
    length: toSI('length', CASE.lengthFt, 'ft'),
    geometry: 'streamlined',
    separation: 'mild',
    quantities: ['forces', 'pressure'],
    budget: { coreHours: 20000, cores: 256, wallClockHours: 72 },
  })
  const reynolds = formatSci(expected.reynolds)

  await expect(page.getByTestId('live-reynolds')).toHaveText(reynolds)
  await expect(page.getByTestId('live-mach')).toHaveText('n/a') // a liquid: no Mach number here
  await expect(page.getByTestId('live-approach')).not.toBeEmpty()
  await keepScreenshot(page, 'questionnaire')

  await page.getByTestId('get-advice').click()
  const preview = page.getByTestId('advice-preview')
  await expect(preview.getByTestId('advice-reynolds')).toHaveText(reynolds)
  await expect(preview.getByTestId('approach-table').locator('tbody tr')).toHaveCount(6)
  await expect(preview.getByTestId('advice-cautions')).toContainText('order-of-magnitude')
  await expect(preview.getByTestId('advice-cautions')).toContainText('licensed engineering practice')
  for (const caution of expected.cautions) await expect(preview.getByTestId('advice-cautions')).toContainText(caution)
  await expect(preview.getByTestId('cost-chart').locator('canvas')).toBeVisible()
  await expect(preview.getByTestId('mesh-first-cell-height')).toContainText('in') // imperial: inches
  const firstCellHeight = await preview.getByTestId('mesh-first-cell-height').textContent()
  const approach = await preview.getByTestId('advice-approach').textContent()
  const coreHours = await preview.getByTestId('advice-core-hours').textContent()

  // Sorting by core-hours: a number column sorts largest first (DNS, the costliest), then cheapest first.
  const table = preview.getByTestId('approach-table')
  await table.getByTestId('sort-coreHours').click()
  await expect(table.locator('th[aria-sort="descending"]')).toHaveCount(1)
  await expect(table.locator('tbody tr').first()).toHaveAttribute('data-testid', 'approach-row-dns')
  await table.getByTestId('sort-coreHours').press('Enter')
  await expect(table.locator('th[aria-sort="ascending"]')).toHaveCount(1)
  await expect(table.locator('tbody tr').last()).toHaveAttribute('data-testid', 'approach-row-dns')
  const ascending = [...expected.approaches].sort((a, b) => a.coreHours - b.coreHours)
  await expect(table.locator('tbody tr').first()).toHaveAttribute('data-testid', `approach-row-${ascending[0]!.id}`)
  // Infeasible rows say why.
  if (expected.approaches.some((a) => !a.feasible)) await expect(table.getByTestId('infeasible-why').first()).toContainText('Needs')
  await keepScreenshot(page, 'advice-view')

  await page.getByTestId('decision-title').fill('Ferry hull at 24 ft/s, mild stern separation')
  await page.getByTestId('decision-notes').fill('Second service speed from the client brief.')
  await page.getByTestId('save-draft').click()
  await expect(page).toHaveURL(/\/decisions\/\d+$/)
  const decisionId = Number(new URL(page.url()).pathname.split('/').pop())

  await expect(page.getByTestId('decision-title')).toHaveText('Ferry hull at 24 ft/s, mild stern separation')
  await expect(page.getByTestId('status-draft')).toBeVisible()
  await expect(page.getByTestId('advice-reynolds')).toHaveText(reynolds)
  await expect(page.getByTestId('advice-approach')).toHaveText(approach!)
  await expect(page.getByTestId('advice-core-hours')).toHaveText(coreHours!)
  // The decision keeps the unit system it was typed in: still inches here.
  await expect(page.getByTestId('mesh-first-cell-height')).toHaveText(firstCellHeight!)
  await expect(page.getByTestId('chain-check')).toHaveText('History verified (1 event)')
  await expect(page.getByTestId('decision-timeline')).toContainText('Created by Ada Ferreira')
  await expect(page.getByTestId('decision-revisions')).toContainText('Revision 1')
  await expect(page.getByTestId('revise-link')).toBeVisible()
  await keepScreenshot(page, 'decision-page')
  // After a reload the decision's own unit system still shows the mesh in inches.
  await page.reload()
  await expect(page.getByTestId('mesh-first-cell-height')).toHaveText(firstCellHeight!)

  await page.getByRole('link', { name: /KB-101/ }).click()
  const row = page.getByTestId(`decision-row-${decisionId}`)
  await expect(row).toContainText('Ferry hull at 24 ft/s')
  await expect(row).toContainText('Draft')
  await expect(row).toContainText('Ada Ferreira')
  await expect(row).toContainText(reynolds)
  await keepScreenshot(page, 'project-decisions')

  // The status filter: the demo's approved decision stays, the new draft goes.
  await page.getByTestId('decision-status-filter').selectOption('approved')
  await expect(page.getByTestId('decisions-table')).toContainText('Ferry hull calm-water resistance')
  await expect(page.getByTestId('decisions-table')).not.toContainText('Ferry hull at 24 ft/s')
  expect(browserErrors).toEqual([])
})

test('the questionnaire shows the engine\'s message at the field and refuses to save', async ({ page }) => {
  const browserErrors: string[] = []
  page.on('pageerror', (error) => browserErrors.push(error.message))
  page.on('console', (message) => {
    if (message.type() === 'error') browserErrors.push(message.text())
  })
  await signInAs(page, 'engineer')
  await page.getByTestId('projects-table').getByRole('link', { name: 'Harbour ferry hull resistance' }).click()
  await page.getByTestId('new-case').click()
  await expect(page).toHaveURL(/\/decisions\/new$/)
  // Rendered on the server too: a reload hydrates without a mismatch.
  await page.reload()
  await expect(page.getByTestId('live-incomplete')).toBeVisible()
  await page.getByRole('radio', { name: 'Other fluid' }).check()
  await fillQuantity(page, 'velocity', 5)
  await fillQuantity(page, 'length', 2)
  await page.getByTestId('decision-title').fill('Incomplete case')
  await page.getByTestId('save-draft').click()
  await expect(page.getByTestId('field-fluid-density')).toContainText('Density is required for a custom fluid.')
  await expect(page.getByTestId('field-fluid-viscosity')).toContainText('Dynamic viscosity is required for a custom fluid.')
  await expect(page.getByTestId('form-message')).toBeVisible()
  await expect(page).toHaveURL(/\/decisions\/new$/)
  await keepScreenshot(page, 'questionnaire-errors')
  // Back to air: the fields the other fluid hid kept their values.
  await page.getByRole('radio', { name: 'Air' }).check()
  await expect(page.locator('#field-fluid-pressure')).toHaveValue('101.325')
  await expect(page.locator('#field-fluid-temperature')).toHaveValue('20')
  expect(browserErrors).toEqual([])
})

test('the author revises a draft; a second tab with the old version gets a clear conflict message', async ({ page, context }) => {
  await signInAs(page, 'engineer')
  await page.getByTestId('projects-table').getByRole('link', { name: 'Harbour ferry hull resistance' }).click()
  await page.getByTestId('new-case').click()
  // The unit-system switch works from the keyboard like a radio group.
  await page.getByTestId('unit-system').getByRole('radio', { name: 'SI units' }).focus()
  await page.keyboard.press('ArrowRight')
  await expect(page.getByTestId('unit-system').getByRole('radio', { name: 'Imperial units' })).toBeFocused()
  await expect(page.getByTestId('field-velocity-unit')).toHaveValue('ft/s')
  await page.keyboard.press('ArrowLeft')
  await expect(page.getByTestId('field-velocity-unit')).toHaveValue('m/s')
  await fillQuantity(page, 'velocity', 7)
  await fillQuantity(page, 'length', 30)
  await page.getByTestId('decision-title').fill('Ferry hull, harbour manoeuvring speed')
  await page.getByTestId('save-draft').click()
  await expect(page).toHaveURL(/\/decisions\/\d+$/)
  const decisionUrl = page.url()
  const reynoldsBefore = await page.getByTestId('advice-reynolds').textContent()

  const other = await context.newPage()
  await other.goto(`${decisionUrl}/edit`)
  await expect(other.locator('#field-velocity')).toHaveValue('7')

  await page.getByTestId('revise-link').click()
  await expect(page.locator('#field-length')).toHaveValue('30')
  await fillQuantity(page, 'velocity', 14)
  await page.getByTestId('save-revision').click()
  await expect(page).toHaveURL(decisionUrl)
  await expect(page.getByTestId('decision-revisions')).toContainText('Revision 2')
  await expect(page.getByTestId('decision-timeline')).toContainText('Revised by Ada Ferreira')
  // Twice the velocity, twice the Reynolds number (Re = U L / nu).
  await expect(page.getByTestId('advice-reynolds')).not.toHaveText(reynoldsBefore!)
  await expect(page.getByTestId('chain-check')).toHaveText('History verified (2 events)')

  // Revision 1 stays readable with its own figures.
  await page.getByRole('link', { name: 'Revision 1' }).click()
  await expect(page.getByTestId('advice-reynolds')).toHaveText(reynoldsBefore!)
  await expect(page.getByTestId('revision-provenance')).toContainText('ruleset eddyledger-core')

  // The second tab still holds version 1.
  await fillQuantity(other, 'velocity', 9)
  await other.getByTestId('save-revision').click()
  await expect(other.getByTestId('form-message')).toContainText('changed this decision after you opened it')
  await expect(other.locator('#field-velocity')).toHaveValue('9')
  await expect(other).toHaveURL(/\/edit$/)
})

test('the guidance articles: one per approach and wall treatment, each with cautions and sources', async ({ page }) => {
  await signInAs(page, 'auditor')
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Guidance' }).click()
  await expect(page.getByTestId('guidance-approaches').getByRole('link')).toHaveCount(7)
  await expect(page.getByTestId('guidance-walls').getByRole('link')).toHaveCount(5)
  for (const slug of ['dns', 'wrles', 'wmles', 'hybrid', 'urans', 'rans', 'laminar', 'resolved', 'blended', 'wall-function', 'rough-wall-function', 'wall-model']) {
    await page.goto(`/guidance/${slug}`)
    const article = page.getByTestId('guidance-article')
    await expect(article.getByRole('heading', { name: 'Cautions' })).toBeVisible()
    await expect(article.getByRole('heading', { name: 'Sources' })).toBeVisible()
    await expect(article).toContainText('licensed engineering practice')
  }
  await keepScreenshot(page, 'guidance-article')
  const missing = await page.goto('/guidance/no-such-article')
  expect(missing?.status()).toBe(404)
})

test("QA reads an overridden decision: the reviewer's choice, its near-wall mesh, the verified history, no edit controls", async ({ page }) => {
  await signInAs(page, 'auditor')
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Projects' }).click()
  await page.getByTestId('projects-table').getByRole('link', { name: 'Rooftop condenser wake and noise' }).click()
  await expect(page.getByTestId('decisions-table')).toBeVisible()
  await expect(page.getByTestId('new-case')).toHaveCount(0)
  await page.getByTestId('decisions-table').getByRole('link', { name: 'Condenser wake and tonal noise at the east facade' }).click()
  await expect(page.getByTestId('status-overridden')).toBeVisible()
  await expect(page.getByTestId('advice-override')).toContainText('Overridden by')
  await expect(page.getByTestId('mesh-overridden')).toBeVisible()
  await expect(page.getByTestId('chain-check')).toContainText('History verified (4 events)')
  await expect(page.getByTestId('decision-timeline')).toContainText('Commented by Ada Ferreira')
  await expect(page.getByTestId('revise-link')).toHaveCount(0)

  // The advice links each method to its guidance article.
  const wallTreatment = await page.getByTestId('advice-wall-treatment').textContent()
  await page.getByTestId('advice-wall-treatment').click()
  await expect(page.getByTestId('guidance-article')).toBeVisible()
  await expect(page.getByTestId('guidance-article').getByRole('heading', { level: 1 })).toContainText(wallTreatment!.split(' (')[0]!)
})
