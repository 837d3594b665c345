import { linkLength, type LinkageModel } from './model'
import type { CaseLoads, CaseStatics } from './statics'
import { mag, type Vec } from './vec'

/** Internal forces of one link at one position, from its end forces. */
export interface MemberForces {
  /** Axial force at mid-length, N, tension positive. */
  axialMid: number
  /** Largest and smallest axial force over the link's segments, N. */
  axialMax: number
  axialMin: number
  /** Largest |bending moment| along the link, N·mm. */
  moment: number
  /** Largest force any one pin applies to the link (the eye or hole it bears on), N, and its point index. */
  eye: number
  eyeAt: number
  /** Largest component of a pin force across the link's axis, N (0 for a two-force bar). */
  across: number
}

/**
 * Axial force and bending moment along a straight link carrying point forces
 * at its pins, a couple (the drive torque on the crank) and a uniform weight.
 * Cutting at distance x from the first point, the part [0, x] is in balance:
 * N(x) = −Σ fᵢ·e − w·e·x and M(x) = Σ (sᵢ − x) fᵢ·n + C − w·n x²/2, where the
 * sums run over the points before the cut. |M| is largest at a point or where
 * the shear V(x) = Σ fᵢ·n + w·n x vanishes inside a segment.
 */
export function memberForces(model: LinkageModel, pts: Float64Array, b: number, loads: CaseLoads, st: CaseStatics): MemberForces {
  const out = new Float64Array(MEMBER_FIELDS)
  memberForcesInto(model, pts, b, loads.weightPerMm, st.endForces, 0, st.torque, out, 0)
  return { axialMid: out[0], axialMax: out[1], axialMin: out[2], moment: out[3], eye: out[4], eyeAt: out[5], across: out[6] }
}

/** Numbers memberForcesInto writes per link: axialMid, axialMax, axialMin, moment, eye, eyeAt, across. */
export const MEMBER_FIELDS = 7

/**
 * memberForces into a flat array (the fields in MemberForces order at out[at …]), from end forces
 * stored at f[fo …] in the model's flat point layout: the sweep keeps them per position in one array.
 */
export function memberForcesInto(
  model: LinkageModel,
  pts: Float64Array,
  b: number,
  w: Vec | null,
  f: Float64Array,
  fo: number,
  torque: number,
  out: Float64Array,
  at: number,
): void {
  const link = model.links[b]
  const o = 2 * model.offset[b]
  const np = link.points.length
  const last = o + 2 * (np - 1)
  const len = linkLength(link)
  const ex = (pts[last] - pts[o]) / len
  const ey = (pts[last + 1] - pts[o + 1]) / len
  const we = w ? w.x * ex + w.y * ey : 0
  const wn = w ? -w.x * ey + w.y * ex : 0
  const couple = b === model.crankIndex ? torque : 0
  const stations = link.stations
  const g = fo + o
  let fe = 0 // Σ fᵢ·e before the cut
  let fn = 0 // Σ fᵢ·n before the cut
  let sfn = 0 // Σ sᵢ fᵢ·n before the cut
  let feMid = 0
  let axialMax = -Infinity
  let axialMin = Infinity
  let moment = 0
  for (let k = 0; k < np - 1; k++) {
    const fx = f[g + 2 * k]
    const fy = f[g + 2 * k + 1]
    const s0 = stations[k]
    const s1 = stations[k + 1]
    const fek = fx * ex + fy * ey
    const fnk = -fx * ey + fy * ex
    fe += fek
    fn += fnk
    sfn += s0 * fnk
    if (s0 <= len / 2) feMid += fek
    for (let side = 0; side < 2; side++) {
      const x = side === 0 ? s0 : s1
      const ax = -fe - we * x
      if (ax > axialMax) axialMax = ax
      if (ax < axialMin) axialMin = ax
      moment = Math.max(moment, Math.abs(sfn - x * fn + couple - (wn * x * x) / 2))
    }
    if (wn !== 0) {
      const xs = -fn / wn
      if (xs > s0 && xs < s1) moment = Math.max(moment, Math.abs(sfn - xs * fn + couple - (wn * xs * xs) / 2))
    }
  }
  let eye = 0
  let eyeAt = 0
  let across = 0
  for (let k = 0; k < np; k++) {
    const fx = f[g + 2 * k]
    const fy = f[g + 2 * k + 1]
    const m = mag(fx, fy)
    if (m > eye) {
      eye = m
      eyeAt = k
    }
    across = Math.max(across, Math.abs(-fx * ey + fy * ex))
  }
  out[at] = -feMid - (we * len) / 2
  out[at + 1] = axialMax
  out[at + 2] = axialMin
  out[at + 3] = moment
  out[at + 4] = eye
  out[at + 5] = eyeAt
  out[at + 6] = across
}

type ForceRec = { x: number; y: number; magnitude: number }

/** Per joint, the force on each attached link from the pin; the largest governs. */
export function pinForces(model: LinkageModel, st: CaseStatics): Record<string, ForceRec> {
  const out: Record<string, ForceRec> = {}
  const f = st.endForces
  model.links.forEach((l, b) => {
    for (let k = 0; k < l.points.length; k++) {
      const i = 2 * (model.offset[b] + k)
      const m = mag(f[i], f[i + 1])
      const j = l.points[k]
      const cur = out[j]
      if (!cur || m > cur.magnitude) out[j] = { x: f[i], y: f[i + 1], magnitude: m }
    }
  })
  return out
}

/**
 * The pin force of one joint at f[fo …]: the first largest (strict >) of the forces on its points
 * (flat indices `points`, in link order, as pinForces scans them). Returns the winning point's flat
 * index and writes its magnitude to out[0].
 */
export function pinPointInto(f: Float64Array, fo: number, points: Int32Array, out: Float64Array): number {
  let best = points[0]
  let top = mag(f[fo + 2 * best], f[fo + 2 * best + 1])
  for (let u = 1; u < points.length; u++) {
    const k = fo + 2 * points[u]
    const m = mag(f[k], f[k + 1])
    if (m > top) {
      best = points[u]
      top = m
    }
  }
  out[0] = top
  return best
}

/** Force the ground applies to the mechanism at each fixed pivot, N. */
export function groundReactions(model: LinkageModel, st: CaseStatics): Record<string, ForceRec> {
  const out: Record<string, ForceRec> = {}
  for (const j of Object.keys(model.ground)) {
    const points = model.jointPoints.find((p) => p.joint === j)?.points ?? []
    let x = 0
    let y = 0
    for (let t = 0; t < points.length; t++) {
      x += st.endForces[2 * points[t]]
      y += st.endForces[2 * points[t] + 1]
    }
    out[j] = { x, y, magnitude: mag(x, y) }
  }
  return out
}
