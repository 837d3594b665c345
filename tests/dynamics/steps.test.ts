import { describe, expect, it } from 'vitest'
import { dynamicEnvelope, mechanismDynamics } from '@/lib/dynamics'
import { CELLS, steelFlats, sweep } from './_setup'

/*
 * The result as the package and the calc read it: stable step ids, the mass and inertia steps with
 * their hand values (m = ρAL, I_G = mL²/12 — common practice), the peak torque at speed against the
 * static one, and the case at speed usable as one more load case by the static envelope code.
 */

const run = () => {
  const m = CELLS.peaucellier()
  return mechanismDynamics({
    ...m,
    anglesDeg: sweep(-60, 60, 21),
    motion: { kind: 'constant', rpm: 200 },
    bodies: steelFlats(m.cell),
    addedMasses: [{ joint: 'T', mass: 0.5, label: 'tool' }],
    loads: [{ name: 'Working load', fx: 0, fy: -100 }],
    gravity: { x: 0, y: -9.81 },
  })
}

describe('steps of the forces at speed', () => {
  it('have stable ids in the dynamics and verification sections', () => {
    const r = run()
    const ids = r.steps.map((s) => s.id)
    expect(new Set(ids).size).toBe(ids.length)
    for (const l of ['OA', 'OB', 'AP', 'BP', 'AT', 'BT', 'CP']) {
      expect(ids).toContain(`dyn.mass.${l}`)
      expect(ids).toContain(`dyn.inertia.${l}`)
      expect(ids).toContain(`dyn.accel.${l}`)
    }
    for (const id of ['dyn.motion', 'dyn.added-mass.T', 'dyn.accel.tracer', 'dyn.torque.working-load-at-speed', 'ver.virtual-power.working-load-at-speed', 'ver.equilibrium-at-speed.working-load-at-speed']) expect(ids).toContain(id)
    for (const s of r.steps) expect(['dynamics', 'verification']).toContain(s.section)
    expect(r.steps.filter((s) => s.section === 'verification').every((s) => s.verdict === 'pass' && s.criterion)).toBe(true)
    expect(r.tables.map((t) => t.id)).toEqual(['tab.dynamics.working-load-at-speed'])
    expect(r.tables[0].rows).toHaveLength(21)
  })

  it('print the hand values of mass and inertia (OA: 7850 · 100 · 250 · 10⁻⁹ = 0.19625 kg, I_G = 0.19625 · 250²/12 = 1022.14 kg·mm²)', () => {
    const r = run()
    const m = r.steps.find((s) => s.id === 'dyn.mass.OA')!
    const i = r.steps.find((s) => s.id === 'dyn.inertia.OA')!
    expect(m.value).toBeCloseTo(0.19625, 12)
    expect(i.value).toBeCloseTo((0.19625 * 62500) / 12, 9)
    expect(m.unit).toBe('kg')
    expect(i.unit).toBe('kg·mm²')
    expect(m.formula).toBe('m = \\rho\\,A\\,L')
    expect(r.steps.find((s) => s.id === 'dyn.motion')!.value).toBeCloseTo((2 * Math.PI * 200) / 60, 12)
  })

  it('compare the largest drive torque at speed with the largest static one', () => {
    const r = run()
    const c = r.cases[0]
    const step = r.steps.find((s) => s.id === 'dyn.torque.working-load-at-speed')!
    const maxAbs = (xs: number[]) => xs.reduce((a, b) => (Math.abs(b) > Math.abs(a) ? b : a), 0)
    expect(step.value).toBe(maxAbs(c.samples.map((s) => s.position.driveTorque)))
    expect(r.peaks.torque[0].static.value).toBe(maxAbs(c.samples.map((s) => s.staticTorque)))
    expect(Math.abs(r.peaks.torque[0].atSpeed.value)).not.toBeCloseTo(Math.abs(r.peaks.torque[0].static.value), 0)
  })

  it('give a case the static envelope code takes as one more load case', () => {
    const r = run()
    const env = dynamicEnvelope(r.model, r.cases[0])
    expect(env.atSpeed.loadCase).toBe('Working load at speed')
    expect(env.atSpeed.slug).toBe('working-load-at-speed')
    const peakT = Math.max(...r.cases[0].samples.map((s) => s.position.pinForces.T.magnitude))
    expect(env.atSpeed.pins.T.value).toBe(peakT)
    expect(Object.keys(env.atSpeed.links)).toEqual(['OA', 'OB', 'AP', 'BP', 'AT', 'BT', 'CP'])
    expect(env.withoutInertia.driveTorque.value).toBe(r.peaks.torque[0].static.value)
  })

  it('serialise to JSON without loss (a revision freezes the result)', () => {
    const r = run()
    const { model: _model, ...plain } = r
    void _model
    const back = JSON.parse(JSON.stringify(plain))
    expect(back.steps).toEqual(plain.steps)
    expect(back.peaks).toEqual(plain.peaks)
    expect(back.checks).toEqual(plain.checks)
  })
})
