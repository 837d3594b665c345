/**
 * Forces at operating speed over a sweep of crank angles: kinematics from the loop-closure
 * equations, d'Alembert kinetostatics for every load case, and the virtual-power check at every
 * position. Each case's samples have the shape of the static sweep's (lib/linkage/sweep.ts
 * CaseSample), so the envelope code and the component checks can take the case at speed as one
 * more load case.
 */
import type { Extreme, PositionResult, ToggleFlag } from '@/lib/contract'
import type { InversorCell } from '@/lib/linkage/cells/cell'
import { linkageOf, placeAt } from '@/lib/linkage/crank'
import { envelopeOf } from '@/lib/linkage/envelope'
import { groundReactions, pinForces, type MemberForces } from '@/lib/linkage/members'
import { buildModel, linkLength, pointsFromJoints, type LinkageModel } from '@/lib/linkage/model'
import { caseSlugs } from '@/lib/linkage/report/context'
import type { CaseLoads } from '@/lib/linkage/statics'
import type { CaseSample, LoadInput } from '@/lib/linkage/sweep'
import type { Vec } from '@/lib/linkage/vec'
import { atSpeed, jointMotions, kinematicsWorkspace, linkMotions, pointRates, unitRates, type LinkMotion, type PointMotion } from './kinematics'
import { equilibriumResidual, KG_MM_S2_TO_N, kinetoWorkspace, memberForcesAlong, solveLoadSets, type PositionLoads, type SolvedCase } from './kinetostatics'
import { linkMasses, type AddedMass, type LinkBody, type LinkMass } from './mass'
import { crankRate, describeMotion, type MotionLaw } from './motion'
import { closedFormRates, virtualPower } from './virtual-power'
import { dynamicsSteps, dynamicsTables } from './steps'
import type { DynamicCase, DynamicSample, DynamicsResult, PositionKinematics } from './types'

export type { DynamicCase, DynamicSample, DynamicsResult, PositionKinematics } from './types'

const DEG = Math.PI / 180

export interface DynamicsInput {
  model: LinkageModel
  /** Every joint at a crank angle (rad), or null out of reach: the closed-form positions. */
  place: (crankRad: number) => Record<string, Vec> | null
  anglesDeg: number[]
  motion: MotionLaw
  /** Section area and density of every link, by link name. */
  bodies: Record<string, LinkBody>
  /** Point masses at joints, e.g. the tool or carriage at the tracer T, kg. */
  addedMasses?: AddedMass[]
  /** The static load cases (point loads at joints, N; link weight per mm, N/mm). */
  loads: CaseLoads[]
  /**
   * Gravity on the link masses and the added masses, m/s² (e.g. { x: 0, y: −9.81 }). Leave it out
   * when the static cases already carry the links' self-weight (`weightPerMm`), or it counts twice.
   */
  gravity?: Vec | null
  /** Joint whose unit loads measure force amplification, and that the positions report as tracer. Default `T`. */
  tracer?: string
  /** Positions whose largest pin force per newton at the tracer exceeds this are left out. Default 100. */
  amplificationLimit?: number
  /** Watched angles [vertex, end, end] for the transmission angle, as the cells give them. */
  transmission?: [string, string, string][]
  /** Name of the case at speed, from the static case's name. Default `<name> at speed`. */
  caseName?: (staticName: string) => string
}

/** Loads on every link and added mass from their masses, accelerations and gravity. */
function inertiaLoads(model: LinkageModel, pts: Float64Array, masses: LinkMass[], added: AddedMass[], u: NonNullable<ReturnType<typeof unitRates>>, links: LinkMotion[], jm: Record<string, PointMotion>, omega: number, alpha: number, gravity: Vec | null, withInertia: boolean): PositionLoads {
  const c = withInertia ? KG_MM_S2_TO_N : 0
  const gx = gravity?.x ?? 0
  const gy = gravity?.y ?? 0
  const along: PositionLoads['along'] = []
  const resultant: PositionLoads['resultant'] = []
  model.links.forEach((l, b) => {
    const m = masses[b]
    const mu = m.mass / m.length
    const o = 2 * model.offset[b]
    const e = o + 2 * (l.points.length - 1)
    const ex = (pts[e] - pts[o]) / m.length
    const ey = (pts[e + 1] - pts[o + 1]) / m.length
    const r = pointRates(model, pts, u, b, pts[o], pts[o + 1])
    const a1 = atSpeed(r.d1, r.d2, omega, alpha).a
    const lm = links[b]
    // a(s) = a₁ + s (α n − ω² e), n = e turned a quarter turn.
    const k1 = { x: lm.alpha * -ey - lm.omega * lm.omega * ex, y: lm.alpha * ex - lm.omega * lm.omega * ey }
    along.push({ q0: { x: mu * gx - c * mu * a1.x, y: mu * gy - c * mu * a1.y }, q1: { x: -c * mu * k1.x, y: -c * mu * k1.y } })
    resultant.push({
      force: { x: m.mass * gx - c * m.mass * lm.aG.x, y: m.mass * gy - c * m.mass * lm.aG.y },
      at: { x: (pts[o] + pts[e]) / 2, y: (pts[o + 1] + pts[e + 1]) / 2 },
      couple: -c * m.inertia * lm.alpha,
    })
  })
  const point = added
    .filter((a) => !(a.joint in model.ground))
    .map((a) => ({ joint: a.joint, force: { x: a.mass * gx - c * a.mass * jm[a.joint].a.x, y: a.mass * gy - c * a.mass * jm[a.joint].a.y } }))
  return { point, along, resultant }
}

/** The static case's loads at a position, added to the mass loads. */
function withCase(model: LinkageModel, pts: Float64Array, base: PositionLoads, lc: CaseLoads): PositionLoads {
  const w = lc.weightPerMm
  return {
    point: [...lc.pointLoads, ...base.point],
    along: base.along.map((q) => (w ? { q0: { x: q.q0.x + w.x, y: q.q0.y + w.y }, q1: q.q1 } : q)),
    resultant: base.resultant.map((r, b) => {
      if (!w) return r
      const L = linkLength(model.links[b])
      return { ...r, force: { x: r.force.x + w.x * L, y: r.force.y + w.y * L } }
    }),
  }
}

function vertexAngle(j: Record<string, Vec>, v: string, a: string, b: string): number {
  const ux = j[a].x - j[v].x
  const uy = j[a].y - j[v].y
  const wx = j[b].x - j[v].x
  const wy = j[b].y - j[v].y
  const g = Math.acos(Math.min(1, Math.max(-1, (ux * wx + uy * wy) / (Math.hypot(ux, uy) * Math.hypot(wx, wy))))) / DEG
  return Math.min(g, 180 - g)
}

function sampleOf(model: LinkageModel, pts: Float64Array, joints: Record<string, Vec>, crankDeg: number, tracer: string, loads: PositionLoads, st: SolvedCase, angles: Record<string, number> | null): CaseSample {
  const members: Record<string, MemberForces> = {}
  const linkForces: Record<string, number> = {}
  const linkMoments: Record<string, number> = {}
  model.links.forEach((l, b) => {
    const m = memberForcesAlong(model, pts, b, loads.along[b], st)
    members[l.name] = m
    linkForces[l.name] = l.kind === 'beam' ? (m.axialMax >= -m.axialMin ? m.axialMax : m.axialMin) : m.axialMid
    linkMoments[l.name] = m.moment
  })
  const position: PositionResult = {
    crankDeg,
    tracer: { ...joints[tracer] },
    joints,
    linkForces,
    pinForces: pinForces(model, st),
    reactions: groundReactions(model, st),
    driveTorque: st.torque,
    linkMoments,
    ...(angles ? { transmissionAngleDeg: Math.min(...Object.values(angles)), transmissionAngles: angles } : {}),
  }
  return { position, members, residual: equilibriumResidual(model, pts, loads, st), vwTorque: st.torque, vwError: 0 }
}

/** Size of the loads a case applies at a position, N: the scale of its equilibrium residual. */
function appliedSize(loads: PositionLoads): number {
  let s = 0
  for (const p of loads.point) s += Math.hypot(p.force.x, p.force.y)
  for (const r of loads.resultant) s += Math.hypot(r.force.x, r.force.y)
  return s
}

export function runDynamics(input: DynamicsInput): DynamicsResult {
  const { model, motion } = input
  const tracer = input.tracer ?? 'T'
  if (!(tracer in model.attached)) throw new Error(`no joint ${tracer} in the mechanism`)
  const masses = linkMasses(model, input.bodies)
  const added = input.addedMasses ?? []
  for (const a of added) {
    if (!(a.joint in model.attached)) throw new Error(`added mass at ${a.joint}: no such joint`)
    if (!(a.mass >= 0)) throw new Error(`added mass at ${a.joint} must not be negative`)
  }
  if (motion.kind === 'harmonic') {
    const lo = Math.min(motion.fromDeg, motion.toDeg) - 1e-9
    const hi = Math.max(motion.fromDeg, motion.toDeg) + 1e-9
    const out = input.anglesDeg.filter((d) => d < lo || d > hi)
    if (out.length) throw new Error(`crank angles ${out.join(', ')}° lie outside the harmonic swing ${motion.fromDeg}° … ${motion.toDeg}°`)
  }
  const gravity = input.gravity ?? null
  const limit = input.amplificationLimit ?? 100
  const names = input.loads.map((l) => (input.caseName ? input.caseName(l.name) : `${l.name} at speed`))
  const slugs = caseSlugs(names)
  const cases: DynamicCase[] = input.loads.map((l, i) => ({ name: names[i], staticName: l.name, slug: slugs[i], samples: [], withoutInertia: [] }))
  const toggles: ToggleFlag[] = []
  const kinematics: PositionKinematics[] = []
  const kws = kinematicsWorkspace(model)
  const sws = kinetoWorkspace(model)
  const pts = new Float64Array(2 * model.pointCount)
  const zero = model.links.map(() => ({ q0: { x: 0, y: 0 }, q1: { x: 0, y: 0 } }))
  const probe = (x: number, y: number): PositionLoads => ({ point: [{ joint: tracer, force: { x, y } }], along: zero, resultant: model.links.map(() => ({ force: { x: 0, y: 0 }, at: { x: 0, y: 0 }, couple: 0 })) })
  const probes = tracer in model.ground ? [] : [probe(1, 0), probe(0, 1)]
  let eqWorst = { worst: 0, loadCase: input.loads[0]?.name ?? '' }
  for (const crankDeg of input.anglesDeg) {
    const th = crankDeg * DEG
    const joints = input.place(th)
    if (!joints) {
      toggles.push({ crankDeg, reason: 'unreachable' })
      continue
    }
    pointsFromJoints(model, joints, pts)
    const u = unitRates(model, pts, kws)
    if (!u) {
      toggles.push({ crankDeg, reason: 'singular' })
      continue
    }
    const { omega, alpha } = crankRate(motion, th)
    const lm = linkMotions(model, pts, u, omega, alpha)
    const jm = jointMotions(model, pts, u, omega, alpha)
    const moving = inertiaLoads(model, pts, masses, added, u, lm, jm, omega, alpha, gravity, true)
    const still = inertiaLoads(model, pts, masses, added, u, lm, jm, omega, alpha, gravity, false)
    const sets: PositionLoads[] = []
    for (const lc of input.loads) sets.push(withCase(model, pts, moving, lc), withCase(model, pts, still, lc))
    const solved = solveLoadSets(model, pts, [...sets, ...probes], sws)
    if (!solved) {
      toggles.push({ crankDeg, reason: 'singular' })
      continue
    }
    if (probes.length) {
      const amplification = Math.max(solved[sets.length].largestConnection, solved[sets.length + 1].largestConnection)
      if (amplification > limit) {
        toggles.push({ crankDeg, reason: 'force-amplification', amplification })
        continue
      }
    }
    const linksRec: Record<string, LinkMotion> = {}
    const inertia: DynamicSample['inertia'] = {}
    model.links.forEach((l, b) => {
      linksRec[l.name] = lm[b]
      const m = masses[b]
      inertia[l.name] = {
        force: { x: -KG_MM_S2_TO_N * m.mass * lm[b].aG.x, y: -KG_MM_S2_TO_N * m.mass * lm[b].aG.y },
        couple: -KG_MM_S2_TO_N * m.inertia * lm[b].alpha,
      }
    })
    kinematics.push({ crankDeg, omega, alpha, joints: jm, links: linksRec })
    const angles = input.transmission ? Object.fromEntries(input.transmission.map(([v, a, b]) => [v, vertexAngle(joints, v, a, b)])) : null
    const rates = closedFormRates(input.place, th)
    input.loads.forEach((lc, i) => {
      const dyn = sets[2 * i]
      const st = solved[2 * i]
      const base = sampleOf(model, pts, joints, crankDeg, tracer, dyn, st, angles)
      const power = rates ? virtualPower({ model, joints, rates, masses, added, loads: lc, gravity, omega, alpha, torque: st.torque }) : null
      cases[i].samples.push({
        ...base,
        vwTorque: power ? power.torque : st.torque,
        vwError: power ? power.relative : 0,
        omega,
        alpha,
        staticTorque: solved[2 * i + 1].torque,
        inertia,
        power,
        applied: appliedSize(dyn),
      })
      cases[i].withoutInertia.push(sampleOf(model, pts, joints, crankDeg, tracer, sets[2 * i + 1], solved[2 * i + 1], angles))
      const size = appliedSize(dyn)
      const rel = size > 0 ? base.residual / size : base.residual
      if (rel > eqWorst.worst) eqWorst = { worst: rel, loadCase: cases[i].name }
    })
  }
  const result: Omit<DynamicsResult, 'steps' | 'tables'> = {
    tracer,
    motion: {
      kind: motion.kind,
      description: describeMotion(motion),
      ...(motion.kind === 'constant' ? { rpm: motion.rpm } : {}),
      ...(motion.kind === 'harmonic' ? { cyclesPerMinute: motion.cyclesPerMinute } : {}),
    },
    masses,
    addedMasses: added,
    gravity,
    kinematics,
    cases,
    toggles,
    peaks: peaksOf(model, tracer, kinematics, cases),
    checks: { virtualPower: worstPower(cases, kinematics.length), equilibrium: eqWorst },
  }
  return { ...result, steps: dynamicsSteps(result), tables: dynamicsTables(result) }
}

function largest(values: { v: number; signed?: number; crankDeg: number }[]): Extreme {
  let best: Extreme = { value: 0, crankDeg: values[0]?.crankDeg ?? 0 }
  let top = -1
  for (const x of values) {
    if (Math.abs(x.v) > top) {
      top = Math.abs(x.v)
      best = { value: x.signed ?? x.v, crankDeg: x.crankDeg }
    }
  }
  return best
}

function peaksOf(model: LinkageModel, tracer: string, kin: PositionKinematics[], cases: DynamicCase[]): DynamicsResult['peaks'] {
  const links: DynamicsResult['peaks']['links'] = {}
  for (const l of model.links) {
    links[l.name] = {
      acceleration: largest(kin.map((k) => ({ v: Math.hypot(k.links[l.name].aG.x, k.links[l.name].aG.y), crankDeg: k.crankDeg }))),
      angular: largest(kin.map((k) => ({ v: Math.abs(k.links[l.name].alpha), signed: k.links[l.name].alpha, crankDeg: k.crankDeg }))),
    }
  }
  return {
    crankSpeed: largest(kin.map((k) => ({ v: Math.abs(k.omega), signed: k.omega, crankDeg: k.crankDeg }))),
    crankAcceleration: largest(kin.map((k) => ({ v: Math.abs(k.alpha), signed: k.alpha, crankDeg: k.crankDeg }))),
    tracerAcceleration: largest(kin.map((k) => ({ v: Math.hypot(k.joints[tracer].a.x, k.joints[tracer].a.y), crankDeg: k.crankDeg }))),
    links,
    torque: cases.map((c) => ({
      loadCase: c.name,
      slug: c.slug,
      atSpeed: largest(c.samples.map((s) => ({ v: s.position.driveTorque, crankDeg: s.position.crankDeg }))),
      static: largest(c.samples.map((s) => ({ v: s.staticTorque, crankDeg: s.position.crankDeg }))),
    })),
  }
}

function worstPower(cases: DynamicCase[], positions: number): DynamicsResult['checks']['virtualPower'] {
  let out = { worst: 0, crankDeg: 0, loadCase: cases[0]?.name ?? '', checked: cases[0]?.samples.filter((s) => s.power).length ?? 0, positions }
  for (const c of cases) {
    for (const s of c.samples) {
      if (s.power && s.power.relative >= out.worst) out = { ...out, worst: s.power.relative, crankDeg: s.position.crankDeg, loadCase: c.name }
    }
  }
  return out
}

/** The envelope of a case at speed (and of the same case without inertia), as the static sweep's. */
export function dynamicEnvelope(model: LinkageModel, c: DynamicCase) {
  return { atSpeed: envelopeOf(model, c.name, c.samples, c.slug), withoutInertia: envelopeOf(model, c.staticName, c.withoutInertia) }
}

/** The inputs of a named inversor cell, as the calc has them (lib/mechanisms `model()` gives cell, crank, offset). */
export interface MechanismDynamicsInput extends Omit<DynamicsInput, 'model' | 'place' | 'loads' | 'transmission'> {
  cell: InversorCell
  crank: number
  offset: number
  /** The static load cases at the tracer, N. */
  loads: LoadInput[]
  /** Self-weight per mm carried by the static cases, N/mm (as lib/linkage's sweep), or null. */
  weightPerMm?: Vec | null
}

/** runDynamics for a registered inversor mechanism: its cell and crank, loads at the tracer T. */
export function mechanismDynamics(input: MechanismDynamicsInput): DynamicsResult & { model: LinkageModel } {
  const { cell, crank: r, offset: e } = input
  const model = buildModel(linkageOf(cell, e, r))
  const loads: CaseLoads[] = input.loads.map((l) => ({ name: l.name, pointLoads: [{ joint: 'T', force: { x: l.fx, y: l.fy } }], weightPerMm: input.weightPerMm ?? null }))
  const out = runDynamics({ ...input, model, place: (th) => placeAt(cell, e, r, th), loads, transmission: cell.transmission })
  return { ...out, model }
}
