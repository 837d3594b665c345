import { describe, expect, it } from 'vitest'
import { placeAt } from '@/lib/linkage/crank'
import { DEG } from '@/lib/linkage/vec'
import { deviationFor, prepareTolerance, scratchFor, solvePositions } from '@/lib/tolerance'
import { HART, only, PEAUCELLIER, RANGE } from './fixtures'

describe('perturbed kinematics by dyads', () => {
  it.each([
    ['peaucellier', PEAUCELLIER],
    ['hart', HART],
  ] as const)('%s: with nothing perturbed it reproduces the closed-form positions (Coxeter §6.1 via lib/linkage)', (_, model) => {
    const setup = prepareTolerance({ model, workingRange: RANGE })
    const lk = setup.linkage
    const n = lk.anglesDeg.length
    const xs = new Float64Array(n)
    const ys = new Float64Array(n)
    expect(solvePositions(lk, setup.effects, new Float64Array(setup.items.length), scratchFor(lk), xs, ys)).toBe(true)
    for (let p = 0; p < n; p++) {
      const T = placeAt(model.cell, model.offset, model.crank, lk.anglesDeg[p] * DEG)!.T
      expect(Math.hypot(xs[p] - T.x, ys[p] - T.y)).toBeLessThan(1e-9)
    }
  })

  it.each([
    ['peaucellier', PEAUCELLIER],
    ['hart', HART],
  ] as const)('%s: zero tolerances and zero clearance give the ideal straight line (inversion: Peaucellier 1864; Kempe 1877 for Hart)', (_, model) => {
    const setup = only(model, {})
    expect(deviationFor(setup, new Float64Array(setup.items.length))).toBeLessThan(1e-9)
  })

  it('Peaucellier: all four rhombus sides longer by the same δ is still an exact inversor, so still straight (k′ = l² − (s + δ)²)', () => {
    const setup = prepareTolerance({ model: PEAUCELLIER, workingRange: RANGE })
    const v = new Float64Array(setup.items.length)
    for (const id of ['AP', 'BP', 'AT', 'BT']) v[setup.items.findIndex((i) => i.id === id)] = 0.4
    expect(deviationFor(setup, v)).toBeLessThan(1e-9)
    // One side alone breaks the rhombus: the path is no longer straight.
    const w = new Float64Array(setup.items.length)
    w[setup.items.findIndex((i) => i.id === 'AP')] = 0.4
    expect(deviationFor(setup, w)).toBeGreaterThan(1e-3)
  })

  it.each([
    ['peaucellier', PEAUCELLIER],
    ['hart', HART],
  ] as const)('%s: a longer crank or frame puts the tracer on the image circle of the closed form with r + δ or e + δ (Coxeter §6.1)', (_, model) => {
    const setup = prepareTolerance({ model, workingRange: RANGE })
    const lk = setup.linkage
    const n = lk.anglesDeg.length
    const xs = new Float64Array(n)
    const ys = new Float64Array(n)
    const d = 0.7
    for (const [id, e, r] of [
      ['CP', model.offset, model.crank + d],
      ['frame:OC', model.offset + d, model.crank],
    ] as const) {
      const v = new Float64Array(setup.items.length)
      v[setup.items.findIndex((i) => i.id === id)] = d
      expect(solvePositions(lk, setup.effects, v, scratchFor(lk), xs, ys)).toBe(true)
      for (let p = 0; p < n; p++) {
        const T = placeAt(model.cell, e, r, lk.anglesDeg[p] * DEG)!.T
        expect(Math.hypot(xs[p] - T.x, ys[p] - T.y)).toBeLessThan(1e-9)
      }
    }
  })

  it('every perturbed link keeps its perturbed lengths in the solved position (geometry)', () => {
    const setup = prepareTolerance({ model: HART, workingRange: RANGE, clearances: { A: 0.2, D: 0.1 } })
    const lk = setup.linkage
    const n = lk.anglesDeg.length
    const v = Float64Array.from(setup.items, (it, i) => (it.plusMinus || 0.1) * (i % 2 ? 1 : -1))
    const s = scratchFor(lk)
    expect(solvePositions(lk, setup.effects, v, s, new Float64Array(n), new Float64Array(n))).toBe(true)
    // s.world holds the last position; each body's local points, moved as the items say, must fit it rigidly.
    const local = Float64Array.from(lk.baseLocal)
    setup.effects.forEach((ef, i) => {
      if (ef.mode === 'axial') local[2 * ef.point] += v[i]
    })
    for (const b of lk.bodies) {
      for (let i = 0; i < b.points.length; i++) {
        for (let k = i + 1; k < b.points.length; k++) {
          const ji = lk.joints.indexOf(b.points[i])
          const jk = lk.joints.indexOf(b.points[k])
          const world = Math.hypot(s.world[2 * jk] - s.world[2 * ji], s.world[2 * jk + 1] - s.world[2 * ji + 1])
          const qi = b.first + i
          const qk = b.first + k
          const design = Math.hypot(local[2 * qk] - local[2 * qi], local[2 * qk + 1] - local[2 * qi + 1])
          expect(Math.abs(world - design)).toBeLessThan(1e-9)
        }
      }
    }
  })

  it('refuses unknown dimension and pin names, naming the field', () => {
    expect(() => prepareTolerance({ model: PEAUCELLIER, workingRange: RANGE, tolerances: { XY: 0.1 } })).toThrow(/no dimension "XY"/)
    expect(() => prepareTolerance({ model: PEAUCELLIER, workingRange: RANGE, clearances: { D: 0.1 } })).toThrow(/no pin or eye "D"/)
    expect(() => prepareTolerance({ model: PEAUCELLIER, workingRange: { crankMinDeg: -170, crankMaxDeg: 170 } })).toThrow(/outside the reach/)
  })
})
