import { linkLength, type LinkageModel } from './model'
import type { EyeExtreme, LoadCaseEnvelope, Extreme } from '@/lib/contract'
import { MEMBER_FIELDS } from './members'
import type { CaseArrays, CaseSample, SweepArrays } from './sweep'

/**
 * Keeps the sample where the offered value is largest, with its crank angle.
 * Values are offered one sample at a time so that one pass over a long sweep
 * serves every quantity, with no object allocated per improvement.
 */
class Largest {
  value = 0
  crankDeg: number
  found = false

  constructor(firstCrankDeg: number) {
    this.crankDeg = firstCrankDeg
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
 * What the envelope reads of position i (0 ≤ i < count): the per-link internals (link b in model
 * order), pin forces (joints in Object.keys(model.attached) order), reactions (Object.keys(model.ground)
 * order), the drive torque and the crank angle. undefined where the sample has no such value.
 */
interface EnvelopeSource {
  count: number
  crankDeg(i: number): number
  member(i: number, b: number, out: Float64Array): void
  moment(i: number, b: number): number | undefined
  reaction(i: number, g: number): number | undefined
  pin(i: number, j: number): number | undefined
  torque(i: number): number
}

/**
 * Largest demands over the sweep. Tension positive throughout: maxTension is
 * ≥ 0 and maxCompression ≤ 0 (0 when the link never sees that sign).
 */
export function envelopeOf(model: LinkageModel, loadCase: string, samples: CaseSample[], slug?: string): LoadCaseEnvelope {
  const names = model.links.map((l) => l.name)
  const joints = Object.keys(model.attached)
  const grounds = Object.keys(model.ground)
  return envelopeFrom(model, loadCase, slug, {
    count: samples.length,
    crankDeg: (i) => samples[i].position.crankDeg,
    member: (i, b, out) => {
      const m = samples[i].members[names[b]]
      out[1] = m.axialMax
      out[2] = m.axialMin
      out[4] = m.eye
      out[5] = m.eyeAt
      out[6] = m.across
    },
    moment: (i, b) => samples[i].position.linkMoments?.[names[b]],
    reaction: (i, g) => samples[i].position.reactions[grounds[g]]?.magnitude,
    pin: (i, j) => samples[i].position.pinForces[joints[j]]?.magnitude,
    torque: (i) => samples[i].position.driveTorque,
  })
}

/** envelopeOf read straight from a flat sweep's case: the same envelope, no sample objects. */
export function envelopeOfArrays(s: SweepArrays, c: CaseArrays, slug?: string): LoadCaseEnvelope {
  const model = s.model
  const nl = model.links.length
  const moments = model.links.map((l) => l.kind !== 'bar' || !!c.loads.weightPerMm)
  // Pins in model.attached order; the flat sweep keeps them in model.jointPoints order.
  const jp = Object.keys(model.attached).map((j) => model.jointPoints.findIndex((p) => p.joint === j))
  const njp = model.jointPoints.length
  const ng = s.grounds.length
  const grounds = Object.keys(model.ground).map((g) => s.grounds.indexOf(g))
  return envelopeFrom(model, c.name, slug, {
    count: s.count,
    crankDeg: (i) => s.crankDeg[i],
    member: (i, b, out) => {
      const k = (i * nl + b) * MEMBER_FIELDS
      for (let f = 0; f < MEMBER_FIELDS; f++) out[f] = c.members[k + f]
    },
    moment: (i, b) => (moments[b] ? c.members[(i * nl + b) * MEMBER_FIELDS + 3] : undefined),
    reaction: (i, g) => (grounds[g] >= 0 ? c.reactions[(i * ng + grounds[g]) * 3 + 2] : undefined),
    pin: (i, j) => (jp[j] >= 0 ? c.pinMagnitude[i * njp + jp[j]] : undefined),
    torque: (i) => c.torque[i],
  })
}

function envelopeFrom(model: LinkageModel, loadCase: string, slug: string | undefined, src: EnvelopeSource): LoadCaseEnvelope {
  const names = model.links.map((l) => l.name)
  const joints = Object.keys(model.attached)
  const first = src.count > 0 ? src.crankDeg(0) : 0
  const tension = names.map(() => new Largest(first))
  const compression = names.map(() => new Largest(first))
  const moment = names.map(() => new Largest(first))
  const pin = joints.map(() => new Largest(first))
  const torque = new Largest(first)
  const eye = names.map(() => new Largest(first))
  const eyeAt = names.map(() => 0)
  const across = names.map(() => 0)
  const grounds = Object.keys(model.ground)
  const reaction = grounds.map(() => new Largest(first))
  const m = new Float64Array(MEMBER_FIELDS)
  for (let i = 0; i < src.count; i++) {
    const crankDeg = src.crankDeg(i)
    for (let b = 0; b < names.length; b++) {
      src.member(i, b, m)
      tension[b].offer(m[1], crankDeg)
      compression[b].offer(-m[2], crankDeg)
      moment[b].offer(src.moment(i, b), crankDeg)
      const before = eye[b].value
      eye[b].offer(m[4], crankDeg)
      if (eye[b].value !== before || !eye[b].found) eyeAt[b] = m[5]
      across[b] = Math.max(across[b], m[6])
    }
    for (let g = 0; g < grounds.length; g++) reaction[g].offer(src.reaction(i, g), crankDeg)
    for (let j = 0; j < joints.length; j++) pin[j].offer(src.pin(i, j), crankDeg)
    torque.offer(Math.abs(src.torque(i)), crankDeg)
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
  let at = -1
  for (let i = 0; i < src.count && at < 0; i++) if (src.crankDeg(i) === torque.crankDeg) at = i
  return {
    loadCase,
    ...(slug ? { slug } : {}),
    links,
    pins,
    eyes,
    reactions,
    driveTorque: { value: at >= 0 ? src.torque(at) : 0, crankDeg: torque.crankDeg },
  }
}
