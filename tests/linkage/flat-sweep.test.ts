import { describe, it, expect } from 'vitest'
import { peaucellierCell } from '@/lib/linkage/cells/peaucellier'
import { hartCell } from '@/lib/linkage/cells/hart'
import type { InversorCell } from '@/lib/linkage/cells/cell'
import { runSweep, sampleObjects, sweepArrays, type SweepInput } from '@/lib/linkage/sweep'
import { envelopeOf, envelopeOfArrays } from '@/lib/linkage/envelope'
import { referenceSweep } from './_reference-sweep'

/*
 * The sweep now computes in flat typed arrays and builds its objects at the end. It must give the
 * very numbers, keys and key order of the object-per-position sweep it replaced (referenceSweep, the
 * per-position public functions called one position at a time), bit for bit: several reported
 * checks are rounding-level quantities, where any change in the arithmetic would show.
 */

const angles = (from: number, to: number, n: number) => Array.from({ length: n }, (_, i) => from + ((to - from) * i) / (n - 1))

const LOADS = [
  { name: 'push', fx: 12.5, fy: -80 },
  { name: 'Jam at end', fx: 120, fy: -420 },
]

// Cells are built inside each test (not while collecting), so mutation testing sees which tests cover them.
const CASES: [string, () => InversorCell, number, number, number[]][] = [
  // Past the crank limit (≈ ±75°) positions are unreachable; 0° gives mirror-image ties.
  ['Peaucellier, straight', () => peaucellierCell({ arm: 150, side: 60 }), 60, 60, [...angles(-95, 95, 77), 0]],
  ['Peaucellier, arc', () => peaucellierCell({ arm: 150, side: 60 }), 60, 52, angles(-80, 80, 41)],
  ['Hart', () => hartCell({ long: 240, short: 100, ratio: 0.4 }), 40, 40, [...angles(-60, 60, 61), 0]],
  ['Hart, arc', () => hartCell({ long: 240, short: 100, ratio: 0.3 }), 40, 46, angles(-50, 50, 33)],
  ['Peaucellier, infeasible', () => peaucellierCell({ arm: 60, side: 150 }), 60, 60, angles(-30, 30, 5)],
]

function compare(input: SweepInput): void {
  const fast = runSweep(input)
  const ref = referenceSweep(input)
  expect(fast.toggles).toEqual(ref.toggles)
  expect(fast.cases.map((c) => c.samples.length)).toEqual(ref.cases.map((c) => c.samples.length))
  // toEqual tells 0 from −0 and compares NaN as equal; the JSON adds the key order.
  expect(fast).toEqual(ref)
  expect(JSON.stringify(fast.cases)).toBe(JSON.stringify(ref.cases))
  // What analyse() reads: the envelopes straight from the arrays, and the samples without members.
  const flat = sweepArrays(input)
  flat.cases.forEach((c, i) => {
    const env = envelopeOfArrays(flat, c, `slug-${i}`)
    const refEnv = envelopeOf(ref.model, ref.cases[i].name, ref.cases[i].samples, `slug-${i}`)
    expect(env).toEqual(refEnv)
    expect(JSON.stringify(env)).toBe(JSON.stringify(refEnv))
  })
  const lean = sampleObjects(flat, false)
  expect(lean.toggles).toEqual(ref.toggles)
  lean.cases.forEach((c, i) => expect(c.samples).toEqual(ref.cases[i].samples.map(({ members: _, ...rest }) => rest)))
}

describe('flat sweep against the object-per-position sweep', () => {
  for (const [name, newCell, r, e, anglesDeg] of CASES) {
    it(`${name}: every sample, toggle and key the same`, () => {
      const cell = newCell()
      compare({ cell, crank: r, offset: e, anglesDeg, loads: LOADS, weightPerMm: null, amplificationLimit: 100 })
    })
    it(`${name}, with self-weight and a low amplification limit: the same`, () => {
      const cell = newCell()
      compare({ cell, crank: r, offset: e, anglesDeg, loads: LOADS, weightPerMm: { x: 0.0003, y: -0.004 }, amplificationLimit: 3 })
    })
  }
})
