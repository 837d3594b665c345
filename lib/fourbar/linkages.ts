/**
 * The four approximate straight-line four-bars, by their published names, in their own frame, sized
 * for a stroke S. Each puts the approximately straight part of its tracer path along +x, from
 * `from` to `to` (the ends of the working stroke), the middle of the stroke at the origin.
 */
import type { Point } from '@/lib/contract'
import { branchOf, type FourBar } from './model'
import { dist, pt } from './geometry'

export type FourBarName = 'watt' | 'chebyshev' | 'roberts' | 'hoeken'
export const FOURBAR_NAMES: readonly FourBarName[] = ['watt', 'chebyshev', 'roberts', 'hoeken']

/** Proportions of the two linkages whose scale is a choice (Watt's and Roberts'), as multiples of the stroke S. */
export interface FourBarRules {
  /**
   * Chebyshev's: the stroke is the middle `usable` part of the straight part (frame = S/usable). The
   * straight part ends at the driven link's dead point (coupler and rocker in line), where the drive
   * torque grows without bound, so the whole straight part cannot be driven through that link.
   */
  chebyshev?: { usable?: number }
  /** Watt's: rocker length r = watt.rocker·S and coupler length c = watt.coupler·S. */
  watt?: { rocker?: number; coupler?: number }
  /** Roberts': rocker (and coupler-triangle side) l = roberts.rocker·S; frame = S. */
  roberts?: { rocker?: number }
}

export const DEFAULT_RULES = { chebyshev: { usable: 0.8 }, watt: { rocker: 1, coupler: 0.5 }, roberts: { rocker: 0.8 } } as const

export interface SizedFourBar {
  name: FourBarName
  label: string
  model: FourBar
  /** Driven-link angle at the middle of the stroke (the reference assembly), rad. */
  thetaMid: number
  /** Ends of the working stroke in the mechanism's own frame (straight part along +x through the origin). */
  from: Point
  to: Point
  /** How the link lengths follow from the stroke, in words; and the published proportions. */
  rule: string
  proportions: string
  source: string
  /** The driven link and how it moves over the stroke. */
  drive: string
  /** The proportions as TeX, e.g. `a:b:c:d = 2.5:1:2.5:2`. */
  tex: string
}

const fmt = (x: number) => String(Math.round(x * 1e6) / 1e6)

/**
 * Builds the model from the reference assembly (A, B, C, D and T at the middle of the stroke), shifted
 * so that T at the middle is the origin: lengths and branch follow from the points, so the published
 * proportions are written once, as coordinates.
 */
function fromAssembly(A: Point, B: Point, C: Point, D: Point, T: Point): { model: FourBar; thetaMid: number } {
  const o = T
  const s = (p: Point) => pt(p.x - o.x, p.y - o.y)
  const [a0, b0, c0, d0, t0] = [s(A), s(B), s(C), s(D), s(T)]
  const b = dist(b0, c0)
  const ex = (c0.x - b0.x) / b
  const ey = (c0.y - b0.y) / b
  const along = (t0.x - b0.x) * ex + (t0.y - b0.y) * ey
  const across = -(t0.x - b0.x) * ey + (t0.y - b0.y) * ex
  return {
    model: { A: a0, D: d0, a: dist(a0, b0), b, c: dist(d0, c0), tracer: { along, across }, branch: branchOf(b0, c0, d0) },
    thetaMid: Math.atan2(b0.y - a0.y, b0.x - a0.x),
  }
}

/** Sizes the named four-bar for the stroke S (mm). */
export function sizeFourBar(name: FourBarName, S: number, rules: FourBarRules = {}): SizedFourBar {
  const half = S / 2
  const from = pt(-half, 0)
  const to = pt(half, 0)
  switch (name) {
    case 'chebyshev': {
      // Crossed: frame A D = 2, links A B = D C = 2.5, coupler B C = 1, tracer at the middle of B C.
      // Middle position: B (1.5, 2), C (0.5, 2), T (1, 2). Exact points T = (0, 2), (1, 2), (2, 2):
      // the straight part spans the frame's length. The stroke is its middle `usable` part: u = S/(2·usable).
      const usable = rules.chebyshev?.usable ?? DEFAULT_RULES.chebyshev.usable
      const u = S / (2 * usable)
      const { model, thetaMid } = fromAssembly(pt(0, 0), pt(1.5 * u, 2 * u), pt(0.5 * u, 2 * u), pt(2 * u, 0), pt(u, 2 * u))
      return {
        name, label: "Chebyshev's linkage", model, thetaMid, from, to,
        rule: `straight part between the exact points (0, 2u) and (2u, 2u), its middle ${fmt(usable)} the stroke: u = S/(2·${fmt(usable)}) = ${fmt(u)} mm, frame 2u = ${fmt(2 * u)} mm (one outer exact point is the driven link's dead point)`,
        proportions: 'links 2.5 : coupler 1 : frame 2, tracer at the middle of the coupler',
        source: "Chebyshev's straight-line linkage, proportions 1 : 2.5 : 2 (coupler : links : frame), tracer at the coupler's middle",
        drive: 'link A B driven, oscillating',
        tex: 'a:b:c:d = 2.5:1:2.5:2',
      }
    }
    case 'hoeken': {
      // Crank A B = 1, coupler B C = 2.5, rocker D C = 2.5, frame A D = 2, tracer on B C extended, B T = 5.
      // Middle position: crank at 180°, B (−1, 0), C (0.5, 2), T (2, 4); exact points T = (0, 4), (2, 4), (4, 4)
      // at crank 270°, 180°, 90°: the straight part is twice the frame, so u = S/4.
      const u = S / 4
      const { model, thetaMid } = fromAssembly(pt(0, 0), pt(-u, 0), pt(0.5 * u, 2 * u), pt(2 * u, 0), pt(2 * u, 4 * u))
      return {
        name, label: "Hoeken's linkage", model, thetaMid, from, to,
        rule: `straight part between the exact points (0, 4u) and (4u, 4u) = stroke: u = S/4 = ${fmt(u)} mm, frame = S/2`,
        proportions: 'crank 1 : coupler 2.5 : rocker 2.5 : frame 2, tracer on the coupler extended at 5 from the crank pin',
        source: "Hoeken's linkage, proportions 1 : 2.5 : 2.5 : 2 with the tracer at 5 on the extended coupler (the cognate of Chebyshev's linkage by the Roberts–Chebyshev theorem)",
        drive: 'crank A B driven, turning (half a turn over the stroke)',
        tex: 'a:b:c:d:\\overline{BT} = 1:2.5:2.5:2:5',
      }
    }
    case 'watt': {
      // Equal rockers r on opposite sides, coupler c, tracer at the coupler's middle. Middle position:
      // rockers square to the line, coupler across it: A (c/2, r), B (c/2, 0), C (−c/2, 0), D (−c/2, −r).
      const r = (rules.watt?.rocker ?? DEFAULT_RULES.watt.rocker) * S
      const c = (rules.watt?.coupler ?? DEFAULT_RULES.watt.coupler) * S
      const { model, thetaMid } = fromAssembly(pt(c / 2, r), pt(c / 2, 0), pt(-c / 2, 0), pt(-c / 2, -r), pt(0, 0))
      // Rocker AB points down (−90°) at the middle; turning it counter-clockwise moves B, and T, towards +x.
      return {
        name, label: "Watt's linkage", model, thetaMid, from, to,
        rule: `rockers r = ${rules.watt?.rocker ?? DEFAULT_RULES.watt.rocker}·S = ${fmt(r)} mm, coupler c = ${rules.watt?.coupler ?? DEFAULT_RULES.watt.coupler}·S = ${fmt(c)} mm (chosen rule; the tracer's deviation grows as y⁵/(4 c r³))`,
        proportions: 'equal rockers, tracer at the middle of the coupler',
        source: "Watt's linkage (equal rockers, tracer at the coupler's middle)",
        drive: 'rocker A B driven, oscillating',
        tex: 'a = c = r,\\; b = c_{\\mathrm{coupler}}',
      }
    }
    case 'roberts': {
      // Frame A D = d, equal rockers l, coupler B C = d/2 with the triangle B C T, B T = C T = l, T on the
      // far side of B C. Middle: B (−d/4, H), C (d/4, H), T (0, 0) on the frame line, H = √(l² − d²/16).
      // T passes through A and D as well, so the frame is the stroke: d = S.
      const d = S
      const l = (rules.roberts?.rocker ?? DEFAULT_RULES.roberts.rocker) * S
      const H = Math.sqrt(l * l - (d * d) / 16)
      const { model, thetaMid } = fromAssembly(pt(-d / 2, 0), pt(-d / 4, H), pt(d / 4, H), pt(d / 2, 0), pt(0, 0))
      return {
        name, label: "Roberts' linkage", model, thetaMid, from, to,
        rule: `frame d = S (the tracer passes through both pivots and the middle); rockers l = ${rules.roberts?.rocker ?? DEFAULT_RULES.roberts.rocker}·S = ${fmt(l)} mm (chosen rule), coupler d/2`,
        proportions: 'frame d, rockers l, coupler d/2, coupler triangle with sides l to the tracer',
        source: "Roberts' linkage (equal rockers, coupler half the frame, isosceles coupler triangle with sides equal to the rockers)",
        drive: 'rocker A B driven, oscillating',
        tex: 'a = c = \\overline{BT} = \\overline{CT} = l,\\; b = d/2',
      }
    }
  }
}
