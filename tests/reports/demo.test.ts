import { describe, expect, it } from 'vitest'
import { formatValue, renderPdf } from '@/reports/index'
import { demoCalc, demoPackage } from '@/reports/demo'
import { pageCount, pdfText, squash } from './helpers'

/**
 * Real engine output (long check lists, sweep tables, unique substituted TeX per
 * step) is what made the PDF slow and long; the hand-made fixture alone hid it.
 */
describe('renderPdf with a real demo calc', () => {
  it('renders LC-001 whole: every step value and id, numbers in formulas as text', async () => {
    const pkg = demoPackage(demoCalc('LC-001'))
    const bytes = await renderPdf(pkg)
    const pages = await pageCount(bytes)
    expect(pages).toBeGreaterThanOrEqual(15)
    expect(pages).toBeLessThanOrEqual(60)
    const text = pdfText(bytes)
    for (const step of pkg.result.steps) {
      expect(text, `step ${step.id}`).toContain(step.id)
      // Long string results (load case names) wrap inside the result column; their head must be there.
      const shown = squash(formatValue(step.value, step.unit))
      expect(text, `value of ${step.id}`).toContain(typeof step.value === 'string' ? shown.split(' (')[0] : shown)
    }
    // Plain numbers inside formulas are set as text, so a checker can search for them.
    const force = pkg.result.steps.find((s) => s.id.endsWith('.force') && s.substituted)
    for (const n of force?.substituted?.match(/\d+(?:\.\d+)?/g) ?? []) expect(text).toContain(n)
    expect(text).toContain(`1 of ${pages}`)
  }, 120_000)
})
