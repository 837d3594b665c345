import { execFileSync } from 'node:child_process'
import { describe, expect, it } from 'vitest'
import { finishPdf, formatValue, renderBody, renderPdf } from '@/reports/index'
import { DEMO_CALCS, demoCalc, demoPackage } from '@/reports/demo'
import { formatUtilisation } from '@/lib/units/format'
import { pageCount, pdfText, squash } from './helpers'

/**
 * Real engine output (long check lists, sweep tables, unique substituted TeX per step) is what made
 * the PDF slow and long; the hand-made fixture alone hid it. Every demo package is rendered and read
 * back from its text (poppler's pdftotext and pdffonts).
 */
const SECTION_TITLES = [
  'Summary', 'Purpose and design basis', 'Inputs and materials', 'Method', 'Geometry and kinematics', 'Statics', 'Component checks',
  'Conclusion', 'References', 'Cautions and limits', 'Revision history and remarks', 'Signatures', 'Attached documents', 'Appendix: working in full',
]

function pageTexts(bytes: Uint8Array, pages: number): string[] {
  return Array.from({ length: pages }, (_, i) =>
    execFileSync('pdftotext', ['-f', String(i + 1), '-l', String(i + 1), '-layout', '-', '-'], { input: bytes, maxBuffer: 64 << 20 }).toString('utf8'),
  )
}

/** Lowest text on each page above the title block, as a share of the body's height (poppler's word boxes). */
function pageFill(bytes: Uint8Array): number[] {
  const html = execFileSync('pdftotext', ['-bbox', '-', '-'], { input: bytes, maxBuffer: 64 << 20 }).toString('utf8')
  return html.split('<page ').slice(1).map((page) => {
    const [w, h] = [Number(/width="([\d.]+)"/.exec(page)![1]), Number(/height="([\d.]+)"/.exec(page)![1])]
    const top = 38
    const bottom = h - 16 - 42 - 14
    let low = top
    for (const m of page.matchAll(/xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)"/g)) {
      const [x0, , , y1] = m.slice(1).map(Number)
      if (y1 < bottom && x0 < w - 30) low = Math.max(low, y1)
    }
    return (low - top) / (bottom - top)
  })
}

const headingOf = (text: string) => {
  const first = text.split('\n').map((l) => l.trim()).find(Boolean) ?? ''
  return SECTION_TITLES.find((t) => new RegExp(`^(\\d+|A)\\s+${t.replace(/[:()]/g, '\\$&')}$`).test(first.replace(/\s+/g, ' ')))
}

describe('the demo packages', () => {
  for (const c of DEMO_CALCS) {
    it(`${c.number}: reads as a package a checker can sign`, async () => {
      const pkg = demoPackage(demoCalc(c.number))
      const body = await renderBody(pkg)
      const bytes = await finishPdf(body, pkg)
      // Byte-identical: the stored body stamped again gives the package rendered in one go.
      expect(Buffer.from(await renderPdf(pkg)).equals(Buffer.from(bytes))).toBe(true)
      const pages = await pageCount(bytes)
      const texts = pageTexts(bytes, pages)
      const text = pdfText(bytes)
      // At most 15 pages before the appendix (the working in full).
      const appendix = texts.findIndex((t) => headingOf(t) === 'Appendix: working in full')
      expect(appendix, 'appendix present').toBeGreaterThan(0)
      expect(appendix, 'pages before the appendix').toBeLessThanOrEqual(15)
      // Every step, with its id and its value.
      for (const step of pkg.result.steps) {
        expect(text, `step ${step.id}`).toContain(step.id)
        const shown = squash(formatValue(step.value, step.unit))
        if (!step.id.startsWith('chk.') || step.id.endsWith('.force')) expect(text, `value of ${step.id}`).toContain(typeof step.value === 'string' ? shown.split(' (')[0] : shown)
      }
      // Each governing utilisation is printed with one rounding: the rounded-up three decimals,
      // never the value rounded to nearest or to fewer figures when that differs.
      for (const g of (pkg.result.checks ?? []).filter((x) => x.governing)) {
        const shown = formatUtilisation(g.utilisation)
        expect(text, `${g.stepId} u`).toContain(shown)
        const nearest = g.utilisation.toFixed(3)
        if (nearest !== shown) expect(text.includes(` ${nearest} `) && !text.includes(` ${shown} `), `${g.stepId} rounded to nearest`).toBe(false)
      }
      const v = pkg.result.verdict!
      const headline = formatUtilisation(v.maxUtilisation)
      expect(text.split(`u = ${headline}`).length - 1, 'headline utilisation in the summary, the criteria and the conclusion').toBeGreaterThanOrEqual(3)
      // Numbers inside formulas are text a checker can search for.
      const force = pkg.result.steps.find((s) => s.id.endsWith('.force') && s.substituted)
      for (const n of force?.substituted?.match(/\d+(?:\.\d+)?/g) ?? []) expect(text).toContain(n)
      // Every font embedded.
      const fonts = execFileSync('pdffonts', ['-'], { input: bytes }).toString('utf8').split('\n').slice(2).filter(Boolean)
      for (const f of fonts) expect(f, f).toMatch(/\s+yes\s+(yes|no)\s+(yes|no)\s+\d+\s+\d+\s*$/)
      for (const f of fonts) expect(f.split(/\s+/)[0]).not.toMatch(/^Helvetica/)
      // No page less than a quarter full, except the last page of a section (the next starts one) and the last page.
      const fill = pageFill(bytes)
      fill.forEach((f, i) => {
        if (i === pages - 1 || headingOf(texts[i + 1] ?? '')) return
        expect(f, `page ${i + 1} of ${c.number} filled ${Math.round(f * 100)} %`).toBeGreaterThan(0.25)
      })
      expect(text).toContain(`1 of ${pages}`)
    }, 600_000)
  }
})
