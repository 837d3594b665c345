import { describe, expect, it } from 'vitest'
import { poseAt } from '@/lib/fourbar'
import { analysed, sized } from '../helpers/fourbar'

describe("Watt's linkage (equal rockers r, coupler c, tracer at the coupler's middle)", () => {
  const S = 150
  const s = sized('watt', S) // r = S, c = S/2 by the default rule
  const r = s.model.a
  const c = s.model.b

  it('the tracer passes through the centre point, midway between the pivots, moving square to the rockers (symmetry; common practice)', () => {
    const p = poseAt(s.model, s.thetaMid)!
    const mid = { x: (s.model.A.x + s.model.D.x) / 2, y: (s.model.A.y + s.model.D.y) / 2 }
    expect(Math.hypot(p.T.x - mid.x, p.T.y - mid.y)).toBeLessThan(1e-12)
    const e = 1e-6
    const a = poseAt(s.model, s.thetaMid + e)!.T
    const b = poseAt(s.model, s.thetaMid - e)!.T
    const v = { x: a.x - b.x, y: a.y - b.y }
    const rocker = { x: p.B.x - p.A.x, y: p.B.y - p.A.y }
    // tangent square to the rockers (which are parallel at the middle)
    expect(Math.abs(v.x * rocker.x + v.y * rocker.y) / (Math.hypot(v.x, v.y) * r)).toBeLessThan(1e-8)
  })

  it('the path is symmetric about the centre point (the linkage is: a half turn about it maps it on itself)', () => {
    const res = analysed('watt', { stroke: S, load: { fx: 0, fy: 0 } })
    const n = res.path.length
    for (let i = 0; i < n; i += 25) {
      expect(res.path[i].x + res.path[n - 1 - i].x).toBeCloseTo(0, 9)
      expect(res.path[i].y + res.path[n - 1 - i].y).toBeCloseTo(0, 9)
    }
  })

  it('the deviation from the line grows as x⁵/(4 c r³) near the centre (derived by series: ψ = −φ + δ, δ ≈ −rφ⁴/(2c))', () => {
    // Rocker angles φ, ψ from the middle; the coupler's length gives δ ≈ −r φ⁴ / (2c), and the tracer's
    // offset r (cos φ − cos ψ)/2 ≈ r² φ⁵ / (4c) with x ≈ r φ: offset ≈ x⁵ / (4 c r³).
    const ratio = (dphi: number) => {
      const T = poseAt(s.model, s.thetaMid + dphi)!.T
      return Math.abs(T.y) / (Math.abs(T.x) ** 5 / (4 * c * r ** 3))
    }
    const e1 = Math.abs(ratio(0.02) - 1)
    const e2 = Math.abs(ratio(0.01) - 1)
    expect(e1).toBeLessThan(0.01)
    expect(e2).toBeLessThan(e1 / 3) // the next term is O(φ²): halving φ quarters it
  })

  it('the stroke is covered exactly: the ends of the path are ±S/2 along the line (sizing rule)', () => {
    const res = analysed('watt', { stroke: S, load: { fx: 0, fy: 0 } })
    expect(res.path[0].x).toBeCloseTo(-S / 2, 9)
    expect(res.path[res.path.length - 1].x).toBeCloseTo(S / 2, 9)
  })
})

describe("Roberts' linkage (frame d, rockers l, coupler d/2, coupler triangle B C T with B T = C T = l)", () => {
  const S = 150
  it('the tracer passes through both frame pivots and the middle of the frame line (derived: at T = A, C lies on the bisector of A D at height √(l² − d²/4))', () => {
    const res = analysed('roberts', { stroke: S, load: { fx: 0, fy: 0 } })
    const { model, thetaMid } = sized('roberts', S)
    const mid = poseAt(model, thetaMid)!.T
    expect(Math.hypot(mid.x, mid.y)).toBeLessThan(1e-12)
    const ends = [res.path[0], res.path[res.path.length - 1]]
    const pivots = [model.A, model.D].sort((a, b) => a.x - b.x)
    for (let k = 0; k < 2; k++) expect(Math.hypot(ends[k].x - pivots[k].x, ends[k].y - pivots[k].y)).toBeLessThan(1e-6)
    expect(res.lengths.AD).toBeCloseTo(S, 12)
    expect(res.lengths.BC).toBeCloseTo(S / 2, 12)
    expect(res.lengths.BT).toBeCloseTo(res.lengths.AB, 12)
  })

  it('the path is symmetric about the bisector of the frame (mirror symmetry of the linkage)', () => {
    const res = analysed('roberts', { stroke: S, load: { fx: 0, fy: 0 } })
    const n = res.path.length
    for (let i = 0; i < n; i += 25) {
      expect(res.path[i].x + res.path[n - 1 - i].x).toBeCloseTo(0, 7)
      expect(res.path[i].y - res.path[n - 1 - i].y).toBeCloseTo(0, 7)
    }
  })

  it('taller rockers run straighter (more rocker length for the same frame)', () => {
    const e = (l: number) => analysed('roberts', { stroke: S, load: { fx: 0, fy: 0 } }, { rocker: l }).straightness.error
    expect(e(1.2)).toBeLessThan(e(0.8))
  })
})
