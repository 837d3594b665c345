import { describe, expect, it } from 'vitest'
import { poseAt, staticsAt } from '@/lib/fourbar'
import { analysed, sized } from '../helpers/fourbar'
import { fourBars } from '@/lib/mechanisms'

const fourBarIds = fourBars().map((f) => f.id)

const cross = (a: { x: number; y: number }, b: { x: number; y: number }) => a.x * b.y - a.y * b.x
const loads = [
  { fx: 0, fy: -140 },
  { fx: 140, fy: 0 },
  { fx: -90, fy: 60 },
]

describe('statics of the four-bars', () => {
  for (const name of fourBarIds) {
    it(`${name}: drive torque equals −F·dT/dθ at every position (virtual work)`, () => {
      for (const load of loads) {
        const r = analysed(name, { stroke: 150, load, positions: 91 })
        for (const p of r.positions) {
          expect(Math.abs(p.torque - p.torqueByVirtualWork)).toBeLessThan(1e-6 * Math.max(p.virtualWorkScale, 1))
        }
        expect(r.virtualWorkError).toBeLessThan(1e-6)
      }
    })

    it(`${name}: the whole mechanism is in equilibrium — ground forces at A and D, the load and the torque (statics)`, () => {
      const s = sized(name, 150)
      const F = { x: -90, y: 60 }
      for (let d = -5; d <= 5; d += 1) {
        const p = poseAt(s.model, s.thetaMid + (d * Math.PI) / 180)!
        const st = staticsAt(s.model, p, F)
        const GA = st.atB // the driven link is a free body: the ground gives at A what it passes on at B
        const u = { x: (p.D.x - p.C.x) / s.model.c, y: (p.D.y - p.C.y) / s.model.c }
        const GD = { x: st.rocker * u.x, y: st.rocker * u.y } // two-force rocker in tension: the ground pulls it at D away from C
        expect(Math.abs(GA.x + GD.x + F.x)).toBeLessThan(1e-9)
        expect(Math.abs(GA.y + GD.y + F.y)).toBeLessThan(1e-9)
        const m = st.torque + cross(p.A, GA) + cross(p.D, GD) + cross(p.T, F)
        expect(Math.abs(m)).toBeLessThan(1e-7 * (1 + Math.abs(st.torque)))
      }
    })
  }

  it('moving and turning the line moves the mechanism with it: same straightness, same torque for the load turned alike (frame invariance)', () => {
    const a = (30 * Math.PI) / 180
    const load = { fx: 100, fy: -50 }
    const turned = { fx: load.fx * Math.cos(a) - load.fy * Math.sin(a), fy: load.fx * Math.sin(a) + load.fy * Math.cos(a) }
    for (const name of fourBarIds) {
      const r0 = analysed(name, { stroke: 120, load, positions: 31 })
      const r1 = analysed(name, { stroke: 120, load: turned, positions: 31, line: { point: { x: 200, y: -40 }, angleDeg: 30 } })
      expect(r1.straightness.error).toBeCloseTo(r0.straightness.error, 9)
      expect(r1.peak.torque.value).toBeCloseTo(r0.peak.torque.value, 6)
      expect(r1.peak.pinForce.value).toBeCloseTo(r0.peak.pinForce.value, 6)
      const d = r1.straightness.line.direction
      expect(Math.abs(cross(d, { x: Math.cos(a), y: Math.sin(a) }))).toBeLessThan(0.02)
      expect(r1.inputRange.spanDeg).toBeCloseTo(r0.inputRange.spanDeg, 9)
    }
  })

  it('Hoeken at mid-stroke: a load square to the line needs no drive torque (the tracer moves along the line there; virtual work)', () => {
    const r = analysed('hoeken', { stroke: 150, load: { fx: 0, fy: -140 }, positions: 3 })
    expect(Math.abs(r.positions[1].torque)).toBeLessThan(1e-9)
  })
})
