import { expect, test, type Page } from '@playwright/test'
import { gotoHydrated, keepScreenshot, signInAs } from '../support/e2e'

/** Content-Security-Policy violations the page reports, collected from the moment it loads. */
async function watchPolicyViolations(page: Page) {
  const violations: string[] = []
  await page.exposeFunction('reportViolation', (text: string) => { violations.push(text) })
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      (window as unknown as { reportViolation: (t: string) => void }).reportViolation(`${e.violatedDirective} ${e.blockedURI}`)
    })
  })
  page.on('console', (message) => { if (/Content Security Policy/i.test(message.text())) violations.push(message.text()) })
  return violations
}

test('the pages run under the security policy: hydration, styles, fonts and the chart', async ({ page }) => {
  const violations = await watchPolicyViolations(page)
  await signInAs(page, 'lead')
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Overview' }).click()
  await expect(page).toHaveURL(/\/overview$/)
  // chart.js draws on its canvas.
  const canvas = page.getByTestId('overview-method-chart').locator('canvas')
  await expect(canvas).toBeVisible()
  await expect.poll(() => canvas.evaluate((c: HTMLCanvasElement) => c.width > 0 && c.height > 0)).toBe(true)
  // Tailwind's stylesheet applies, and the bundled font is in use.
  const header = page.locator('header').first()
  await expect(header).toHaveCSS('background-color', 'rgb(20, 28, 37)')
  await expect.poll(() => page.evaluate(async () => {
    await document.fonts.ready
    return document.fonts.check('14px "Inter Variable"')
  })).toBe(true)
  await gotoHydrated(page, '/guidance')
  expect(violations).toEqual([])
})

test('"sign out everywhere" in the account menu ends the sessions in other browsers too', async ({ page, browser }) => {
  const other = await browser.newContext()
  const otherPage = await other.newPage()
  await signInAs(otherPage, 'auditor')
  await signInAs(page, 'auditor')

  await page.locator('summary', { has: page.getByTestId('signed-in-user') }).click()
  await expect(page.getByTestId('account-menu')).toContainText('Ends your sessions on every device')
  await keepScreenshot(page, 'account-menu')
  await page.getByRole('button', { name: 'Sign out everywhere' }).click()
  await expect(page).toHaveURL(/\/login/)

  // The other browser's session has ended: its next page asks it to sign in.
  await otherPage.reload()
  await expect(otherPage).toHaveURL(/\/login/)
  await other.close()
})
