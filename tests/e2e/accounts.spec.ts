import { expect, test } from '@playwright/test'
import { openDemoProject, signInAs } from './helpers'

test('a wrong password and an unknown e-mail get the same message at the password field; the e-mail is kept', async ({ page }) => {
  for (const email of ['ines.vogt@feldmark.example', 'someone@elsewhere.example']) {
    await page.goto('/sign-in')
    await page.getByLabel('E-mail').fill(email)
    await page.getByLabel('Password').fill('definitely-wrong')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await expect(page.locator('#f-password-error')).toHaveText('E-mail or password is wrong.')
    await expect(page.locator('#f-email-error')).toHaveText('')
    await expect(page.getByLabel('E-mail')).toHaveValue(email)
  }
})

test('pages and API answers carry the security headers; pages hydrate under the nonce CSP without violations', async ({ page, request }) => {
  const violations: string[] = []
  page.on('console', (m) => {
    if (/Content Security Policy|Refused to/i.test(m.text())) violations.push(m.text())
  })
  const res = await page.goto('/sign-in')
  const h = res!.headers()
  const csp = h['content-security-policy']
  expect(csp).toMatch(/script-src 'self' 'nonce-[^']+' 'strict-dynamic'/)
  expect(csp).toContain("frame-ancestors 'none'")
  expect(h['x-content-type-options']).toBe('nosniff')
  expect(h['referrer-policy']).toBe('strict-origin-when-cross-origin')
  // Next put this response's nonce on its scripts.
  const nonce = csp.match(/'nonce-([^']+)'/)![1]
  // (Read from the HTML as sent: browsers hide a nonce attribute's value from the DOM.)
  expect(await res!.text()).toContain(`nonce="${nonce}"`)
  // Hydrated: React has attached itself to the form (blocked scripts would leave plain HTML).
  await expect.poll(() => page.locator('form').evaluate((el) => Object.keys(el).some((k) => k.startsWith('__react')))).toBe(true)
  expect(violations).toEqual([])

  const api = await request.get('/api/v1/projects')
  expect(api.status()).toBe(401)
  expect(api.headers()['cache-control']).toBe('private, no-store')
  expect(api.headers()['x-content-type-options']).toBe('nosniff')
  const foreign = await request.post('/api/v1/analyse', { headers: { origin: 'https://evil.example', 'content-type': 'text/plain' }, data: '{}' })
  expect(foreign.status()).toBe(403)
})

test('the engineer creates a draft calc; a duplicate number is refused at the number field', async ({ page }) => {
  await signInAs(page, 'engineer')
  await openDemoProject(page)
  const form = page.getByTestId('create-calc')
  await form.getByLabel('Number').fill('LC-020')
  await form.getByLabel('Title').fill('Lid tucker guide')
  await form.getByRole('button', { name: 'Create and open' }).click()
  await expect(page.getByRole('heading', { level: 1 })).toContainText('LC-020', { timeout: 30_000 })
  await page.goBack()
  await expect(page.getByTestId('register').getByRole('link', { name: 'LC-020' })).toBeVisible()

  await form.getByLabel('Number').fill('lc-001')
  await form.getByLabel('Title').fill('Duplicate')
  await form.getByRole('button', { name: 'Create and open' }).click()
  await expect(form.locator('#f-number-error')).toContainText('already exists')
  await expect(form.getByLabel('Title')).toHaveValue('Duplicate')
})

test('an admin invites a person; the caught mail link lets them set a password and sign in', async ({ page, browser }) => {
  test.setTimeout(180_000)
  await signInAs(page, 'admin')
  await openDemoProject(page)
  await page.getByTestId('manage-members').click()
  const form = page.getByTestId('invite')
  await form.getByLabel('E-mail').fill('ola.nord@feldmark.example')
  await form.getByLabel('Role').selectOption('checker')
  await form.getByRole('button', { name: 'Send invitation' }).click()
  await expect(form.getByRole('alert')).toContainText('Invitation sent')

  // The mail goes out through the outbox a moment after the action: reload until it is caught.
  await expect(page.getByRole('link', { name: 'Local mailbox' })).toBeVisible()
  await page.goto('/admin/mail')
  const mail = page.locator('article', { hasText: 'ola.nord@feldmark.example' }).first()
  await expect(async () => {
    await page.reload()
    await expect(mail).toContainText('Invitation to Carton erector CE-40', { timeout: 1000 })
  }).toPass({ timeout: 90_000 })
  const link = (await mail.locator('pre').innerText()).match(/http\S+/)![0]

  const guest = await browser.newContext()
  const p2 = await guest.newPage()
  await p2.goto(link)
  await p2.getByLabel('Your name').fill('Ola Nord')
  await p2.getByLabel('Password', { exact: true }).fill('short')
  await p2.getByLabel('Password again').fill('short')
  await p2.getByRole('button', { name: /Set password/ }).click()
  await expect(p2.locator('#f-password-error')).toContainText('at least 10')
  await p2.getByLabel('Password', { exact: true }).fill('ola-long-password')
  await p2.getByLabel('Password again').fill('ola-long-password')
  await p2.getByRole('button', { name: /Set password/ }).click()
  await expect(p2).toHaveURL(/\/projects$/)
  await openDemoProject(p2)
  await expect(p2.getByTestId('create-calc')).toHaveCount(0)
  await guest.close()
})

test('a visitor without a session is sent to sign-in; an unknown project is a 404', async ({ page }) => {
  await page.goto('/projects')
  await expect(page).toHaveURL(/\/sign-in$/)
  await signInAs(page, 'engineer')
  const res = await page.goto('/projects/does-not-exist')
  expect(res?.status()).toBe(404)
  await expect(page.getByText('Nothing here')).toBeVisible()
})
