import { expect, test } from '@playwright/test'
import { gotoHydrated, signInAs, signOut } from '../support/e2e'

// The seeded KB-101 decision (server/db/seed-demo.ts), approved and closed: a remark still joins
// its history without changing the decision.
const SEEDED_TITLE = 'Ferry hull calm-water resistance at service speed'

test('a member comments on a closed decision; the comment joins the verified history, and an auditor may only read', async ({ page }) => {
  await signInAs(page, 'engineer')
  const projects = (await (await page.request.get('/api/projects')).json()).projects as { id: number; code: string }[]
  const kb101 = projects.find(p => p.code === 'KB-101')!
  const list = (await (await page.request.get(`/api/projects/${kb101.id}/decisions?limit=100`)).json()).items as { id: number; title: string; version: number }[]
  const seeded = list.find(d => d.title === SEEDED_TITLE)!

  await gotoHydrated(page, `/decisions/${seeded.id}`)
  const chain = page.getByTestId('chain-check')
  await expect(chain).toContainText(/History verified \((\d+) events\)/)
  const before = Number((await chain.textContent())!.match(/\((\d+) events?\)/)![1])
  const comments = page.getByTestId('decision-timeline').getByTestId('event-commented')
  const commentsBefore = await comments.count()

  // An empty comment is refused at the field, before anything is sent.
  await page.getByTestId('comment-form').getByRole('button', { name: 'Add to the history' }).click()
  await expect(page.getByTestId('comment-form')).toContainText('The comment is required.')

  const remark = `Checked against the towing-tank data of the sister hull ${Date.now().toString(36)}.`
  await page.getByLabel('Comment').fill(remark)
  await page.getByTestId('comment-form').getByRole('button', { name: 'Add to the history' }).click()
  await expect(comments).toHaveCount(commentsBefore + 1)
  await expect(page.getByTestId('decision-timeline')).toContainText(remark)
  await expect(chain).toContainText(`History verified (${before + 1} events)`)
  // The decision itself did not change: still approved, same version.
  await expect(page.getByTestId('decision-header')).toContainText('Approved')
  await expect(page.getByTestId('decision-header')).toContainText(`version ${seeded.version}`)
  await signOut(page)

  await signInAs(page, 'auditor')
  await gotoHydrated(page, `/decisions/${seeded.id}`)
  await expect(page.getByTestId('decision-timeline')).toContainText(remark)
  await expect(page.getByTestId('comment-form')).toHaveCount(0)
})
