import { describe, expect, it } from 'vitest'
import { mechanismDynamics, virtualPower, closedFormRates, type MotionLaw } from '@/lib/dynamics'
import { placeAt } from '@/lib/linkage/crank'
import { CELLS, steelFlats, sweep } from './_setup'

/*
 * Independent checks of the forces at speed, at every position of the sweep:
 * - virtual power (principle of virtual power — drive power τω plus the loads' power equals the
 *   rate of change of kinetic energy, T = Σ ½ m v_G² + ½ I_G ω²), with velocities and
 *   accelerations from the closed-form positions by central differences rather than from the
 *   loop-closure kinematics the forces use;
 * - momentum of the whole mechanism (Newton–Euler for a system of bodies — any dynamics text,
 *   common practice): ground reactions + loads + weights = Σ m a_G + m_t a_T, and the moment of
 *   all external actions about O equals Σ (r_G × m a_G + I_G α) + r_T × m_t a_T.
 */

const G = { x: 0, y: -9.81 }
const cases = [
  { name: 'push', fx: 0, fy: -150 },
  { name: 'side', fx: 80, fy: 20 },
]
const motions: MotionLaw[] = [
  { kind: 'constant', rpm: 300 },
  { kind: 'harmonic', cyclesPerMinute: 120, fromDeg: -50, toDeg: 50 },
]

function solve(id: 'peaucellier' | 'hart', motion: MotionLaw, gravity: typeof G | null, weight: boolean) {
  const m = CELLS[id]()
  const [lo, hi] = motion.kind === 'harmonic' ? [-50, 50] : m.range
  return {
    m,
    r: mechanismDynamics({
      ...m,
      anglesDeg: sweep(lo, hi, 41),
      motion,
      bodies: steelFlats(m.cell),
      addedMasses: [{ joint: 'T', mass: 1.2, label: 'carriage' }],
      loads: cases,
      gravity,
      weightPerMm: weight ? { x: 0.002, y: -0.0077 } : null,
    }),
  }
}

for (const id of ['peaucellier', 'hart'] as const) {
  describe(`${id}: virtual power at every position (independent method)`, () => {
    for (const motion of motions) {
      for (const [label, gravity, weight] of [
        ['loads only', null, false],
        ['gravity on the masses', G, false],
        ['static self-weight per mm', null, true],
      ] as const) {
        it(`${motion.kind} motion, ${label}`, () => {
          const { r } = solve(id, motion, gravity, weight)
          expect(r.toggles).toEqual([])
          for (const c of r.cases) {
            expect(c.samples).toHaveLength(41)
            for (const s of c.samples) {
              expect(s.power).not.toBeNull()
              expect(s.power!.relative).toBeLessThan(1e-6)
              if (s.omega !== 0) expect(Math.abs(s.power!.residual)).toBeLessThan(1e-6 * Math.abs(s.omega) * (Math.abs(s.position.driveTorque) + Math.abs(s.power!.torque) + 1))
            }
          }
          expect(r.checks.virtualPower.worst).toBeLessThan(1e-6)
          expect(r.checks.virtualPower.checked).toBe(41)
          const step = r.steps.find((s) => s.id === `ver.virtual-power.${r.cases[0].slug}`)
          expect(step?.verdict).toBe('pass')
        })
      }
    }

    it('the check notices a drive torque 0.01 % off', () => {
      const { m, r } = solve(id, motions[0], G, false)
      const c = r.cases[0]
      const s = c.samples[7]
      const th = (s.position.crankDeg * Math.PI) / 180
      const place = (t: number) => placeAt(m.cell, m.offset, m.crank, t)
      const loads = { name: 'push', pointLoads: [{ joint: 'T', force: { x: 0, y: -150 } }], weightPerMm: null }
      const p = (torque: number) => virtualPower({ model: r.model, joints: s.position.joints, rates: closedFormRates(place, th)!, masses: r.masses, added: r.addedMasses, loads, gravity: G, omega: s.omega, alpha: s.alpha, torque })
      expect(p(s.position.driveTorque).relative).toBeLessThan(1e-8)
      expect(p(s.position.driveTorque * 1.0001).relative).toBeGreaterThan(1e-6)
    })
  })

  describe(`${id}: momentum of the whole mechanism at every position (Newton–Euler, common practice)`, () => {
    it('external forces and moments about O equal the rates of momentum', () => {
      const { r } = solve(id, motions[1], G, false)
      const c = 1e-3 // kg·mm/s² → N
      const cross = (ax: number, ay: number, bx: number, by: number) => ax * by - ay * bx
      for (const [i, lc] of cases.entries()) {
        for (const s of r.cases[i].samples) {
          const k = r.kinematics.find((q) => q.crankDeg === s.position.crankDeg)!
          const j = s.position.joints
          const { O, C } = s.position.reactions
          let fx = O.x + C.x + lc.fx
          let fy = O.y + C.y + lc.fy
          let mo = s.position.driveTorque + cross(j.C.x, j.C.y, C.x, C.y) + cross(j.T.x, j.T.y, lc.fx, lc.fy)
          let px = 0
          let py = 0
          let h = 0
          let size = Math.hypot(lc.fx, lc.fy) + O.magnitude + C.magnitude
          r.model.links.forEach((l, b) => {
            const mass = r.masses[b]
            const a = j[l.points[0]]
            const z = j[l.points[l.points.length - 1]]
            const g = { x: (a.x + z.x) / 2, y: (a.y + z.y) / 2 }
            const lm = k.links[l.name]
            fx += mass.mass * G.x
            fy += mass.mass * G.y
            mo += cross(g.x, g.y, mass.mass * G.x, mass.mass * G.y)
            px += c * mass.mass * lm.aG.x
            py += c * mass.mass * lm.aG.y
            h += c * (cross(g.x, g.y, mass.mass * lm.aG.x, mass.mass * lm.aG.y) + mass.inertia * lm.alpha)
            size += mass.mass * 9.81 + c * mass.mass * Math.hypot(lm.aG.x, lm.aG.y)
          })
          const t = r.addedMasses[0]
          const aT = k.joints.T.a
          fx += t.mass * G.x
          fy += t.mass * G.y
          mo += cross(j.T.x, j.T.y, t.mass * G.x, t.mass * G.y)
          px += c * t.mass * aT.x
          py += c * t.mass * aT.y
          h += c * cross(j.T.x, j.T.y, t.mass * aT.x, t.mass * aT.y)
          size += t.mass * 9.81 + c * t.mass * Math.hypot(aT.x, aT.y)
          expect(Math.abs(fx - px) / size).toBeLessThan(1e-10)
          expect(Math.abs(fy - py) / size).toBeLessThan(1e-10)
          expect(Math.abs(mo - h) / (size * r.model.lc)).toBeLessThan(1e-10)
        }
      }
    })
  })

  describe(`${id}: loop-closure kinematics against the closed-form positions differentiated numerically`, () => {
    it('joint velocities and accelerations agree at every position', () => {
      const { m, r } = solve(id, motions[1], null, false)
      const place = (t: number) => placeAt(m.cell, m.offset, m.crank, t)
      for (const k of r.kinematics) {
        const fd = closedFormRates(place, (k.crankDeg * Math.PI) / 180)!
        for (const [j, mo] of Object.entries(k.joints)) {
          const v = { x: k.omega * fd.d1[j].x, y: k.omega * fd.d1[j].y }
          const a = { x: k.omega ** 2 * fd.d2[j].x + k.alpha * fd.d1[j].x, y: k.omega ** 2 * fd.d2[j].y + k.alpha * fd.d1[j].y }
          const vs = Math.max(1, Math.hypot(v.x, v.y))
          const as = Math.max(1, Math.hypot(a.x, a.y))
          expect(Math.hypot(mo.v.x - v.x, mo.v.y - v.y) / vs).toBeLessThan(1e-8)
          expect(Math.hypot(mo.a.x - a.x, mo.a.y - a.y) / as).toBeLessThan(1e-6)
        }
      }
    })
  })
}
