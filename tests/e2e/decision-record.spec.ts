// The record a reviewer signs: the inputs as typed and in their units on the page, in the PDF and
// in the revise form; what changed between revisions; and a form that loses nothing.
import { execFileSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { expect, test, type Page } from '@playwright/test'
import { WALL_TREATMENT_LABELS } from '../../shared/rules'
import { LEAVE_MESSAGE } from '../../app/composables/useUnsavedGuard'
import { gotoHydrated, keepScreenshot, signInAs } from '../support/e2e'

// Long journeys through several pages (and a PDF): more time than one page's test on a busy machine.
test.describe.configure({ timeout: 180_000 })

// Our own scenario: the Kestrel Bay ferry hull (KB-101) typed in imperial units, as the client's
// drawings give them: 59 °F sea water, 24 ft/s, a 98 ft waterline.
const CASE = { temperatureF: '59', velocityFtS: '24', lengthFt: '98' }

async function fill(page: Page, field: string, value: string) {
  const input = page.locator(`#field-${field}`)
  await input.fill(value)
  await input.blur()
}

async function openNewCase(page: Page) {
  const projects = (await (await page.request.get('/api/projects')).json()).projects as { id: number; code: string }[]
  const kb101 = projects.find(p => p.code === 'KB-101')!
  await gotoHydrated(page, `/projects/${kb101.id}/decisions/new`)
  await expect(page.getByRole('heading', { name: 'New case' })).toBeVisible()
  return kb101
}

/** The text of a PDF, through poppler's pdftotext (installed by the test script). */
function pdfText(bytes: Buffer): string {
  const dir = mkdtempSync(join(tmpdir(), 'eddy-pdf-'))
  const file = join(dir, 'record.pdf')
  writeFileSync(file, bytes)
  return execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' })
}

test('an imperial case keeps its units on the decision page, in the PDF, in the revise form and in the revision diff', async ({ page }) => {
  await signInAs(page, 'engineer')
  await openNewCase(page)
  await page.getByTestId('unit-system').getByRole('radio', { name: 'Imperial units' }).click()
  await page.getByRole('radio', { name: 'Water' }).check()
  await fill(page, 'fluid-temperature', CASE.temperatureF)
  await fill(page, 'velocity', CASE.velocityFtS)
  await fill(page, 'length', CASE.lengthFt)
  await page.getByTestId('decision-title').fill(`Ferry hull in imperial units ${Date.now().toString(36)}`)
  await page.getByTestId('save-draft').click()
  await expect(page).toHaveURL(/\/decisions\/\d+$/)
  const decisionUrl = page.url()
  const decisionId = Number(new URL(decisionUrl).pathname.split('/').pop())

  // The decision page lists the inputs as typed: °F, ft/s, ft; nothing converted to SI.
  const inputs = page.getByTestId('case-inputs')
  await expect(inputs.getByTestId('case-unit-system')).toHaveText('Imperial units, as typed')
  await expect(inputs.getByTestId('input-temperature')).toHaveText('59\u202f°F')
  await expect(inputs.getByTestId('input-velocity')).toHaveText('24\u202fft/s')
  await expect(inputs.getByTestId('input-length')).toHaveText('98\u202fft')
  await expect(inputs.getByTestId('input-medium')).toHaveText('Water')
  await expect(inputs.getByTestId('input-quantities')).toHaveText('Forces and moments')
  await expect(inputs).not.toContainText('m/s')
  // The near-wall layers in imperial units too: inches and pounds-force per square foot.
  const mesh = page.getByTestId('mesh-card')
  await expect(mesh.getByTestId('mesh-first-cell-height')).toContainText('in')
  await expect(mesh.getByTestId('mesh-wall-shear')).toContainText('lbf/ft²')
  await expect(mesh.getByTestId('mesh-friction-velocity')).toContainText('ft/s')
  await expect(mesh.getByTestId('mesh-stack')).toHaveAttribute('aria-label', /layers from the wall to the boundary-layer edge/)
  await mesh.screenshot({ path: 'tests/artifacts/mesh-card-imperial.png' })
  await keepScreenshot(page, 'decision-imperial')

  // The PDF record prints the same inputs in the same units.
  const pdf = await page.request.get(`/api/decisions/${decisionId}/report.pdf`)
  expect(pdf.status()).toBe(200)
  // pdftotext breaks lines where the PDF wraps them: compare without whitespace.
  const text = pdfText(await pdf.body()).replace(/\s+/g, '')
  expect(text).toContain('Caseinputastyped(imperialunits)')
  expect(text).toContain('Free-streamvelocity24ft/s')
  expect(text).toContain('Temperature59°F')
  expect(text).toContain('Referencelength98ft')
  expect(text).not.toContain('(SIunits)')

  // Revising reopens the case in imperial units, as typed, not 18.3333 °C and 7.3152 m/s.
  await page.getByTestId('revise-link').click()
  await expect(page.getByTestId('unit-system').getByRole('radio', { name: 'Imperial units' })).toHaveAttribute('aria-checked', 'true')
  await expect(page.locator('#field-velocity')).toHaveValue('24')
  await expect(page.getByTestId('field-velocity-unit')).toHaveValue('ft/s')
  await expect(page.locator('#field-fluid-temperature')).toHaveValue('59')
  await expect(page.getByTestId('field-fluid-temperature-unit')).toHaveValue('degF')
  await expect(page.locator('#field-length')).toHaveValue('98')
  await fill(page, 'velocity', '30')
  await page.getByTestId('save-revision').click()
  await expect(page).toHaveURL(decisionUrl)
  await expect(page.getByTestId('input-velocity')).toHaveText('30\u202fft/s')

  // Revision 2 says what changed from revision 1: the velocity, in the units typed, and the advice.
  await page.getByTestId('decision-revisions').getByRole('link', { name: 'Revision 2' }).click()
  const diff = page.getByTestId('revision-diff')
  await expect(diff).toContainText('Changes from revision 1 to 2')
  const velocity = diff.getByTestId('diff-velocity')
  await expect(velocity).toContainText('Free-stream velocity')
  await expect(velocity).toContainText('24\u202fft/s')
  await expect(velocity).toContainText('30\u202fft/s')
  await expect(diff.getByTestId('diff-inputs').locator('tbody tr')).toHaveCount(1)
  // Re = U L / nu grows with U (Schlichting, Boundary-Layer Theory): the advice part names it.
  await expect(diff.getByTestId('diff-reynolds')).toContainText('Reynolds number')
  await keepScreenshot(page, 'revision-diff')
})

test('guidance opens beside the form, focus lands on the advice, and leaving asks first and keeps a draft', async ({ page, context }) => {
  await signInAs(page, 'engineer')
  await openNewCase(page)
  await fill(page, 'velocity', '7.5')
  await fill(page, 'length', '36')
  const title = `Hull at harbour speed ${Date.now().toString(36)}`
  await page.getByTestId('decision-title').fill(title)

  // After "Get advice" focus is on the advice's heading: the next Tab stays in the advice.
  await page.getByTestId('get-advice').click()
  await expect(page.getByTestId('advice-heading')).toBeFocused()
  // The advice view's code arrives with the first preview; a person reads the heading before tabbing on.
  await expect(page.getByTestId('advice-preview').getByTestId('advice-wall-treatment')).toBeVisible()
  await page.keyboard.press('Tab')
  expect(await page.evaluate(() => Boolean(document.activeElement?.closest('[data-testid="advice-preview"]')))).toBe(true)

  // A guidance link in the advice opens in a new tab; the form keeps its values.
  const guidance = page.getByTestId('advice-preview').getByTestId('advice-wall-treatment')
  await expect(guidance).toHaveAttribute('target', '_blank')
  const [article] = await Promise.all([context.waitForEvent('page'), guidance.click()])
  await article.waitForLoadState()
  await expect(article.getByTestId('guidance-article')).toBeVisible()
  await article.close()
  await expect(page.locator('#field-velocity')).toHaveValue('7.5')
  await expect(page.getByTestId('decision-title')).toHaveValue(title)

  // Leaving through the menu asks first; staying keeps everything.
  const asked: string[] = []
  page.once('dialog', (dialog) => { asked.push(dialog.message()); void dialog.dismiss() })
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Projects' }).click()
  await expect.poll(() => asked).toEqual([LEAVE_MESSAGE])
  await expect(page).toHaveURL(/\/decisions\/new$/)
  await expect(page.locator('#field-length')).toHaveValue('36')

  // Leaving anyway, then Back: the same values come back from the draft kept in this browser.
  page.once('dialog', (dialog) => { void dialog.accept() })
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Projects' }).click()
  await expect(page).toHaveURL(/\/projects$/)
  // Back once the projects page has loaded (a person sees it first), not during its navigation.
  await expect(page.getByRole('heading', { level: 1, name: 'Projects' })).toBeVisible()
  await page.goBack()
  await expect(page).toHaveURL(/\/decisions\/new$/)
  await expect(page.getByRole('heading', { level: 1, name: 'New case' })).toBeVisible()
  await expect(page.getByTestId('draft-restored')).toBeVisible()
  await expect(page.locator('#field-velocity')).toHaveValue('7.5')
  await expect(page.locator('#field-length')).toHaveValue('36')
  await expect(page.getByTestId('decision-title')).toHaveValue(title)
  await keepScreenshot(page, 'draft-restored')

  // Closing or reloading the tab is guarded by the browser's own question.
  const unload: string[] = []
  page.once('dialog', (dialog) => { unload.push(dialog.type()); void dialog.dismiss() })
  // The dismissed reload never completes: a short wait, then the page is still the form.
  await page.reload({ timeout: 3000 }).catch(() => {})
  await expect.poll(() => unload).toEqual(['beforeunload'])
  await expect(page.locator('#field-velocity')).toHaveValue('7.5')

  // Once saved, nothing is asked and the draft is gone.
  await page.getByTestId('save-draft').click()
  await expect(page).toHaveURL(/\/decisions\/\d+$/)
  await openNewCase(page)
  await expect(page.getByTestId('draft-restored')).toHaveCount(0)
  await expect(page.locator('#field-velocity')).toHaveValue('')
})

test('numbers are read strictly and a y+ target that contradicts the requested wall treatment is refused', async ({ page }) => {
  await signInAs(page, 'engineer')
  await openNewCase(page)
  await fill(page, 'velocity', '0x10')
  await expect(page.getByTestId('field-velocity')).toContainText('hexadecimal')
  await fill(page, 'velocity', '12')
  await fill(page, 'length', '2')
  await fill(page, 'budget-coreHours', '1 000')
  await expect(page.getByTestId('field-budget-coreHours')).toContainText('Enter the digits without separators: 1000.')
  await fill(page, 'budget-coreHours', '1000')
  // An emptied temperature is not silently room temperature.
  await fill(page, 'fluid-temperature', '')
  await fill(page, 'turbulenceIntensityPercent', '')
  await expect(page.getByTestId('field-turbulenceIntensityPercent').getByTestId('field-assumed')).toHaveText('Left empty: 1\u202f% is assumed.')
  await page.getByTestId('decision-title').fill('Strict input')
  await page.getByTestId('save-draft').click()
  await expect(page.getByTestId('field-fluid-temperature')).toContainText('Temperature is required for air')
  // Focus goes to the first field in error.
  await expect(page.locator('#field-fluid-temperature')).toBeFocused()
  await fill(page, 'fluid-temperature', '20')

  // The engineer asks for a resolved wall but a y+ of 1000: refused at the field.
  await fill(page, 'yPlusTarget', '1000')
  await page.getByLabel('Requested wall treatment').selectOption('resolved')
  await page.locator('#field-requested-reason').fill('The client wants the wall heat flux resolved, not modelled.')
  await page.getByTestId('save-draft').click()
  await expect(page.getByTestId('field-yPlusTarget')).toContainText('contradicts the wall treatment you requested')
  await expect(page).toHaveURL(/\/decisions\/new$/)
  await fill(page, 'yPlusTarget', '1')
  await page.getByTestId('save-draft').click()
  await expect(page).toHaveURL(/\/decisions\/\d+$/)
  const choice = page.getByTestId('requested-choice')
  await expect(choice).toContainText('The client wants the wall heat flux resolved')
  await expect(choice.getByTestId('requested-table-wall-treatment').getByTestId('other')).toHaveText(WALL_TREATMENT_LABELS.resolved)
})
