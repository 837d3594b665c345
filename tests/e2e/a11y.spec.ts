import AxeBuilder from '@axe-core/playwright'
import { expect, test, type Page } from '@playwright/test'
import { openDemoProject, signInAs } from './helpers'

/*
 * Every screen through axe-core (WCAG 2.1 A and AA rules): any serious or critical violation fails,
 * with the rule, its help text and the first offending elements printed. Keyboard: the first Tab
 * reaches the skip link, and it moves focus to the main content.
 */

async function audit(page: Page, screen: string) {
  const { violations } = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze()
  const bad = violations.filter((v) => v.impact === 'serious' || v.impact === 'critical')
  const report = bad.map((v) => `${screen}: ${v.impact} ${v.id} — ${v.help}\n  ${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join('\n  ')}`)
  expect(report, report.join('\n')).toEqual([])
}

test('signed-out screens', async ({ page }) => {
  for (const path of ['/sign-in', '/reset', '/verify', '/about', '/no-such-page']) {
    await page.goto(path)
    await audit(page, path)
  }
})

test('the engineer’s screens: projects, register, calc bench with package, sizing, settings, to-do', async ({ page }) => {
  // Eight axe passes, one over the calc page with its whole package: on a loaded two-core machine that outran the default minute.
  test.slow()
  await signInAs(page, 'engineer')
  await audit(page, 'projects')
  // From a fresh load, the first Tab lands on the skip link.
  await page.goto('/projects')
  await page.keyboard.press('Tab')
  await expect(page.getByRole('link', { name: 'Skip to main content' })).toBeFocused()
  await page.keyboard.press('Enter')
  await expect(page.locator('main')).toBeFocused()

  await openDemoProject(page)
  await audit(page, 'register')
  await page.getByTestId('register').getByRole('link', { name: 'LC-001' }).click()
  await expect(page.getByTestId('tracer')).toBeVisible({ timeout: 30_000 })
  await expect(page).toHaveTitle(/^LC-001 .* · Inverso$/)
  await audit(page, 'calc page')
  await page.getByTestId('show-package').click()
  await expect(page.locator('.inverso-report')).toContainText('Summary', { timeout: 30_000 })
  await audit(page, 'calc page with its package')
  const ids = await page.locator('[id]').evaluateAll((els) => els.map((e) => e.id))
  expect(ids.filter((id, i) => ids.indexOf(id) !== i)).toEqual([])

  for (const [name, path] of [
    ['sizing', 'size'],
    ['materials', 'materials'],
    ['project audit', 'audit'],
  ] as const) {
    await page.goto(`${new URL(page.url()).pathname.split('/calcs/')[0]}/${path}`)
    await audit(page, name)
  }
  for (const path of ['/settings', '/todo']) {
    await page.goto(path)
    await audit(page, path)
  }
})

test('the checker’s and the administrator’s screens', async ({ page }) => {
  await signInAs(page, 'checker')
  await openDemoProject(page)
  await page.getByTestId('register').getByRole('link', { name: 'LC-002' }).click()
  await expect(page.getByTestId('drawing')).toBeVisible({ timeout: 30_000 })
  await audit(page, 'calc page, read-only')
  await page.getByRole('button', { name: 'Sign out' }).click()
  await signInAs(page, 'admin')
  await openDemoProject(page)
  await page.getByTestId('manage-members').click()
  await audit(page, 'members')
  await page.goto('/admin/mail')
  await audit(page, 'caught mail')
})
