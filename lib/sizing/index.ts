/**
 * The sizing assistant: from what the machine needs (stroke, line offset or a range of it, an
 * envelope, a smallest transmission angle, the load) to ranked, feasible dimensions for the
 * Peaucellier cell and Hart's inversor. Pure: the CLI (`npm run size`), the API
 * (`POST /api/v1/size`) and the bench call it alike, and every proposal is measured by the same
 * engine a calc uses (lib/linkage for the positions, `runMechanism` for the forces).
 *
 * Method: with the crank pivot on the crank circle through the pole (e = r) the line sits at
 * d = k/(2r). For a target d, a crank r and a link proportion (s/l, or b/a and μ) fix the cell:
 * l = √(2rd/(1 − σ²)), a = √(2rd/(μ(1 − μ)(1 − β²))). A grid over r, the proportion (and μ) is
 * screened by kinematics (usable stroke, transmission angle over the stroke, envelope); the
 * survivors get statics over the stroke and are ranked by the goal.
 */
import { runMechanism } from '@/lib/calc/mechanism'
import { assessGeometry, placeAt } from '@/lib/linkage'
import { getMechanism } from '@/lib/mechanisms'
import type { Vec } from '@/lib/linkage/vec'
import { sizingInputSchema, GOAL_LABELS, type SizingGoal, type SizingInput, type SizingRequest } from './schema'

export { sizingInputSchema, SIZING_GOALS, GOAL_LABELS, type SizingGoal, type SizingInput, type SizingRequest } from './schema'

export interface SizingMetrics {
  usableStroke: number
  lineOffset: number
  minTransmissionDeg: number
  peakPinForce: number
  peakPinJoint: string
  peakTorque: number
  footprint: { width: number; height: number; area: number }
  /** Crank angles that cover the stroke asked for, degrees (±). */
  crankRangeDeg: number
}

export interface SizingProposal {
  mechanism: 'peaucellier' | 'hart'
  label: string
  /** Ready for a calc input's `geometry` (mm; e = r, the straight line). */
  geometry: Record<string, number>
  metrics: SizingMetrics
  /** 1 = best for the goal over every mechanism. */
  rank: number
  /** How it compares with the best proposal, in words. */
  tradeoff: string
}

export interface SizingOutput {
  goal: SizingGoal
  goalLabel: string
  request: SizingRequest
  proposals: SizingProposal[]
  /** How many candidates were tried and how many met every constraint. */
  tried: number
  feasible: number
  /** Why nothing was found, when nothing was. */
  advice?: string
}

const DEG = Math.PI / 180
const round1 = (x: number) => Math.round(x * 10) / 10
const round3 = (x: number) => Math.round(x * 1000) / 1000

function offsetsOf(req: SizingRequest): number[] {
  const o = req.offset
  if (typeof o === 'number') return [o]
  if (o) return o.max === o.min ? [o.min] : Array.from({ length: 5 }, (_, i) => o.min + ((o.max - o.min) * i) / 4)
  return [0.5, 0.75, 1, 1.25, 1.5, 2].map((f) => f * req.stroke)
}

function offsetOk(req: SizingRequest, d: number): boolean {
  const o = req.offset
  if (typeof o === 'number') return Math.abs(d - o) <= 0.5
  if (o) return d >= o.min - 1e-9 && d <= o.max + 1e-9
  return true
}

const CRANK_FACTORS = [0.12, 0.16, 0.2, 0.25, 0.3, 0.4, 0.5, 0.6, 0.75, 0.9, 1.1, 1.4, 1.8]
const PROPORTIONS = [0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8]
const RATIOS = [0.2, 0.3, 0.4, 0.5, 0.6, 0.7]

/** Geometries to try, each on the straight line (e = r) at offset d, lengths to 0.1 mm. */
function* candidates(req: SizingRequest, mechanism: 'peaucellier' | 'hart'): Generator<Record<string, number>> {
  for (const d of offsetsOf(req)) {
    for (const f of CRANK_FACTORS) {
      const r = round1(f * req.stroke)
      if (r <= 0) continue
      for (const p of PROPORTIONS) {
        if (mechanism === 'peaucellier') {
          const l = Math.sqrt((2 * r * d) / (1 - p * p))
          yield { arm: round1(l), side: round1(p * l), crank: r, crankPivotOffset: r }
        } else {
          for (const mu of RATIOS) {
            const a = Math.sqrt((2 * r * d) / (mu * (1 - mu) * (1 - p * p)))
            yield { long: round1(a), short: round1(p * a), ratio: mu, crank: r, crankPivotOffset: r }
          }
        }
      }
    }
  }
}

/** Angle between two links at a vertex, folded to 0–90° (0° = in line), as the engine reports it. */
function transmission(j: Record<string, Vec>, v: string, a: string, b: string): number {
  const ux = j[a].x - j[v].x
  const uy = j[a].y - j[v].y
  const wx = j[b].x - j[v].x
  const wy = j[b].y - j[v].y
  const c = (ux * wx + uy * wy) / (Math.hypot(ux, uy) * Math.hypot(wx, wy))
  const g = Math.acos(Math.min(1, Math.max(-1, c))) / DEG
  return Math.min(g, 180 - g)
}

interface Screened {
  mechanism: 'peaucellier' | 'hart'
  geometry: Record<string, number>
  angles: number[]
  metrics: Omit<SizingMetrics, 'peakPinForce' | 'peakPinJoint' | 'peakTorque'>
}

/** Kinematics only: stroke, offset, transmission angle over the stroke, envelope. */
function screen(req: SizingRequest, mechanism: 'peaucellier' | 'hart', geometry: Record<string, number>): Screened | null {
  const def = getMechanism(mechanism)
  const parsed = def.geometry.safeParse(geometry)
  if (!parsed.success) return null
  const { cell, crank: r, offset: e } = def.model(parsed.data)
  const v = assessGeometry(cell, e, r, req.toggleMarginDeg)
  if (!v.feasibility.ok || v.path?.kind !== 'line') return null
  const usableStroke = 2 * v.usable.half
  if (usableStroke < req.stroke || !offsetOk(req, v.lineOffset)) return null
  // The crank angle at which the tracer reaches the end of the stroke asked for (|T_y| grows with |θ|).
  const ty = (deg: number) => Math.abs(placeAt(cell, e, r, deg * DEG)?.T.y ?? Infinity)
  let lo = 0
  let hi = v.usable.crankMaxDeg
  if (ty(hi) < req.stroke / 2) return null
  for (let i = 0; i < 50; i++) {
    const mid = (lo + hi) / 2
    if (ty(mid) < req.stroke / 2) lo = mid
    else hi = mid
  }
  const range = hi
  const n = 13
  const angles = Array.from({ length: n }, (_, i) => -range + (2 * range * i) / (n - 1))
  let minT = 90
  let x0 = 0
  let x1 = 0
  let y0 = 0
  let y1 = 0
  for (const deg of angles) {
    const j = placeAt(cell, e, r, deg * DEG)
    if (!j) return null
    for (const [vx, a, b] of cell.transmission) minT = Math.min(minT, transmission(j, vx, a, b))
    for (const p of Object.values(j)) {
      x0 = Math.min(x0, p.x)
      x1 = Math.max(x1, p.x)
      y0 = Math.min(y0, p.y)
      y1 = Math.max(y1, p.y)
    }
  }
  if (minT < req.minTransmissionDeg) return null
  const footprint = { width: x1 - x0, height: y1 - y0, area: (x1 - x0) * (y1 - y0) }
  if (req.envelope && (footprint.width > req.envelope.width || footprint.height > req.envelope.height)) return null
  return { mechanism, geometry, angles, metrics: { usableStroke, lineOffset: v.lineOffset, minTransmissionDeg: minT, footprint, crankRangeDeg: range } }
}

/** Statics over the stroke by the calc's own engine; null when a position is locked. */
function withForces(req: SizingRequest, s: Screened): SizingMetrics | null {
  const out = runMechanism({
    mechanism: s.mechanism,
    geometry: s.geometry,
    loads: [{ name: 'Load', fx: req.load.fx, fy: req.load.fy }],
    crankAnglesDeg: s.angles,
    toggleMarginDeg: req.toggleMarginDeg,
  } as Parameters<typeof runMechanism>[0])
  if (!out.feasibility.ok || out.toggles.length > 0 || out.positions.length !== s.angles.length) return null
  let pin = { value: 0, joint: '' }
  let torque = 0
  for (const p of out.positions) {
    torque = Math.max(torque, Math.abs(p.driveTorque))
    for (const [joint, f] of Object.entries(p.pinForces)) if (f.magnitude > pin.value) pin = { value: f.magnitude, joint }
  }
  return { ...s.metrics, peakPinForce: pin.value, peakPinJoint: pin.joint, peakTorque: torque }
}

const score: Record<SizingGoal, (m: SizingMetrics) => number> = {
  'pin-force': (m) => m.peakPinForce,
  torque: (m) => m.peakTorque,
  footprint: (m) => m.footprint.area,
}

/** Two proposals are alike when every length is within 5 % of the other's. */
function alike(a: Record<string, number>, b: Record<string, number>): boolean {
  return Object.keys(a).every((k) => Math.abs(a[k] - b[k]) <= 0.05 * Math.max(Math.abs(a[k]), Math.abs(b[k]), 1e-9))
}

function pct(x: number, best: number): string {
  if (best === 0) return ''
  const p = Math.round((Math.abs(x - best) / best) * 100)
  return p === 0 ? ' (same)' : ` (${x > best ? '+' : '−'}${p} %)`
}
const n0 = (x: number) => String(Math.round(x))

function tradeoffOf(m: SizingMetrics, best: SizingMetrics, first: boolean): string {
  const parts = [
    `peak pin force ${n0(m.peakPinForce)} N${first ? '' : pct(m.peakPinForce, best.peakPinForce)}`,
    `peak drive torque ${n0(m.peakTorque)} N·mm${first ? '' : pct(m.peakTorque, best.peakTorque)}`,
    `footprint ${n0(m.footprint.width)} × ${n0(m.footprint.height)} mm${first ? '' : pct(m.footprint.area, best.footprint.area)}`,
    `smallest transmission angle ${Math.round(m.minTransmissionDeg)}°`,
  ]
  return first ? `Best for the goal: ${parts.join(', ')}.` : `Against the best: ${parts.join(', ')}.`
}

export function sizeMechanism(input: SizingInput): SizingOutput {
  const req = sizingInputSchema.parse(input)
  let tried = 0
  const found: { mechanism: 'peaucellier' | 'hart'; geometry: Record<string, number>; metrics: SizingMetrics }[] = []
  for (const mechanism of req.mechanisms) {
    for (const geometry of candidates(req, mechanism)) {
      tried++
      const s = screen(req, mechanism, geometry)
      const metrics = s && withForces(req, s)
      if (metrics) found.push({ mechanism, geometry, metrics })
    }
  }
  const rank = score[req.goal]
  found.sort((a, b) => rank(a.metrics) - rank(b.metrics) || a.metrics.footprint.area - b.metrics.footprint.area)
  const chosen: typeof found = []
  for (const mechanism of req.mechanisms) {
    const mine: typeof found = []
    for (const c of found) {
      if (c.mechanism !== mechanism || mine.some((m) => alike(m.geometry, c.geometry))) continue
      mine.push(c)
      if (mine.length === req.count) break
    }
    chosen.push(...mine)
  }
  chosen.sort((a, b) => rank(a.metrics) - rank(b.metrics) || a.metrics.footprint.area - b.metrics.footprint.area)
  const best = chosen[0]?.metrics
  const proposals = chosen.map((c, i) => ({
    mechanism: c.mechanism,
    label: getMechanism(c.mechanism).label,
    geometry: Object.fromEntries(Object.entries(c.geometry).map(([k, v]) => [k, round3(v)])),
    metrics: c.metrics,
    rank: i + 1,
    tradeoff: tradeoffOf(c.metrics, best!, i === 0),
  }))
  const advice = proposals.length
    ? undefined
    : 'No cell met every constraint. Allow a smaller transmission angle, a larger envelope, a wider offset range or a shorter stroke.'
  return { goal: req.goal, goalLabel: GOAL_LABELS[req.goal], request: req, proposals, tried, feasible: found.length, advice }
}

/** A new calc's input for a proposal: the geometry, the load, the stroke and the working crank range. */
export function calcInputOf(p: SizingProposal, req: SizingRequest): Record<string, unknown> {
  return {
    mechanism: p.mechanism,
    geometry: p.geometry,
    loads: [{ name: 'Working load', fx: req.load.fx, fy: req.load.fy }],
    toggleMarginDeg: req.toggleMarginDeg,
    requiredStroke: req.stroke,
  }
}
