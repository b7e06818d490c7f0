import { expect, test } from '@playwright/test'
import { gotoHydrated, keepScreenshot, signInAs, signOut } from '../support/e2e'
import { DEMO_PASSWORD } from '../support/test-server'

// Our own demo case (KB-101): a 38 m ferry hull in water at 6.2 m/s.
const FERRY_CASE = {
  regime: 'external',
  fluid: { medium: 'water', temperatureK: 288 },
  velocity: 6.2,
  length: 38,
  geometry: 'streamlined',
  separation: 'mild',
  quantities: ['forces'],
  budget: { coreHours: 50_000, cores: 256, wallClockHours: 72 },
}
const OVERRIDE_COMMENT = 'The stern separation drives the resistance here; resolve its eddies with a hybrid model.'

test('an engineer submits, a reviewer overrides from the queue, and the engineer sees why', async ({ page }) => {
  test.setTimeout(150_000) // three people, two sign-ins each way, and a supersede
  const title = `Hull resistance at service speed ${Date.now().toString(36)}`

  // The engineer's draft, saved through the API in the engineer's own session.
  await signInAs(page, 'engineer')
  const projects = (await (await page.request.get('/api/projects')).json()).projects as { id: number; code: string }[]
  const kb101 = projects.find(p => p.code === 'KB-101')!
  const created = await page.request.post(`/api/projects/${kb101.id}/decisions`, { data: { title, caseInput: FERRY_CASE } })
  expect(created.status()).toBe(201)
  const decisionId = (await created.json()).decision.id as number

  await gotoHydrated(page, `/decisions/${decisionId}`)
  await expect(page.getByTestId('decision-title')).toHaveText(title)
  await expect(page.getByTestId('status-draft')).toBeVisible()
  // Submitting hands the case on: the page says what follows and asks once more.
  await page.getByTestId('submit-for-review').click()
  await expect(page.getByTestId('confirm-submit')).toContainText('can no longer be revised')
  await page.getByTestId('confirm-submit').getByRole('button', { name: 'Submit for review' }).click()
  await expect(page.getByTestId('status-in_review')).toBeVisible()
  await expect(page.getByTestId('review-done')).toContainText('Submitted')
  await expect(page.getByTestId('submit-for-review')).toHaveCount(0)
  await expect(page.getByTestId('event-submitted')).toBeVisible()
  await signOut(page)

  // The reviewer finds it in the queue with its project, approach, Re and cost.
  await signInAs(page, 'reviewer')
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Review queue' }).click()
  const row = page.getByTestId(`queue-row-${decisionId}`)
  await expect(row).toContainText('KB-101')
  await expect(row).toContainText(title)
  await expect(row).toContainText('Steady RANS')
  await expect(row).toContainText('Ada Ferreira')
  await expect(row).toContainText(/%/)
  await keepScreenshot(page, 'review-queue')
  // Rendered on the server too: a reload hydrates without a mismatch.
  const consoleErrors: string[] = []
  page.on('console', (message) => { if (message.type() === 'error') consoleErrors.push(message.text()) })
  await gotoHydrated(page, '/review')
  await expect(row).toContainText(title)
  expect(consoleErrors).toEqual([])

  await row.getByRole('link', { name: title }).click()
  await expect(page.getByTestId('status-in_review')).toBeVisible()
  await page.getByRole('button', { name: 'Override…' }).click()
  const form = page.getByTestId('override-form')
  // A comment too short to be a reason is refused at the field, before anything is sent.
  await form.getByLabel('Why (required)').fill('No.')
  await form.getByRole('button', { name: 'Record the override' }).click()
  await expect(form).toContainText(/at least a sentence/)

  await form.getByLabel('Approach', { exact: true }).selectOption({ label: 'Hybrid RANS-LES (DES family)' })
  await expect(form.getByLabel('Model', { exact: true })).toHaveValue('IDDES')
  await form.getByLabel('Wall treatment', { exact: true }).selectOption('resolved')
  await form.getByLabel('Target y+ (optional)').fill('1')
  await form.getByLabel('Why (required)').fill(OVERRIDE_COMMENT)
  await form.getByRole('checkbox', { name: /Mild separation/ }).check()
  await keepScreenshot(page, 'override-form')
  await form.getByRole('button', { name: 'Record the override' }).click()
  await expect(page.getByTestId('status-overridden')).toBeVisible()
  await expect(page.getByTestId('override-form')).toHaveCount(0)
  await signOut(page)

  // The engineer sees the reviewer's choice beside the engine's, and the reason on the timeline.
  await signInAs(page, 'engineer')
  await gotoHydrated(page, `/projects/${kb101.id}`)
  await page.getByRole('link', { name: title }).click()
  await expect(page.getByTestId('status-overridden')).toBeVisible()
  const block = page.getByTestId('override-block')
  await expect(block).toContainText('Overridden by Priya Raman')
  const table = block.getByTestId('override-table')
  await expect(table.getByTestId('override-table-approach').getByTestId('other')).toHaveText('Hybrid RANS-LES (DES family)')
  await expect(table.getByTestId('override-table-model').getByTestId('other')).toHaveText('IDDES')
  await expect(table.getByTestId('override-table-approach').getByTestId('engine')).toHaveText('Steady RANS')
  // Each column is costed for its own choice: the reviewer's costs more than the engine's.
  const coreHours = table.getByTestId('override-table-core-hours')
  await expect(coreHours.getByTestId('other')).not.toHaveText(await coreHours.getByTestId('engine').innerText())
  await expect(block.getByTestId('override-comment')).toHaveText(OVERRIDE_COMMENT)
  await expect(block).toContainText(/Disagrees with: Mild separation/)
  const event = page.getByTestId('decision-timeline').getByTestId('event-overridden')
  await expect(event).toContainText('Priya Raman')
  await expect(event).toContainText('Senior reviewer')
  await expect(event).toContainText('Hybrid RANS-LES (DES family)')
  await expect(event).toContainText(OVERRIDE_COMMENT)
  // Closed: no review buttons for the author, but a new decision may supersede it.
  await expect(page.getByRole('button', { name: 'Approve' })).toHaveCount(0)
  await expect(page.getByRole('button', { name: /Supersede/ })).toBeVisible()
  await keepScreenshot(page, 'decision-overridden')

  // A change now means a new decision that links back; the old one shows superseded.
  await page.getByRole('button', { name: /Supersede/ }).click()
  await page.getByRole('button', { name: 'Create the new draft' }).click()
  await expect(page).not.toHaveURL(new RegExp(`/decisions/${decisionId}$`))
  await expect(page.getByTestId('status-draft')).toBeVisible()
  // The new draft starts from the reviewer's choice, recorded as the engineer's own.
  await expect(page.getByTestId('requested-adopted')).toContainText(`Adopted from Priya Raman's override of decision ${decisionId}`)
  await expect(page.getByTestId('requested-table-approach').getByTestId('other')).toHaveText('Hybrid RANS-LES (DES family)')
  const header = page.getByTestId('decision-header')
  await expect(header.getByRole('link', { name: `decision ${decisionId}` })).toBeVisible()
  await header.getByRole('link', { name: `decision ${decisionId}` }).click()
  await expect(page.getByTestId('status-superseded')).toBeVisible()
  await expect(page.getByRole('button', { name: /Supersede/ })).toHaveCount(0)
})

test('a reviewer who acts on a decision someone else already closed is told to reload', async ({ page, request }) => {
  const title = `Duct pressure drop ${Date.now().toString(36)}`
  await signInAs(page, 'engineer')
  const projects = (await (await page.request.get('/api/projects')).json()).projects as { id: number; code: string }[]
  const kb102 = projects.find(p => p.code === 'KB-102')!
  const created = await (await page.request.post(`/api/projects/${kb102.id}/decisions`, {
    data: { title, caseInput: { ...FERRY_CASE, regime: 'internal', geometry: 'duct', fluid: { medium: 'air' }, velocity: 8, length: 0.6 } },
  })).json()
  const submitted = await page.request.post(`/api/decisions/${created.decision.id}/submit`, { data: { version: created.decision.version } })
  expect(submitted.status()).toBe(200)
  const inReview = (await submitted.json()).decision as { id: number; version: number }
  await signOut(page)

  // Two reviewers have the same decision open; the other one approves first.
  await signInAs(page, 'reviewer')
  await gotoHydrated(page, `/decisions/${created.decision.id}`)
  await expect(page.getByTestId('status-in_review')).toBeVisible()
  // Meanwhile the other reviewer of the project approves it from their own session.
  expect((await request.post('/api/auth/login', { data: { email: 'reviewer2@eddyledger.test', password: DEMO_PASSWORD } })).status()).toBe(200)
  const approved = await request.post(`/api/decisions/${created.decision.id}/approve`, { data: { version: inReview.version } })
  expect(approved.status()).toBe(200)

  await page.getByRole('button', { name: 'Approve…' }).click()
  await page.getByTestId('confirm-approve').getByRole('button', { name: 'Approve and close' }).click()
  await expect(page.getByTestId('review-error')).toContainText('Someone else acted first')
  await page.getByRole('button', { name: 'Reload the decision' }).click()
  await expect(page.getByTestId('status-approved')).toBeVisible()
  await expect(page.getByRole('button', { name: 'Approve' })).toHaveCount(0)
})

test('a reviewer sends a decision back with a reason; it is a draft again with the reason on the record', async ({ page }) => {
  const title = `Condenser wake ${Date.now().toString(36)}`
  await signInAs(page, 'engineer')
  const projects = (await (await page.request.get('/api/projects')).json()).projects as { id: number; code: string }[]
  const kb103 = projects.find(p => p.code === 'KB-103')!
  const created = await (await page.request.post(`/api/projects/${kb103.id}/decisions`, {
    data: { title, caseInput: { ...FERRY_CASE, fluid: { medium: 'air' }, geometry: 'bluff', separation: 'massive', velocity: 5, length: 2.4 } },
  })).json()
  expect((await page.request.post(`/api/decisions/${created.decision.id}/submit`, { data: { version: created.decision.version } })).status()).toBe(200)
  await signOut(page)

  await signInAs(page, 'reviewer')
  await gotoHydrated(page, `/decisions/${created.decision.id}`)
  const comment = page.getByLabel(/Comment \(optional to approve/)
  await comment.fill('Why?')
  await page.getByRole('button', { name: 'Request changes' }).click()
  await expect(page.getByTestId('review-actions')).toContainText(/at least a sentence/)
  await expect(page.getByTestId('status-in_review')).toBeVisible()
  await comment.fill('Give the fin spacing of the condenser units; it sets the wake scale.')
  await page.getByRole('button', { name: 'Request changes' }).click()
  await expect(page.getByTestId('status-draft')).toBeVisible()
  // Still a draft, but it says who asked for changes.
  await expect(page.getByTestId('status-draft')).toHaveText('Draft: changes requested by Priya Raman')
  await expect(page.getByRole('button', { name: 'Approve' })).toHaveCount(0)
  const event = page.getByTestId('decision-timeline').getByTestId('event-changes_requested')
  await expect(event).toContainText('Priya Raman')
  await expect(event).toContainText('Give the fin spacing of the condenser units; it sets the wake scale.')
})
