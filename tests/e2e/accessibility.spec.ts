// Every page, as each role that can open it: no horizontal scroll on a 390 px phone and no
// serious or critical accessibility violation (axe-core run in the page itself).
import { createRequire } from 'node:module'
import { expect, test, type Page } from '@playwright/test'
import { gotoHydrated, keepScreenshot, signInAs } from '../support/e2e'

const AXE_SOURCE = createRequire(import.meta.url).resolve('axe-core/axe.min.js')
const PHONE = { width: 390, height: 844 }
const DESKTOP = { width: 1280, height: 860 }

type AxeResult = { violations: { id: string; impact: string | null; help: string; nodes: { target: string[] }[] }[] }

/** Serious and critical axe violations of the page as it is now, one line each. */
async function seriousViolations(page: Page): Promise<string[]> {
  if (!(await page.evaluate(() => 'axe' in window))) await page.addScriptTag({ path: AXE_SOURCE })
  const result = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (context: Document, options: unknown) => Promise<unknown> } }).axe
    return await axe.run(document, { resultTypes: ['violations'] })
  }) as AxeResult
  return result.violations
    .filter(v => v.impact === 'serious' || v.impact === 'critical')
    .map(v => `${v.id} (${v.impact}): ${v.help} at ${v.nodes.slice(0, 3).map(n => n.target.join(' ')).join(', ')}${v.nodes.length > 3 ? ` and ${v.nodes.length - 3} more` : ''}`)
}

/** How far the page is wider than the window, in CSS pixels (0 when it fits). */
async function overflow(page: Page): Promise<number> {
  return page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)
}

/** What is wider than the window: the widest offenders, to name in a failure. */
async function widest(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const limit = document.documentElement.clientWidth
    const found: { name: string; right: number }[] = []
    for (const el of Array.from(document.querySelectorAll('body *'))) {
      const box = el.getBoundingClientRect()
      if (box.right > limit + 1 && box.width > 0) {
        const id = el.id ? `#${el.id}` : ''
        const testid = el.getAttribute('data-testid') ? `[data-testid=${el.getAttribute('data-testid')}]` : ''
        found.push({ name: `${el.tagName.toLowerCase()}${id}${testid}.${String(el.className).split(' ').slice(0, 3).join('.')}`, right: Math.round(box.right) })
      }
    }
    return found.sort((a, b) => b.right - a.right).slice(0, 4).map(f => `${f.name} to ${f.right}px`)
  })
}

/**
 * Checks one page on a phone (the narrower layout, where overflow and contrast over the wrong
 * background show) and, when asked, at desktop width too; returns what is wrong.
 */
async function checkPage(page: Page, role: string, path: string, options: { ready?: (page: Page) => Promise<void>; desktop?: boolean; screenshot?: boolean } = {}): Promise<string[]> {
  const problems: string[] = []
  if (options.desktop) {
    await page.setViewportSize(DESKTOP)
    await gotoHydrated(page, path)
    await options.ready?.(page)
    for (const v of await seriousViolations(page)) problems.push(`${role} ${path} at 1280 px: ${v}`)
    if (options.screenshot) await keepScreenshot(page, `a11y-${role}-${slug(path)}-1280`)
  }
  await page.setViewportSize(PHONE)
  if (options.desktop) await page.waitForTimeout(150) // layout and charts settle after the resize
  else {
    await gotoHydrated(page, path)
    await options.ready?.(page)
  }
  const over = await overflow(page)
  if (over > 0) problems.push(`${role} ${path} at 390 px is ${over} px too wide: ${(await widest(page)).join('; ')}`)
  for (const v of await seriousViolations(page)) problems.push(`${role} ${path} at 390 px: ${v}`)
  if (options.screenshot) await keepScreenshot(page, `a11y-${role}-${slug(path)}-390`)
  return problems
}

const slug = (path: string) => path.replace(/[^a-z0-9]+/gi, '-').replace(/^-|-$/g, '') || 'home'

type DemoDecision = { id: number; title: string }
let demo: { hull: DemoDecision; wake: DemoDecision; duct: DemoDecision; intake: DemoDecision; projects: Record<string, number> }

/** The demo's decisions and projects, read once as the auditor (who reads every one). */
async function demoIds(page: Page) {
  if (demo) return demo
  const list = await (await page.request.get('/api/audit/decisions?limit=50')).json() as { items: DemoDecision[] }
  const byTitle = (part: string) => list.items.find(d => d.title.includes(part))!
  const projects = await (await page.request.get('/api/projects')).json() as { projects: { id: number; code: string }[] }
  demo = {
    hull: byTitle('Ferry hull calm-water'),
    wake: byTitle('Condenser wake'),
    duct: byTitle('Supply duct'),
    intake: byTitle('Intake bay swirl'),
    projects: Object.fromEntries(projects.projects.map(p => [p.code, p.id])),
  }
  return demo
}

const chartDrawn = async (page: Page) => {
  await expect(page.locator('canvas').first()).toBeVisible()
}

test('signed-out pages fit a phone and pass axe', async ({ page }) => {
  const problems: string[] = []
  for (const path of ['/login', '/forgot-password', '/set-password?token=not-a-real-token']) {
    problems.push(...await checkPage(page, 'visitor', path, { screenshot: path === '/login' }))
  }
  expect(problems).toEqual([])
})

test.describe('every page of each role fits a phone and passes axe', () => {
  test.describe.configure({ timeout: 240_000 })

  test.beforeEach(async ({ page }) => {
    await signInAs(page, 'auditor')
    await demoIds(page)
    await page.context().clearCookies()
  })

  test('auditor', async ({ page }) => {
    await signInAs(page, 'auditor')
    const problems: string[] = []
    problems.push(...await checkPage(page, 'auditor', '/audit', { desktop: true, screenshot: true }))
    problems.push(...await checkPage(page, 'auditor', '/projects'))
    problems.push(...await checkPage(page, 'auditor', `/projects/${demo.projects['KB-103']}`))
    problems.push(...await checkPage(page, 'auditor', `/decisions/${demo.wake.id}`, { ready: chartDrawn, desktop: true, screenshot: true }))
    problems.push(...await checkPage(page, 'auditor', '/guidance'))
    problems.push(...await checkPage(page, 'auditor', '/guidance/wall-function'))
    expect(problems).toEqual([])
  })

  test('lead', async ({ page }) => {
    await signInAs(page, 'lead')
    const problems: string[] = []
    problems.push(...await checkPage(page, 'lead', '/overview', { ready: chartDrawn, desktop: true, screenshot: true }))
    problems.push(...await checkPage(page, 'lead', `/decisions/${demo.hull.id}`, { ready: chartDrawn }))
    problems.push(...await checkPage(page, 'lead', `/decisions/${demo.hull.id}/revisions/2`, { screenshot: true }))
    expect(problems).toEqual([])
  })

  test('engineer', async ({ page }) => {
    await signInAs(page, 'engineer')
    const kb101 = demo.projects['KB-101']
    const problems: string[] = []
    problems.push(...await checkPage(page, 'engineer', '/projects'))
    problems.push(...await checkPage(page, 'engineer', `/projects/${kb101}`, { screenshot: true }))
    problems.push(...await checkPage(page, 'engineer', `/projects/${kb101}/decisions/new`, { desktop: true, screenshot: true }))
    problems.push(...await checkPage(page, 'engineer', `/decisions/${demo.hull.id}`, { screenshot: true }))
    expect(problems).toEqual([])
  })

  test('engineer with a draft', async ({ page }) => {
    await signInAs(page, 'engineer2')
    const problems: string[] = []
    problems.push(...await checkPage(page, 'engineer2', `/decisions/${demo.intake.id}`))
    problems.push(...await checkPage(page, 'engineer2', `/decisions/${demo.intake.id}/edit`, { screenshot: true }))
    expect(problems).toEqual([])
  })

  test('reviewer', async ({ page }) => {
    await signInAs(page, 'reviewer')
    const problems: string[] = []
    problems.push(...await checkPage(page, 'reviewer', '/review'))
    problems.push(...await checkPage(page, 'reviewer', `/decisions/${demo.duct.id}`, { screenshot: true }))
    // The override form open, as a reviewer sees it while deciding.
    await page.getByRole('button', { name: /Override/ }).click()
    await expect(page.getByTestId('override-form')).toBeVisible()
    for (const v of await seriousViolations(page)) problems.push(`reviewer override form: ${v}`)
    expect(problems).toEqual([])
  })

  test('administrator', async ({ page }) => {
    await signInAs(page, 'admin')
    const problems: string[] = []
    for (const path of ['/admin/users', '/admin/projects', '/admin/mail', '/projects']) {
      problems.push(...await checkPage(page, 'admin', path, { screenshot: path === '/admin/projects' }))
    }
    expect(problems).toEqual([])
  })
})

test('the header keeps Sign out within reach on a phone', async ({ page }) => {
  await page.setViewportSize(PHONE)
  await signInAs(page, 'lead')
  await expect(page.getByRole('button', { name: 'Sign out' })).toBeInViewport()
  await keepScreenshot(page, 'header-phone')
})
