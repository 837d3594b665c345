import { describe, expect, it } from 'vitest'
import type { CalcResult } from '@/lib/contract'
import { compareInputRows, compareInputs, compareResults } from '@/lib/review/compare'

// Percent change is (new − old)/|old| × 100 (common practice); the cases are worked by hand.
const result = (values: Record<string, number>, u: Record<string, [number, boolean]>, pass = true, governing = 'pin A · shear') =>
  ({
    steps: Object.entries(values).map(([id, value]) => ({ id, title: id, value, unit: 'N' })),
    checks: Object.entries(u).map(([key, [utilisation, ok]]) => {
      const [component, check] = key.split(' · ')
      return { component, check, utilisation, pass: ok }
    }),
    verdict: { pass, governing, maxUtilisation: Math.max(...Object.values(u).map(([x]) => x)) },
  }) as unknown as CalcResult

describe('comparing two revisions', () => {
  it('step values: absolute and percent change, added and removed steps, unchanged ones left out', () => {
    const d = compareResults(result({ a: 100, b: -50, c: 0, gone: 1, same: 7 }, {}), result({ a: 120, b: -40, c: 5, added: 2, same: 7 }, {}))
    const by = new Map(d.values.map((v) => [v.id, v]))
    expect(by.get('a')).toMatchObject({ from: 100, to: 120, change: 20, percent: 20 })
    // −50 → −40 is +10 on |−50|: +20 %.
    expect(by.get('b')).toMatchObject({ change: 10, percent: 20 })
    // From zero there is no percent.
    expect(by.get('c')).toMatchObject({ change: 5, percent: null })
    expect(by.get('gone')).toMatchObject({ from: 1, to: null, change: null })
    expect(by.get('added')).toMatchObject({ from: null, to: 2 })
    expect(by.has('same')).toBe(false)
  })

  it('checks: a changed utilisation or verdict is listed; the verdict change names pass and governing', () => {
    const d = compareResults(
      result({}, { 'pin A · shear': [0.5, true], 'link AB · buckling': [0.9, true], 'pin B · bearing': [0.2, true] }),
      result({}, { 'pin A · shear': [0.5, true], 'link AB · buckling': [1.1, false], 'pin B · bearing': [0.2, true] }, false, 'link AB · buckling'),
    )
    expect(d.checks).toHaveLength(1)
    expect(d.checks[0]).toMatchObject({ id: 'link AB · buckling', from: 0.9, to: 1.1, fromPass: true, toPass: false })
    expect(d.checks[0].percent).toBeCloseTo(22.2222, 3)
    expect(d.verdict.changed).toBe(true)
  })

  it('inputs by path and by printed row, including a repeated label', () => {
    expect(compareInputs({ g: { arm: 200, side: 80 }, loads: [{ fy: -180 }] }, { g: { arm: 200, side: 90 }, loads: [{ fy: -180 }, { fy: 5 }] })).toEqual([
      { path: 'g.side', from: 80, to: 90 },
      { path: 'loads.1.fy', from: undefined, to: 5 },
    ])
    const row = (label: string, value: number | string) => ({ group: 'Material S355', label, value, unit: 'MPa' })
    expect(compareInputRows([row('f_y', 355), row('f_y', 345)], [row('f_y', 355), row('f_y', 335), row('E', 210000)])).toEqual([
      { input: 'Material S355 · f_y (2)', unit: 'MPa', from: 345, to: 335 },
      { input: 'Material S355 · E', unit: 'MPa', from: null, to: 210000 },
    ])
  })
})
