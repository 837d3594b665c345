import { describe, expect, it } from 'vitest'
import { calculate } from '@/lib/calc/run'
import { DEMO_CALCS } from '@/lib/demo/calcs'
import { defineFourBar, fourBars, registerFourBar } from '@/lib/mechanisms'
import { watt } from '@/lib/mechanisms/watt'

/*
 * A four-bar plugs into every package's "Choice of mechanism" through the registry alone: this
 * test-only one is Watt's linkage with rockers of twice the stroke (the built-in one's sizing with
 * another rule), declared here and registered at run time, with no shared file edited. Watt's deviation for a coupler c and rockers r grows as
 * y⁵/(4 c r³) (the series the Watt tests check), so longer rockers run straighter.
 */
const longWatt = defineFourBar({
  id: 'test-long-watt',
  label: "Watt's linkage, long rockers",
  rule: { rocker: 2, coupler: 0.5 },
  size: (S, rule) => ({ ...watt.size(S, rule), name: 'test-long-watt', label: "Watt's linkage, long rockers", source: "Watt's linkage (test-only proportions)" }),
})

describe('a four-bar registered at run time', () => {
  registerFourBar(longWatt)

  it('is offered after the built-in ones, and registering it again is a no-op', () => {
    registerFourBar(longWatt)
    expect(fourBars().map((f) => f.id)).toEqual(['watt', 'chebyshev', 'roberts', 'hoeken', 'test-long-watt'])
    expect(() => registerFourBar({ ...longWatt })).toThrow(/already registered/)
  })

  it('appears in a calc\'s comparison table and steps, straighter than the built-in Watt', () => {
    const out = calculate(DEMO_CALCS[0].inputs)
    if (!out.ok) throw new Error(JSON.stringify(out.fieldErrors))
    const table = out.result.tables.find((t) => t.id === 'cmp.choice')!
    const rows = new Map(table.rows.map((r) => [r.mechanism, r]))
    const mine = rows.get("Watt's linkage, long rockers")!
    expect(mine).toMatchObject({ links: 4, pins: 4, basis: 'approximate' })
    expect(mine.straightness as number).toBeLessThan(rows.get("Watt's linkage")!.straightness as number)
    expect(out.result.steps.some((s) => s.id === 'cmp.test-long-watt.straightness')).toBe(true)
    // The exact cell stays the last row.
    expect(table.rows.at(-1)!.mechanism).toBe('Peaucellier–Lipkin cell')
  })
})
