import { expect, test } from '@playwright/test'
import { gotoHydrated, keepScreenshot, signInAs, signOut } from '../support/e2e'
import { EXPECTED, wallCsv } from '../support/wall-files'

// Our own demo case (KB-101): a 38 m ferry hull in water at 6.2 m/s; the reviewer signs off
// steady RANS with log-law wall functions, whose band is 30 <= y+ <= 300 (Launder & Spalding
// 1974; common practice).
const FERRY_CASE = {
  regime: 'external', fluid: { medium: 'water', temperatureK: 288 }, velocity: 6.2, length: 38,
  geometry: 'streamlined', separation: 'mild', quantities: ['forces'], budget: { coreHours: 50_000, cores: 256, wallClockHours: 72 },
}

test('an engineer uploads the wall y+ export, sees the histogram and verdict, and a reviewer accepts it', async ({ page }) => {
  // Four sign-ins and a cold first render of the decision page: more than the default minute.
  test.setTimeout(180_000)
  const title = `Hull wall y+ after the run ${Date.now().toString(36)}`
  await signInAs(page, 'engineer')
  const projects = (await (await page.request.get('/api/projects')).json()).projects as { id: number; code: string }[]
  const kb101 = projects.find(p => p.code === 'KB-101')!
  const created = await page.request.post(`/api/projects/${kb101.id}/decisions`, { data: { title, caseInput: FERRY_CASE } })
  const decision = (await created.json()).decision as { id: number; version: number }
  const submitted = await page.request.post(`/api/decisions/${decision.id}/submit`, { data: { version: decision.version } })
  const version = (await submitted.json()).decision.version as number
  await signOut(page)

  await signInAs(page, 'reviewer')
  const overridden = await page.request.post(`/api/decisions/${decision.id}/override`, {
    data: { version, approach: 'rans', model: 'k-omega SST', wallTreatment: 'wall-function', comment: 'Wall functions carry the resistance well enough at this Reynolds number.' },
  })
  expect(overridden.status()).toBe(200)
  await signOut(page)

  await signInAs(page, 'engineer')
  await gotoHydrated(page, `/decisions/${decision.id}`)
  const section = page.getByTestId('verification-section')
  await expect(section.getByTestId('verification-band')).toContainText('30 to 300')
  await section.getByTestId('open-wall-upload').click()
  await expect(section.getByText(/Up to 50 MB/)).toBeVisible()
  await section.getByLabel('Wall export of the solver (CSV or TSV)').setInputFiles({
    name: 'hull-wall.csv', mimeType: 'text/csv', buffer: Buffer.from(wallCsv({ faces: 400 })),
  })
  // The columns are read in the browser and offered for mapping.
  await expect(section.getByLabel('y+ column')).toHaveValue('y+')
  await expect(section.getByLabel('Face area column')).toHaveValue('face area [m^2]')
  await section.getByTestId('wall-upload').click()

  const check = section.locator('[data-testid^="wall-check-"]').first()
  // Arithmetic on the generated file: 62.5 % of the area inside, 25 % below, 12.5 % above.
  await expect(check.getByTestId('wall-inside')).toContainText(String(EXPECTED.byArea.inside * 100))
  await expect(check.getByTestId('wall-below')).toContainText('25')
  await expect(check.getByTestId('wall-verdict')).toHaveText('Fail')
  await expect(check.getByRole('img', { name: /Histogram of first-cell y\+/ })).toBeVisible()
  await expect(check.getByTestId('yplus-histogram-canvas')).toBeVisible()
  await expect(check.getByTestId('wall-patches')).toContainText('rudder')
  await expect(page.getByTestId('decision-timeline').getByTestId('event-wall_check_uploaded')).toBeVisible()
  await keepScreenshot(page, 'verification-wall-check')
  await signOut(page)

  await signInAs(page, 'reviewer')
  await gotoHydrated(page, `/decisions/${decision.id}`)
  const reviewing = page.getByTestId('verification-section').locator('[data-testid^="wall-check-"]').first()
  await expect(reviewing.getByTestId('wall-review-pending')).toBeVisible()
  await expect(reviewing.getByTestId('yplus-histogram-canvas')).toBeVisible()
  await reviewing.getByLabel('Your comment as reviewer').fill('Below-band faces are on the bulbous bow only; acceptable for resistance.')
  await reviewing.getByTestId('wall-accept').click()
  await expect(reviewing.getByTestId('wall-review')).toContainText('Accepted by')
  await expect(reviewing.getByTestId('wall-review-form')).toHaveCount(0)
  await expect(page.getByTestId('decision-timeline').getByTestId('event-wall_check_reviewed')).toBeVisible()
})
