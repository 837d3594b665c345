import { describe, expect, it } from 'vitest'
import { defaultCalcInputs } from '@/lib/calc/defaults'
import { inputRowsOf } from '@/lib/calc/input-rows'
import { calculate } from '@/lib/calc/run'
import { mechanismChoiceMessage, mechanismComponents, mechanismIds, mechanismLabel, registerMechanism } from '@/lib/mechanisms'
import { createCalcSchema } from '@/lib/schemas/project'
import { registerReportParts, renderWebHtml, stepOutline } from '@/reports/index'
import { packageFromInputs } from '@/reports/demo'
import { TEST_CELL } from './test-cell/mechanism'

/*
 * A third mechanism plugs in through the registry alone: two registration calls, its own folder
 * (tests/mechanisms/test-cell), no shared file edited. It then runs through the same calc entry,
 * schemas, input rows and web rendering as the built-in two.
 */
registerMechanism(TEST_CELL)
const DIAGRAM_MARK = 'test-cell diagram'
registerReportParts('test-cell', {
  template: 'tests/mechanisms/test-cell/template.mdx',
  diagram: (result, at, width) => ({ width, height: 20, items: [{ kind: 'text', x: 4, y: 12, text: `${DIAGRAM_MARK} (${at.join(', ')}; ${result.positions?.length ?? 0} positions)`, size: 8 }] }),
})

const INPUTS = {
  ...defaultCalcInputs('test-cell'),
  loads: [{ name: 'Push', fx: 0, fy: -200 }],
}

describe('a test-only mechanism registered at run time', () => {
  it('is offered and accepted wherever a mechanism is named', () => {
    expect(mechanismIds()).toEqual(['peaucellier', 'hart', 'test-cell'])
    expect(mechanismChoiceMessage()).toBe('must be "peaucellier", "hart" or "test-cell"')
    expect(mechanismLabel('test-cell')).toBe('Test cell (k and s given)')
    expect(createCalcSchema.safeParse({ number: 'T-1', title: 'Third mechanism', calcType: 'test-cell' }).success).toBe(true)
    expect(createCalcSchema.safeParse({ number: 'T-1', title: 'Third mechanism', calcType: 'slider' }).success).toBe(false)
    expect(mechanismComponents('test-cell')).toEqual({ joints: ['O', 'C', 'L', 'P', 'R', 'T'], links: ['OL', 'OR', 'LP', 'RP', 'LT', 'RT', 'CP'] })
  })

  it('refuses its geometry field by field, and an unknown mechanism with every registered id', () => {
    const bad = calculate({ ...INPUTS, geometry: { k: -1, side: 100, crank: 100 } })
    expect(bad.ok ? null : bad.fieldErrors).toEqual({ 'geometry.k': 'must be positive' })
    const unknown = calculate({ ...INPUTS, mechanism: 'slider' })
    expect(unknown.ok ? null : unknown.fieldErrors.mechanism).toBe('must be "peaucellier", "hart" or "test-cell"')
  })

  it('runs through calculate: feasible, statics verified, checks on its own link names', () => {
    const run = calculate(INPUTS)
    if (!run.ok) throw new Error(JSON.stringify(run.fieldErrors))
    const r = run.result
    expect(r.mechanism).toBe('test-cell')
    expect(r.feasibility.ok).toBe(true)
    // k = 52 500 mm², r = e = 100 mm: the tracer runs on x = k/(2r) = 262.5 mm (geometry of inversion).
    expect(r.lineOffset).toBeCloseTo(262.5, 9)
    for (const p of r.positions) expect(p.tracer.x).toBeCloseTo(262.5, 9)
    // The engine's own second routes: equilibrium of every body and virtual work.
    for (const s of r.steps.filter((s) => s.section === 'verification')) expect(s.verdict, s.id).toBe('pass')
    expect(r.checks.some((c) => c.component === 'link OL')).toBe(true)
    expect(r.checks.some((c) => c.component === 'pin L')).toBe(true)
    // The same cell as the built-in Peaucellier one with l = √(k + s²) = 250 mm: same forces at P.
    const twin = calculate({ ...INPUTS, mechanism: 'peaucellier', geometry: { arm: 250, side: 100, crank: 100, crankPivotOffset: 100 } })
    if (!twin.ok) throw new Error('twin refused')
    expect(r.positions.map((p) => p.pinForces.P.magnitude)).toEqual(twin.result.positions.map((p) => expect.closeTo(p.pinForces.P.magnitude, 6)))
    const rows = inputRowsOf(run.input)
    expect(rows[0]).toEqual({ group: 'Mechanism', label: 'Type', value: 'Test cell (k and s given)', unit: '' })
    expect(rows).toContainEqual({ group: 'Geometry', label: 'Inversion constant k = |OP|·|OT|', value: 52500, unit: 'mm²' })
  })

  it('renders web HTML of its package with its template, its diagram and its step order', async () => {
    const pkg = packageFromInputs({
      inputs: INPUTS,
      project: { code: 'T-1', name: 'Registry test', client: 'none' },
      calc: { number: 'T-1-001', title: 'Third mechanism through the registry' },
      revision: { label: 'A', state: 'draft', engineer: { name: 'A. Tester' }, checker: { name: '—' }, approver: { name: '—' } },
      generatedAt: '2027-01-01T00:00:00.000Z',
    })
    expect(pkg.calc.type).toBe('test-cell')
    const html = await renderWebHtml(pkg)
    expect(html).toContain('T-1-001, Test cell (k and s given)')
    expect(html).toContain('A test-only mechanism, rendered through the registry.')
    expect(html).toContain(`${DIAGRAM_MARK} (start, end; ${pkg.result.positions?.length} positions)`)
    // Numbered in the mechanism's declared order (statics before verification), the same numbers as stepOutline.
    const outline = stepOutline(pkg)
    const sections = [...new Set(outline.map((s) => s.section))]
    expect(sections).toEqual(['geometry', 'kinematics', 'statics', 'verification', 'checks', 'comparison'])
    const shown = [...html.matchAll(/id="step-([^"]+)"[\s\S]*?class="inv-step-n"[^>]*>(\d+)</g)].map((m) => [m[1], Number(m[2])])
    expect(shown).toEqual(outline.map((s) => [s.id, s.number]))
  }, 120_000)
})
