import { expect, test } from '@playwright/test'
import { keepScreenshot, signInAs, signOut } from '../support/e2e'

const NAV: Record<string, string[]> = {
  engineer: ['Projects'],
  reviewer: ['Review queue', 'Projects'],
  auditor: ['Audit', 'Ledger', 'Overview', 'Projects'],
  lead: ['Overview', 'Audit', 'Ledger', 'Calibration', 'Projects', 'Rulesets'],
  admin: ['Projects', 'Users', 'Manage projects', 'Mail', 'Rulesets', 'Ledger'],
}
// Each role lands where its work waits.
const LANDING: Record<string, RegExp> = {
  engineer: /\/projects$/, reviewer: /\/review$/, auditor: /\/audit$/, lead: /\/overview$/, admin: /\/projects$/,
}
const ROLE_LABEL: Record<string, string> = {
  engineer: 'Engineer', reviewer: 'Senior reviewer', auditor: 'QA auditor', lead: 'Team lead', admin: 'Administrator',
}

test('a signed-out visitor is sent to sign-in', async ({ page }) => {
  await page.goto('/projects')
  await expect(page).toHaveURL(/\/login\?next=/)
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible()
  await keepScreenshot(page, 'sign-in')
})

test('a wrong password shows a message at the form', async ({ page }) => {
  await page.goto('/login')
  await page.getByLabel('E-mail').fill('engineer@eddyledger.test')
  await page.getByLabel('Password').fill('certainly-wrong')
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page.getByRole('alert')).toContainText(/not right/i)
})

for (const role of Object.keys(NAV)) {
  test(`${role} signs in and sees the navigation of the role`, async ({ page }) => {
    await signInAs(page, role)
    await expect(page).toHaveURL(LANDING[role]!)
    await expect(page.getByTestId('signed-in-user')).toContainText(ROLE_LABEL[role]!)
    const nav = page.getByRole('navigation', { name: 'Main' })
    await expect(nav.getByRole('link')).toHaveText([...NAV[role]!, 'Guidance'])
    await expect(page.getByTestId('general-cautions')).toContainText(/order-of-magnitude/)
    if (role === 'engineer') {
      await expect(page.getByTestId('projects-table')).toContainText('KB-101')
      await expect(page.getByTestId('projects-table')).not.toContainText('KB-104')
      await keepScreenshot(page, 'projects-engineer')
    }
    await signOut(page)
  })
}

test('a signed-in reviewer who opens the address of the product lands on the review queue', async ({ page }) => {
  await signInAs(page, 'reviewer')
  await page.goto('/')
  await expect(page).toHaveURL(/\/review$/)
})

test('an engineer who types an admin page address is sent back to projects', async ({ page }) => {
  await signInAs(page, 'engineer')
  await page.goto('/admin/users')
  await expect(page).toHaveURL(/\/projects$/)
})

test('the admin adds a user and sees them in the table', async ({ page }) => {
  await signInAs(page, 'admin')
  await page.getByRole('link', { name: 'Users' }).click()
  await page.getByLabel('Name', { exact: true }).fill('Iris Brennan')
  await page.getByLabel('E-mail').fill('iris.brennan@eddyledger.test')
  await page.getByRole('button', { name: 'Add user' }).click()
  await expect(page.getByTestId('users-table')).toContainText('iris.brennan@eddyledger.test')
  const row = page.getByTestId('users-table').getByRole('row').filter({ hasText: 'iris.brennan@eddyledger.test' })
  await expect(row).toContainText('Invited')
  await row.getByRole('button', { name: 'Resend invitation' }).click()
  await expect(page.getByRole('status').filter({ hasText: 'A new invitation goes to iris.brennan@eddyledger.test' })).toBeVisible()
  await keepScreenshot(page, 'admin-users')
})

test('an administrator on a project page is told who reads its decisions, with nothing to retry', async ({ page }) => {
  await signInAs(page, 'admin')
  await page.getByTestId('projects-table').getByRole('link').first().click()
  const note = page.getByTestId('decisions-unavailable')
  await expect(note).toContainText(/auditors and leads/i)
  await expect(note.getByRole('button', { name: 'Retry' })).toHaveCount(0)
})

