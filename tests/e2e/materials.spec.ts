import { expect, test } from '@playwright/test'
import { openDemoProject, signInAs } from './helpers'

test('a checker adds a project material; a missing source is refused at its field', async ({ page }) => {
  await signInAs(page, 'checker')
  await openDemoProject(page)
  await page.getByRole('link', { name: 'Materials', exact: true }).click()
  await expect(page.getByTestId('materials')).toContainText('S355')
  const form = page.getByTestId('material-form')
  await form.getByLabel('Name').fill('S460 flat')
  await form.getByLabel('fy [MPa]').fill('460')
  await form.getByLabel('fu [MPa]').fill('540')
  await form.getByRole('button', { name: 'Add material' }).click()
  await expect(form.locator('#f-source-error')).toContainText('source is required')
  await expect(form.getByLabel('fy [MPa]')).toHaveValue('460')
  await form.getByLabel('Source of the values').fill('Mill certificate 3.1 no. 2207 (demo)')
  await form.getByRole('button', { name: 'Add material' }).click()
  await expect(form.getByRole('alert')).toContainText('S460 flat added')
  await expect(page.getByTestId('materials')).toContainText('Mill certificate 3.1 no. 2207')
})
