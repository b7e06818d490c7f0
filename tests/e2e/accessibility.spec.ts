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

/** Checks one page at both widths; returns what is wrong, page by page. */
async function checkPage(page: Page, role: string, path: string, ready?: (page: Page) => Promise<void>): Promise<string[]> {
  const problems: string[] = []
  await page.setViewportSize(DESKTOP)
  await gotoHydrated(page, path)
  await ready?.(page)
  for (const v of await seriousViolations(page)) problems.push(`${role} ${path} at 1280 px: ${v}`)
  await page.setViewportSize(PHONE)
  await page.waitForTimeout(150) // layout and charts settle after the resize
  const over = await overflow(page)
  if (over > 0) problems.push(`${role} ${path} at 390 px is ${over} px too wide: ${(await widest(page)).join('; ')}`)
  for (const v of await seriousViolations(page)) problems.push(`${role} ${path} at 390 px: ${v}`)
  const name = `a11y-${role}-${path.replace(/[^a-z0-9]+/gi, '-').replace(/^-|-$/g, '') || 'home'}`
  await keepScreenshot(page, `${name}-390`)
  return problems
}

async function decisionIds(page: Page) {
  const list = await (await page.request.get('/api/audit/decisions?pageSize=50')).json() as { decisions: { id: number; title: string; status: string; revision: number }[] }
  return list.decisions
}

const chartDrawn = async (page: Page) => {
  await expect(page.locator('canvas').first()).toBeVisible()
}

test('signed-out pages fit a phone and pass axe', async ({ page }) => {
  const problems: string[] = []
  for (const path of ['/login', '/forgot-password', '/set-password?token=not-a-real-token']) {
    problems.push(...await checkPage(page, 'visitor', path))
  }
  expect(problems).toEqual([])
})

test('every page of each role fits a phone and passes axe', async ({ page }) => {
  test.setTimeout(300_000)
  const problems: string[] = []

  // The auditor reads every decision: the ids of the demo's decisions come from the audit list.
  await signInAs(page, 'auditor')
  const decisions = await decisionIds(page)
  const byTitle = (part: string) => decisions.find(d => d.title.includes(part))!
  const hull = byTitle('Ferry hull calm-water')
  const wake = byTitle('Condenser wake')
  const duct = byTitle('Supply duct')
  const intake = byTitle('Intake bay swirl')
  const projects = await (await page.request.get('/api/projects')).json() as { projects: { id: number; code: string }[] }
  const projectId = (code: string) => projects.projects.find(p => p.code === code)!.id
  for (const path of ['/audit', '/overview', '/projects', `/projects/${projectId('KB-103')}`, `/decisions/${wake.id}`, '/guidance', '/guidance/wall-function']) {
    problems.push(...await checkPage(page, 'auditor', path, path.startsWith('/decisions') || path === '/overview' ? chartDrawn : undefined))
  }

  await page.context().clearCookies()
  await signInAs(page, 'lead')
  for (const path of ['/overview', `/decisions/${hull.id}`, `/decisions/${hull.id}/revisions/1`]) {
    problems.push(...await checkPage(page, 'lead', path, path === '/overview' ? chartDrawn : undefined))
  }

  await page.context().clearCookies()
  await signInAs(page, 'engineer')
  const kb101 = projectId('KB-101')
  for (const path of ['/projects', `/projects/${kb101}`, `/projects/${kb101}/decisions/new`, `/decisions/${hull.id}`]) {
    problems.push(...await checkPage(page, 'engineer', path))
  }

  await page.context().clearCookies()
  await signInAs(page, 'engineer2')
  for (const path of [`/decisions/${intake.id}`, `/decisions/${intake.id}/edit`]) {
    problems.push(...await checkPage(page, 'engineer2', path))
  }

  await page.context().clearCookies()
  await signInAs(page, 'reviewer')
  for (const path of ['/review', `/decisions/${duct.id}`]) {
    problems.push(...await checkPage(page, 'reviewer', path))
  }
  // The override form open, as a reviewer sees it while deciding.
  await page.setViewportSize(DESKTOP)
  await gotoHydrated(page, `/decisions/${duct.id}`)
  await page.getByRole('button', { name: /Override/ }).click()
  await expect(page.getByTestId('override-form')).toBeVisible()
  for (const v of await seriousViolations(page)) problems.push(`reviewer override form: ${v}`)

  await page.context().clearCookies()
  await signInAs(page, 'admin')
  for (const path of ['/admin/users', '/admin/projects', '/admin/mail', '/projects']) {
    problems.push(...await checkPage(page, 'admin', path))
  }

  expect(problems).toEqual([])
})

test('the header keeps Sign out within reach on a phone', async ({ page }) => {
  await page.setViewportSize(PHONE)
  await signInAs(page, 'lead')
  await expect(page.getByRole('button', { name: 'Sign out' })).toBeInViewport()
  await keepScreenshot(page, 'header-phone')
})
