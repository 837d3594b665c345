/**
 * Analyses one approximate straight-line four-bar, sized for a stroke, over the working stroke:
 * the tracer path, its straightness (largest distance from the total-least-squares line), the
 * footprint, the drive angle range and the static forces under a load at the tracer, each position's
 * drive torque checked by virtual work.
 */
import type { Point } from '@/lib/contract'
import { add, dist, fitLine, norm, offsetFrom, rotate, type LineFit } from './geometry'
import { poseAt, staticsAt, type FourBar, type FourBarPose } from './model'
import type { SizedFourBar } from './linkages'

export interface FourBarOptions {
  /** Stroke the machine needs along the line, mm. */
  stroke: number
  /** Load applied to the mechanism at the tracer, N (in the global frame). */
  load: { fx: number; fy: number }
  /** Positions over the working stroke for the forces (equal steps of the drive angle); default 181. */
  positions?: number
  /**
   * Where the line lies: the middle of the stroke at `point` (default the origin), the line along
   * `angleDeg` from +x (default 0). The mechanism's frame sits on its own side of the line (see SizedFourBar).
   */
  line?: { point?: Point; angleDeg?: number }
}

/** Points equally spaced along the stroke at which the straightness is evaluated. */
export const STRAIGHTNESS_SAMPLES = 1001

export interface FourBarPosition {
  /** Drive angle (direction of A→B from the global +x), degrees. */
  inputDeg: number
  joints: { A: Point; B: Point; C: Point; D: Point; T: Point }
  /** Torque the drive applies to AB, N·mm, counter-clockwise positive. */
  torque: number
  /** The same torque by virtual work, τ = −F·dT/dθ with dT/dθ by central differences, N·mm. */
  torqueByVirtualWork: number
  /** Σ|F|·|dT/dθ|, the scale of the virtual-work comparison, N·mm. */
  virtualWorkScale: number
  /** Axial forces, N, tension positive; the driven link's force across it, N. */
  linkForces: { AB: number; DC: number; ABshear: number }
  /** Resultant pin forces, N. */
  pinForces: { A: number; B: number; C: number; D: number }
  /** Angle between coupler and rocker folded to 0–90°, degrees (0: in line, the drive's dead point). */
  transmissionDeg: number
}

export interface Peak {
  value: number
  inputDeg: number
}

export interface FourBarResult {
  name: string
  label: string
  source: string
  proportions: string
  rule: string
  drive: string
  tex: string
  stroke: number
  /** Link lengths, mm: AB driven link, BC coupler, DC rocker, AD frame; BT and the tracer's offset across BC. */
  lengths: { AB: number; BC: number; DC: number; AD: number; BT: number; tracerAcross: number }
  /** Bars counting the frame, moving links, revolute joints. */
  links: number
  movingLinks: number
  pins: number
  /** Drive angle range used (global frame), degrees, and its span. */
  inputRange: { fromDeg: number; toDeg: number; spanDeg: number }
  straightness: {
    /** Largest distance of the tracer from the fitted line over the stroke, mm. */
    error: number
    /** The total-least-squares line (global frame). */
    line: LineFit
    /** Tracer position of the largest distance. */
    at: Point
    samples: number
    /** Middle of the stroke and the line's nominal direction as placed (global frame). */
    nominal: { point: Point; direction: Point }
  }
  /** Bounding box of every joint (tracer included) over the working stroke, mm. */
  footprint: { width: number; height: number; min: Point; max: Point }
  peak: {
    pinForce: Peak & { joint: 'A' | 'B' | 'C' | 'D' }
    torque: Peak
    /** Largest |axial force| of the driven link and of the rocker, N. */
    drivenLinkAxial: Peak
    rockerAxial: Peak
    drivenLinkShear: Peak
  }
  minTransmissionDeg: number
  /** Largest |τ − τ_vw| / max(scale, 1e-9·|F|·a) over the positions. */
  virtualWorkError: number
  positions: FourBarPosition[]
  /** The tracer at the straightness samples, global frame. */
  path: Point[]
  load: { fx: number; fy: number }
}

const DEG = 180 / Math.PI
const VW_STEP = 1e-6

/** Drive angle where the tracer's coordinate along the line (local x) is `target`, searching away from θ₀. */
function angleForX(m: FourBar, theta0: number, target: number): number {
  const p0 = poseAt(m, theta0)
  if (!p0) throw new Error('the reference position does not assemble')
  const x0 = p0.T.x
  const eps = 1e-6
  const pa = poseAt(m, theta0 + eps)
  const pb = poseAt(m, theta0 - eps)
  if (!pa || !pb) throw new Error('the reference position is a toggle')
  const dir = Math.sign((pa.T.x - pb.T.x) * (target - x0)) || 1
  const step = (0.25 * Math.PI) / 180
  let lo = theta0
  let hi = theta0
  for (let i = 0; i < 4 * 360; i++) {
    const next = hi + dir * step
    const p = poseAt(m, next)
    if (!p) {
      // Past the driven link's dead point: the end of the stroke may be that point itself (Chebyshev's
      // straight part ends there). Find the last angle that assembles and accept it if it reaches the end.
      let ok = hi
      let bad = next
      for (let k = 0; k < 80; k++) {
        const mid = (ok + bad) / 2
        if (poseAt(m, mid)) ok = mid
        else bad = mid
      }
      const pe = poseAt(m, ok) as FourBarPose
      if (Math.abs(pe.T.x - target) <= 1e-6 * Math.max(1, Math.abs(target))) return ok
      break
    }
    if ((p.T.x - target) * (x0 - target) <= 0) {
      lo = hi
      hi = next
      // Bisection between lo (before the end) and hi (at or past it).
      for (let k = 0; k < 80; k++) {
        const mid = (lo + hi) / 2
        const pm = poseAt(m, mid)
        if (pm && (pm.T.x - target) * (x0 - target) > 0) lo = mid
        else hi = mid
      }
      return (lo + hi) / 2
    }
    hi = next
  }
  throw new Error(`the tracer does not reach x = ${target} mm on this branch`)
}

/** Analyses one four-bar sized for opts.stroke (lib/mechanisms: `getFourBar(id).size(S, rule)`). */
export function analyseFourBar(sized: SizedFourBar, opts: FourBarOptions): FourBarResult {
  const S = opts.stroke
  if (!(S > 0) || !Number.isFinite(S)) throw new Error('stroke must be a positive number of mm')
  const n = Math.max(3, Math.floor(opts.positions ?? 181))
  const m = sized.model
  const angle = ((opts.line?.angleDeg ?? 0) * Math.PI) / 180
  const origin = opts.line?.point ?? { x: 0, y: 0 }
  const place = (p: Point): Point => add(origin, rotate(p, angle))
  const F = { x: opts.load.fx, y: opts.load.fy }
  const Floc = rotate(F, -angle)

  // Working range: the drive angles at the two ends of the stroke.
  const tA = angleForX(m, sized.thetaMid, sized.from.x)
  const tB = angleForX(m, sized.thetaMid, sized.to.x)
  const t0 = Math.min(tA, tB)
  const t1 = Math.max(tA, tB)
  const xAt = (t: number) => (poseAt(m, t) as FourBarPose).T.x
  const increasing = xAt(t1) > xAt(t0)

  // Straightness: points equally spaced along the stroke, each by bisection of the drive angle.
  const local: Point[] = []
  for (let k = 0; k < STRAIGHTNESS_SAMPLES; k++) {
    const x = sized.from.x + ((sized.to.x - sized.from.x) * k) / (STRAIGHTNESS_SAMPLES - 1)
    let lo = t0
    let hi = t1
    for (let it = 0; it < 70; it++) {
      const mid = (lo + hi) / 2
      if (xAt(mid) < x === increasing) lo = mid
      else hi = mid
    }
    local.push((poseAt(m, (lo + hi) / 2) as FourBarPose).T)
  }
  const path = local.map(place)
  const line = fitLine(path)
  let error = 0
  let at = path[0]
  for (const p of path) {
    const d = Math.abs(offsetFrom(line, p))
    if (d > error) {
      error = d
      at = p
    }
  }

  // Positions: equal steps of the drive angle, statics and virtual work at each.
  const positions: FourBarPosition[] = []
  const min = { x: Infinity, y: Infinity }
  const max = { x: -Infinity, y: -Infinity }
  let vwError = 0
  let minMu = 90
  const zero = (): Peak => ({ value: 0, inputDeg: t0 * DEG })
  const peak = { pinForce: { ...zero(), joint: 'A' as 'A' | 'B' | 'C' | 'D' }, torque: zero(), drivenLinkAxial: zero(), rockerAxial: zero(), drivenLinkShear: zero() }
  const more = (p: Peak, v: number, deg: number) => {
    if (Math.abs(v) > Math.abs(p.value)) {
      p.value = v
      p.inputDeg = deg
    }
  }
  for (let i = 0; i < n; i++) {
    const t = t0 + ((t1 - t0) * i) / (n - 1)
    const pose = poseAt(m, t) as FourBarPose
    const st = staticsAt(m, pose, Floc)
    const before = poseAt(m, t - VW_STEP)
    const after = poseAt(m, t + VW_STEP)
    let tvw = NaN
    let scale = 0
    if (before && after) {
      const v = { x: (after.T.x - before.T.x) / (2 * VW_STEP), y: (after.T.y - before.T.y) / (2 * VW_STEP) }
      tvw = -(Floc.x * v.x + Floc.y * v.y)
      scale = norm(Floc) * norm(v)
      vwError = Math.max(vwError, Math.abs(st.torque - tvw) / Math.max(scale, 1e-9 * norm(Floc) * m.a, 1e-300))
    }
    const joints = { A: place(pose.A), B: place(pose.B), C: place(pose.C), D: place(pose.D), T: place(pose.T) }
    for (const p of Object.values(joints)) {
      min.x = Math.min(min.x, p.x)
      min.y = Math.min(min.y, p.y)
      max.x = Math.max(max.x, p.x)
      max.y = Math.max(max.y, p.y)
    }
    const mu = Math.asin(Math.min(1, st.sinMu)) * DEG
    minMu = Math.min(minMu, mu)
    const inputDeg = (t + angle) * DEG
    positions.push({
      inputDeg,
      joints,
      torque: st.torque,
      torqueByVirtualWork: tvw,
      virtualWorkScale: scale,
      linkForces: { AB: st.crankAxial, DC: st.rocker, ABshear: st.crankShear },
      pinForces: st.pins,
      transmissionDeg: mu,
    })
    for (const j of ['A', 'B', 'C', 'D'] as const) {
      if (st.pins[j] > peak.pinForce.value) Object.assign(peak.pinForce, { value: st.pins[j], inputDeg, joint: j })
    }
    more(peak.torque, st.torque, inputDeg)
    more(peak.drivenLinkAxial, st.crankAxial, inputDeg)
    more(peak.rockerAxial, st.rocker, inputDeg)
    more(peak.drivenLinkShear, st.crankShear, inputDeg)
  }

  const BT = Math.hypot(m.tracer.along, m.tracer.across)
  return {
    name: sized.name,
    label: sized.label,
    source: sized.source,
    proportions: sized.proportions,
    rule: sized.rule,
    drive: sized.drive,
    tex: sized.tex,
    stroke: S,
    lengths: { AB: m.a, BC: m.b, DC: m.c, AD: dist(m.A, m.D), BT, tracerAcross: m.tracer.across },
    links: 4,
    movingLinks: 3,
    pins: 4,
    inputRange: { fromDeg: (t0 + angle) * DEG, toDeg: (t1 + angle) * DEG, spanDeg: (t1 - t0) * DEG },
    straightness: {
      error,
      line,
      at,
      samples: STRAIGHTNESS_SAMPLES,
      nominal: { point: origin, direction: rotate({ x: 1, y: 0 }, angle) },
    },
    footprint: { width: max.x - min.x, height: max.y - min.y, min, max },
    peak,
    minTransmissionDeg: minMu,
    virtualWorkError: vwError,
    positions,
    path,
    load: { ...opts.load },
  }
}

