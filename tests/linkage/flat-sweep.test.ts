import { describe, it, expect } from 'vitest'
import { peaucellierCell } from '@/lib/linkage/cells/peaucellier'
import { hartCell } from '@/lib/linkage/cells/hart'
import type { InversorCell } from '@/lib/linkage/cells/cell'
import { runSweep, sampleObjects, sweepArrays, type SweepInput } from '@/lib/linkage/sweep'
import { envelopeOf, envelopeOfArrays } from '@/lib/linkage/envelope'
import { maskScratch, recordPivots, solveInPlace, solveMasked, solvePlan, solvePlanned, solveScratch } from '@/lib/linkage/dense'
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

describe('solveMasked against solveInPlace', () => {
  // A seeded generator (mulberry32, common practice) so a failure can be replayed.
  const rng = (seed: number) => () => {
    seed = (seed + 0x6d2b79f5) | 0
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed)
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }

  it('same outcome, pivots and solution bits on sparse matrices with ties, exact zeros and singular ones', () => {
    const next = rng(12)
    for (let trial = 0; trial < 400; trial++) {
      const n = 2 + Math.floor(next() * 29)
      const nnz = Math.floor(n * (1.5 + next() * 2))
      const at = new Set<number>()
      for (let i = 0; i < n; i++) at.add(i * n + Math.floor(next() * n))
      while (at.size < Math.min(nnz, n * n)) at.add(Math.floor(next() * n * n))
      const pattern = Int32Array.from([...at].sort((x, y) => x - y))
      const a = new Float64Array(n * n)
      // Small integers give exact ties between candidate pivots; some pattern entries are exactly 0.
      for (const p of pattern) a[p] = next() < 0.1 ? 0 : next() < 0.5 ? Math.round(next() * 6 - 3) : next() * 2 - 1
      const rhs = () => [0, 1, 2].map(() => Float64Array.from({ length: n }, () => next() - 0.5))
      const b1 = rhs()
      const b2 = b1.map((b) => b.slice())
      const a1 = a.slice()
      const a2 = a.slice()
      const ref = solveInPlace(a1, n, b1, 1e-11, solveScratch(n, pattern))
      const got = solveMasked(a2, n, b2, maskScratch(n, pattern))
      expect(got).toEqual(ref)
      if (ref.ok) b1.forEach((b, q) => expect(Array.from(b2[q])).toEqual(Array.from(b)))
    }
  })

  it('solvePlanned replays solveMasked bit for bit, and declines a pivot sequence it has not recorded', () => {
    const next = rng(34)
    let replayed = 0
    let declined = 0
    for (let trial = 0; trial < 300; trial++) {
      const n = 2 + Math.floor(next() * 29)
      const at = new Set<number>()
      for (let i = 0; i < n; i++) at.add(i * n + Math.floor(next() * n))
      while (at.size < Math.min(Math.floor(n * (1.5 + next() * 2)), n * n)) at.add(Math.floor(next() * n * n))
      const pattern = Int32Array.from([...at].sort((x, y) => x - y))
      const plan = solvePlan(n, pattern)
      const pivots = new Int32Array(n)
      // Several matrices of one pattern: ties and exact zeros now and then, so pivot sequences repeat and differ.
      for (let m = 0; m < 6; m++) {
        const a = new Float64Array(n * n)
        for (const p of pattern) a[p] = next() < 0.1 ? 0 : next() < 0.5 ? Math.round(next() * 6 - 3) : next() * 2 - 1
        const b = [0, 1].map(() => Float64Array.from({ length: n }, () => next() - 0.5))
        const ref = b.map((x) => x.slice())
        const refOut = solveMasked(a.slice(), n, ref, maskScratch(n, pattern), undefined, pivots)
        const mine = b.map((x) => x.slice())
        const out = solvePlanned(plan, a.slice(), mine)
        if (out === null) {
          declined++
          if (refOut.ok) recordPivots(plan, pivots)
          continue
        }
        replayed++
        expect(out).toEqual(refOut)
        if (refOut.ok) ref.forEach((x, q) => expect(Array.from(mine[q])).toEqual(Array.from(x)))
      }
    }
    // Both paths are exercised.
    expect(replayed).toBeGreaterThan(100)
    expect(declined).toBeGreaterThan(100)
  })
})
