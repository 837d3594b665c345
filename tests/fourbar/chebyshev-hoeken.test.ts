/**
 * Chebyshev's linkage (links 2.5, coupler 1, frame 2, tracer at the coupler's middle) and Hoeken's
 * linkage (crank 1, coupler 2.5, rocker 2.5, frame 2, tracer at 5 on the extended coupler), checked
 * against facts worked by hand and against an independent solution by complex-number loop closure.
 */
import { describe, expect, it } from 'vitest'
import { poseAt } from '@/lib/fourbar'
import { analysed, sized } from '../helpers/fourbar'

type C = { x: number; y: number }
const deg = Math.PI / 180

/**
 * Chebyshev's linkage in its published frame (A = 0, D = 2, unit u = 1) by complex-number loop closure
 * A + 2.5 e^{iθ} + 1 e^{iβ} = D + 2.5 e^{iγ}, solved for γ by the half-angle tangent (Freudenstein's
 * way) — not by intersecting circles. Returns the tracer (B + C)/2 or null.
 */
function chebyshevByLoopClosure(theta: number): C | null {
  const a = 2.5
  const b = 1
  const c = 2.5
  const B = { x: a * Math.cos(theta), y: a * Math.sin(theta) }
  const K = { x: B.x - 2, y: B.y } // B − D
  // |c e^{iγ} − K| = b  ⇒  Kx cos γ + Ky sin γ = R
  const R = (c * c + K.x * K.x + K.y * K.y - b * b) / (2 * c)
  const disc = K.x * K.x + K.y * K.y - R * R
  if (disc < 0) return null
  // t = tan(γ/2): (R + Kx) t² − 2 Ky t + (R − Kx) = 0. The root with "+" gives the crossed assembly
  // (at θ = atan2(2, 1.5): C = (0.5, 2), γ = 180° − atan2(2, 1.5); checked in the first test below).
  const t = (K.y + Math.sqrt(disc)) / (R + K.x)
  const g = 2 * Math.atan(t)
  const Cp = { x: 2 + c * Math.cos(g), y: c * Math.sin(g) }
  return { x: (B.x + Cp.x) / 2, y: (B.y + Cp.y) / 2 }
}

describe("Chebyshev's linkage, 1 : 2.5 : 2 (coupler : links : frame), tracer at the coupler's middle", () => {
  const s = sized('chebyshev', 2, { usable: 1 }) // u = 1: the published numbers
  const raw = (theta: number) => {
    const p = poseAt(s.model, theta)!
    return { x: p.T.x + 1, y: p.T.y + 2, p } // the sized frame puts the middle tracer point (1, 2) at the origin
  }

  it('passes through (0, 2), (1, 2), (2, 2) at θ = 90°, atan2(2, 1.5), atan2(1.5, 2) (worked by hand: B (0, 2.5), (1.5, 2), (2, 1.5))', () => {
    const cases = [
      [90 * deg, 0],
      [Math.atan2(2, 1.5), 1],
      [Math.atan2(1.5, 2), 2],
    ] as const
    for (const [theta, x] of cases) {
      const t = raw(theta)
      expect(t.x).toBeCloseTo(x, 12)
      expect(t.y).toBeCloseTo(2, 12)
      const q = chebyshevByLoopClosure(theta)!
      expect(q.x).toBeCloseTo(x, 12)
      expect(q.y).toBeCloseTo(2, 12)
    }
    expect(s.thetaMid).toBeCloseTo(Math.atan2(2, 1.5), 14)
  })

  it('the tracer path by circle intersection equals the path by complex loop closure over the whole swing (independent method)', () => {
    let worst = 0
    for (let th = Math.atan2(1.5, 2); th <= 90 * deg + 1e-12; th += 0.05 * deg) {
      const a = raw(th)
      const b = chebyshevByLoopClosure(th)!
      worst = Math.max(worst, Math.hypot(a.x - b.x, a.y - b.y))
    }
    expect(worst).toBeLessThan(1e-12)
  })

  it('(2, 2) is the driven link\'s dead point: coupler and rocker in line (B on D C, |DB| = 2.5 − 1), so the drive cannot pass it (worked by hand)', () => {
    const p = poseAt(s.model, Math.atan2(1.5, 2))!
    expect(p.h).toBeLessThan(1e-6)
    expect(poseAt(s.model, Math.atan2(1.5, 2) - 1e-6)).toBeNull()
  })

  it('deviation from the line through the exact points, by dense loop closure, equals the analysed path; a few tenths of a per cent of the straight part (from memory, order only)', () => {
    // Dense evaluation by the other method: the largest |y − 2| over the straight part.
    let dense = 0
    for (let th = Math.atan2(1.5, 2); th <= 90 * deg; th += 0.001 * deg) dense = Math.max(dense, Math.abs(chebyshevByLoopClosure(th)!.y - 2))
    // The analysed path (sized for a stroke of 150 mm: u = 75) scaled back to u = 1.
    const r = analysed('chebyshev', { stroke: 150, load: { fx: 0, fy: 0 } }, { usable: 1 })
    const fromPath = Math.max(...r.path.map((p) => Math.abs(p.y))) / 75
    expect(fromPath).toBeCloseTo(dense, 7)
    expect(dense / 2).toBeGreaterThan(0.001)
    expect(dense / 2).toBeLessThan(0.005)
    // The fitted line's error is smaller than the deviation from the chord: the fit moves the line into the band.
    expect(r.straightness.error).toBeLessThan(dense * 75)
    expect(r.straightness.error).toBeGreaterThan(0.4 * dense * 75)
  })
})

describe("Hoeken's linkage is the cognate of Chebyshev's (Roberts–Chebyshev cognate theorem)", () => {
  it('the cognate built from Chebyshev\'s positions by parallelograms is Hoeken\'s 1 : 2.5 : 2.5 : 2, tracer at 5, at half scale (derived)', () => {
    // Chebyshev: O_A = (0, 0), O_B = (2, 0), A B the coupler, P its middle. Parallelogram O_A A P A1 gives
    // A1 = O_A + (P − A), |O_A A1| = |AP| = 0.5. Claim: with O_C = (1, 0) and C1 the middle of A1 P,
    // |O_C C1| = 1.25 at every position, |A1 C1| = 1.25, |A1 P| = 2.5: Hoeken's 1 : 2.5 : 2.5 : 2 : 5 halved.
    const s = sized('chebyshev', 2, { usable: 1 })
    let worst = 0
    for (let th = Math.atan2(1.5, 2); th <= 90 * deg; th += 0.25 * deg) {
      const p = poseAt(s.model, th)!
      const sh = (q: C) => ({ x: q.x + 1, y: q.y + 2 })
      const [A, P] = [sh(p.B), sh(p.T)]
      const A1 = { x: P.x - A.x, y: P.y - A.y }
      const C1 = { x: (A1.x + P.x) / 2, y: (A1.y + P.y) / 2 }
      worst = Math.max(worst, Math.abs(Math.hypot(A1.x, A1.y) - 0.5), Math.abs(Math.hypot(C1.x - 1, C1.y) - 1.25))
    }
    expect(worst).toBeLessThan(1e-12)
  })

  it("Hoeken's tracer runs on Chebyshev's curve for the same stroke: same path, same straightness error (similarity: scale 1 at equal strokes)", () => {
    const S = 150
    const load = { fx: 0, fy: -140 }
    const h = analysed('hoeken', { stroke: S, load })
    const c = analysed('chebyshev', { stroke: S, load }, { usable: 1 })
    // Both frames put the middle of the stroke at the origin and the line along x; the curve is symmetric about x = 0.
    for (let i = 0; i < h.path.length; i += 50) expect(Math.abs(h.path[i].y - c.path[c.path.length - 1 - i].y)).toBeLessThan(1e-7)
    expect(h.straightness.error).toBeCloseTo(c.straightness.error, 7)
    expect(h.lengths.AD).toBeCloseTo(S / 2, 12) // frame 2u with u = S/4
    expect(c.lengths.AD).toBeCloseTo(S, 12) // frame 2u with u = S/2
  })

  it('proportions: crank 1, coupler 2.5, rocker 2.5, frame 2, tracer 5 from the crank pin on the coupler extended (published)', () => {
    const { model } = sized('hoeken', 4) // u = 1
    expect(model.a).toBeCloseTo(1, 14)
    expect(model.b).toBeCloseTo(2.5, 14)
    expect(model.c).toBeCloseTo(2.5, 14)
    expect(Math.hypot(model.A.x - model.D.x, model.A.y - model.D.y)).toBeCloseTo(2, 14)
    expect(model.tracer.along).toBeCloseTo(5, 14)
    expect(model.tracer.across).toBeCloseTo(0, 14)
  })

  it('the crank turns half a turn, 90° to 270°, over the straight part (worked by hand: T (4, 4) at A B ⟂ up, (2, 4) at 180°, (0, 4) at 270°)', () => {
    const r = analysed('hoeken', { stroke: 150, load: { fx: 0, fy: 0 } })
    expect(r.inputRange.fromDeg).toBeCloseTo(90, 9)
    expect(r.inputRange.toDeg).toBeCloseTo(270, 9)
    // A turning crank: the crank is the shortest link and s + l ≤ p + q (Grashof: 1 + 2.5 ≤ 2.5 + 2).
    expect(r.minTransmissionDeg).toBeGreaterThan(45)
  })
})
