import type { InversorCell } from './cells/cell'
import { crankReach, placeAt, type ReachKind } from './crank'
import { plain } from './tex'
import { DEG } from './vec'
import type { StrokeLimits, TracerPath } from '@/lib/contract'

export type { TracerPath }
/** Crank limits and half stroke, as the contract's StrokeLimits. */
export type StrokeRange = StrokeLimits

export interface GeometryVerdict {
  k: number
  lineOffset: number
  feasibility: { ok: boolean; kind: string; message: string }
  reach: ReachKind | 'invalid'
  /** Crank angle at the toggle, degrees (180 for a full turn). */
  limitDeg: number
  path: TracerPath | null
  stroke: StrokeRange
  usable: StrokeRange
}

const EMPTY: StrokeRange = { half: 0, crankMinDeg: 0, crankMaxDeg: 0 }

/** Straight when the crank circle passes through the pole, to rounding. */
export const isStraight = (e: number, r: number): boolean => Math.abs(e - r) <= 1e-9 * Math.max(e, r)

/**
 * The tracer's path: inversion maps P's circle (centre (e, 0), radius r) to a
 * line when the circle passes through O (e = r), at distance k/(2r), and
 * otherwise to the circle with centre ke/(e² − r²) and radius kr/|e² − r²|
 * (Coxeter, Introduction to Geometry, §6.1).
 */
export function tracerPath(k: number, e: number, r: number): TracerPath {
  if (isStraight(e, r)) return { kind: 'line', point: { x: k / (2 * r), y: 0 }, direction: { x: 0, y: 1 } }
  const den = e * e - r * r
  return { kind: 'arc', centre: { x: (k * e) / den, y: 0 }, radius: (k * r) / Math.abs(den) }
}

/** Largest |T_y| between the limits, sampled (the exact ends included). */
function halfStroke(cell: InversorCell, e: number, r: number, loDeg: number, hiDeg: number): number {
  let half = 0
  const n = 360
  for (let i = 0; i <= n; i++) {
    const j = placeAt(cell, e, r, (loDeg + ((hiDeg - loDeg) * i) / n) * DEG)
    if (j) half = Math.max(half, Math.abs(j.T.y))
  }
  return half
}

export function assessGeometry(cell: InversorCell, e: number, r: number, marginDeg: number): GeometryVerdict {
  const k = cell.k
  const base = { k, lineOffset: k > 0 ? k / (2 * r) : 0, limitDeg: 0, path: null, stroke: EMPTY, usable: EMPTY }
  if (cell.invalid) return { ...base, reach: 'invalid', feasibility: { ok: false, ...cell.invalid } }
  const straight = isStraight(e, r)
  const farName = straight ? '2r' : 'e + r'
  const far = e + r
  const reach = crankReach(e, r, cell.rhoMin, cell.rhoMax)
  const fail = (kind: string, message: string): GeometryVerdict => ({ ...base, reach: reach.kind, feasibility: { ok: false, kind, message } })
  if (reach.kind === 'cannot-reach') {
    return fail('crank-cannot-reach', `${farName} = ${plain(far)} mm < ${cell.rhoMinName} = ${plain(cell.rhoMin)} mm: the crank cannot reach the cell, which only closes for |OP| ≥ ${cell.rhoMinName}.`)
  }
  if (reach.kind === 'beyond-reach') {
    return fail('crank-cannot-reach', `|e − r| = ${plain(Math.abs(e - r))} mm > ${cell.rhoMaxName} = ${plain(cell.rhoMax)} mm: the crank keeps P farther from the pole than the cell reaches.`)
  }
  if (reach.kind === 'split') {
    return fail('split-segment', `${farName} = ${plain(far)} mm ≥ ${cell.rhoMaxName} = ${plain(cell.rhoMax)} mm: the tracer's path is split in two pieces; ${cell.splitReason}. Shorten the crank or lengthen the links.`)
  }
  const limitDeg = reach.limitRad / DEG
  const path = tracerPath(k, e, r)
  const full = reach.kind === 'full'
  const m = full ? 0 : marginDeg
  const stroke = { half: halfStroke(cell, e, r, -limitDeg, limitDeg), crankMinDeg: -limitDeg, crankMaxDeg: limitDeg }
  const withRange = { ...base, reach: reach.kind, limitDeg, path, stroke }
  if (m >= limitDeg) {
    return {
      ...withRange,
      feasibility: { ok: false, kind: 'no-usable-stroke', message: `The toggle margin ${plain(m)}° is not smaller than the crank limit ${plain(limitDeg)}°: no usable stroke is left.` },
    }
  }
  const usable = { half: halfStroke(cell, e, r, m - limitDeg, limitDeg - m), crankMinDeg: m - limitDeg, crankMaxDeg: limitDeg - m }
  if (path.kind === 'arc') {
    const message = `The crank pivot offset e = ${plain(e)} mm differs from the crank r = ${plain(r)} mm, so P's circle misses the pole and the tracer follows a circle arc, centre (${plain(path.centre.x)}, 0) mm, radius ${plain(path.radius)} mm, not a straight line.`
    return { ...withRange, usable, feasibility: { ok: true, kind: 'circle-arc', message } }
  }
  const message = `The tracer follows the straight line x = k/(2r) = ${plain(k / (2 * r))} mm for crank angles within ±${plain(limitDeg)}°, stopping ${plain(m)}° short of the toggle.`
  return { ...withRange, usable, feasibility: { ok: true, kind: 'ok', message } }
}
