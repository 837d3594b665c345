import { describe, expect, it } from 'vitest'
import { calculate } from '@/lib/calc/run'
import { DEMO_CALCS } from '@/lib/demo/calcs'

// The calc wiring of "Choice of mechanism" (lib/calc/comparison.ts); the four-bars themselves are
// checked against hand-worked points, their cognates and virtual work in tests/fourbar.
const run = (i: number) => {
  const out = calculate(DEMO_CALCS[i].inputs)
  if (!out.ok) throw new Error(JSON.stringify(out.fieldErrors))
  return out.result
}

describe('choice of mechanism in the calc', () => {
  it('puts the exact cell beside the four-bars sized for its stroke', () => {
    const r = run(0)
    const table = r.tables.find((t) => t.id === 'cmp.choice')!
    expect(table.rows.map((x) => x.mechanism)).toEqual(["Watt's linkage", "Chebyshev's linkage", "Roberts' linkage", "Hoeken's linkage", 'Peaucellier–Lipkin cell'])
    const cell = table.rows.at(-1)!
    // The Peaucellier–Lipkin linkage: seven moving bars and the frame on six pins (Kempe 1877; common practice).
    expect(cell).toMatchObject({ links: 8, pins: 6, basis: 'ideal' })
    expect(cell.straightness).toBe(r.straightness)
    // Each four-bar only approximates the line; its working goes to the appendix.
    for (const row of table.rows.slice(0, 4)) expect(row.straightness as number).toBeGreaterThan(1e-3)
    expect(r.steps.filter((s) => s.section === 'comparison').every((s) => s.appendix)).toBe(true)
    // The exact cell's forces are those of the first load case over the working range.
    expect(cell.pinForce).toBe(Math.max(...Object.values(r.envelope[0].pins).map((p) => p.value)))
  })

  it('a cell analysed as built is compared with its toleranced straightness', () => {
    const r = run(1)
    const cell = r.tables.find((t) => t.id === 'cmp.choice')!.rows.at(-1)!
    expect(cell).toMatchObject({ mechanism: "Hart's inversor", basis: 'toleranced' })
    expect(cell.straightness).toBe(r.steps.find((s) => s.id === 'tol.worst-confirmed')!.value)
  })
})
