import { linkLength, type LinkageModel } from './model'
import type { EyeExtreme, LoadCaseEnvelope, Extreme } from '@/lib/contract'
import type { CaseSample } from './sweep'

/**
 * Keeps the sample where the offered value is largest, with its crank angle.
 * Values are offered one sample at a time so that one pass over a long sweep
 * serves every quantity, with no object allocated per improvement.
 */
class Largest {
  value = 0
  crankDeg: number
  found = false

  constructor(samples: CaseSample[]) {
    this.crankDeg = samples[0]?.position.crankDeg ?? 0
  }

  offer(v: number | undefined, crankDeg: number): void {
    if (v !== undefined && (!this.found || v > this.value)) {
      this.value = v
      this.crankDeg = crankDeg
      this.found = true
    }
  }

  get extreme(): Extreme {
    return { value: this.value, crankDeg: this.crankDeg }
  }
}

/**
 * Largest demands over the sweep. Tension positive throughout: maxTension is
 * ≥ 0 and maxCompression ≤ 0 (0 when the link never sees that sign).
 */
export function envelopeOf(model: LinkageModel, loadCase: string, samples: CaseSample[], slug?: string): LoadCaseEnvelope {
  const names = model.links.map((l) => l.name)
  const joints = Object.keys(model.attached)
  const tension = names.map(() => new Largest(samples))
  const compression = names.map(() => new Largest(samples))
  const moment = names.map(() => new Largest(samples))
  const pin = joints.map(() => new Largest(samples))
  const torque = new Largest(samples)
  const eye = names.map(() => new Largest(samples))
  const eyeAt = names.map(() => 0)
  const across = names.map(() => 0)
  const grounds = Object.keys(model.ground)
  const reaction = grounds.map(() => new Largest(samples))
  for (const s of samples) {
    const p = s.position
    for (let b = 0; b < names.length; b++) {
      const m = s.members[names[b]]
      tension[b].offer(m.axialMax, p.crankDeg)
      compression[b].offer(-m.axialMin, p.crankDeg)
      moment[b].offer(p.linkMoments?.[names[b]], p.crankDeg)
      const before = eye[b].value
      eye[b].offer(m.eye, p.crankDeg)
      if (eye[b].value !== before || !eye[b].found) eyeAt[b] = m.eyeAt
      across[b] = Math.max(across[b], m.across)
    }
    for (let g = 0; g < grounds.length; g++) reaction[g].offer(p.reactions[grounds[g]]?.magnitude, p.crankDeg)
    for (let j = 0; j < joints.length; j++) pin[j].offer(p.pinForces[joints[j]]?.magnitude, p.crankDeg)
    torque.offer(Math.abs(p.driveTorque), p.crankDeg)
  }
  // An axial force at round-off level of the largest pin force (e.g. 1e-13 N in a crank that only
  // bends) is solver noise, not a demand: report it as zero so checks do not cite it.
  const noise = 1e-9 * Math.max(0, ...pin.map((p) => p.value))
  const real = (v: number) => (Math.abs(v) <= noise ? 0 : v)
  const links: LoadCaseEnvelope['links'] = {}
  model.links.forEach((l, b) => {
    const t = tension[b]
    const c = compression[b]
    links[l.name] = {
      length: linkLength(l),
      maxTension: { value: real(Math.max(t.value, 0)), crankDeg: t.crankDeg },
      maxCompression: { value: real(Math.min(-c.value, 0)), crankDeg: c.crankDeg },
      ...(moment[b].found ? { maxMoment: moment[b].extreme } : {}),
    }
  })
  const pins: LoadCaseEnvelope['pins'] = {}
  joints.forEach((j, k) => (pins[j] = pin[k].extreme))
  const eyes: Record<string, EyeExtreme> = {}
  model.links.forEach((l, b) => {
    eyes[l.name] = { ...eye[b].extreme, joint: l.points[eyeAt[b]], across: real(across[b]) }
  })
  const reactions: Record<string, Extreme> = {}
  grounds.forEach((g, k) => (reactions[g] = reaction[k].extreme))
  const at = samples.find((s) => s.position.crankDeg === torque.crankDeg)
  return {
    loadCase,
    ...(slug ? { slug } : {}),
    links,
    pins,
    eyes,
    reactions,
    driveTorque: { value: at ? at.position.driveTorque : 0, crankDeg: torque.crankDeg },
  }
}
