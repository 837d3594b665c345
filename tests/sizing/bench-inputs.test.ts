import { describe, expect, it } from 'vitest'
import { parseDecimal } from '@/lib/bench/number'
import { rangeErrors, rangeFor } from '@/lib/bench/ranges'
import { benchCalculate } from '@/lib/bench/validate'
import { keyFigures } from '@/lib/bench/key-results'
import { defaultCalcInputs } from '@/lib/calc/defaults'

/*
 * The bench's input rules: a decimal comma is a decimal separator or refused, never dropped; every
 * number has a range with its reason; an infeasible geometry is an error at the fields that make it so,
 * with the reach condition of the engine (2r ≥ l − s for the Peaucellier cell on the line, docs/engine.md).
 */

describe('numbers as typed', () => {
  it.each([
    ['80,5', 80.5],
    ['80.5', 80.5],
    [' -12,25 ', -12.25],
    ['1e3', 1000],
    ['−3', -3],
    ['', undefined],
  ])('reads %j as %j', (text, value) => {
    expect(parseDecimal(text)).toEqual({ ok: true, value })
  })

  it.each(['1,000.5', '1.000,5', '80,5,1', '12 mm', 'abc', '1..2'])('refuses %j with a reason', (text) => {
    const p = parseDecimal(text)
    expect(p.ok).toBe(false)
    if (!p.ok) expect(p.message).toMatch(/number/)
  })
})

describe('ranges', () => {
  it('has a range with a reason for every number of the default inputs', () => {
    const paths: string[] = []
    const walk = (node: unknown, prefix: string) => {
      if (typeof node === 'number') paths.push(prefix)
      else if (node && typeof node === 'object') for (const [k, v] of Object.entries(node)) walk(v, prefix ? `${prefix}.${k}` : k)
    }
    for (const m of ['peaucellier', 'hart'] as const) walk(defaultCalcInputs(m), '')
    for (const p of paths) expect(rangeFor(p), p).toBeDefined()
  })

  it('refuses an arm of 1e12 mm at its field, with the reason', () => {
    const input = { ...defaultCalcInputs('peaucellier'), geometry: { arm: 1e12, side: 100, crank: 100 } }
    expect(rangeErrors(input)['geometry.arm']).toMatch(/from 1 mm to 5000 mm: links from 1 mm to 5 m/)
    const out = benchCalculate(input)
    expect(out.ok).toBe(false)
  })
})

describe('infeasible geometry at its fields', () => {
  it('a crank too short for the Peaucellier cell is named at l, s and r', () => {
    const out = benchCalculate({ ...defaultCalcInputs('peaucellier'), geometry: { arm: 250, side: 100, crank: 40 } })
    expect(out.ok).toBe(false)
    if (out.ok) return
    for (const f of ['geometry.arm', 'geometry.side', 'geometry.crank']) expect(out.fieldErrors[f]).toMatch(/^the crank cannot reach the cell: make 2r ≥ l − s \(now 2r = 80 mm < l − s = 150 mm\)/)
    expect(out.fieldErrors['geometry.crankPivotOffset']).toBeUndefined()
    expect(out.result?.feasibility.kind).toBe('crank-cannot-reach')
  })

  it('an arm not longer than the side is named at both', () => {
    const out = benchCalculate({ ...defaultCalcInputs('peaucellier'), geometry: { arm: 100, side: 120, crank: 40 } })
    expect(out.ok).toBe(false)
    if (!out.ok) expect(Object.keys(out.fieldErrors).sort()).toEqual(['geometry.arm', 'geometry.side'])
  })

  it('a Hart crank reaching past the flat position is named at a, b, μ and r', () => {
    const out = benchCalculate({ ...defaultCalcInputs('hart'), geometry: { long: 240, short: 100, ratio: 0.3, crank: 60 } })
    expect(out.ok).toBe(false)
    if (!out.ok) {
      expect(Object.keys(out.fieldErrors).sort()).toEqual(['geometry.crank', 'geometry.long', 'geometry.ratio', 'geometry.short'])
      expect(out.fieldErrors['geometry.ratio']).toMatch(/make 2r < μ\(a \+ b\)/)
    }
  })

  it('the defaults are feasible and give key figures from the result', () => {
    for (const m of ['peaucellier', 'hart'] as const) {
      const out = benchCalculate(defaultCalcInputs(m))
      expect(out.ok).toBe(true)
      if (!out.ok) continue
      const f = keyFigures(out.result)
      expect(f.k).toBeCloseTo(out.result.inversionConstant, 9)
      expect(f.usableStroke).toBeCloseTo(2 * out.result.stroke.usable.half, 9)
      expect(Math.abs(f.peakTorque!.value)).toBe(Math.max(...out.result.loadCases.flatMap((lc) => lc.positions.map((p) => Math.abs(p.driveTorque)))))
    }
  })
})
