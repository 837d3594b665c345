/**
 * Design forces from the engine's envelopes: for each component and each
 * demand, the largest envelope value over the load cases times the user's
 * load and dynamic factors. The governing load case and crank angle travel
 * with the value so each check can say where it governs.
 */
import type { Extreme, LoadCaseEnvelope } from '@/lib/contract'
import type { Demand, EyeDemand, JointForces, LinkForces } from './spec'
import { maxDemand } from './spec'
import type { Factors } from './schema'

function pick(envelopes: LoadCaseEnvelope[], get: (e: LoadCaseEnvelope) => Extreme | undefined, factor: number, step?: (slug: string) => string): Demand | undefined {
  let best: Demand | undefined
  for (const env of envelopes) {
    const x = get(env)
    if (!x || !Number.isFinite(x.value)) continue
    // Compression may arrive signed (tension positive); the checks want magnitudes.
    const raw = Math.abs(x.value)
    const d: Demand = { value: raw * factor, raw, loadCase: env.loadCase, crankDeg: x.crankDeg, ...(env.slug && step ? { stepId: step(env.slug) } : {}) }
    if (!best || d.value > best.value) best = d
  }
  return best
}

const zero = (loadCase: string): Demand => ({ value: 0, raw: 0, loadCase: loadCase === 'direct' ? '—' : loadCase })

export function jointForces(envelopes: LoadCaseEnvelope[], name: string, f: Factors): JointForces {
  const force = pick(envelopes, (e) => e.pins[name], f.load * f.dynamic, (slug) => `stat.envelope.${slug}.pin.${name}`) ?? zero(envelopes[0]?.loadCase ?? '—')
  return { force, service: force.raw * f.dynamic }
}

export function linkForces(envelopes: LoadCaseEnvelope[], name: string, f: Factors): LinkForces {
  const k = f.load * f.dynamic
  const lc = envelopes[0]?.loadCase ?? '—'
  const tensionPick = pick(
    envelopes,
    // A "max tension" that is negative means the link never pulls: no tension demand.
    (e) => {
      const t = e.links[name]?.maxTension
      return t && t.value > 0 ? t : undefined
    },
    k,
    (slug) => `stat.envelope.${slug}.${name}`,
  )
  const tension = tensionPick ?? zero(lc)
  const compression =
    pick(
      envelopes,
      (e) => {
        const c = e.links[name]?.maxCompression
        return c && c.value !== 0 ? c : undefined
      },
      k,
      (slug) => `stat.envelope.${slug}.${name}`,
    ) ?? zero(lc)
  const moment = pick(envelopes, (e) => e.links[name]?.maxMoment, k, (slug) => `stat.envelope.${slug}.${name}.moment`)
  const axial = maxDemand(tension, compression)
  const eyePick = pick(envelopes, (e) => e.eyes?.[name], k, (slug) => `stat.envelope.${slug}.${name}.eye`)
  const across = envelopes.some((e) => (e.eyes?.[name]?.across ?? 0) > 0)
  const joint = envelopes.find((e) => e.loadCase === eyePick?.loadCase)?.eyes?.[name]?.joint
  // Envelopes without eye forces (older results) fall back to the axial force, along the link.
  const eye: EyeDemand = eyePick && eyePick.value >= axial.value ? { ...eyePick, across, joint } : { ...axial, across: false }
  return { tension, compression, moment, axial, eye }
}

export interface DirectForce {
  /** Pin resultant (joint) or axial tension (link), N. */
  force?: number
  tension?: number
  compression?: number
  moment?: number
  /** Largest pin force on the link's eye, N (default: the larger axial force), and whether it may act across the link. */
  eye?: number
  across?: boolean
}

/** A force given directly by the engineer: factors still apply, there is no crank angle. */
export function directJointForces(force: number, f: Factors): JointForces {
  const d: Demand = { value: force * f.load * f.dynamic, raw: force, loadCase: 'direct' }
  return { force: d, service: force * f.dynamic }
}

export function directLinkForces(x: DirectForce, f: Factors): LinkForces {
  const k = f.load * f.dynamic
  const mk = (v: number | undefined): Demand => ({ value: Math.abs(v ?? 0) * k, raw: Math.abs(v ?? 0), loadCase: 'direct' })
  const tension = mk(x.tension ?? x.force)
  const compression = mk(x.compression)
  const moment = x.moment !== undefined ? mk(x.moment) : undefined
  const axial = maxDemand(tension, compression)
  const eye: EyeDemand = x.eye !== undefined ? { ...mk(x.eye), across: x.across ?? false } : { ...axial, across: x.across ?? false }
  return { tension, compression, moment, axial, eye }
}
