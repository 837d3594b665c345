import { describe, expect, it } from 'vitest'
import { mechanismDynamics, type MotionLaw } from '@/lib/dynamics'
import { CELLS, steelFlats, sweep } from './_setup'

/*
 * Hand-worked tracer motion. With the crank pivot at e = r the driven point is
 * P = (r + r cos θ, r sin θ) = 2r cos(θ/2) (cos θ/2, sin θ/2), and the inversion puts T on the ray
 * O→P at |OT| = k/|OP| (Peaucellier 1864; Hart's cell inverts the same way — Kempe, How to Draw a
 * Straight Line, 1877). So x_T = k/(2r) and y_T = (k/(2r)) tan(θ/2). Differentiated by hand, with
 * c = k/(2r):
 *   dy/dθ = (c/2) sec²(θ/2),   d²y/dθ² = (c/2) sec²(θ/2) tan(θ/2),
 *   ẏ_T = ω dy/dθ,   ÿ_T = ω² d²y/dθ² + α dy/dθ,   ẋ_T = ẍ_T = 0.
 * The module gets its accelerations from the loop-closure equations, not from this formula.
 */

const sec2 = (th: number) => 1 / Math.cos(th / 2) ** 2

for (const id of ['peaucellier', 'hart'] as const) {
  describe(`${id}: tracer velocity and acceleration on the line x = k/(2r), by hand`, () => {
    for (const motion of [
      { kind: 'constant', rpm: 240 },
      { kind: 'harmonic', cyclesPerMinute: 90, fromDeg: -60, toDeg: 60 },
    ] as MotionLaw[]) {
      it(`${motion.kind} crank motion`, () => {
        const m = CELLS[id]()
        const [lo, hi] = motion.kind === 'harmonic' ? [-60, 60] : m.range
        const r = mechanismDynamics({
          ...m,
          anglesDeg: sweep(lo, hi, 25),
          motion,
          bodies: steelFlats(m.cell),
          addedMasses: [{ joint: 'T', mass: 0.8, label: 'tool' }],
          loads: [{ name: 'none', fx: 0, fy: 0 }],
        })
        const c = m.cell.k / (2 * m.crank)
        expect(r.kinematics).toHaveLength(25)
        for (const k of r.kinematics) {
          const th = (k.crankDeg * Math.PI) / 180
          const d1 = (c / 2) * sec2(th)
          const d2 = (c / 2) * sec2(th) * Math.tan(th / 2)
          const v = k.omega * d1
          const a = k.omega * k.omega * d2 + k.alpha * d1
          const T = k.joints.T
          const scale = Math.max(1, Math.abs(a))
          expect(Math.abs(T.v.y - v) / Math.max(1, Math.abs(v))).toBeLessThan(1e-10)
          expect(Math.abs(T.v.x) / Math.max(1, Math.abs(v))).toBeLessThan(1e-10)
          expect(Math.abs(T.a.y - a) / scale).toBeLessThan(1e-9)
          expect(Math.abs(T.a.x) / scale).toBeLessThan(1e-9)
        }
        expect(r.cases[0].samples).toHaveLength(25)
      })
    }

    it('the harmonic swing stops at its end stops: ω = 0 and α = ∓Ω²Δ there', () => {
      const m = CELLS[id]()
      const r = mechanismDynamics({
        ...m,
        anglesDeg: [-60, 0, 60],
        motion: { kind: 'harmonic', cyclesPerMinute: 60, fromDeg: -60, toDeg: 60 },
        bodies: steelFlats(m.cell),
        loads: [{ name: 'none', fx: 0, fy: 0 }],
      })
      const W = 2 * Math.PI
      const D = Math.PI / 3
      const [a, b, z] = r.kinematics
      expect(a.omega).toBe(0)
      expect(a.alpha).toBeCloseTo(W * W * D, 10)
      expect(b.omega).toBeCloseTo(W * D, 10)
      expect(b.alpha).toBeCloseTo(0, 12)
      expect(z.omega).toBe(0)
      expect(z.alpha).toBeCloseTo(-W * W * D, 10)
    })
  })
}

describe('harmonic swing: crank angles outside the swing are refused', () => {
  it('throws rather than reporting a crank at rest where it never is', () => {
    const m = CELLS.peaucellier()
    expect(() =>
      mechanismDynamics({ ...m, anglesDeg: [-70, 0], motion: { kind: 'harmonic', cyclesPerMinute: 60, fromDeg: -60, toDeg: 60 }, bodies: steelFlats(m.cell), loads: [{ name: 'none', fx: 0, fy: 0 }] }),
    ).toThrow(/outside the harmonic swing/)
  })
})
