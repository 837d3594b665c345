import { describe, expect, it } from 'vitest'
import { calculate } from '@/lib/calc/run'
import { DEMO_CALCS } from '@/lib/demo/calcs'

// The calc wiring of the straightness as built (lib/calc/tolerances.ts); the tolerance engine itself is
// checked against hand-worked cases in tests/tolerance.
const lc3 = structuredClone(DEMO_CALCS[2].inputs) as unknown as Record<string, unknown> & { defaults: { joint: Record<string, unknown> } }
const run = (patch: Record<string, unknown>) => calculate({ ...lc3, operatingSpeed: undefined, ...patch })
const ok = (patch: Record<string, unknown>) => {
  const out = run(patch)
  if (!out.ok) throw new Error(JSON.stringify(out.fieldErrors))
  return out.result
}
const value = (r: ReturnType<typeof ok>, id: string) => r.steps.find((s) => s.id === id)?.value as number

describe('straightness as built in the calc', () => {
  it('an exact cell with exact links on tight pins stays on its line (Peaucellier 1864: inversion)', () => {
    const exact = ok({
      tolerances: { lengths: { OA: 0, OB: 0, AP: 0, BP: 0, AT: 0, BT: 0, CP: 0, 'frame:OC': 0 }, samples: 0 },
      defaults: { ...lc3.defaults, joint: { ...lc3.defaults.joint, holeDiameter: lc3.defaults.joint.pinDiameter } },
    })
    expect(value(exact, 'tol.worst-confirmed')).toBeLessThan(1e-9)
  })

  it('the confirmed worst case is a criterion of the verdict, judged against the straightness tolerance', () => {
    const r = ok({ tolerances: { toleranceClass: 'm', samples: 500 }, straightnessTolerance: 0.5 })
    const worst = value(r, 'tol.worst-confirmed')
    const c = r.criteria!.find((x) => x.id === 'toleranced-straightness')!
    expect(c.pass).toBe(worst <= 0.5)
    const tight = ok({ tolerances: { toleranceClass: 'm', samples: 0 }, straightnessTolerance: worst / 2 })
    expect(tight.verdict.pass).toBe(false)
    expect(tight.verdict.unmet).toContain(c.label)
    // A finer class can only make it straighter: ISO 2768-1 f is tighter than m in every band (from memory).
    const fine = ok({ tolerances: { toleranceClass: 'f', samples: 0 } })
    expect(value(fine, 'tol.worst-confirmed')).toBeLessThan(worst)
  })

  it('a length drawn uniformly instead of normally (t = 3σ) spreads the built mechanisms wider', () => {
    // With OA the only tolerance, the deviation grows with |ΔOA|: the 99th percentile of |x| is 0.99 t for a
    // uniform draw over ±t and 2.576 σ = 0.859 t for a normal one with t = 3σ (statistics; common practice).
    const p99 = (d: 'normal' | 'uniform') => {
      const lengths = { OA: 0.3, OB: 0, AP: 0, BP: 0, AT: 0, BT: 0, CP: 0, 'frame:OC': 0 }
      const r = ok({ tolerances: { lengths, distributions: { OA: d }, samples: 4000 }, defaults: { ...lc3.defaults, joint: { ...lc3.defaults.joint, holeDiameter: lc3.defaults.joint.pinDiameter } } })
      return value(r, 'tol.monte-carlo')
    }
    expect(p99('uniform')).toBeGreaterThan(p99('normal'))
  })

  it('the same seed gives the same Monte Carlo figure', () => {
    const a = value(ok({ tolerances: { samples: 400, seed: 7 } }), 'tol.monte-carlo')
    const b = value(ok({ tolerances: { samples: 400, seed: 7 } }), 'tol.monte-carlo')
    expect(a).toBe(b)
  })

  it('a long run reports its progress to whoever runs it (the bench worker shows it)', () => {
    const seen: [number, number][] = []
    const out = calculate({ ...lc3, operatingSpeed: undefined, tolerances: { samples: 5000 } }, { onProgress: (done, total) => seen.push([done, total]) })
    expect(out.ok).toBe(true)
    expect(seen.length).toBeGreaterThan(1)
    expect(seen.at(-1)).toEqual([5000, 5000])
    expect(seen.every(([d], i) => i === 0 || d > seen[i - 1][0])).toBe(true)
  })

  it('bad tolerance inputs are refused at their field', () => {
    expect(run({ tolerances: { toleranceClass: 'x' } })).toMatchObject({ ok: false, fieldErrors: { 'tolerances.toleranceClass': expect.stringMatching(/f, m, c or v/) } })
    expect(run({ tolerances: { samples: 1e6 } })).toMatchObject({ ok: false, fieldErrors: { 'tolerances.samples': expect.stringMatching(/at most 20000/) } })
    expect(run({ tolerances: { lengths: { XY: 0.1 } } })).toMatchObject({ ok: false, fieldErrors: { 'tolerances.lengths.XY': expect.stringMatching(/no dimension "XY"/) } })
    expect(run({ tolerances: { distributions: { XY: 'uniform' } } })).toMatchObject({ ok: false, fieldErrors: { 'tolerances.distributions.XY': expect.stringMatching(/no dimension "XY"/) } })
  })
})
