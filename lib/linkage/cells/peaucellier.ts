import { add, mag, norm, perp, scale, type Vec } from '../vec'
import { tex } from '../tex'
import { inRing, sqrt0, type InversorCell } from './cell'

export interface PeaucellierGeometry {
  /** l: pole O to the outer rhombus vertices A and B, mm. */
  arm: number
  /** s: rhombus side, mm. */
  side: number
}

/**
 * Peaucellier–Lipkin cell. A and B are l from O and s from both P and T, so
 * O, P, T stay in line and, with M the midpoint of AB at distance d from O,
 * l² = d² + w², s² = (d − |OP|)² + w², hence d = (k + |OP|²)/(2|OP|) and
 * |OT| = 2d − |OP| = k/|OP| with k = l² − s² (geometry of inversion:
 * Coxeter, Introduction to Geometry, §6.1; Kempe, How to Draw a Straight
 * Line, 1877). The ring runs from l − s, where the rhombus lies flat along
 * O→P, to √k, where it folds (P meets T); past √k the tracer is on the
 * other branch (inside P), which the cell as built does not use.
 */
export function peaucellierCell(g: PeaucellierGeometry): InversorCell {
  const { arm: l, side: s } = g
  const k = l * l - s * s
  const invalid =
    l <= s
      ? {
          kind: 'arm-not-longer-than-side',
          message: `The arm l = ${l} mm must be longer than the rhombus side s = ${s} mm: with l ≤ s the inversion constant k = l² − s² is not positive and the cell cannot invert.`,
        }
      : null
  const rhoMin = l - s
  const rhoMax = Math.sqrt(Math.max(k, 0))
  return {
    mechanism: 'peaucellier',
    invalid,
    k,
    rhoMin,
    rhoMax,
    links: [
      { name: 'OA', points: ['O', 'A'], stations: [0, l], kind: 'bar' },
      { name: 'OB', points: ['O', 'B'], stations: [0, l], kind: 'bar' },
      { name: 'AP', points: ['A', 'P'], stations: [0, s], kind: 'bar' },
      { name: 'BP', points: ['B', 'P'], stations: [0, s], kind: 'bar' },
      { name: 'AT', points: ['A', 'T'], stations: [0, s], kind: 'bar' },
      { name: 'BT', points: ['B', 'T'], stations: [0, s], kind: 'bar' },
    ],
    place(p: Vec) {
      const rho = norm(p)
      if (invalid || !inRing(rho, rhoMin, rhoMax)) return null
      const u = scale(p, 1 / rho)
      const n = perp(u)
      const d = (k + rho * rho) / (2 * rho)
      const w = sqrt0(l * l - d * d)
      const m = scale(u, d)
      return {
        O: { x: 0, y: 0 },
        P: { ...p },
        A: add(m, scale(n, w)),
        B: add(m, scale(n, -w)),
        T: scale(u, k / rho),
      }
    },
    joints: ['O', 'P', 'A', 'B', 'T'],
    placeInto(px: number, py: number, out: Float64Array, at: number): boolean {
      const rho = mag(px, py)
      if (invalid || !inRing(rho, rhoMin, rhoMax)) return false
      const inv = 1 / rho
      const ux = px * inv
      const uy = py * inv
      const nx = -uy
      const ny = ux
      const d = (k + rho * rho) / (2 * rho)
      const w = sqrt0(l * l - d * d)
      const mx = ux * d
      const my = uy * d
      const t = k / rho
      out[at] = 0
      out[at + 1] = 0
      out[at + 2] = px
      out[at + 3] = py
      out[at + 4] = mx + nx * w
      out[at + 5] = my + ny * w
      out[at + 6] = mx + nx * -w
      out[at + 7] = my + ny * -w
      out[at + 8] = ux * t
      out[at + 9] = uy * t
      return true
    },
    transmission: [
      ['A', 'O', 'P'],
      ['B', 'O', 'P'],
      ['T', 'A', 'B'],
    ],
    tex: {
      k: { formula: 'k = l^2 - s^2', substituted: `k = ${tex(l)}^2 - ${tex(s)}^2 = ${tex(k)}` },
      rhoMin: { formula: '\\rho_{\\min} = l - s', substituted: `\\rho_{\\min} = ${tex(l)} - ${tex(s)} = ${tex(rhoMin)}` },
      rhoMax: { formula: '\\rho_{\\max} = \\sqrt{k}', substituted: `\\rho_{\\max} = \\sqrt{${tex(k)}} = ${tex(rhoMax)}` },
    },
    rhoMinName: 'l − s',
    rhoMaxName: '√k',
    splitReason: 'its middle is only reachable through a fold of the rhombus, where P meets T at |OP| = √k',
    source: 'geometry of inversion (Coxeter, Introduction to Geometry, §6.1; Kempe, How to Draw a Straight Line, 1877)',
  }
}
