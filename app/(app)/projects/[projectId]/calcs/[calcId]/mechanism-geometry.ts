/**
 * The drawing's geometry, computed in the browser by the engine itself (lib/linkage): the cell of
 * the mechanism, its reach, the tracer's path and the joints at any crank angle. Forces come from
 * the solved result and are interpolated between its positions.
 */
import { assessGeometry, placeAt } from '@/lib/linkage'
import type { InversorCell } from '@/lib/linkage'
import { getMechanism } from '@/lib/mechanisms'
import type { CalcResult } from '@/lib/calc/run'
import type { Point } from '@/lib/contract'

export interface MechanismFrame {
  cell: InversorCell
  r: number
  e: number
  feasible: boolean
  message: string
  /** Crank limits at the locked positions and after the margin, degrees. */
  limitDeg: number
  usable: [number, number]
  /** Tracer over the whole reachable stroke and over the usable one. */
  path: Point[]
  usablePath: Point[]
  /** View box in engine coordinates (y up). */
  box: { x0: number; y0: number; x1: number; y1: number }
  links: { name: string; points: string[]; kind: string; length: number }[]
}

const DEG = Math.PI / 180

export function frameOf(mechanism: string, geometry: Record<string, number>, marginDeg: number): MechanismFrame | null {
  const def = getMechanism(mechanism)
  const parsed = def.geometry.safeParse(geometry)
  if (!parsed.success) return null
  const { cell, crank: r, offset: e } = def.model(parsed.data)
  if (![r, e, cell.k].every(Number.isFinite) || r <= 0) return null
  const v = assessGeometry(cell, e, r, Math.max(0, marginDeg || 0))
  const links = [...cell.links, { name: 'CP', points: ['C', 'P'], stations: [0, r], kind: 'crank' as const }].map((l) => ({
    name: l.name,
    points: l.points,
    kind: l.kind,
    length: l.stations[l.stations.length - 1],
  }))
  const limit = v.limitDeg
  const reachable = v.reach === 'full' || v.reach === 'limited'
  const path: Point[] = []
  const usablePath: Point[] = []
  let x0 = Math.min(0, e - r)
  let x1 = Math.max(0, e + r)
  let y0 = -r
  let y1 = r
  const grow = (p: Point) => {
    x0 = Math.min(x0, p.x)
    x1 = Math.max(x1, p.x)
    y0 = Math.min(y0, p.y)
    y1 = Math.max(y1, p.y)
  }
  if (reachable) {
    const lo = -limit + 0.01
    const hi = limit - 0.01
    for (let i = 0; i <= 120; i++) {
      const deg = lo + ((hi - lo) * i) / 120
      const j = placeAt(cell, e, r, deg * DEG)
      if (!j) continue
      path.push(j.T)
      Object.values(j).forEach(grow)
      if (deg >= v.usable.crankMinDeg && deg <= v.usable.crankMaxDeg) usablePath.push(j.T)
    }
  } else {
    // Show why: the ring P must stay in, against the crank circle.
    grow({ x: cell.rhoMax, y: cell.rhoMax })
    grow({ x: -cell.rhoMax * 0.2, y: -cell.rhoMax })
  }
  const pad = 0.12 * Math.max(x1 - x0, y1 - y0, 1)
  return {
    cell,
    r,
    e,
    feasible: v.feasibility.ok,
    message: v.feasibility.message,
    limitDeg: limit,
    usable: [v.usable.crankMinDeg, v.usable.crankMaxDeg],
    path,
    usablePath,
    box: { x0: x0 - pad, y0: y0 - pad, x1: x1 + pad, y1: y1 + pad },
    links,
  }
}

export function jointsAt(frame: MechanismFrame, crankDeg: number): Record<string, Point> | null {
  return placeAt(frame.cell, frame.e, frame.r, crankDeg * DEG)
}

/** Pin forces and the drive torque at a crank angle, linearly between the solved positions of the first load case. */
export function forcesAt(result: CalcResult | null, crankDeg: number): { pins: Record<string, Point>; torque: number } | null {
  const ps = result?.positions
  if (!ps || ps.length === 0) return null
  let i = ps.findIndex((p) => p.crankDeg >= crankDeg)
  if (i <= 0) i = i === 0 ? 1 : ps.length - 1
  const a = ps[Math.max(0, i - 1)]
  const b = ps[Math.min(ps.length - 1, i)]
  const t = b.crankDeg === a.crankDeg ? 0 : Math.min(1, Math.max(0, (crankDeg - a.crankDeg) / (b.crankDeg - a.crankDeg)))
  const pins: Record<string, Point> = {}
  for (const [j, fa] of Object.entries(a.pinForces)) {
    const fb = b.pinForces[j] ?? fa
    pins[j] = { x: fa.x + (fb.x - fa.x) * t, y: fa.y + (fb.y - fa.y) * t }
  }
  return { pins, torque: a.driveTorque + (b.driveTorque - a.driveTorque) * t }
}
