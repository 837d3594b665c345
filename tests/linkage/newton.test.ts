import { describe, it, expect } from 'vitest'
import { hartCell } from '@/lib/linkage/cells/hart'
import { peaucellierCell } from '@/lib/linkage/cells/peaucellier'
import type { InversorCell } from '@/lib/linkage/cells/cell'
import { linkageOf, placeAt } from '@/lib/linkage/crank'
import { buildModel } from '@/lib/linkage/model'
import { jointsFromPoses, posesFromJoints, solvePositionNewton } from '@/lib/linkage/newton'

/*
 * Independent method: the generic Newton–Raphson loop-closure solver knows only
 * the links, pins and the crank angle. It must land on the cells' closed forms.
 */
function holdAgainstClosedForm(cell: InversorCell, r: number, e: number, anglesDeg: number[]): void {
  const model = buildModel(linkageOf(cell, e, r))
  const start = placeAt(cell, e, r, (anglesDeg[0] * Math.PI) / 180)!
  // Start off the solution on purpose, then follow the sweep by continuation.
  for (const j of Object.keys(start)) if (j !== 'O' && j !== 'C') start[j] = { x: start[j].x + 1.5, y: start[j].y - 2 }
  let guess = posesFromJoints(model, start)
  for (const deg of anglesDeg) {
    const res = solvePositionNewton(model, (deg * Math.PI) / 180, guess)
    expect(res.ok).toBe(true)
    const solved = jointsFromPoses(model, res.poses)
    const closed = placeAt(cell, e, r, (deg * Math.PI) / 180)!
    for (const j of Object.keys(closed)) {
      expect(Math.abs(solved[j].x - closed[j].x)).toBeLessThan(1e-9)
      expect(Math.abs(solved[j].y - closed[j].y)).toBeLessThan(1e-9)
    }
    guess = res.poses
  }
}

const sweep = (from: number, to: number, n: number) => Array.from({ length: n }, (_, i) => from + ((to - from) * i) / (n - 1))

describe('generic Newton–Raphson loop closure against the closed forms', () => {
  it('Peaucellier–Lipkin, straight-line crank', () => holdAgainstClosedForm(peaucellierCell({ arm: 150, side: 60 }), 60, 60, sweep(-70, 70, 29)))
  it('Peaucellier–Lipkin, offset crank (arc)', () => holdAgainstClosedForm(peaucellierCell({ arm: 150, side: 60 }), 60, 52, sweep(-50, 50, 21)))
  it("Hart's inversor, straight-line crank", () => holdAgainstClosedForm(hartCell({ long: 240, short: 100, ratio: 0.4 }), 40, 40, sweep(-80, 80, 33)))
  it("Hart's inversor, μ = 0.5 through the position where P meets T", () => holdAgainstClosedForm(hartCell({ long: 200, short: 90, ratio: 0.5 }), 50, 50, sweep(-60, 60, 25)))

  it('reports failure instead of NaN at a toggle (singular Jacobian)', () => {
    const cell = peaucellierCell({ arm: 150, side: 60 })
    const model = buildModel(linkageOf(cell, 60, 60))
    const limit = 2 * Math.acos(90 / 120)
    const guess = posesFromJoints(model, placeAt(cell, 60, 60, limit - 0.05)!)
    const res = solvePositionNewton(model, limit + 0.2, guess)
    expect(res.ok).toBe(false)
    expect(Number.isNaN(res.residual)).toBe(false)
  })
})
