import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import { runMechanism, type MechanismInput } from '@/lib/calc/mechanism'
import { buildModel } from '@/lib/linkage/model'
import { linkageOf } from '@/lib/linkage/crank'
import { peaucellierCell } from '@/lib/linkage/cells/peaucellier'
import { hartCell } from '@/lib/linkage/cells/hart'
import { linkLengthError } from '@/lib/linkage/kinematic-checks'
import type { MechanismResult } from '@/lib/contract'

/** Every number anywhere in the result, so a NaN or Infinity cannot hide in a nested key. */
function numbers(x: unknown, out: number[] = []): number[] {
  if (typeof x === 'number') out.push(x)
  else if (Array.isArray(x)) for (const v of x) numbers(v, out)
  else if (x && typeof x === 'object') for (const v of Object.values(x)) numbers(v, out)
  return out
}

const step = (r: MechanismResult, id: string) => r.steps.find((s) => s.id === id)

function checkFeasible(input: MechanismInput, res: MechanismResult, lines: boolean): void {
  expect(res.feasibility.ok).toBe(true)
  expect(numbers(res).every(Number.isFinite)).toBe(true)
  const cell = input.mechanism === 'peaucellier' ? peaucellierCell(input.geometry) : hartCell(input.geometry)
  const model = buildModel(linkageOf(cell, input.geometry.crankPivotOffset ?? input.geometry.crank, input.geometry.crank))
  for (const p of res.positions) {
    expect(linkLengthError(model, p.joints)).toBeLessThan(1e-9)
    if (lines) expect(Math.abs(p.tracer.x - res.lineOffset)).toBeLessThan(1e-9 * res.lineOffset)
  }
  // Equilibrium residual and virtual work at every solved position (verification steps).
  expect(step(res, 'ver.equilibrium.f')?.verdict).toBe('pass')
  expect(Number(step(res, 'ver.equilibrium.f')?.value)).toBeLessThan(1e-9)
  expect(Number(step(res, 'ver.virtual-work.f')?.value)).toBeLessThan(1e-6)
}

// Rounded to 0.001 N: denormal loads like 5e-324 N would make any relative residual meaningless.
const force = fc.double({ min: -500, max: 500, noNaN: true }).map((x) => Math.round(x * 1000) / 1000)
const load = fc.record({ fx: force, fy: force })

describe('property tests over random feasible geometries', () => {
  it('Peaucellier–Lipkin: lengths kept, tracer on the line, equilibrium and virtual work hold', () => {
    fc.assert(
      fc.property(fc.double({ min: 10, max: 300, noNaN: true }), fc.double({ min: 0.1, max: 2, noNaN: true }), fc.double({ min: 0.05, max: 0.95, noNaN: true }), load, (s, a, t, f) => {
        const l = s * (1 + a)
        const root = Math.sqrt(l * l - s * s)
        const r = (l - s + t * (root - (l - s))) / 2
        const input: MechanismInput = { mechanism: 'peaucellier', geometry: { arm: l, side: s, crank: r }, loads: [{ name: 'f', ...f }], toggleMarginDeg: 2, amplificationLimit: 1e6, sweep: undefined }
        const res = runMechanism(input)
        checkFeasible(input, res, true)
      }),
      { numRuns: 60 },
    )
  })

  it("Hart's inversor: lengths kept, tracer on the line, equilibrium and virtual work hold", () => {
    fc.assert(
      fc.property(fc.double({ min: 10, max: 300, noNaN: true }), fc.double({ min: 0.1, max: 3, noNaN: true }), fc.double({ min: 0.1, max: 0.9, noNaN: true }), fc.double({ min: 0.05, max: 0.95, noNaN: true }), load, (b, a0, mu, t, f) => {
        const a = b * (1 + a0)
        const r = (mu * (a - b) + t * 2 * mu * b) / 2
        const input: MechanismInput = { mechanism: 'hart', geometry: { long: a, short: b, ratio: mu, crank: r }, loads: [{ name: 'f', ...f }], toggleMarginDeg: 2, amplificationLimit: 1e6 }
        const res = runMechanism(input)
        checkFeasible(input, res, true)
      }),
      { numRuns: 60 },
    )
  })

  it('random infeasible inputs give an infeasible verdict, never NaN or Infinity', () => {
    const pos = fc.double({ min: 0.01, max: 1000, noNaN: true })
    fc.assert(
      fc.property(pos, pos, pos, fc.option(fc.double({ min: 0, max: 1000, noNaN: true }), { nil: undefined }), fc.double({ min: 0.01, max: 0.99, noNaN: true }), fc.boolean(), (x, y, r, e, mu, peau) => {
        const input: MechanismInput = peau
          ? { mechanism: 'peaucellier', geometry: { arm: x, side: y, crank: r, crankPivotOffset: e }, loads: [{ name: 'f', fx: 1, fy: 2 }] }
          : { mechanism: 'hart', geometry: { long: x, short: y, ratio: mu, crank: r, crankPivotOffset: e }, loads: [{ name: 'f', fx: 1, fy: 2 }] }
        const res = runMechanism(input)
        expect(numbers(res).every(Number.isFinite)).toBe(true)
        expect(JSON.stringify(res)).not.toMatch(/NaN|Infinity|null,"unit"/)
        if (!res.feasibility.ok) {
          expect(res.positions).toEqual([])
          expect(res.feasibility.message.length).toBeGreaterThan(20)
        }
      }),
      { numRuns: 200 },
    )
  })

  it('geometries built infeasible on purpose are reported as such', () => {
    fc.assert(
      fc.property(fc.double({ min: 10, max: 300, noNaN: true }), fc.double({ min: 0.1, max: 2, noNaN: true }), fc.constantFrom('side', 'short-crank', 'long-crank'), (s, a, kind) => {
        const l = kind === 'side' ? s / (1 + a) : s * (1 + a)
        const root = Math.sqrt(Math.max(l * l - s * s, 0))
        const r = kind === 'short-crank' ? ((l - s) / 2) * 0.9 : kind === 'long-crank' ? (root / 2) * 1.1 : 50
        const res = runMechanism({ mechanism: 'peaucellier', geometry: { arm: l, side: s, crank: r }, loads: [{ name: 'f', fx: 0, fy: 1 }] })
        expect(res.feasibility.ok).toBe(false)
        expect(res.feasibility.kind).toBe({ side: 'arm-not-longer-than-side', 'short-crank': 'crank-cannot-reach', 'long-crank': 'split-segment' }[kind])
        expect(numbers(res).every(Number.isFinite)).toBe(true)
      }),
      { numRuns: 60 },
    )
  })
})
