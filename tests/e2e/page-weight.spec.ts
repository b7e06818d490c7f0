// What each page makes the browser download: scripts compressed, the audit and overview pages
// without the engine, the unit library or the markdown code, the audit page without the chart
// code, and the questionnaire's first load within its budget. Sizes are counted as gzip level 9
// (what the server's .gz files hold); the browser itself is sent brotli, smaller still.
import { gzipSync } from 'node:zlib'
import { expect, test, type Page } from '@playwright/test'
import { RULESET } from '../../shared/rules'
import { DEMO_PASSWORD } from '../support/test-server'
import { gotoHydrated } from '../support/e2e'

// The questionnaire's first load, scripts only, gzip.
const QUESTIONNAIRE_BUDGET = 200 * 1024

// Text only each library's code carries: a rule id of our ruleset (the engine), an error message
// of mathjs, of chart.js and of marked, and DOMPurify's name.
const LIBRARIES = {
  engine: RULESET.rules[0]!.id,
  units: 'Unexpected type of argument',
  chart: 'Canvas is already in use',
  markdown: 'marked(): input parameter',
  sanitiser: 'DOMPurify',
} as const
type Library = keyof typeof LIBRARIES

type Script = { url: string; encoding: string | undefined; bytes: number; gzipBytes: number; libraries: Library[] }

/** Every script the page loads until the network is idle. */
async function scriptsOf(page: Page, open: () => Promise<void>): Promise<Script[]> {
  const pending: Promise<Script>[] = []
  const listener = (response: import('@playwright/test').Response) => {
    if (!/\/_nuxt\/.*\.js$/.test(new URL(response.url()).pathname)) return
    pending.push((async () => {
      const body = await response.body()
      const text = body.toString('utf8')
      return {
        url: response.url(),
        encoding: (await response.allHeaders())['content-encoding'],
        bytes: body.length,
        gzipBytes: gzipSync(body, { level: 9 }).length,
        libraries: (Object.keys(LIBRARIES) as Library[]).filter(name => text.includes(LIBRARIES[name])),
      }
    })())
  }
  page.on('response', listener)
  await open()
  await page.waitForLoadState('networkidle')
  page.off('response', listener)
  return Promise.all(pending)
}

const librariesOf = (scripts: Script[]) => [...new Set(scripts.flatMap(s => s.libraries))].sort()

/** Signs in without opening a page, so the browser's cache holds no script yet. */
async function signInQuietly(page: Page, key: string) {
  const origin = test.info().project.use.baseURL!
  const res = await page.request.post('/api/auth/login', { data: { email: `${key}@eddyledger.test`, password: DEMO_PASSWORD }, headers: { origin } })
  expect(res.status()).toBe(200)
}

test('the audit page loads no engine, unit, chart or markdown code, and its scripts come compressed', async ({ page }) => {
  await signInQuietly(page, 'auditor')
  const scripts = await scriptsOf(page, () => gotoHydrated(page, '/audit'))
  await expect(page.getByTestId('audit-table')).toBeVisible()
  expect(scripts.length).toBeGreaterThan(0)
  // The server keeps a compressed copy of every script above 1 kB (smaller ones gain nothing).
  for (const script of scripts.filter(s => s.bytes > 1024)) expect(script.encoding, script.url).toMatch(/^(br|gzip)$/)
  expect(librariesOf(scripts)).toEqual([])
})

test('the overview page carries its chart but no engine, unit or markdown code', async ({ page }) => {
  await signInQuietly(page, 'lead')
  const scripts = await scriptsOf(page, () => gotoHydrated(page, '/overview'))
  await expect(page.getByTestId('overview-method-chart').locator('canvas')).toBeVisible()
  expect(librariesOf(scripts)).toEqual(['chart'])
})

test('the questionnaire\'s first load stays within 200 KB of gzip script; the advice view comes with the first preview', async ({ page }) => {
  await signInQuietly(page, 'engineer')
  const projects = (await (await page.request.get('/api/projects')).json()).projects as { id: number; code: string }[]
  const kb101 = projects.find(p => p.code === 'KB-101')!
  const scripts = await scriptsOf(page, () => gotoHydrated(page, `/projects/${kb101.id}/decisions/new`))
  const total = scripts.reduce((sum, s) => sum + s.gzipBytes, 0)
  test.info().annotations.push({ type: 'questionnaire first load', description: `${(total / 1024).toFixed(0)} KB gzip in ${scripts.length} scripts` })
  expect(total).toBeLessThanOrEqual(QUESTIONNAIRE_BUDGET)
  // The live estimate runs the engine in the browser; units convert by a table, without mathjs.
  expect(librariesOf(scripts)).toEqual(['engine'])

  // The first preview brings the advice view: its chart and the markdown of the reasons.
  const more = await scriptsOf(page, async () => {
    for (const [field, value] of [['velocity', '6'], ['length', '36']] as const) {
      await page.locator(`#field-${field}`).fill(value)
      await page.locator(`#field-${field}`).blur()
    }
    await page.getByTestId('get-advice').click()
    await expect(page.getByTestId('advice-view')).toBeVisible()
  })
  // The chart's code is not in the first load (above); it may arrive once the page is idle, before
  // the preview, so what counts is that the chart is drawn.
  expect(librariesOf(more)).toContain('markdown')
  await expect(page.getByTestId('advice-view').locator('canvas')).toBeVisible()
})
