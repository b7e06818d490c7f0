// The browser's view: how long /overview, /audit and /review take to show their content (the
// navigation until the page's table or figures are visible), in Debian's chromium.
import { chromium, type Browser } from '@playwright/test'
import { median } from './stats'

export const PAGES = [
  { path: '/overview', account: 'lead', ready: 'overview-figures' },
  { path: '/audit', account: 'auditor', ready: 'audit-table' },
  { path: '/review', account: 'reviewer', ready: 'review-queue' },
] as const

export async function launchBrowser() {
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  })
}

/** Median milliseconds from navigation to the page's content being visible, per page, over `loads` loads. */
export async function pageTimes(browser: Browser, base: string, loads: number) {
  const result: Record<string, number> = {}
  for (const spec of PAGES) {
    const context = await browser.newContext({ baseURL: base })
    const login = await context.request.post('/api/auth/login', {
      data: { email: `${spec.account}@eddyledger.test`, password: process.env.DEMO_PASSWORD || 'ledger-demo-2026' },
      headers: { origin: base },
    })
    if (!login.ok()) throw new Error(`sign-in of ${spec.account} failed: ${login.status()}`)
    const page = await context.newPage()
    const times: number[] = []
    for (let i = 0; i < loads + 1; i++) {
      const start = Date.now()
      await page.goto(spec.path)
      await page.getByTestId(spec.ready).first().waitFor({ state: 'visible', timeout: 60_000 })
      // The first load warms the browser's cache of scripts; it is not counted.
      if (i > 0) times.push(Date.now() - start)
    }
    result[spec.path] = median(times)
    await context.close()
  }
  return result
}
