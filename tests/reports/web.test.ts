import { describe, expect, it } from 'vitest'
import { renderWebHtml, stepOutline } from '@/reports/index'
import { peaucellierPackage } from './fixtures/peaucellier'
import { hartPackage } from './fixtures/hart'

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
