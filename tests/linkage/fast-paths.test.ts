import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import { peaucellierCell } from '@/lib/linkage/cells/peaucellier'
import { hartCell } from '@/lib/linkage/cells/hart'
import type { InversorCell } from '@/lib/linkage/cells/cell'
import { linkageOf, placeAt } from '@/lib/linkage/crank'
import { buildModel, pointsFromJoints } from '@/lib/linkage/model'
import { solveStatics, staticsWorkspace, type CaseLoads } from '@/lib/linkage/statics'
import { equilibriumMatrix, equilibriumPattern } from '@/lib/linkage/equations'
import { solveInPlace, solveScratch } from '@/lib/linkage/dense'
import { pinForces } from '@/lib/linkage/members'
import { mag } from '@/lib/linkage/vec'

/*
 * The sweep's fast paths (reused workspaces, the matrix pattern) must give
 * the very numbers of the straightforward code, bit for bit: several reported
 * checks are rounding-level quantities, where any change in the arithmetic
 * would show. Lengths are taken by mag, which stands for Math.hypot.
 */

const LOADS: CaseLoads[] = [
  { name: 'a', pointLoads: [{ joint: 'T', force: { x: 12.5, y: -80 } }], weightPerMm: { x: 0, y: -0.004 } },
  { name: 'px', pointLoads: [{ joint: 'T', force: { x: 1, y: 0 } }], weightPerMm: null },
  { name: 'py', pointLoads: [{ joint: 'T', force: { x: 0, y: 1 } }], weightPerMm: null },
]

function positions(cell: InversorCell, r: number, e: number, from: number, to: number, n: number): Record<string, { x: number; y: number }>[] {
  const out = []
  for (let i = 0; i < n; i++) {
    const j = placeAt(cell, e, r, ((from + ((to - from) * i) / (n - 1)) * Math.PI) / 180)
    if (j) out.push(j)
  }
  return out
}

// Cells are built inside each test (not while collecting), so mutation testing sees which tests cover them.
const CELLS: [string, () => InversorCell, number, number][] = [
  ['Peaucellier', () => peaucellierCell({ arm: 150, side: 60 }), 60, 60],
  ['Peaucellier, arc', () => peaucellierCell({ arm: 150, side: 60 }), 60, 52],
  ['Hart', () => hartCell({ long: 240, short: 100, ratio: 0.4 }), 40, 40],
]

describe('statics with a reused workspace', () => {
  for (const [name, newCell, r, e] of CELLS) {
    it(`${name}: equals a fresh solve at every position, including the symmetric one`, () => {
      const cell = newCell()
      const model = buildModel(linkageOf(cell, e, r))
      const ws = staticsWorkspace(model, LOADS.length)
      const pts = new Float64Array(2 * model.pointCount)
      // 0° is in the list: mirror-image positions give exact ties in pivot and force ranking.
      for (const joints of [...positions(cell, r, e, -80, 80, 33), placeAt(cell, e, r, 0)!]) {
        const fresh = solveStatics(model, pointsFromJoints(model, joints), LOADS)
        const reused = solveStatics(model, pointsFromJoints(model, joints, pts), LOADS, LOADS.length, ws)
        expect(reused.ok).toBe(fresh.ok)
        if (!fresh.ok || !reused.ok) continue
        expect(reused.minPivot).toBe(fresh.minPivot)
        expect(reused.largestConnection).toEqual(fresh.largestConnection)
        fresh.cases.forEach((c, i) => {
          expect(Array.from(reused.cases[i].endForces)).toEqual(Array.from(c.endForces))
          expect(reused.cases[i].torque).toBe(c.torque)
          expect(pinForces(model, reused.cases[i])).toEqual(pinForces(model, c))
        })
      }
    })
  }

  it('solveInPlace with the equilibrium pattern equals the full scan', () => {
    const [, newCell, r, e] = CELLS[2]
    const cell = newCell()
    const model = buildModel(linkageOf(cell, e, r))
    const n = model.size
    const scratch = solveScratch(n, equilibriumPattern(model))
    for (const joints of positions(cell, r, e, -85, 85, 21)) {
      const a = equilibriumMatrix(model, pointsFromJoints(model, joints))
      const b = Float64Array.from({ length: n }, (_, i) => Math.sin(i + 1))
      const a2 = a.slice()
      const b2 = b.slice()
      const plain = solveInPlace(a, n, [b])
      const fast = solveInPlace(a2, n, [b2], undefined, scratch)
      expect(fast).toEqual(plain)
      expect(Array.from(b2)).toEqual(Array.from(b))
    }
  })
})

describe('mag', () => {
  it('is Math.hypot within an ulp or two, over every magnitude a double holds', () => {
    // √(x² + y²) rounds twice (the sum, then the root): at most about 1.5 ulp from the exact length,
    // which Math.hypot returns correctly rounded (IEEE 754 error analysis, common practice).
    const component = fc.oneof(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true }))
    fc.assert(
      fc.property(component, component, (x, y) => {
        const h = Math.hypot(x, y)
        const m = mag(x, y)
        if (h === 0 || !Number.isFinite(h)) expect(m).toBe(h)
        else expect(Math.abs(m - h) / h).toBeLessThanOrEqual(2 * Number.EPSILON)
      }),
      { numRuns: 5000 },
    )
  })
})
