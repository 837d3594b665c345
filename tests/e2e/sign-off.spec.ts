import { execFileSync } from 'node:child_process'
import { readFileSync, writeFileSync } from 'node:fs'
import { expect, test, type Page } from '@playwright/test'
import { DEMO_PASSWORD } from '../../server/demo/demo-data'
import { openDemoProject, signInAs, type DemoRole } from './helpers'

// One calc taken through a return to issue by three people, each told what to do next, then a
// second revision that supersedes the first; the issued PDF verifies on the public page.
test.describe.configure({ mode: 'serial' })

async function openCalc(page: Page, number: string) {
  await openDemoProject(page)
  await page.getByTestId('register').getByRole('link', { name: number }).click()
  await expect(page.getByRole('heading', { level: 1 })).toContainText(number)
}

async function as(page: Page, role: DemoRole) {
  await page.context().clearCookies()
  await signInAs(page, role)
}

async function transition(page: Page, button: string, fill: { reason?: string; password?: boolean; materials?: boolean } = {}) {
  const panel = page.getByTestId('revisions')
  await panel.getByRole('button', { name: button }).first().click()
  const form = panel.getByRole('form', { name: button })
  if (fill.reason) await form.getByLabel('Reason').fill(fill.reason)
  // Only a revision that uses "from memory" material values asks the approver to confirm them.
  const confirm = form.getByRole('checkbox', { name: /checked each value/ })
  if (fill.materials && (await confirm.count())) await confirm.check()
  if (fill.password) await form.getByLabel(/Your password/).fill(DEMO_PASSWORD)
  await form.getByRole('button', { name: button }).click()
  await expect(panel.getByRole('status')).toBeVisible({ timeout: 30_000 })
}

const pdfFile = 'test-results/LC-002-issued.pdf'

test('checker remarks at a step, ticks another and returns the revision', async ({ page }) => {
  await as(page, 'checker')
  await expect(page.getByTestId('nav-todo')).toContainText(/\d/)
  await page.getByTestId('nav-todo').click()
  await page.getByTestId('todo').getByRole('link', { name: /LC-002/ }).click()
  await expect(page.getByRole('heading', { level: 1 })).toContainText('LC-002')

  // Click a step in the package to anchor the remark there.
  const step = page.locator('.inverso-report .inv-step').nth(1)
  const stepTitle = (await step.locator('.inv-step-title').textContent())!
  await step.locator('.inv-step-title').click()
  const remarks = page.getByTestId('remarks')
  await expect(remarks).toContainText(stepTitle)
  await remarks.getByLabel('Severity').selectOption('must-resolve')
  await remarks.getByLabel('Remark').fill('Please state the source of the inversion constant.')
  await remarks.getByRole('button', { name: 'Add remark' }).click()
  await expect(remarks.getByTestId('remark')).toContainText('Please state the source')
  await expect(step.locator('.inv-review-box')).toContainText('Please state the source')

  // Tick the first step as verified.
  await page.locator('.inverso-report .inv-step').first().getByRole('checkbox', { name: /Verified/ }).check()
  await expect(page.locator('.inverso-report .inv-step').first()).toContainText('Tomas Brandt')

  // Checking is refused while the remark is open.
  const panel = page.getByTestId('revisions')
  await panel.getByRole('button', { name: 'Sign as checked' }).click()
  await expect(panel.getByRole('form', { name: 'Sign as checked' }).getByRole('alert')).toContainText('still open')
  await panel.getByRole('form', { name: 'Sign as checked' }).getByRole('button', { name: 'Cancel' }).click()

  await transition(page, 'Return to engineer', { reason: 'Source of k missing.' })
  await expect(panel.getByTestId('revision-A')).toContainText('Returned')
  await page.screenshot({ path: 'test-results/sign-off-returned.png', fullPage: true })
})

test('the engineer is told, answers the remark and resubmits', async ({ page }) => {
  await as(page, 'engineer')
  await page.getByTestId('nav-todo').click()
  await expect(page.getByTestId('todo')).toContainText('returned to you')
  await expect(page.getByTestId('notices')).toContainText('was returned to you')
  await page.getByTestId('todo').getByRole('link', { name: /LC-002/ }).first().click()
  const remarks = page.getByTestId('remarks')
  await remarks.getByLabel('Reply').fill('Source added: geometry of inversion, Coxeter §6.1.')
  await remarks.getByRole('button', { name: 'Reply' }).click()
  await expect(remarks.getByTestId('remark')).toContainText('Coxeter §6.1')
  await expect(remarks.getByTestId('remark')).toContainText('answered')
  await transition(page, 'Resubmit for check')
  await expect(page.getByTestId('revisions').getByTestId('revision-A')).toContainText('In check')
})

test('the checker closes the remark and signs with the password', async ({ page }) => {
  await as(page, 'checker')
  await openCalc(page, 'LC-002')
  const remarks = page.getByTestId('remarks')
  await remarks.getByRole('button', { name: 'Close remark' }).click()
  await expect(remarks.getByTestId('remark')).toContainText('closed')
  // A wrong password signs nothing and says so at the field.
  const panel = page.getByTestId('revisions')
  await panel.getByRole('button', { name: 'Sign as checked' }).click()
  const form = panel.getByRole('form', { name: 'Sign as checked' })
  await form.getByLabel(/Your password/).fill('not-my-password')
  await form.getByRole('button', { name: 'Sign as checked' }).click()
  await expect(form).toContainText('Wrong password')
  await form.getByRole('button', { name: 'Cancel' }).click()
  await transition(page, 'Sign as checked', { password: true })
  await expect(panel.getByTestId('revision-A')).toContainText('Checked')
})

test('the approver approves and issues, confirming the material values; the PDF carries the code', async ({ page }) => {
  await as(page, 'approver')
  await page.getByTestId('nav-todo').click()
  await expect(page.getByTestId('todo')).toContainText('to approve')
  await page.getByTestId('todo').getByRole('link', { name: /LC-002/ }).first().click()
  await transition(page, 'Sign as approved', { password: true })
  const panel = page.getByTestId('revisions')
  await expect(panel.getByTestId('revision-A')).toContainText('Approved')
  await transition(page, 'Issue', { password: true, materials: true })
  await expect(panel.getByTestId('revision-A')).toContainText('Issued')
  await expect(panel.getByTestId('revision-A')).toContainText(/Verification code [0-9A-Z]{5}-[0-9A-Z]{5}/)
  const href = (await panel.getByTestId('revision-A').getByRole('link', { name: 'PDF (A4)' }).getAttribute('href'))!
  const res = await page.request.get(href)
  expect(res.status()).toBe(200)
  expect(res.headers()['content-disposition']).toContain('FM-CE40_LC-002_revA_A4.pdf')
  writeFileSync(pdfFile, await res.body())
  await page.screenshot({ path: 'test-results/sign-off-issued.png', fullPage: true })
})

test('anyone verifies the issued PDF on the public page; a copy with one byte changed fails', async ({ page }) => {
  await page.context().clearCookies()
  await page.goto('/verify')
  const bytes = readFileSync(pdfFile)
  await page.getByLabel('The PDF package').setInputFiles({ name: 'package.pdf', mimeType: 'application/pdf', buffer: bytes })
  await page.getByRole('button', { name: 'Verify the file' }).click()
  await expect(page.getByTestId('verdict')).toContainText('is issued and current; the signature verifies')
  const tampered = Buffer.from(bytes)
  tampered[Math.floor(tampered.length / 2)] ^= 1
  await page.getByLabel('The PDF package').setInputFiles({ name: 'package.pdf', mimeType: 'application/pdf', buffer: tampered })
  await page.getByRole('button', { name: 'Verify the file' }).click()
  await expect(page.getByTestId('verdict')).toContainText('Not an issued package')
  await page.screenshot({ path: 'test-results/verify.png', fullPage: true })
})

test('a second revision goes through and supersedes the first', async ({ page }) => {
  test.setTimeout(180_000)
  await as(page, 'engineer')
  await openCalc(page, 'LC-002')
  const panel = page.getByTestId('revisions')
  await panel.getByRole('button', { name: 'Save revision for check' }).click()
  await panel.getByLabel(/Why this revision/).fill('Nozzle reaction raised')
  const failing = panel.getByRole('checkbox', { name: /Submit it anyway/ })
  if (await failing.count()) await failing.check()
  await panel.getByRole('button', { name: 'Save revision and send to check' }).click()
  await expect(panel.getByRole('status').first()).toContainText('sent to check', { timeout: 60_000 })
  // The package is rendered off the request path; the panel says so until it is there.
  await expect(panel.getByTestId('preparing')).toHaveCount(0, { timeout: 90_000 })
  await as(page, 'checker')
  await openCalc(page, 'LC-002')
  await transition(page, 'Sign as checked', { password: true })
  await as(page, 'approver')
  await openCalc(page, 'LC-002')
  await transition(page, 'Sign as approved', { password: true })
  await transition(page, 'Issue', { password: true, materials: true })
  await expect(page.getByTestId('revisions').getByTestId('revision-B')).toContainText('Issued')
  await expect(page.getByTestId('revisions').getByTestId('revision-A')).toContainText('Superseded')
  // The new revision's package says what changed since the one it supersedes.
  const href = (await page.getByTestId('revisions').getByTestId('revision-B').getByRole('link', { name: 'PDF (A4)' }).getAttribute('href'))!
  const text = execFileSync('pdftotext', ['-layout', '-', '-'], { input: await (await page.request.get(href)).body() }).toString('utf8')
  expect(text).toContain('Changes since rev A')
  expect(text).toMatch(/The verdict (is unchanged|changed)/)
  await page.getByRole('link', { name: 'Compare revisions' }).click()
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Changes from rev A to rev B')
})
