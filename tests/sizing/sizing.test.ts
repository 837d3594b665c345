import { describe, expect, it } from 'vitest'
import { runMechanism } from '@/lib/calc/mechanism'
import { sizeMechanism, type SizingInput, type SizingProposal } from '@/lib/sizing'

/*
 * Every proposal is checked against the constraints it was given by running it through the calc's
 * own engine (runMechanism), not by the assistant's screening: usable stroke, line offset, the
 * smallest transmission angle over the stroke, the envelope of every joint, and no locked position.
 * The line offset of a Peaucellier cell with e = r is k/(2r), k = l² − s² (Coxeter, Introduction to
 * Geometry, §6.1); of Hart's inversor k = μ(1 − μ)(a² − b²) (docs/engine.md).
 */

function measured(p: SizingProposal, req: SizingInput) {
  const n = 25
  const range = p.metrics.crankRangeDeg
  const angles = Array.from({ length: n }, (_, i) => -range + (2 * range * i) / (n - 1))
  const out = runMechanism({ mechanism: p.mechanism, geometry: p.geometry, loads: [{ name: 'L', fx: req.load.fx, fy: req.load.fy }], crankAnglesDeg: angles, toggleMarginDeg: req.toggleMarginDeg ?? 5 } as Parameters<typeof runMechanism>[0])
  const joints = out.positions.flatMap((q) => Object.values(q.joints))
  const ys = out.positions.map((q) => q.tracer.y)
  return {
    out,
    travel: Math.max(...ys) - Math.min(...ys),
    minT: Math.min(...out.positions.map((q) => q.transmissionAngleDeg ?? 90)),
    width: Math.max(0, ...joints.map((j) => j.x)) - Math.min(0, ...joints.map((j) => j.x)),
    height: Math.max(...joints.map((j) => j.y)) - Math.min(...joints.map((j) => j.y)),
    peakPin: Math.max(...out.positions.flatMap((q) => Object.values(q.pinForces).map((f) => f.magnitude))),
  }
}

const REQUESTS: [string, SizingInput][] = [
  ['one offset, pin force', { stroke: 120, offset: 150, minTransmissionDeg: 30, load: { fx: 0, fy: -150 }, goal: 'pin-force' }],
  ['offset range and envelope, footprint', { stroke: 80, offset: { min: 60, max: 120 }, envelope: { width: 260, height: 260 }, minTransmissionDeg: 25, load: { fx: 40, fy: -300 }, goal: 'footprint' }],
  ['free offset, torque', { stroke: 200, minTransmissionDeg: 35, load: { fx: -20, fy: 500 }, goal: 'torque' }],
]

describe('sizing assistant', () => {
  it.each(REQUESTS)('%s: every proposal, run through the engine, meets every constraint', (_, req) => {
    const res = sizeMechanism(req)
    expect(res.proposals.length).toBeGreaterThan(0)
    expect(new Set(res.proposals.map((p) => p.mechanism))).toEqual(new Set(['peaucellier', 'hart']))
    for (const p of res.proposals) {
      const m = measured(p, req)
      expect(m.out.feasibility.ok).toBe(true)
      expect(m.out.line?.kind).toBe('line')
      expect(m.out.toggles).toEqual([])
      expect(2 * m.out.stroke.usable.half).toBeGreaterThanOrEqual(req.stroke - 1e-9)
      expect(m.travel).toBeGreaterThanOrEqual(req.stroke * (1 - 1e-6))
      if (typeof req.offset === 'number') expect(Math.abs(m.out.lineOffset - req.offset)).toBeLessThanOrEqual(0.5)
      if (req.offset && typeof req.offset === 'object') {
        expect(m.out.lineOffset).toBeGreaterThanOrEqual(req.offset.min - 1e-9)
        expect(m.out.lineOffset).toBeLessThanOrEqual(req.offset.max + 1e-9)
      }
      // The 25 positions here lie between the 13 the assistant screened with; a dip between samples of ≤ 0.5° is allowed.
      expect(m.minT).toBeGreaterThanOrEqual((req.minTransmissionDeg ?? 30) - 0.5)
      if (req.envelope) {
        expect(m.width).toBeLessThanOrEqual(req.envelope.width * 1.01)
        expect(m.height).toBeLessThanOrEqual(req.envelope.height * 1.01)
      }
      // Line offset from the closed form.
      const g = p.geometry
      const k = p.mechanism === 'peaucellier' ? g.arm ** 2 - g.side ** 2 : g.ratio * (1 - g.ratio) * (g.long ** 2 - g.short ** 2)
      expect(m.out.lineOffset).toBeCloseTo(k / (2 * g.crank), 9)
      expect(g.crankPivotOffset).toBe(g.crank)
    }
  })

  it('ranks by the goal it was given', () => {
    for (const goal of ['pin-force', 'torque', 'footprint'] as const) {
      const res = sizeMechanism({ stroke: 100, offset: { min: 80, max: 160 }, load: { fx: 0, fy: -200 }, goal })
      const key = (p: SizingProposal) => (goal === 'pin-force' ? p.metrics.peakPinForce : goal === 'torque' ? p.metrics.peakTorque : p.metrics.footprint.area)
      const values = res.proposals.map(key)
      expect(values).toEqual([...values].sort((a, b) => a - b))
      expect(res.proposals.map((p) => p.rank)).toEqual(res.proposals.map((_, i) => i + 1))
    }
  })

  it('reports the peak pin force the engine finds', () => {
    const req: SizingInput = { stroke: 120, offset: 150, load: { fx: 0, fy: -150 } }
    const best = sizeMechanism(req).proposals[0]
    expect(best.metrics.peakPinForce).toBeCloseTo(measured(best, req).peakPin, 0)
  })

  it('says what to relax when nothing fits', () => {
    const res = sizeMechanism({ stroke: 400, envelope: { width: 50, height: 50 }, load: { fx: 0, fy: -100 } })
    expect(res.proposals).toEqual([])
    expect(res.advice).toMatch(/larger envelope/)
  })

  it('refuses a request with the field named', () => {
    expect(() => sizeMechanism({ stroke: -5, load: { fx: 0, fy: 1 } })).toThrow(/at least 1 mm/)
    expect(() => sizeMechanism({ stroke: 100, offset: { min: 90, max: 50 }, load: { fx: 0, fy: 1 } })).toThrow(/smallest offset/)
  })
})
