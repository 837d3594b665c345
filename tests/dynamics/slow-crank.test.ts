import { describe, expect, it } from 'vitest'
import { mechanismDynamics } from '@/lib/dynamics'
import { runSweep } from '@/lib/linkage/sweep'
import type { PositionResult } from '@/lib/contract'
import { CELLS, steelFlats, sweep } from './_setup'

/*
 * As the crank slows down (ω → 0 at constant speed) the inertia loads, proportional to ω², vanish
 * and the forces at speed tend to the static ones — here the existing statics of lib/linkage
 * (runSweep), solved by its own code. At constant speed every acceleration is ω² X″, so the
 * departure from the static forces is exactly proportional to ω² (d'Alembert: the inertia loads
 * enter a linear equilibrium system): doubling the speed multiplies it by 4.
 */

const loads = [
  { name: 'push', fx: 0, fy: -150 },
  { name: 'side', fx: 60, fy: 10 },
]
const weightPerMm = { x: 0, y: -0.0077 }

/** Largest difference of the forces of two positions, and the size of the static ones. */
function difference(a: PositionResult, b: PositionResult): { diff: number; size: number } {
  let diff = Math.abs(a.driveTorque - b.driveTorque) / 100
  let size = Math.abs(b.driveTorque) / 100
  for (const [k, v] of Object.entries(b.linkForces)) {
    diff = Math.max(diff, Math.abs(a.linkForces[k] - v))
    size = Math.max(size, Math.abs(v))
  }
  for (const [k, v] of Object.entries(b.pinForces)) {
    diff = Math.max(diff, Math.abs(a.pinForces[k].x - v.x), Math.abs(a.pinForces[k].y - v.y))
    size = Math.max(size, v.magnitude)
  }
  for (const [k, v] of Object.entries(b.reactions)) diff = Math.max(diff, Math.abs(a.reactions[k].x - v.x), Math.abs(a.reactions[k].y - v.y))
  for (const [k, v] of Object.entries(b.linkMoments ?? {})) diff = Math.max(diff, Math.abs((a.linkMoments?.[k] ?? NaN) - v) / 100)
  return { diff, size }
}

for (const id of ['peaucellier', 'hart'] as const) {
  describe(`${id}: a slow crank gives forces tending to the static ones (lib/linkage statics)`, () => {
    const setup = () => {
      const m = CELLS[id]()
      const angles = sweep(m.range[0], m.range[1], 29)
      const statics = runSweep({ cell: m.cell, crank: m.crank, offset: m.offset, anglesDeg: angles, loads, weightPerMm, amplificationLimit: 100 })
      const at = (rpm: number) => mechanismDynamics({ ...m, anglesDeg: angles, motion: { kind: 'constant', rpm }, bodies: steelFlats(m.cell), addedMasses: [{ joint: 'T', mass: 1 }], loads, weightPerMm })
      return { statics, at }
    }

    it('without inertia the module reproduces the static sweep exactly', () => {
      const { statics, at } = setup()
      const r = at(100)
      for (const [i, c] of r.cases.entries()) {
        expect(c.withoutInertia).toHaveLength(statics.cases[i].samples.length)
        c.withoutInertia.forEach((s, k) => {
          const d = difference(s.position, statics.cases[i].samples[k].position)
          expect(d.diff / d.size).toBeLessThan(1e-11)
          expect(c.samples[k].staticTorque).toBeCloseTo(statics.cases[i].samples[k].position.driveTorque, 8)
        })
      }
    })

    it('the departure from the static forces shrinks with the speed and is below 10⁻⁹ of them at 0.001 rpm', () => {
      const { statics, at } = setup()
      const worst = (rpm: number) => {
        const r = at(rpm)
        let w = 0
        for (const [i, c] of r.cases.entries()) {
          c.samples.forEach((s, k) => {
            const d = difference(s.position, statics.cases[i].samples[k].position)
            w = Math.max(w, d.diff / d.size)
          })
        }
        return w
      }
      let last = Infinity
      for (const rpm of [100, 10, 1, 0.1, 0.01, 0.001]) {
        const d = worst(rpm)
        expect(d).toBeLessThan(last)
        last = d
      }
      expect(last).toBeLessThan(1e-9)
    })

    it('the departure of the drive torque and the pivot reactions grows exactly as ω² (doubling the speed: × 4)', () => {
      const { statics, at } = setup()
      const r40 = at(40)
      const r80 = at(80)
      for (const [i, c] of r40.cases.entries()) {
        c.samples.forEach((s, k) => {
          const s0 = statics.cases[i].samples[k].position
          const s2 = r80.cases[i].samples[k].position
          const d1 = s.position.driveTorque - s0.driveTorque
          const d2 = s2.driveTorque - s0.driveTorque
          expect(Math.abs(d2 - 4 * d1)).toBeLessThan(1e-9 * (Math.abs(d2) + Math.abs(s0.driveTorque)))
          for (const j of ['O', 'C']) {
            for (const q of ['x', 'y'] as const) {
              const e1 = s.position.reactions[j][q] - s0.reactions[j][q]
              const e2 = s2.reactions[j][q] - s0.reactions[j][q]
              expect(Math.abs(e2 - 4 * e1)).toBeLessThan(1e-9 * (s2.reactions[j].magnitude + s0.reactions[j].magnitude))
            }
          }
        })
      }
    })
  })
}
