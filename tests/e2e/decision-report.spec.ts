import { expect, test } from '@playwright/test'
import { readFileSync } from 'node:fs'
import { gotoHydrated, signInAs } from '../support/e2e'

// The decision page offers its PDF record; the browser downloads it under the server's file name.
test('an auditor downloads the PDF record from the decision page', async ({ page }) => {
  await signInAs(page, 'auditor')
  const projects = (await (await page.request.get('/api/projects')).json()).projects as { id: number; code: string }[]
  const kb101 = projects.find(p => p.code === 'KB-101')!
  const list = (await (await page.request.get(`/api/projects/${kb101.id}/decisions?status=approved`)).json()).items as { id: number; version: number }[]
  const decision = list[0]!

  await gotoHydrated(page, `/decisions/${decision.id}`)
  const link = page.getByTestId('report-pdf-link')
  await expect(link).toHaveText('Download PDF record')
  const [download] = await Promise.all([page.waitForEvent('download'), link.click()])
  expect(download.suggestedFilename()).toBe(`eddyledger-KB-101-decision-${decision.id}-v${decision.version}.pdf`)
  const path = await download.path()
  expect(readFileSync(path).subarray(0, 5).toString('latin1')).toBe('%PDF-')
})
