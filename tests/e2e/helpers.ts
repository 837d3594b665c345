import { expect, type Page } from '@playwright/test'
import { DEMO_PASSWORD, DEMO_USERS } from '../../server/demo/demo-data'

export type DemoRole = (typeof DEMO_USERS)[number]['key']

export async function signInAs(page: Page, role: DemoRole, password = DEMO_PASSWORD) {
  const user = DEMO_USERS.find((u) => u.key === role)!
  await page.goto('/sign-in')
  await page.getByLabel('E-mail').fill(user.email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page).toHaveURL(/\/projects$/)
  await expect(page.getByTestId('current-user')).toContainText(user.name)
  return user
}

export async function openDemoProject(page: Page) {
  await page.getByRole('link', { name: /Carton erector CE-40/ }).click()
  await expect(page.getByTestId('register')).toBeVisible()
  await expect(page.getByTestId('register').getByRole('link', { name: 'LC-001' })).toBeVisible()
}
