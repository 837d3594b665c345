import { expect, test, type Page } from '@playwright/test'
import { runMechanism } from '../../lib/calc/mechanism'
import { openDemoProject, signInAs } from './helpers'

/*
 * The engineer's bench in Chromium, tried as a new user would: a new calc opens at once with
 * feasible defaults; digits survive a unit round trip; a decimal comma is read as one; an infeasible
 * geometry is said at its fields and saves nothing; the drawing moves the tracer along its line;
 * a sizing proposal meets what it was asked (checked by the engine here); clone, export and import
 * give identical inputs. Frame rates while animating are printed (aim 60).
 */

async function newCalc(page: Page, title: string, mechanism: 'Peaucellier–Lipkin cell' | "Hart's inversor" = 'Peaucellier–Lipkin cell') {
  await openDemoProject(page)
  const form = page.getByTestId('create-calc')
  const number = await form.getByLabel('Number').inputValue()
  expect(number).toMatch(/^LC-\d{3}$/)
  await form.getByLabel('Title').fill(title)
  await form.getByLabel('Mechanism').selectOption({ label: mechanism })
  await form.getByRole('button', { name: 'Create and open' }).click()
  await expect(page.getByRole('heading', { level: 1 })).toContainText(number, { timeout: 30_000 })
  await expect(page.getByTestId('verdict')).toContainText(/PASS|FAIL/)
  return number
}

const field = (page: Page, label: RegExp | string) => page.getByTestId('inputs-form').getByLabel(label)
const saved = (page: Page) => expect(page.getByTestId('save-status')).toContainText('Saved', { timeout: 30_000 })

test('a new calc opens saved with feasible defaults, and a unit round trip leaves every digit', async ({ page }) => {
  await signInAs(page, 'engineer')
  await newCalc(page, 'Units round trip')
  await saved(page)
  await expect(page.getByTestId('key-results-source')).toContainText('saved')
  await field(page, /Arm l/).fill('250.4')
  await field(page, /Pin diameter d/).fill('10.3')
  await saved(page)
  const before = await page.getByTestId('inputs-form').locator('input[inputmode=decimal]').evaluateAll((els) => els.map((e) => (e as HTMLInputElement).value))
  const units = page.getByTestId('inputs-form').getByLabel('Units')
  await units.selectOption('US')
  await expect(field(page, /Arm l/)).toHaveValue('9.85827')
  await units.selectOption('SI')
  const after = await page.getByTestId('inputs-form').locator('input[inputmode=decimal]').evaluateAll((els) => els.map((e) => (e as HTMLInputElement).value))
  expect(after).toEqual(before)
  await saved(page)
  await page.reload()
  await expect(field(page, /Arm l/)).toHaveValue('250.4')
})

test('80,5 is read as 80.5; an infeasible crank is said at l, s and r and saves nothing; fixing it redraws', async ({ page }) => {
  // Leaving with unsaved changes asks first; here the answer is yes.
  page.on('dialog', (d) => d.accept())
  await signInAs(page, 'engineer')
  await newCalc(page, 'Comma and reach')
  await field(page, /Stroke needed/).fill('80,5')
  await expect(page.getByTestId('kr-stroke')).toContainText('80.50 mm needed')
  await saved(page)
  await page.reload()
  await expect(field(page, /Stroke needed/)).toHaveValue('80.5')

  await field(page, /Crank r/).fill('20')
  await field(page, /Crank pivot offset e/).fill('20')
  const form = page.getByTestId('inputs-form')
  for (const id of ['#in-geometry-arm-error', '#in-geometry-side-error', '#in-geometry-crank-error']) {
    await expect(form.locator(id)).toContainText('the crank cannot reach the cell: make 2r ≥ l − s')
  }
  await expect(page.getByTestId('save-status')).toContainText('Not saved')
  await expect(page.getByTestId('verdict')).toContainText('INFEASIBLE')
  await expect(page.getByTestId('drawing-infeasible')).toBeVisible()
  await page.waitForTimeout(2000)
  await page.reload()
  await expect(field(page, /Crank r/)).toHaveValue('100')
  // The unsaved draft is offered back, then fixed.
  await page.getByRole('button', { name: 'Restore them' }).click()
  await expect(field(page, /Crank r/)).toHaveValue('20')
  await field(page, /Crank r/).fill('90')
  await field(page, /Crank pivot offset e/).fill('90')
  await expect(page.getByTestId('drawing-infeasible')).toHaveCount(0)
  await expect(page.getByTestId('tracer')).toBeVisible()
  await expect(form.locator('#in-geometry-crank-error')).toBeEmpty()
  await saved(page)
})

test('the slider moves the tracer along its line, and the drawing animates (fps printed)', async ({ page }) => {
  await signInAs(page, 'engineer')
  await openDemoProject(page)
  for (const number of ['LC-001', 'LC-002']) {
    await page.goto('/projects')
    await openDemoProject(page)
    await page.getByTestId('register').getByRole('link', { name: number }).click()
    const tracer = page.getByTestId('tracer')
    await expect(tracer).toBeVisible({ timeout: 30_000 })
    const slider = page.getByTestId('crank-slider')
    const lo = Number(await slider.getAttribute('min'))
    const hi = Number(await slider.getAttribute('max'))
    const points: { x: number; y: number }[] = []
    for (const t of [0, 0.25, 0.5, 0.75, 1]) {
      await slider.fill(String(lo + (hi - lo) * t))
      points.push({ x: Number(await tracer.getAttribute('data-x')), y: Number(await tracer.getAttribute('data-y')) })
    }
    const offset = Number(/([\d.]+) mm/.exec((await page.getByTestId('kr-offset').textContent())!.replace(/\u2009/g, ''))![1])
    for (const p of points) expect(Math.abs(p.x - offset)).toBeLessThan(0.02 * offset)
    for (let i = 1; i < points.length; i++) expect(points[i].y).toBeGreaterThan(points[i - 1].y)
    // The browser's own frame rate on this machine, idle, is the yardstick (60 on an idle desktop).
    const idle = await page.evaluate(
      () =>
        new Promise<number>((done) => {
          let n = 0
          const t0 = performance.now()
          const step = (t: number) => (++n, t - t0 < 2000 ? requestAnimationFrame(step) : done((n * 1000) / (t - t0)))
          requestAnimationFrame(step)
        }),
    )
    await page.getByTestId('play').click()
    await page.waitForTimeout(4500)
    const fps = Number(await page.getByTestId('drawing').getAttribute('data-fps'))
    console.log(`[fps] ${number}: ${fps} frames per second while animating (the idle page: ${Math.round(idle)})`)
    // The machine may be shared (CI, other jobs): half the idle rate still means smooth; the figure is printed either way.
    // Printed, never asserted: speed is measured by benchmarks, not held by tests.
    await page.getByTestId('play').click()
  }
})

test('a sizing proposal, run through the engine, meets every constraint, and becomes a draft calc in one click', async ({ page }) => {
  await signInAs(page, 'engineer')
  await openDemoProject(page)
  await page.getByRole('link', { name: 'Size a cell' }).click()
  const form = page.getByTestId('sizing-form')
  await form.getByLabel(/Stroke needed/).fill('100')
  await form.getByLabel(/Line offset from O, from/).fill('120')
  await form.getByLabel(/^to/).fill('160')
  await form.getByLabel(/Envelope across the line/).fill('300')
  await form.getByLabel(/Envelope along the line/).fill('350')
  await form.getByLabel(/Smallest transmission angle/).fill('30')
  await form.getByRole('button', { name: 'Propose dimensions' }).click()
  const first = page.getByTestId('proposal').first()
  await expect(first).toBeVisible({ timeout: 60_000 })
  const text = (await first.getByTestId('proposal-geometry').textContent())!
  const geometry = Object.fromEntries([...text.matchAll(/(\w+) ([\d.]+)/g)].map((m) => [m[1], Number(m[2])]))
  geometry.crankPivotOffset = geometry.crank
  const mechanism = 'arm' in geometry ? 'peaucellier' : 'hart'
  const out = runMechanism({ mechanism, geometry, loads: [{ name: 'L', fx: 0, fy: -150 }], toggleMarginDeg: 5 } as Parameters<typeof runMechanism>[0])
  expect(out.feasibility.ok).toBe(true)
  // The geometry is shown to 0.1 mm; the offset and stroke hold to that rounding.
  expect(out.lineOffset).toBeGreaterThanOrEqual(120 - 1)
  expect(out.lineOffset).toBeLessThanOrEqual(160 + 1)
  expect(2 * out.stroke.usable.half).toBeGreaterThanOrEqual(100 - 0.5)
  await first.getByRole('button', { name: 'Make a draft calc' }).click()
  await expect(page.getByRole('heading', { level: 1 })).toContainText('for a 100 mm stroke', { timeout: 30_000 })
  await expect(field(page, /Stroke needed/)).toHaveValue('100')
  await expect(page.getByTestId('kr-stroke')).toContainText('covers')
})

test('clone, export and import give identical inputs', async ({ page }) => {
  await signInAs(page, 'engineer')
  await openDemoProject(page)
  await page.getByTestId('register').getByRole('link', { name: 'LC-002' }).click()
  await expect(page.getByRole('heading', { level: 1 })).toContainText('LC-002')
  const exportOf = async () => {
    const href = (await page.getByTestId('export-calc').getAttribute('href'))!
    return (await page.request.get(href)).json()
  }
  const original = await exportOf()
  await page.getByRole('button', { name: 'Clone' }).click()
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Copy of', { timeout: 30_000 })
  expect(await exportOf()).toEqual(original)
  await page.goto('/projects')
  await openDemoProject(page)
  const imp = page.getByTestId('import-calc')
  await imp.getByLabel('Calc file (JSON)').setInputFiles({ name: 'LC-002.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(original)) })
  await imp.getByLabel('Title').fill('Imported copy of LC-002')
  await imp.getByRole('button', { name: 'Import and open' }).click()
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Imported copy', { timeout: 30_000 })
  expect(await exportOf()).toEqual(original)

  // A file with errors names its fields and makes nothing.
  await page.goto('/projects')
  await openDemoProject(page)
  const broken = { ...original, geometry: { ...original.geometry, ratio: 1.4 } }
  await imp.getByLabel('Calc file (JSON)').setInputFiles({ name: 'broken.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(broken)) })
  await imp.getByLabel('Title').fill('Broken import')
  await imp.getByRole('button', { name: 'Import and open' }).click()
  await expect(page.getByTestId('import-errors')).toContainText('geometry.ratio')
})

test('a checker sees the inputs read-only, and the register finds step titles', async ({ page }) => {
  await signInAs(page, 'checker')
  await openDemoProject(page)
  await expect(page.getByTestId('register')).toContainText(/PASS|FAIL/)
  await page.getByLabel('Search the calcs of this project').fill('inversion constant')
  await expect(page.getByTestId('search-hits')).toContainText('step')
  await page.getByTestId('register').getByRole('link', { name: 'LC-001' }).click()
  await expect(field(page, /Arm l/)).toHaveAttribute('readonly', '')
  await expect(page.getByTestId('inputs-form')).toContainText('Read-only')
  await expect(page.getByRole('button', { name: 'Save and run' })).toHaveCount(0)
})
