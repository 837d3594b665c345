import { add, mag, norm, perp, scale, type Vec } from '../vec'
import { tex } from '../tex'
import { inRing, sqrt0, type InversorCell } from './cell'

export interface HartGeometry {
  /** a: the two long (crossed) links, mm. */
  long: number
  /** b: the two short links, mm. */
  short: number
  /** μ: fraction along each link, from the base AB, that places O, P and T. */
  ratio: number
}

/** The point `along` O→P and `across` it (unit vectors u, n); module level, as place() runs per position. */
const at = (u: Vec, n: Vec, along: number, across: number): Vec => add(scale(u, along), scale(n, across))

/**
 * Hart's inversor. The antiparallelogram's vertices form an isosceles
 * trapezoid with bases AB (half-length q) and DE (half-length p), legs AD and
 * BE (short, b) and diagonals AE and BD (long, a); then a² = (p + q)² + h²,
 * b² = (q − p)² + h², so pq = (a² − b²)/4 for every position. The pole O on
 * AD, the driven point P on AE and the tracer T on BD, each at fraction μ from
 * the base AB, lie on one line parallel to the bases with |OP| = 2μp and
 * |OT| = 2(1 − μ)q, so |OP|·|OT| = μ(1 − μ)(a² − b²) = k (derived here; the
 * cell itself is described in Kempe, How to Draw a Straight Line, 1877). The ring runs between the two flat positions,
 * μ(a − b) and μ(a + b). Branch: D and E lie left of O→P.
 */
export function hartCell(g: HartGeometry): InversorCell {
  const { long: a, short: b, ratio: mu } = g
  const k = mu * (1 - mu) * (a * a - b * b)
  const quarter = (a * a - b * b) / 4
  const invalid =
    a <= b
      ? {
          kind: 'long-not-longer-than-short',
          message: `The long links a = ${a} mm must be longer than the short links b = ${b} mm: with a ≤ b the inversion constant k = μ(1 − μ)(a² − b²) is not positive and the cell cannot invert.`,
        }
      : null
  const rhoMin = mu * (a - b)
  const rhoMax = mu * (a + b)
  return {
    mechanism: 'hart',
    invalid,
    k,
    rhoMin,
    rhoMax,
    links: [
      { name: 'AD', points: ['A', 'O', 'D'], stations: [0, mu * b, b], kind: 'beam' },
      { name: 'AE', points: ['A', 'P', 'E'], stations: [0, mu * a, a], kind: 'beam' },
      { name: 'BD', points: ['B', 'T', 'D'], stations: [0, mu * a, a], kind: 'beam' },
      { name: 'BE', points: ['B', 'E'], stations: [0, b], kind: 'bar' },
    ],
    place(pt: Vec) {
      const rho = norm(pt)
      if (invalid || !inRing(rho, rhoMin, rhoMax)) return null
      const u = scale(pt, 1 / rho)
      const n = perp(u)
      const p = rho / (2 * mu)
      const q = quarter / p
      const delta = q - p
      const h = sqrt0(b * b - delta * delta)
      return {
        O: { x: 0, y: 0 },
        P: { ...pt },
        T: scale(u, k / rho),
        A: at(u, n, -mu * delta, -mu * h),
        B: at(u, n, 2 * q - mu * delta, -mu * h),
        D: at(u, n, (1 - mu) * delta, (1 - mu) * h),
        E: at(u, n, p + q - mu * delta, (1 - mu) * h),
      }
    },
    joints: ['O', 'P', 'T', 'A', 'B', 'D', 'E'],
    placeInto(px: number, py: number, out: Float64Array, o: number): boolean {
      const rho = mag(px, py)
      if (invalid || !inRing(rho, rhoMin, rhoMax)) return false
      const inv = 1 / rho
      const ux = px * inv
      const uy = py * inv
      const nx = -uy
      const ny = ux
      const p = rho / (2 * mu)
      const q = quarter / p
      const delta = q - p
      const h = sqrt0(b * b - delta * delta)
      const t = k / rho
      out[o] = 0
      out[o + 1] = 0
      out[o + 2] = px
      out[o + 3] = py
      out[o + 4] = ux * t
      out[o + 5] = uy * t
      // A, B, D, E: along u and across n, written out (a helper closure per call cost more than the rest).
      const a1 = -mu * delta
      const a2 = -mu * h
      out[o + 6] = ux * a1 + nx * a2
      out[o + 7] = uy * a1 + ny * a2
      const b1 = 2 * q - mu * delta
      out[o + 8] = ux * b1 + nx * a2
      out[o + 9] = uy * b1 + ny * a2
      const d1 = (1 - mu) * delta
      const d2 = (1 - mu) * h
      out[o + 10] = ux * d1 + nx * d2
      out[o + 11] = uy * d1 + ny * d2
      const e1 = p + q - mu * delta
      out[o + 12] = ux * e1 + nx * d2
      out[o + 13] = uy * e1 + ny * d2
      return true
    },
    transmission: [
      ['A', 'D', 'E'],
      ['B', 'E', 'D'],
      ['D', 'A', 'B'],
      ['E', 'B', 'A'],
    ],
    tex: {
      k: {
        formula: 'k = \\mu\\,(1 - \\mu)\\,(a^2 - b^2)',
        substituted: `k = ${tex(mu)}\\,(1 - ${tex(mu)})\\,(${tex(a)}^2 - ${tex(b)}^2) = ${tex(k)}`,
      },
      rhoMin: {
        formula: '\\rho_{\\min} = \\mu\\,(a - b)',
        substituted: `\\rho_{\\min} = ${tex(mu)}\\,(${tex(a)} - ${tex(b)}) = ${tex(rhoMin)}`,
      },
      rhoMax: {
        formula: '\\rho_{\\max} = \\mu\\,(a + b)',
        substituted: `\\rho_{\\max} = ${tex(mu)}\\,(${tex(a)} + ${tex(b)}) = ${tex(rhoMax)}`,
      },
    },
    rhoMinName: 'μ(a − b)',
    rhoMaxName: 'μ(a + b)',
    splitReason: 'its middle lies past the position where the antiparallelogram goes flat, at |OP| = μ(a + b)',
    source: 'geometry of inversion (Kempe, How to Draw a Straight Line, 1877; Coxeter, Introduction to Geometry, §6.1)',
  }
}
