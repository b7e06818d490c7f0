import { expect, test } from '@playwright/test'
import { gotoHydrated, keepScreenshot, signInAs, signOut } from '../support/e2e'

// The invitation and reset e-mails go to the local mail catcher that scripts/test.sh starts.
const MAILDEV = process.env.TEST_MAILDEV_URL
type Message = { subject: string; text: string; to: { address: string }[] }

async function mailTo(address: string, subject: RegExp) {
  let found: Message | undefined
  await expect.poll(async () => {
    const list = await (await fetch(`${MAILDEV}/api/email`)).json() as Message[]
    found = list.find(m => m.to.some(t => t.address === address) && subject.test(m.subject))
    return Boolean(found)
  }, { timeout: 15_000 }).toBe(true)
  return found!
}

// The link's path and query, opened on the test server.
function linkIn(text: string) {
  const url = new URL(text.match(/https?:\/\/\S+\/set-password\?token=[\w-]+/)![0])
  return url.pathname + url.search
}

test('an invited user sets a password from the e-mail link, once; the admin sees the mail go out', async ({ page }) => {
  test.skip(!MAILDEV, 'needs the mail catcher of npm test')
  const email = `hana.sato.${Date.now().toString(36)}@eddyledger.test`

  await signInAs(page, 'admin')
  await page.getByRole('link', { name: 'Users' }).click()
  await page.getByLabel('Name', { exact: true }).fill('Hana Sato')
  await page.getByLabel('E-mail').fill(email)
  await page.getByRole('button', { name: 'Add user' }).click()
  await expect(page.getByTestId('users-table')).toContainText(email)

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Mail' }).click()
  const row = page.getByTestId('mail-table').getByRole('row', { name: new RegExp(email.replace(/\./g, '\\.')) })
  await expect(async () => {
    await page.getByRole('button', { name: 'Refresh' }).click()
    await expect(row).toContainText('Sent', { timeout: 1000 })
  }).toPass({ timeout: 15_000 })
  await expect(row).toContainText('Invitation')
  await keepScreenshot(page, 'admin-mail')
  const consoleErrors: string[] = []
  page.on('console', (message) => { if (message.type() === 'error') consoleErrors.push(message.text()) })
  await gotoHydrated(page, '/admin/mail')
  await expect(row).toContainText('Sent')
  expect(consoleErrors).toEqual([])
  await signOut(page)

  const invitation = await mailTo(email, /set a password/i)
  const link = linkIn(invitation.text)
  await gotoHydrated(page, link)
  await expect(page.getByRole('heading', { name: 'Set your password' })).toBeVisible()
  await page.getByLabel('New password').fill('harbour-ferry-2026')
  await page.getByLabel('Repeat the password').fill('harbour-ferry-2025')
  await page.getByRole('button', { name: 'Set password and sign in' }).click()
  await expect(page.getByText('The two passwords differ')).toBeVisible()
  await keepScreenshot(page, 'set-password')
  await page.getByLabel('Repeat the password').fill('harbour-ferry-2026')
  await page.getByRole('button', { name: 'Set password and sign in' }).click()
  await expect(page).toHaveURL(/\/projects$/)
  await expect(page.getByTestId('signed-in-user')).toContainText('Hana Sato')
  await signOut(page)

  // The same link a second time.
  await gotoHydrated(page, link)
  await page.getByLabel('New password').fill('another-password-1')
  await page.getByLabel('Repeat the password').fill('another-password-1')
  await page.getByRole('button', { name: 'Set password and sign in' }).click()
  await expect(page.getByRole('alert')).toContainText('This link has expired or was already used')

  // And the password chosen the first time works at the sign-in form.
  await gotoHydrated(page, '/login')
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password').fill('harbour-ferry-2026')
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page.getByTestId('signed-in-user')).toContainText('Hana Sato')
})

test('a forgotten password: the same answer for any address, and a reset link for a real one', async ({ page }) => {
  test.skip(!MAILDEV, 'needs the mail catcher of npm test')
  await gotoHydrated(page, '/login')
  await page.getByRole('link', { name: 'Forgot password?' }).click()
  await expect(page).toHaveURL(/\/forgot-password$/)
  await page.getByLabel('E-mail').fill('not-an-address')
  await page.getByRole('button', { name: 'Send the link' }).click()
  await expect(page.getByText('Enter a valid e-mail address')).toBeVisible()

  await page.getByLabel('E-mail').fill('lead@eddyledger.test')
  await page.getByRole('button', { name: 'Send the link' }).click()
  const answer = page.getByRole('status').filter({ hasText: /if the address belongs/i })
  await expect(answer).toBeVisible()
  const knownText = await answer.textContent()
  await keepScreenshot(page, 'forgot-password')

  await gotoHydrated(page, '/forgot-password')
  await page.getByLabel('E-mail').fill(`nobody.${Date.now()}@eddyledger.test`)
  await page.getByRole('button', { name: 'Send the link' }).click()
  await expect(page.getByRole('status').filter({ hasText: /if the address belongs/i })).toHaveText(knownText!)

  const reset = await mailTo('lead@eddyledger.test', /reset your eddyledger password/i)
  await page.goto(linkIn(reset.text))
  await expect(page.getByRole('heading', { name: 'Set your password' })).toBeVisible()
  // Signing in as the lead with the demo password still works until the link is used.
  await signInAs(page, 'lead')
})
