// Removing a project member asks first, says what happened, and can be undone.
import { expect, test } from '@playwright/test'
import { gotoHydrated, signInAs } from '../support/e2e'

test('an administrator removes a member after confirming, reads what happened, and undoes it', async ({ page }) => {
  await signInAs(page, 'admin')
  await gotoHydrated(page, '/admin/projects')
  await page.getByTestId('admin-projects').getByRole('button', { name: /KB-104/ }).click()
  const members = page.getByTestId('admin-members')
  const row = members.getByRole('row').filter({ hasText: 'Tomas Lindqvist' })
  await expect(row).toBeVisible()

  // The first press only asks; keeping the member changes nothing.
  await row.getByRole('button', { name: 'Remove Tomas Lindqvist…' }).click()
  await expect(row.getByTestId('confirm-remove')).toBeVisible()
  await row.getByRole('button', { name: 'Keep' }).click()
  await expect(row.getByTestId('confirm-remove')).toHaveCount(0)

  await row.getByRole('button', { name: 'Remove Tomas Lindqvist…' }).click()
  await row.getByRole('button', { name: 'Remove Tomas Lindqvist from KB-104' }).click()
  const notice = page.getByTestId('admin-notice')
  await expect(notice).toContainText('Tomas Lindqvist is no longer a member of KB-104.')
  await expect(members).not.toContainText('Tomas Lindqvist')

  // Undo puts the member back.
  await notice.getByTestId('undo').click()
  await expect(members).toContainText('Tomas Lindqvist')
  await expect(page.getByTestId('admin-notice')).toContainText('Undone.')
})
