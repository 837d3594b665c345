import { describe, it, expect } from 'vitest'
import { peaucellierCell } from '@/lib/linkage/cells/peaucellier'
import { runSweep } from '@/lib/linkage/sweep'
import { assessGeometry, tracerPath } from '@/lib/linkage/geometry'
import { runMechanism } from '@/lib/calc/mechanism'

/*
 * Hand-solved case, worked out here with 3-4-5 triangles so every number is exact:
 * l = 100, s = 75, r = e = 17.5 (2r = 35), θ = 0.
 * k = 100² − 75² = 4375. P = (35, 0), d = (k + 35²)/(2·35) = 80, w = √(100² − 80²) = 60,
 * A = (80, 60), B = (80, −60), T = (k/35, 0) = (125, 0), C = (17.5, 0).
 * Load F = (100, 0) N at T.
 * Joint T: unit vectors T→A = (−0.6, 0.8), T→B = (−0.6, −0.8);
 *   x: −0.6·(N_AT + N_BT) + 100 = 0, y: symmetric ⇒ N_AT = N_BT = 250/3 = 83.333 N (tension).
 * Joint A: A→O = (−0.8, −0.6), A→P = (−0.6, −0.8), A→T = (0.6, −0.8);
 *   x: −0.8 N_OA − 0.6 N_AP + 0.6·250/3 = 0
 *   y: −0.6 N_OA − 0.8 N_AP − 0.8·250/3 = 0
 *   ⇒ N_AP = −6250/21 = −297.619 N, N_OA = 2000/7 = 285.714 N.
 * Joint P: P→A = (0.6, 0.8), P→B = (0.6, −0.8), P→C = (−1, 0);
 *   x: 2·0.6·N_AP − N_CP = 0 ⇒ N_CP = −2500/7 = −357.143 N; the crank force passes through C ⇒ τ = 0.
 * Ground: O gets 2·N_OA·(−0.8, ·) = (−457.14, 0), C gets (357.14, 0); with F: 100 − 457.14 + 357.14 = 0.
 */
describe('Peaucellier–Lipkin cell, hand-solved joint equilibrium at the symmetric position', () => {
  // Solved inside each test (not while collecting), so mutation testing sees which tests cover the engine.
  const solved = () => {
    const cell = peaucellierCell({ arm: 100, side: 75 })
    const out = runSweep({ cell, crank: 17.5, offset: 17.5, anglesDeg: [0], loads: [{ name: 'x', fx: 100, fy: 0 }], weightPerMm: null, amplificationLimit: 100 })
    return out.cases[0].samples[0].position
  }

  it('places the joints as worked out by hand', () => {
    const p = solved()
    expect(p.joints.A.x).toBeCloseTo(80, 10)
    expect(p.joints.A.y).toBeCloseTo(60, 10)
    expect(p.joints.B.y).toBeCloseTo(-60, 10)
    expect(p.tracer.x).toBeCloseTo(125, 10)
  })

  it('gives the hand-solved axial forces, tension positive', () => {
    const p = solved()
    expect(p.linkForces.AT).toBeCloseTo(250 / 3, 8)
    expect(p.linkForces.BT).toBeCloseTo(250 / 3, 8)
    expect(p.linkForces.AP).toBeCloseTo(-6250 / 21, 8)
    expect(p.linkForces.OA).toBeCloseTo(2000 / 7, 8)
    expect(p.linkForces.CP).toBeCloseTo(-2500 / 7, 8)
    expect(p.driveTorque).toBeCloseTo(0, 8)
  })

  it('gives the hand-solved reactions and pin forces', () => {
    const p = solved()
    expect(p.reactions.O.x).toBeCloseTo(-3200 / 7, 8)
    expect(p.reactions.O.y).toBeCloseTo(0, 8)
    expect(p.reactions.C.x).toBeCloseTo(2500 / 7, 8)
    // Pin P carries AP, BP (297.6 N each) and the crank (357.1 N): the crank governs.
    expect(p.pinForces.P.magnitude).toBeCloseTo(2500 / 7, 8)
  })
})

describe('Peaucellier–Lipkin cell against the geometry of inversion', () => {
  // Coxeter, Introduction to Geometry, §6.1: inversion maps a circle through the
  // centre of inversion onto a line at distance k/(2r) (diameter 2r), and any
  // other circle onto a circle; Kempe (How to Draw a Straight Line, 1877) gives
  // the cell's |OP|·|OT| = l² − s².
  const newCell = () => peaucellierCell({ arm: 150, side: 60 })

  it('keeps |OP|·|OT| = l² − s² and the tracer on x = k/(2r)', () => {
    const cell = newCell()
    const out = runSweep({ cell, crank: 60, offset: 60, anglesDeg: [-70, -35, 0, 20, 77], loads: [{ name: 'y', fx: 0, fy: 10 }], weightPerMm: null, amplificationLimit: 100 })
    for (const { position: p } of out.cases[0].samples) {
      expect(Math.hypot(p.joints.P.x, p.joints.P.y) * Math.hypot(p.tracer.x, p.tracer.y)).toBeCloseTo(150 ** 2 - 60 ** 2, 8)
      expect(p.tracer.x).toBeCloseTo(18900 / 120, 10)
    }
  })

  it('drives the tracer as T_y = (k/2r)·tan(θ/2), so by virtual work τ = −F_y·(k/4r)·sec²(θ/2)', () => {
    const cell = newCell()
    // Inscribed angle: with the crank circle through O, the ray O→P makes θ/2 with +x.
    const out = runSweep({ cell, crank: 60, offset: 60, anglesDeg: [-60, -10, 25, 70], loads: [{ name: 'y', fx: 0, fy: 50 }], weightPerMm: null, amplificationLimit: 100 })
    for (const { position: p } of out.cases[0].samples) {
      const half = (p.crankDeg * Math.PI) / 360
      expect(p.tracer.y).toBeCloseTo((18900 / 120) * Math.tan(half), 9)
      expect(p.driveTorque).toBeCloseTo((-50 * 18900) / (4 * 60) / Math.cos(half) ** 2, 6)
    }
  })

  it('follows the circle of centre ke/(e² − r²), radius kr/|e² − r²| when e ≠ r', () => {
    const cell = newCell()
    const e = 50
    const r = 60
    const path = tracerPath(cell.k, e, r)
    expect(path.kind).toBe('arc')
    if (path.kind !== 'arc') return
    expect(path.centre.x).toBeCloseTo((18900 * 50) / (2500 - 3600), 9)
    expect(path.radius).toBeCloseTo((18900 * 60) / 1100, 9)
    const out = runSweep({ cell, crank: r, offset: e, anglesDeg: [-40, 0, 40], loads: [{ name: 'y', fx: 0, fy: 1 }], weightPerMm: null, amplificationLimit: 100 })
    for (const { position: p } of out.cases[0].samples) {
      expect(Math.hypot(p.tracer.x - path.centre.x, p.tracer.y)).toBeCloseTo(path.radius, 8)
    }
  })

  it('reports the true arc deviation: the sagitta R − √(R² − h²) of the swept arc', () => {
    const res = runMechanism({ mechanism: 'peaucellier', geometry: { arm: 150, side: 60, crank: 60, crankPivotOffset: 55 }, loads: [{ name: 'y', fx: 0, fy: 1 }], sweep: { fromDeg: -40, toDeg: 40, count: 81 } })
    expect(res.feasibility.kind).toBe('circle-arc')
    expect(res.line?.kind).toBe('arc')
    if (res.line?.kind !== 'arc') return
    const h = Math.abs(res.positions[0].tracer.y)
    const R = res.line.radius
    expect(res.straightness).toBeCloseTo(R - Math.sqrt(R * R - h * h), 8)
    expect(res.straightness).toBeGreaterThan(0.1)
  })

  it('reports ≈ 0 straightness deviation for e = r', () => {
    const res = runMechanism({ mechanism: 'peaucellier', geometry: { arm: 150, side: 60, crank: 60 }, loads: [{ name: 'y', fx: 0, fy: 1 }] })
    expect(res.straightness).toBeLessThan(1e-9)
  })
})

describe('Peaucellier–Lipkin feasibility verdicts', () => {
  const verdict = (l: number, s: number, r: number, e = r) => assessGeometry(peaucellierCell({ arm: l, side: s }), e, r, 5).feasibility
  it('names each case', () => {
    expect(verdict(60, 60, 30).kind).toBe('arm-not-longer-than-side')
    expect(verdict(150, 60, 40).kind).toBe('crank-cannot-reach') // 2r = 80 < l − s = 90
    expect(verdict(150, 60, 80).kind).toBe('split-segment') // 2r = 160 > √k ≈ 137.5
    expect(verdict(150, 60, 60, 50)).toMatchObject({ ok: true, kind: 'circle-arc' })
    expect(verdict(150, 60, 60)).toMatchObject({ ok: true, kind: 'ok' })
  })
  it('gives the stroke between toggles in closed form: half = √((l + s)² − (k/2r)²)', () => {
    const v = assessGeometry(peaucellierCell({ arm: 150, side: 60 }), 60, 60, 5)
    expect(v.stroke.half).toBeCloseTo(Math.sqrt(210 ** 2 - 157.5 ** 2), 9)
    // At the toggle the rhombus lies flat: |OP| = l − s = 2r·cos(θ/2).
    expect(v.stroke.crankMaxDeg).toBeCloseTo((2 * Math.acos(90 / 120) * 180) / Math.PI, 9)
    expect(v.usable.crankMaxDeg).toBeCloseTo(v.stroke.crankMaxDeg - 5, 12)
  })
})
