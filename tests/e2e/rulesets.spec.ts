import { expect, test } from '@playwright/test'
import { gotoHydrated, keepScreenshot, signInAs } from '../support/e2e'

// A lead drafts a new ruleset version, edits a rule in its form (the condition checked at once),
// saves it and previews which past decisions would change, all before anything is published.
// The draft is discarded at the end, so the other browser tests see the published rules unchanged.
test('a lead edits a rule in the form and sees its impact on past decisions before publishing', async ({ page }) => {
  await signInAs(page, 'lead')
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Rulesets' }).click()
  await expect(page).toHaveURL(/\/rulesets$/)
  await gotoHydrated(page, '/rulesets')
  const published = (await (await page.request.get('/api/rulesets/published')).json()).ruleset
  await expect(page.getByTestId(`ruleset-row-${published.version}-published`)).toBeVisible()

  await page.getByTestId('ruleset-new-draft').click()
  await expect(page).toHaveURL(/\/rulesets\/\d+$/)
  await page.waitForLoadState('networkidle')
  await expect(page.getByTestId('ruleset-title')).not.toContainText(published.version)
  await expect(page.getByTestId('ruleset-status')).toHaveText('Draft')

  // The rule for mild separation: its condition is checked as it is typed.
  await page.getByTestId('rule-item-mild-separation').click()
  const condition = page.getByTestId('rule-condition')
  await condition.fill('{ "==": [{ "var": "separaton" }, "mild"] }')
  await expect(page.getByTestId('rule-problems')).toContainText('Unknown fact "separaton"')
  await condition.fill('{ "==": [{ "var": "separation" }, "mild"')
  await expect(page.getByTestId('rule-condition-error')).toContainText('Not valid JSON')
  await condition.fill('{ "==": [{ "var": "separation" }, "mild"] }')
  await expect(page.getByTestId('rule-valid')).toBeVisible()

  // The team's choice: realizable k-epsilon for steady RANS in mildly separated flow.
  await page.getByLabel('Model for Steady RANS').selectOption('realizable k-epsilon')
  await expect(page.getByTestId('rule-valid')).toBeVisible()
  await page.getByTestId('ruleset-save').click()
  await expect(page.getByTestId('ruleset-notice')).toHaveText('Draft saved.')

  // The canonical ferry hull case expects k-omega SST, so publishing is blocked.
  await page.getByTestId('tab-cases').click()
  await expect(page.getByTestId('ruleset-cases')).toContainText('Ferry hull at service speed')
  await expect(page.getByTestId('case-result-0')).toHaveText('fails')

  // The impact: the seeded ferry hull decision (mild separation, steady RANS) changes model.
  await page.getByTestId('tab-impact').click()
  await page.getByTestId('impact-run').click()
  await expect(page.getByTestId('impact-summary')).toBeVisible()
  const changes = page.getByTestId('impact-changes').locator('tbody tr')
  await expect(changes.first()).toBeVisible()
  const hull = changes.filter({ hasText: 'realizable k-epsilon' }).first()
  await expect(hull).toContainText('Steady RANS · k-omega SST')
  await expect(hull).toContainText('mild-separation')
  // The table is the server's answer for the saved draft.
  const draftId = Number(page.url().split('/').at(-1))
  const impact = await (await page.request.post(`/api/rulesets/${draftId}/impact`, { data: {} })).json()
  await expect(changes).toHaveCount(impact.changes.length)
  await expect(page.getByTestId('impact-summary')).toHaveText(`${impact.changes.length} of ${impact.evaluated} decisions would change approach, model or wall treatment.`)
  await keepScreenshot(page, 'ruleset-impact')

  // Not published: the publish tab says why, and the published version still advises.
  await page.getByTestId('tab-publish').click()
  await expect(page.getByTestId('publish-blockers')).toContainText('A canonical case fails')
  await expect(page.getByTestId('publish-button')).toBeDisabled()
  expect((await (await page.request.get('/api/rulesets/published')).json()).ruleset.version).toBe(published.version)

  page.once('dialog', dialog => dialog.accept())
  await page.getByRole('button', { name: 'Discard draft' }).click()
  await expect(page).toHaveURL(/\/rulesets$/)
})
