import { expect, test, type Page } from '@playwright/test'
import { openDemoProject, signInAs } from './helpers'

async function openCalc(page: Page, number: string) {
  await openDemoProject(page)
  await page.getByTestId('register').getByRole('link', { name: number }).click()
  await expect(page.getByRole('heading', { level: 1 })).toContainText(number)
}

test('the engineer sends the working inputs to check, naming the reason', async ({ page }) => {
  // Input behaviour (fields, units, ranges, infeasible geometry) is covered by bench.spec.ts.
  await signInAs(page, 'engineer')
  await openCalc(page, 'LC-003')
  await page.getByRole('button', { name: 'Show the package' }).click()
  await expect(page.locator('.inverso-report')).toContainText('Inversion constant', { timeout: 30_000 })
  await page.screenshot({ path: 'test-results/calc-engineer.png', fullPage: true })

  const panel = page.getByTestId('revisions')
  await panel.getByRole('button', { name: 'Save revision for check' }).click()
  await panel.getByLabel(/Why this revision/).fill('First sizing for check')
  const failing = panel.getByRole('checkbox', { name: /Submit it anyway/ })
  if (await failing.count()) await failing.check()
  await panel.getByRole('button', { name: 'Save revision and send to check' }).click()
  await expect(panel.getByRole('status').first()).toContainText('sent to check', { timeout: 60_000 })
  await expect(panel).toContainText('Rev A')
  await expect(panel).toContainText('First sizing for check')
})

test('a checker cannot save inputs: the server refuses even a forged call', async ({ page }) => {
  await signInAs(page, 'checker')
  await openCalc(page, 'LC-001')
  await expect(page.getByTestId('inputs-form').getByRole('button', { name: 'Save and run' })).toHaveCount(0)
  await expect(page.getByRole('button', { name: 'Save revision for check' })).toHaveCount(0)
  const projectId = page.url().split('/projects/')[1].split('/')[0]
  const other = await page.request.get(`/api/v1/projects/${projectId}/calcs/x/revisions/y/pdf`)
  expect(other.status()).toBe(404)
})
