/**
 * What a sized approximate straight-line four-bar is, and the helper its sizing rule uses. The
 * four-bars themselves (Watt's, Chebyshev's, Roberts', Hoeken's) are declared one folder each in
 * lib/mechanisms and offered through its registry (`fourBars()`); this engine analyses whatever
 * sized four-bar it is given.
 */
import type { Point } from '@/lib/contract'
import { branchOf, type FourBar } from './model'
import { dist, pt } from './geometry'

export interface SizedFourBar {
  /** Registry id (`watt`, …). */
  name: string
  label: string
  model: FourBar
  /** Driven-link angle at the middle of the stroke (the reference assembly), rad. */
  thetaMid: number
  /**
   * Ends of the working stroke in the mechanism's own frame: the approximately straight part of the
   * tracer path along +x, the middle of the stroke at the origin.
   */
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

/** A length in a sizing rule's words: at most six decimals. */
export const ruleNumber = (x: number): string => String(Math.round(x * 1e6) / 1e6)

/** Ends of a stroke S along +x about the origin, as SizedFourBar wants them. */
export const strokeEnds = (S: number): { from: Point; to: Point } => ({ from: pt(-S / 2, 0), to: pt(S / 2, 0) })

/**
 * Builds the model from the reference assembly (A, B, C, D and T at the middle of the stroke), shifted
 * so that T at the middle is the origin: lengths and branch follow from the points, so the published
 * proportions are written once, as coordinates.
 */
export function fromAssembly(A: Point, B: Point, C: Point, D: Point, T: Point): { model: FourBar; thetaMid: number } {
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
