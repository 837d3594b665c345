import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { peaucellierCell } from '@/lib/linkage/cells/peaucellier'
import { hartCell } from '@/lib/linkage/cells/hart'
import type { InversorCell } from '@/lib/linkage/cells/cell'
import { linkageOf, placeAt } from '@/lib/linkage/crank'
import { buildModel, linkLength, pointsFromJoints, type LinkageModel } from '@/lib/linkage/model'
import { equilibriumResidual, solveStatics, staticsWorkspace, type CaseLoads, type CaseStatics } from '@/lib/linkage/statics'
import { groundReactions } from '@/lib/linkage/members'
import { virtualWorkTorque, VW_STEP } from '@/lib/linkage/virtual-work'

/*
 * Statics of the whole mechanism checked by means that do not use the solver:
 * the free body of the whole mechanism (ΣF = 0 and ΣM_O = 0 with the ground
 * reactions, the tracer load, the weights and the drive torque) and the
 * principle of virtual work (τ = −Σ F·dX/dθ). Any statics text, e.g. Meriam &
 * Kraige, Engineering Mechanics: Statics, ch. 3 and 7 — common practice.
 */

interface Setup {
  cell: InversorCell
  r: number
  e: number
  model: LinkageModel
}

const setup = (cell: InversorCell, r: number, e: number): Setup => ({ cell, r, e, model: buildModel(linkageOf(cell, e, r)) })
// Built inside each test (not while collecting), so mutation testing sees which tests cover the cells.
const SETUPS = {
  PEAU: () => setup(peaucellierCell({ arm: 150, side: 60 }), 60, 60),
  PEAU_ARC: () => setup(peaucellierCell({ arm: 150, side: 60 }), 60, 52),
  HART: () => setup(hartCell({ long: 240, short: 100, ratio: 0.4 }), 40, 40),
}

function solve(s: Setup, deg: number, loads: CaseLoads[]) {
  const joints = placeAt(s.cell, s.e, s.r, (deg * Math.PI) / 180)!
  const pts = pointsFromJoints(s.model, joints)
  const out = solveStatics(s.model, pts, loads)
  if (!out.ok) throw new Error('singular')
  return { joints, pts, out }
}

const cross = (ax: number, ay: number, bx: number, by: number) => ax * by - ay * bx

/** Whole-mechanism balance: reactions + loads + weights, and moments about O with the drive couple. */
function wholeBody(s: Setup, joints: Record<string, { x: number; y: number }>, lc: CaseLoads, st: CaseStatics) {
  const R = groundReactions(s.model, st)
  let fx = R.O.x + R.C.x
  let fy = R.O.y + R.C.y
  let m = st.torque + cross(joints.C.x, joints.C.y, R.C.x, R.C.y) + cross(joints.O.x, joints.O.y, R.O.x, R.O.y)
  for (const p of lc.pointLoads) {
    fx += p.force.x
    fy += p.force.y
    m += cross(joints[p.joint].x, joints[p.joint].y, p.force.x, p.force.y)
  }
  if (lc.weightPerMm) {
    for (const l of s.model.links) {
      const a = joints[l.points[0]]
      const b = joints[l.points[l.points.length - 1]]
      const W = { x: lc.weightPerMm.x * linkLength(l), y: lc.weightPerMm.y * linkLength(l) }
      fx += W.x
      fy += W.y
      m += cross((a.x + b.x) / 2, (a.y + b.y) / 2, W.x, W.y)
    }
  }
  return { fx, fy, m }
}

describe('self-weight with a horizontal component', () => {
  // A mechanism in a tilted vertical plane: the weight per mm has both components, here
  // (0.004, −0.0065) N/mm, plus a load at the tracer.
  const weight: CaseLoads = { name: 'w', pointLoads: [{ joint: 'T', force: { x: 12, y: -40 } }], weightPerMm: { x: 0.004, y: -0.0065 } }
  const sideOnly: CaseLoads = { name: 'wx', pointLoads: [], weightPerMm: { x: 0.004, y: 0 } }
  for (const [name, which, angles] of [
    ['Peaucellier', 'PEAU', [-60, -20, 0, 35, 70]],
    ['Peaucellier, arc', 'PEAU_ARC', [-40, 10, 40]],
    ['Hart', 'HART', [-70, -10, 25, 80]],
  ] as const) {
    it(`${name}: the whole mechanism is in balance and the torque equals virtual work`, () => {
      const s = SETUPS[which]()
      for (const deg of angles) {
        for (const lc of [weight, sideOnly]) {
          const { joints, pts, out } = solve(s, deg, [lc])
          const st = out.cases[0]
          const g = wholeBody(s, joints, lc, st)
          expect(Math.abs(g.fx)).toBeLessThan(1e-9)
          expect(Math.abs(g.fy)).toBeLessThan(1e-9)
          expect(Math.abs(g.m)).toBeLessThan(1e-6)
          expect(equilibriumResidual(s.model, pts, lc, st)).toBeLessThan(1e-9)
          const th = (deg * Math.PI) / 180
          const vw = virtualWorkTorque(s.model, placeAt(s.cell, s.e, s.r, th - VW_STEP)!, placeAt(s.cell, s.e, s.r, th + VW_STEP)!, lc)
          expect(Math.abs(vw.torque - st.torque)).toBeLessThan(1e-6 * Math.max(1, vw.scale))
        }
      }
    })
  }
  it('a horizontal weight alone needs a drive torque (it is not lost)', () => {
    const PEAU = SETUPS.PEAU()
    const { out } = solve(PEAU, 35, [sideOnly])
    expect(Math.abs(out.cases[0].torque)).toBeGreaterThan(1e-3)
  })
})

describe('solveStatics', () => {
  const unit: CaseLoads = { name: 'u', pointLoads: [{ joint: 'T', force: { x: 0, y: 1 } }], weightPerMm: null }
  it('is linear in the loads, also below the range where squared forces underflow', () => {
    const PEAU = SETUPS.PEAU()
    const big = solveStatics(PEAU.model, pointsFromJoints(PEAU.model, placeAt(PEAU.cell, 60, 60, 0.4)!), [unit])
    const tiny = solveStatics(PEAU.model, pointsFromJoints(PEAU.model, placeAt(PEAU.cell, 60, 60, 0.4)!), [
      { name: 't', pointLoads: [{ joint: 'T', force: { x: 0, y: 1e-160 } }], weightPerMm: null },
    ])
    if (!big.ok || !tiny.ok) throw new Error('singular')
    expect(big.largestConnection[0]).toBeGreaterThan(1)
    expect(tiny.largestConnection[0] / 1e-160).toBeCloseTo(big.largestConnection[0], 9)
    expect(tiny.cases[0].torque / 1e-160).toBeCloseTo(big.cases[0].torque, 9)
  })
  it('without loads every force is zero', () => {
    const HART = SETUPS.HART()
    const out = solveStatics(HART.model, pointsFromJoints(HART.model, placeAt(HART.cell, 40, 40, 0.3)!), [{ name: '0', pointLoads: [], weightPerMm: null }])
    if (!out.ok) throw new Error('singular')
    expect(out.largestConnection).toEqual([0])
    expect(out.cases[0].torque).toBe(0)
    expect(Array.from(out.cases[0].endForces).every((x) => x === 0)).toBe(true)
  })
  it('a load at a ground joint goes straight to the ground', () => {
    const PEAU = SETUPS.PEAU()
    const at = pointsFromJoints(PEAU.model, placeAt(PEAU.cell, 60, 60, 0.4)!)
    const lc: CaseLoads = { name: 'o', pointLoads: [{ joint: 'O', force: { x: 5, y: 7 } }], weightPerMm: null }
    const out = solveStatics(PEAU.model, at, [lc])
    if (!out.ok) throw new Error('singular')
    expect(out.largestConnection[0]).toBe(0)
    expect(out.cases[0].torque).toBe(0)
    expect(Array.from(out.cases[0].endForces).every((x) => x === 0)).toBe(true)
    expect(equilibriumResidual(PEAU.model, at, lc, out.cases[0])).toBe(0)
  })
  it('a load at any moving joint is carried: whole-body balance and virtual work (A is on the first link)', () => {
    for (const [which, joints] of [
      ['PEAU', ['A', 'B', 'P', 'T']],
      ['HART', ['A', 'B', 'D', 'E', 'P', 'T']],
    ] as const) {
      const s = SETUPS[which]()
      for (const joint of joints) {
        const lc: CaseLoads = { name: joint, pointLoads: [{ joint, force: { x: 3, y: -11 } }], weightPerMm: null }
        const deg = 25
        const { joints: at, pts, out } = solve(s, deg, [lc])
        const g = wholeBody(s, at, lc, out.cases[0])
        expect(Math.abs(g.fx) + Math.abs(g.fy), `${which} ${joint}`).toBeLessThan(1e-9)
        expect(Math.abs(g.m), `${which} ${joint}`).toBeLessThan(1e-7)
        expect(equilibriumResidual(s.model, pts, lc, out.cases[0])).toBeLessThan(1e-9)
        const th = (deg * Math.PI) / 180
        const vw = virtualWorkTorque(s.model, placeAt(s.cell, s.e, s.r, th - VW_STEP)!, placeAt(s.cell, s.e, s.r, th + VW_STEP)!, lc)
        expect(vw.scale, `${which} ${joint} moves`).toBeGreaterThan(1)
        expect(Math.abs(vw.torque - out.cases[0].torque)).toBeLessThan(1e-6 * vw.scale)
      }
    }
  })
  it('details only the first `detailed` cases, and a workspace must hold every case', () => {
    const PEAU = SETUPS.PEAU()
    const at = pointsFromJoints(PEAU.model, placeAt(PEAU.cell, 60, 60, 0.4)!)
    const out = solveStatics(PEAU.model, at, [unit, unit, unit], 1)
    if (!out.ok) throw new Error('singular')
    expect(out.cases).toHaveLength(1)
    expect(out.largestConnection).toHaveLength(3)
    expect(() => solveStatics(PEAU.model, at, [unit], 1, staticsWorkspace(PEAU.model, 2))).toThrow('statics workspace holds 2 load cases, not 1')
  })
  it('reports a singular position (the rhombus flat at the toggle)', () => {
    const PEAU = SETUPS.PEAU()
    // At the crank limit |OP| = l − s the rhombus lies flat along O→P: no equilibrium solution.
    const lim = 2 * Math.acos(90 / 120)
    const out = solveStatics(PEAU.model, pointsFromJoints(PEAU.model, placeAt(PEAU.cell, 60, 60, lim)!), [unit])
    expect(out.ok).toBe(false)
  })
})

describe('equilibriumResidual reports a broken equilibrium', () => {
  // A check that cannot fail is not a check: solve, then change one reported
  // force, the drive torque or the weight by δ and the residual must show |δ|.
  const cells = fc.constantFrom('PEAU' as const, 'PEAU_ARC' as const, 'HART' as const)
  const signed = fc.double({ min: 1e-3, max: 1e3, noNaN: true }).chain((m) => fc.constantFrom(m, -m))
  const loads = fc.record({
    fx: fc.double({ min: -200, max: 200, noNaN: true }),
    fy: fc.double({ min: -200, max: 200, noNaN: true }),
    wx: fc.double({ min: -0.01, max: 0.01, noNaN: true }),
    wy: fc.double({ min: -0.01, max: 0.01, noNaN: true }),
  })

  it('a solved state balances; a perturbed force, torque or weight does not', () => {
    fc.assert(
      fc.property(cells, fc.double({ min: -0.9, max: 0.9, noNaN: true }), loads, signed, fc.nat(), fc.constantFrom('force', 'torque', 'weight-x', 'weight-y'), (which, frac, l, delta, pick, what) => {
        const s = SETUPS[which]()
        const limit = which === 'HART' ? 80 : which === 'PEAU' ? 77 : 45
        const lc: CaseLoads = { name: 'p', pointLoads: [{ joint: 'T', force: { x: l.fx, y: l.fy } }], weightPerMm: { x: l.wx, y: l.wy } }
        const { pts, out } = solve(s, frac * limit, [lc])
        const st = out.cases[0]
        const scale = 1 + Math.hypot(l.fx, l.fy) * out.largestConnection[0]
        const r0 = equilibriumResidual(s.model, pts, lc, st)
        expect(r0).toBeLessThan(1e-9 * scale)
        const tol = 1e-9 * scale
        if (what === 'force') {
          const f = Float64Array.from(st.endForces)
          const i = pick % f.length
          f[i] += delta
          const r = equilibriumResidual(s.model, pts, lc, { endForces: f, torque: st.torque })
          // the body's force sum is off by δ; its moment by δ times the lever from its first point
          const b = s.model.offset.findLastIndex((o) => 2 * o <= i)
          const o = 2 * s.model.offset[b]
          const lever = i % 2 === 0 ? -(pts[i + 1] - pts[o + 1]) : pts[i - 1] - pts[o]
          const expected = Math.max(Math.abs(delta), (Math.abs(lever) * Math.abs(delta)) / s.model.lc)
          expect(Math.abs(r - expected)).toBeLessThanOrEqual(tol + 1e-12 * expected)
        } else if (what === 'torque') {
          const r = equilibriumResidual(s.model, pts, lc, { endForces: st.endForces, torque: st.torque + delta })
          expect(Math.abs(r - Math.abs(delta) / s.model.lc)).toBeLessThanOrEqual(tol + 1e-12 * Math.abs(delta))
        } else {
          // weight per mm off by δw = δ·1e-5 N/mm: body b's force sum is off by δw·L_b, its moment
          // about its first point by δw·L_b times the lever of its mid-length
          const dw = delta * 1e-5
          const w = what === 'weight-x' ? { x: l.wx + dw, y: l.wy } : { x: l.wx, y: l.wy + dw }
          const r = equilibriumResidual(s.model, pts, { ...lc, weightPerMm: w }, st)
          const expected = Math.max(
            ...s.model.links.map((link, b) => {
              const o = 2 * s.model.offset[b]
              const e = o + 2 * (link.points.length - 1)
              const lever = what === 'weight-x' ? -(pts[e + 1] - pts[o + 1]) / 2 : (pts[e] - pts[o]) / 2
              const W = Math.abs(dw) * linkLength(link)
              return Math.max(W, (Math.abs(lever) * W) / s.model.lc)
            }),
          )
          expect(Math.abs(r - expected)).toBeLessThanOrEqual(tol + 1e-9 * expected)
        }
      }),
      { numRuns: 300 },
    )
  })
})
