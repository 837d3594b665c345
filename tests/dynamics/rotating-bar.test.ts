import { describe, expect, it } from 'vitest'
import { buildModel } from '@/lib/linkage/model'
import { runDynamics, slenderBar, bodyFromSection, type MotionLaw } from '@/lib/dynamics'

/*
 * A single bar CP of length L pinned to the ground at C and turned by the drive: the simplest
 * mechanism the module takes. Hand results (any dynamics text, e.g. Meriam & Kraige, Engineering
 * Mechanics: Dynamics, rigid-body rotation about a fixed axis — common practice):
 *   a_G = (L/2)(α t − ω² e), so the pin at C pushes the bar with R = m a_G: m ω² L/2 towards C
 *   at constant speed, and m α L/2 along t when it speeds up;
 *   the drive torque is I_C α = (m L²/12 + m L²/4) α = m L² α/3;
 *   the axial force at distance x from C is ∫ₓᴸ (m/L) ω² s ds = m ω² (L² − x²)/(2L): m ω² L/2 at C,
 *   3/4 of that at mid-length;
 *   at rest under gravity g along −y the weight's moment about C is −m g (L/2) cos θ, so the drive
 *   holds it with τ = m g (L/2) cos θ.
 * Slender uniform bar: m = ρ A L, I_G = m L²/12 (common practice).
 */

const L = 200
const section = { shape: 'flat', width: 20, thickness: 5 } as const // A = 100 mm²
const rho = 7850
// Hand: m = 7850 kg/m³ · 100 mm² · 200 mm · 1e-9 = 0.157 kg; I_G = 0.157 · 200²/12 = 523.333… kg·mm².
const M = 0.157
const IG = (0.157 * 40000) / 12

const model = () =>
  buildModel({ links: [{ name: 'CP', points: ['C', 'P'], stations: [0, L], kind: 'crank' }], ground: { C: { x: 0, y: 0 } }, crank: 'CP' })
const place = (th: number) => ({ C: { x: 0, y: 0 }, P: { x: L * Math.cos(th), y: L * Math.sin(th) } })

function run(motion: MotionLaw, angles: number[], gravity: { x: number; y: number } | null = null) {
  return runDynamics({
    model: model(),
    place,
    anglesDeg: angles,
    motion,
    bodies: { CP: bodyFromSection(section, rho) },
    loads: [{ name: 'none', pointLoads: [], weightPerMm: null }],
    gravity,
    tracer: 'P',
  })
}

describe('slender bar mass properties (m = ρAL, I_G = mL²/12 — common practice)', () => {
  it('gives the hand values for a 20 × 5 mm steel flat 200 mm long', () => {
    const b = slenderBar(100, L, rho)
    expect(b.mass).toBeCloseTo(M, 12)
    expect(b.inertia).toBeCloseTo(IG, 9)
    const r = run({ kind: 'constant', rpm: 60 }, [0])
    expect(r.masses[0].mass).toBeCloseTo(M, 12)
    expect(r.masses[0].inertia).toBeCloseTo(IG, 9)
    expect(r.masses[0].section).toBe('flat 20 × 5 mm')
  })
})

describe('single bar turning about a fixed pin (rigid-body rotation — common practice)', () => {
  it('at constant speed the pin pulls the bar towards C with m ω² L/2 and the drive gives no torque', () => {
    const rpm = 300
    const w = (2 * Math.PI * rpm) / 60
    const hand = M * w * w * (L / 2) * 1e-3 // kg · 1/s² · mm → 1e-3 N
    const r = run({ kind: 'constant', rpm }, [0, 30, 135, -100])
    expect(r.cases[0].samples).toHaveLength(4)
    for (const s of r.cases[0].samples) {
      const th = (s.position.crankDeg * Math.PI) / 180
      const R = s.position.reactions.C
      expect(R.magnitude).toBeCloseTo(hand, 10)
      // Towards C: opposite to the bar's direction.
      expect(R.x).toBeCloseTo(-hand * Math.cos(th), 10)
      expect(R.y).toBeCloseTo(-hand * Math.sin(th), 10)
      expect(s.position.driveTorque).toBeCloseTo(0, 10)
      // Tension, largest at C (m ω² L/2); at mid-length 3/4 of it.
      expect(s.members.CP.axialMax).toBeCloseTo(hand, 10)
      expect(s.position.linkForces.CP).toBeCloseTo(0.75 * hand, 10)
    }
    expect(r.peaks.tracerAcceleration.value).toBeCloseTo(w * w * L, 8)
  })

  it('under a constant angular acceleration the drive torque is m L² α/3 and the pin force along t is m α L/2', () => {
    const alpha = 50 // rad/s², crank at rest at the position
    const r = run({ kind: 'custom', label: 'starting from rest', at: () => ({ omega: 0, alpha }) }, [0, 60])
    expect(r.cases[0].samples).toHaveLength(2)
    for (const s of r.cases[0].samples) {
      const th = (s.position.crankDeg * Math.PI) / 180
      expect(s.position.driveTorque).toBeCloseTo((M * L * L * alpha * 1e-3) / 3, 9)
      const t = { x: -Math.sin(th), y: Math.cos(th) }
      const R = s.position.reactions.C
      expect(R.x * t.x + R.y * t.y).toBeCloseTo(M * alpha * (L / 2) * 1e-3, 10)
      // The bending moment at C is the drive torque, and falls to zero at the free end.
      expect(s.members.CP.moment).toBeCloseTo((M * L * L * alpha * 1e-3) / 3, 9)
    }
  })

  it('at rest under gravity the drive holds the weight: τ = m g (L/2) cos θ', () => {
    const r = run({ kind: 'constant', rpm: 0 }, [0, 45, 90, 200], { x: 0, y: -9.81 })
    expect(r.cases[0].samples).toHaveLength(4)
    for (const s of r.cases[0].samples) {
      const th = (s.position.crankDeg * Math.PI) / 180
      expect(s.position.driveTorque).toBeCloseTo(M * 9.81 * (L / 2) * Math.cos(th), 9)
      expect(s.position.reactions.C.y).toBeCloseTo(M * 9.81, 12)
    }
  })
})
