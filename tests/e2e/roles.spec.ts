import { expect, test } from '@playwright/test'
import { openDemoProject, signInAs, type DemoRole } from './helpers'

const EXPECT: Record<DemoRole, { createCalc: boolean; members: boolean }> = {
  engineer: { createCalc: true, members: false },
  checker: { createCalc: false, members: false },
  approver: { createCalc: false, members: false },
  admin: { createCalc: false, members: true },
}

for (const role of Object.keys(EXPECT) as DemoRole[]) {
  test(`${role} signs in, sees the register and only the controls the role allows`, async ({ page }) => {
    await signInAs(page, role)
    await openDemoProject(page)
    // Other tests may add calcs; the three demo calcs are always there.
    for (const n of ['LC-001', 'LC-002', 'LC-003']) await expect(page.getByTestId('register').getByRole('link', { name: n })).toBeVisible()
    await expect(page.getByTestId('create-calc')).toHaveCount(EXPECT[role].createCalc ? 1 : 0)
    await expect(page.getByTestId('manage-members')).toHaveCount(EXPECT[role].members ? 1 : 0)
    await expect(page.getByTestId('caution')).toContainText('competent engineer')
    await page.screenshot({ path: `test-results/register-${role}.png`, fullPage: true })
  })
}

test('a checker who calls the create-calc route directly is refused with 403', async ({ page }) => {
  await signInAs(page, 'checker')
  await openDemoProject(page)
  const projectId = page.url().split('/projects/')[1]
  const res = await page.request.post(`/api/v1/projects/${projectId}/calcs`, { data: { number: "LC-666", title: "Sneaky", mechanism: "hart" } })
  expect(res.status()).toBe(403)
  await page.reload()
  await expect(page.getByTestId('register')).toBeVisible()
  await expect(page.getByTestId('register').getByRole('link', { name: 'LC-666' })).toHaveCount(0)
})

test('the register sorts by a column and filters by text', async ({ page }) => {
  await signInAs(page, 'approver')
  await openDemoProject(page)
  const register = page.getByTestId('register')
  await page.getByLabel('Filter the register').fill('LC-00')
  await register.getByRole('button', { name: 'Number' }).click()
  // Sorted by number, highest first (other tests may have added calcs).
  const numbers = await register.locator('tbody tr td:first-child').allTextContents()
  expect(numbers.length).toBeGreaterThan(1)
  expect([...numbers].sort().reverse()).toEqual(numbers)
  await page.getByLabel('Filter the register').fill('glue')
  // LC-002 (and any copy of it other tests made), none of the others.
  await expect(register.getByRole('link', { name: 'LC-002' })).toBeVisible()
  await expect(register.getByRole('link', { name: 'LC-001' })).toHaveCount(0)
  await expect(register.getByRole('link', { name: 'LC-003' })).toHaveCount(0)
})
