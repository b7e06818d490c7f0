import { expect, test } from '@playwright/test'
import { gotoHydrated, keepScreenshot, signInAs } from '../support/e2e'

test('QA verifies the ledger, signs a checkpoint, and checks its receipt pasted and altered', async ({ page }) => {
  await signInAs(page, 'auditor')
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Ledger' }).click()
  await expect(page).toHaveURL(/\/ledger$/)
  await gotoHydrated(page, '/ledger')

  // The whole ledger, verified from the page: the same answer as the API's.
  await page.getByTestId('ledger-verify-now').click()
  const result = page.getByTestId('ledger-verify-result')
  await expect(result).toContainText(/Valid:|problems? found:/)
  const api = await (await page.request.get('/api/ledger/verify')).json()
  await expect(result).toContainText(`${api.entries} entries`)

  // A checkpoint on request: it heads the list with a receipt to download.
  await page.getByTestId('ledger-sign-now').click()
  await expect(page.getByTestId('ledger-sign-notice')).toContainText(/Checkpoint #\d+ signed at entry #\d+/)
  const { checkpoints } = await (await page.request.get('/api/ledger/checkpoints')).json()
  const newest = checkpoints[0]
  await expect(page.getByTestId('ledger-checkpoint-table').locator('tbody tr').first()).toContainText(String(newest.seq))
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.getByTestId('ledger-checkpoint-table').getByRole('link', { name: 'Receipt' }).first().click(),
  ])
  expect(download.suggestedFilename()).toBe(`eddyledger-checkpoint-${newest.number}.txt`)
  await expect(page.getByTestId('ledger-key-active')).toContainText(newest.keyId)

  // The receipt pasted back matches; with one digit of its hash changed it does not.
  await page.getByTestId('ledger-receipt-text').fill(newest.receipt)
  await page.getByTestId('ledger-receipt-submit').click()
  await expect(page.getByTestId('ledger-receipt-result')).toContainText('Still in the ledger.')
  const altered = newest.receipt.replace(/hash: (\w)/, (_: string, c: string) => `hash: ${c === 'a' ? 'b' : 'a'}`)
  await page.getByTestId('ledger-receipt-text').fill(altered)
  await page.getByTestId('ledger-receipt-submit').click()
  await expect(page.getByTestId('ledger-receipt-result')).toContainText('No longer in the ledger. The signature does not hold')
  await keepScreenshot(page, 'auditor-ledger')
})
