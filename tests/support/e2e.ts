// Browser-test helpers: sign in through the real form, keep screenshots of the main views.
import { mkdirSync } from 'node:fs'
import { expect, type Page } from '@playwright/test'
import { DEMO_PASSWORD } from './test-server'

export const ARTIFACTS = 'tests/artifacts'

export async function signInAs(page: Page, key: string) {
  await page.goto('/login')
  await page.getByLabel('E-mail').fill(`${key}@eddyledger.test`)
  await page.getByLabel('Password').fill(DEMO_PASSWORD)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page.getByTestId('signed-in-user')).toBeVisible()
}

export async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click()
  await expect(page).toHaveURL(/\/login/)
}

export async function keepScreenshot(page: Page, name: string) {
  mkdirSync(ARTIFACTS, { recursive: true })
  await page.screenshot({ path: `${ARTIFACTS}/${name}.png`, fullPage: true })
}
