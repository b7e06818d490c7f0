// Browser-test helpers: sign in through the real form, keep screenshots of the main views.
import { mkdirSync } from 'node:fs'
import { expect, type Page } from '@playwright/test'
import { DEMO_PASSWORD } from './test-server'

export const ARTIFACTS = 'tests/artifacts'

/** Opens a page and waits until Vue has hydrated it, so that typing is not undone by hydration. */
export async function gotoHydrated(page: Page, url: string) {
  // networkidle: the page's chunks (and its async setup) have loaded; __vue_app__: Vue has mounted.
  await page.goto(url, { waitUntil: 'networkidle' })
  await page.waitForFunction(() => Boolean((document.querySelector('#__nuxt') as { __vue_app__?: unknown } | null)?.__vue_app__))
}

export async function signInAs(page: Page, key: string) {
  await gotoHydrated(page, '/login')
  await page.getByLabel('E-mail').fill(`${key}@eddyledger.test`)
  await page.getByLabel('Password').fill(DEMO_PASSWORD)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page.getByTestId('signed-in-user')).toBeVisible()
}

export async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out', exact: true }).click()
  await expect(page).toHaveURL(/\/login/)
}

export async function keepScreenshot(page: Page, name: string) {
  mkdirSync(ARTIFACTS, { recursive: true })
  await page.screenshot({ path: `${ARTIFACTS}/${name}.png`, fullPage: true })
}
