/**
 * The independent check of the kinetostatics: the principle of virtual power. The drive's power
 * plus the power of the external loads equals the rate of change of kinetic energy,
 *
 *   τ ω + Σ F·v = dT/dt,   T = Σ ½ m v_G² + ½ I_G ω_b²,   dT/dt = Σ (m a_G·v_G + I_G α_b ω_b),
 *
 * with added masses as particles. Nothing here reuses the force solution or the Jacobian
 * kinematics: velocities and accelerations come from the closed-form positions differentiated in
 * the crank angle by fourth-order central differences (X′, X″; then v = ω X′, a = ω² X″ + α X′).
 * Every term is proportional to ω, so the balance is compared per unit crank speed (virtual
 * velocities X′): τ = −Σ F·X′ + Σ (m a_G·X′_G + I_G α_b φ′_b). That form also holds where the crank
 * stops (a swing's end stops), and its relative error equals the power balance's where ω ≠ 0.
 */
import type { LinkageModel } from '@/lib/linkage/model'
import type { CaseLoads } from '@/lib/linkage/statics'
import type { Vec } from '@/lib/linkage/vec'
import type { AddedMass, LinkMass } from './mass'
import { KG_MM_S2_TO_N } from './kinetostatics'

/** Step in crank angle for the differences, rad: truncation ~h⁴, rounding ~ε/h² of the second derivative. */
export const VP_STEP = 1e-3

/** dX/dθ and d²X/dθ² of every joint from the closed-form positions. */
export interface ClosedFormRates {
  d1: Record<string, Vec>
  d2: Record<string, Vec>
}

export function closedFormRates(place: (crankRad: number) => Record<string, Vec> | null, thetaRad: number, h = VP_STEP): ClosedFormRates | null {
  const at = [-2, -1, 0, 1, 2].map((k) => place(thetaRad + k * h))
  if (at.some((j) => !j)) return null
  const [m2, m1, z, p1, p2] = at as Record<string, Vec>[]
  const d1: Record<string, Vec> = {}
  const d2: Record<string, Vec> = {}
  for (const j of Object.keys(z)) {
    const f = (c: 'x' | 'y') => ({
      one: (m2[j][c] - 8 * m1[j][c] + 8 * p1[j][c] - p2[j][c]) / (12 * h),
      two: (-m2[j][c] + 16 * m1[j][c] - 30 * z[j][c] + 16 * p1[j][c] - p2[j][c]) / (12 * h * h),
    })
    const x = f('x')
    const y = f('y')
    d1[j] = { x: x.one, y: y.one }
    d2[j] = { x: x.two, y: y.two }
  }
  return { d1, d2 }
}

export interface VirtualPower {
  /** τ ω, the drive's power, N·mm/s. */
  drive: number
  /** Σ F·v of the loads and weights, N·mm/s. */
  loads: number
  /** dT/dt, N·mm/s. */
  kineticRate: number
  /** drive + loads − kineticRate, N·mm/s. */
  residual: number
  /** The drive torque the balance gives, N·mm. */
  torque: number
  /** |τ − τ_vp| over the sum of the magnitudes of the terms per unit crank speed (0 when all vanish). */
  relative: number
}

export interface PowerInput {
  model: LinkageModel
  joints: Record<string, Vec>
  rates: ClosedFormRates
  masses: LinkMass[]
  added: AddedMass[]
  loads: CaseLoads
  /** m/s², on the link and added masses; null for none. */
  gravity: Vec | null
  omega: number
  alpha: number
  /** The drive torque from the kinetostatics, N·mm. */
  torque: number
}

const dot = (a: Vec, b: Vec) => a.x * b.x + a.y * b.y
const len = (a: Vec) => Math.hypot(a.x, a.y)

export function virtualPower(p: PowerInput): VirtualPower {
  const { model, joints, rates, omega: w, alpha: al } = p
  const c = KG_MM_S2_TO_N
  // Per unit crank speed: work rate of the loads and the inertia terms, with the sum of their sizes.
  let loads = 0
  let inertia = 0
  let size = Math.abs(p.torque)
  const force = (F: Vec, v: Vec) => {
    loads += dot(F, v)
    size += len(F) * len(v)
  }
  const mass = (m: number, a: Vec, v: Vec) => {
    inertia += c * m * dot(a, v)
    size += c * m * len(a) * len(v)
  }
  for (const f of p.loads.pointLoads) if (!(f.joint in model.ground)) force(f.force, rates.d1[f.joint])
  model.links.forEach((l, b) => {
    const first = l.points[0]
    const last = l.points[l.points.length - 1]
    const v1 = rates.d1[first]
    const v2 = rates.d1[last]
    const vG = { x: (v1.x + v2.x) / 2, y: (v1.y + v2.y) / 2 }
    const a2G = { x: (rates.d2[first].x + rates.d2[last].x) / 2, y: (rates.d2[first].y + rates.d2[last].y) / 2 }
    const aG = { x: w * w * a2G.x + al * vG.x, y: w * w * a2G.y + al * vG.y }
    const m = p.masses[b]
    const L = m.length
    if (p.loads.weightPerMm) force({ x: p.loads.weightPerMm.x * L, y: p.loads.weightPerMm.y * L }, vG)
    if (p.gravity) force({ x: m.mass * p.gravity.x, y: m.mass * p.gravity.y }, vG)
    mass(m.mass, aG, vG)
    // φ′ = (d × d′)/L², φ″ = (d × d″)/L² for the axis d = X_last − X_first of fixed length L.
    const d = { x: joints[last].x - joints[first].x, y: joints[last].y - joints[first].y }
    const dd1 = { x: v2.x - v1.x, y: v2.y - v1.y }
    const dd2 = { x: rates.d2[last].x - rates.d2[first].x, y: rates.d2[last].y - rates.d2[first].y }
    const f1 = (d.x * dd1.y - d.y * dd1.x) / (L * L)
    const f2 = (d.x * dd2.y - d.y * dd2.x) / (L * L)
    const ab = w * w * f2 + al * f1
    inertia += c * m.inertia * ab * f1
    size += c * m.inertia * Math.abs(ab * f1)
  })
  for (const a of p.added) {
    if (a.joint in model.ground) continue
    const v = rates.d1[a.joint]
    const acc = { x: w * w * rates.d2[a.joint].x + al * v.x, y: w * w * rates.d2[a.joint].y + al * v.y }
    if (p.gravity) force({ x: a.mass * p.gravity.x, y: a.mass * p.gravity.y }, v)
    mass(a.mass, acc, v)
  }
  const torque = inertia - loads
  return {
    drive: p.torque * w,
    loads: loads * w,
    kineticRate: inertia * w,
    residual: (p.torque + loads - inertia) * w,
    torque,
    relative: size > 0 ? Math.abs(p.torque - torque) / size : 0,
  }
}
