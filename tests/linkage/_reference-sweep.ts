/**
 * The sweep as it was written before the flat-array engine (commit 35fa225): one object per
 * position and case, built from the per-position public functions (placeAt, solveStatics,
 * memberForces, pinForces, groundReactions, equilibriumResidual, virtualWorkTorque). It is the
 * straightforward definition the flat sweep must reproduce bit for bit.
 */
import type { InversorCell } from '@/lib/linkage/cells/cell'
import { linkageOf, placeAt } from '@/lib/linkage/crank'
import { groundReactions, memberForces, pinForces, type MemberForces } from '@/lib/linkage/members'
import { buildModel, pointsFromJoints, type LinkageModel } from '@/lib/linkage/model'
import type { PositionResult, ToggleFlag } from '@/lib/contract'
import { equilibriumResidual, solveStatics, staticsWorkspace, type CaseLoads } from '@/lib/linkage/statics'
import { DEG, dot, dist, sub, type Vec } from '@/lib/linkage/vec'
import { virtualWorkTorque, VW_STEP } from '@/lib/linkage/virtual-work'
import type { CaseSample, SweepInput, SweepOutput } from '@/lib/linkage/sweep'

/** Unit forces at the tracer: they measure force amplification whatever the user's loads are. */
const PROBES: CaseLoads[] = [
  { name: 'probe-x', pointLoads: [{ joint: 'T', force: { x: 1, y: 0 } }], weightPerMm: null },
  { name: 'probe-y', pointLoads: [{ joint: 'T', force: { x: 0, y: 1 } }], weightPerMm: null },
]

/** Angle between two links at a vertex, folded to 0–90°: 0° means in line (toggle). */
function transmissionAngle(j: Record<string, Vec>, v: string, a: string, b: string): number {
  const u = sub(j[a], j[v])
  const w = sub(j[b], j[v])
  const c = dot(u, w) / (dist(j[a], j[v]) * dist(j[b], j[v]))
  const g = Math.acos(Math.min(1, Math.max(-1, c))) / DEG
  return Math.min(g, 180 - g)
}

export function referenceSweep(input: SweepInput): SweepOutput {
  const { cell, crank: r, offset: e } = input
  const model = buildModel(linkageOf(cell, e, r))
  const loads: CaseLoads[] = input.loads.map((l) => ({
    name: l.name,
    pointLoads: [{ joint: 'T', force: { x: l.fx, y: l.fy } }],
    weightPerMm: input.weightPerMm,
  }))
  const cases = loads.map((l) => ({ name: l.name, samples: [] as CaseSample[] }))
  const toggles: ToggleFlag[] = []
  const solved = [...loads, ...PROBES]
  // Reused at every position: nothing solved into them outlives its iteration.
  const statics = staticsWorkspace(model, solved.length)
  const pts = new Float64Array(2 * model.pointCount)
  for (const crankDeg of input.anglesDeg) {
    const th = crankDeg * DEG
    const joints = placeAt(cell, e, r, th)
    if (!joints) {
      toggles.push({ crankDeg, reason: 'unreachable' })
      continue
    }
    pointsFromJoints(model, joints, pts)
    const st = solveStatics(model, pts, solved, loads.length, statics)
    if (!st.ok) {
      toggles.push({ crankDeg, reason: 'singular' })
      continue
    }
    const amplification = Math.max(st.largestConnection[loads.length], st.largestConnection[loads.length + 1])
    if (amplification > input.amplificationLimit) {
      toggles.push({ crankDeg, reason: 'force-amplification', amplification })
      continue
    }
    const before = placeAt(cell, e, r, th - VW_STEP)
    const after = placeAt(cell, e, r, th + VW_STEP)
    const angles: Record<string, number> = {}
    let minAngle = Infinity
    for (const [v, a, b] of cell.transmission) {
      angles[v] = transmissionAngle(joints, v, a, b)
      minAngle = Math.min(minAngle, angles[v])
    }
    for (let i = 0; i < loads.length; i++) {
      const lc = loads[i]
      const cs = st.cases[i]
      const members: Record<string, MemberForces> = {}
      const linkForces: Record<string, number> = {}
      const linkMoments: Record<string, number> = {}
      for (let b = 0; b < model.links.length; b++) {
        const l = model.links[b]
        const m = memberForces(model, pts, b, lc, cs)
        members[l.name] = m
        linkForces[l.name] = l.kind === 'beam' ? (m.axialMax >= -m.axialMin ? m.axialMax : m.axialMin) : m.axialMid
        if (l.kind !== 'bar' || lc.weightPerMm) linkMoments[l.name] = m.moment
      }
      const vw = before && after ? virtualWorkTorque(model, before, after, lc) : null
      const scale = vw ? Math.max(Math.abs(cs.torque), Math.abs(vw.torque), vw.scale) : 0
      cases[i].samples.push({
        position: {
          crankDeg,
          tracer: { ...joints.T },
          joints,
          linkForces,
          pinForces: pinForces(model, cs),
          reactions: groundReactions(model, cs),
          driveTorque: cs.torque,
          linkMoments,
          transmissionAngleDeg: minAngle,
          transmissionAngles: angles,
        },
        members,
        residual: equilibriumResidual(model, pts, lc, cs),
        vwTorque: vw ? vw.torque : cs.torque,
        vwError: scale > 0 && vw ? Math.abs(cs.torque - vw.torque) / scale : 0,
      })
    }
  }
  return { model, cases, toggles }
}
