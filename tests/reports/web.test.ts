import { describe, expect, it } from 'vitest'
import { renderWebHtml, stepOutline } from '@/reports/index'
import { peaucellierPackage } from './fixtures/peaucellier'
import { hartPackage } from './fixtures/hart'
import { formatNumber } from '@/lib/units/format'

describe('renderWebHtml', () => {
  it('anchors every step and numbers them 1..n in document order', async () => {
    const pkg = peaucellierPackage({ state: 'issued' })
    const html = await renderWebHtml(pkg)
    for (const step of pkg.result.steps) expect(html).toContain(`id="step-${step.id}"`)
    const numbers = [...html.matchAll(/class="inv-step-n"[^>]*>(\d+)</g)].map((m) => Number(m[1]))
    expect(numbers).toEqual(pkg.result.steps.map((_, i) => i + 1))
    // The numbers are the ones stepOutline gives as data (what the calc page shows beside remarks).
    const anchored = [...html.matchAll(/id="step-([^"]+)"/g)].map((m) => m[1])
    expect(stepOutline(pkg).map((s) => s.id)).toEqual(anchored)
    expect(html).toContain('id="sec-summary"')
    expect(html).toContain('class="katex')
    // Formulas reach screen readers as MathML beside the visual HTML (WCAG 1.1.1, common practice).
    expect(html).toContain('<math xmlns="http://www.w3.org/1998/Math/MathML"')
    expect(html).toContain('This calculation supports but does not replace the judgement of a competent engineer')
    expect(html).not.toContain('inv-watermark')
  }, 120_000)

  it('numbers sections without gaps when a section is left out', async () => {
    const html = await renderWebHtml(hartPackage())
    const numbers = [...html.matchAll(/class="inv-section-n">(\d+)</g)].map((m) => Number(m[1]))
    expect(numbers).toEqual(numbers.map((_, i) => i + 1))
    expect(html).not.toContain('id="sec-kinematics"')
    expect(html).toContain('inv-watermark') // a draft
  }, 120_000)
})

describe('a package in US customary units', () => {
  // Conversions: 1 in = 25.4 mm and 1 lbf = 4.4482216152605 N, exact by definition (NIST SP 811, appendix B).
  const LBF = 4.4482216152605
  const plain = (html: string) => html.replace(/<[^>]+>/g, ' ').replace(/[\s\u2009\u00a0]+/g, ' ')

  it('prints inputs and tables in in/lbf, and each step result in SI then US', async () => {
    const si = peaucellierPackage({ state: 'issued' })
    const us = { ...si, units: 'US' as const }
    const html = plain(await renderWebHtml(us))
    expect(html).toContain('US customary (in, lbf, lbf·in, ksi)')
    // The inputs table: a length in inches.
    const arm = si.inputRows.find((r) => r.unit === 'mm' && typeof r.value === 'number')!
    expect(html).toContain(`${arm.label} ${formatNumber((arm.value as number) / 25.4)} in`)
    // A step with a force: the SI result, then the same in lbf.
    const force = si.result.steps.find((s) => s.unit === 'N' && typeof s.value === 'number' && (s.value as number) > 10)!
    expect(html).toContain(`${formatNumber(force.value as number)} N (${formatNumber((force.value as number) / LBF)} lbf)`)
    // The plots too: the drive torque axis in lbf·in.
    expect(html).toContain('τ [lbf·in]')
    // The SI package has no US values.
    expect(plain(await renderWebHtml(si))).not.toContain(' lbf')
  }, 120_000)
})
