/**
 * The working range, the straightness check and the transmission-angle check (issue 10).
 * Sources: the inversion of a circle not through the pole is a circle, centre ke/(e² − r²), radius
 * kr/|e² − r²| (Coxeter, Introduction to Geometry, §6.1); the sagitta of an arc of radius R over a
 * half chord h is R − √(R² − h²) (geometry). The 30° minimum transmission angle is common practice.
 */
import { describe, expect, it } from 'vitest'
import { calculate } from '@/lib/calc/run'
import { runMechanism } from '@/lib/calc/mechanism'

const loads = [{ name: 'y', fx: 0, fy: -100 }]

describe('working range', () => {
  it('sweeps the crank angles that give the required stroke, not the whole usable stroke', () => {
    // l = 250, s = 100, r = e = 100: x_T = k/(2r) = 52500/200 = 262.5 mm, y_T = x_T tan(θ/2);
    // a 120 mm stroke needs tan(θ/2) = 60/262.5 → θ = 2·atan(0.22857) = 25.75° (hand value).
    const res = runMechanism({ mechanism: 'peaucellier', geometry: { arm: 250, side: 100, crank: 100 }, loads, requiredStroke: 120 })
    expect(res.workingRange!.crankMaxDeg).toBeCloseTo((2 * Math.atan(60 / 262.5) * 180) / Math.PI, 6)
    expect(res.workingRange!.half).toBeCloseTo(60, 6)
    expect(Math.max(...res.positions.map((p) => Math.abs(p.tracer.y)))).toBeCloseTo(60, 6)
    // The full range to the locked positions is there as kinematics only.
    const k = res.kinematics!
    expect(k[0].crankDeg).toBeCloseTo(res.stroke.crankMinDeg, 9)
    expect(k[k.length - 1].crankDeg).toBeCloseTo(res.stroke.crankMaxDeg, 9)
  })

  it('takes end stops as crank angles', () => {
    const res = runMechanism({ mechanism: 'peaucellier', geometry: { arm: 250, side: 100, crank: 100 }, loads, workingRange: { fromDeg: -10, toDeg: 30 } })
    expect(res.positions[0].crankDeg).toBe(-10)
    expect(res.positions[res.positions.length - 1].crankDeg).toBe(30)
    expect(res.envelope[0].eyes).toBeDefined()
  })

  it('refuses a verdict whose end stops reach past the toggle margin', () => {
    const r = calculate({ mechanism: 'peaucellier', geometry: { arm: 250, side: 100, crank: 100 }, loads, workingRange: { fromDeg: -80, toDeg: 80 } })
    if (!r.ok) throw new Error('refused')
    // θ_lim = 82.82°, margin 5° → the usable range ends at ±77.82°.
    expect(r.result.criteria!.find((c) => c.id === 'toggle-margin')!.pass).toBe(false)
    expect(r.result.verdict.pass).toBe(false)
  })
})

describe('straightness check', () => {
  it('fails an offset crank pivot whose arc deviates beyond the tolerance, and says so in the verdict', () => {
    // l = 150, s = 60 → k = 18900; r = 60, e = 55: R = k r/|e² − r²| = 18900·60/575 = 1972.2 mm.
    const input = { mechanism: 'peaucellier', geometry: { arm: 150, side: 60, crank: 60, crankPivotOffset: 55 }, loads, workingRange: { fromDeg: -40, toDeg: 40 }, straightnessTolerance: 0.5 }
    const r = calculate(input)
    if (!r.ok) throw new Error('refused')
    const res = r.result
    expect(res.line?.kind).toBe('arc')
    if (res.line?.kind !== 'arc') return
    expect(res.line.radius).toBeCloseTo((18900 * 60) / 575, 6)
    const h = Math.abs(res.positions[0].tracer.y)
    const sagitta = res.line.radius - Math.sqrt(res.line.radius ** 2 - h * h)
    expect(res.straightness).toBeCloseTo(sagitta, 6)
    expect(res.straightness).toBeGreaterThan(0.5)
    const step = res.steps.find((s) => s.id === 'kin.straightness')!
    expect(step.verdict).toBe('fail')
    expect(res.verdict.pass).toBe(false)
    expect(res.verdict.unmet).toContain('Straightness of the tracer over the working range')
  })

  it('passes the exact line (e = r) within any sensible tolerance', () => {
    const r = calculate({ mechanism: 'peaucellier', geometry: { arm: 150, side: 60, crank: 60 }, loads, straightnessTolerance: 0.01 })
    if (!r.ok) throw new Error('refused')
    expect(r.result.criteria!.find((c) => c.id === 'straightness')!.pass).toBe(true)
  })
})

describe('minimum transmission angle', () => {
  it('defaults to 30° (common practice) and fails a working range that runs close to the toggle', () => {
    const r = calculate({ mechanism: 'peaucellier', geometry: { arm: 200, side: 80, crank: 75 }, loads })
    if (!r.ok) throw new Error('refused')
    const c = r.result.criteria!.find((x) => x.id === 'transmission-angle')!
    expect(c.required).toBe('γ ≥ 30°')
    expect(c.pass).toBe(false)
    const shorter = calculate({ mechanism: 'peaucellier', geometry: { arm: 200, side: 80, crank: 75 }, loads, requiredStroke: 150 })
    if (!shorter.ok) throw new Error('refused')
    expect(shorter.result.criteria!.find((x) => x.id === 'transmission-angle')!.pass).toBe(true)
  })
})
