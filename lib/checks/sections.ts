/**
 * Section properties of link bodies and pins. Bending of a three-pin link is
 * in the plane of the mechanism, i.e. about the axis parallel to the pins; for
 * a flat bar that is the strong axis (width in the plane). Buckling uses the
 * least radius of gyration, because the pins give no rotational restraint the
 * checks could rely on in either plane.
 */
import type { SectionInput } from './schema'

export interface SectionProps {
  label: string
  /** Gross area, mm². */
  A: number
  /** Least second moment of area, mm⁴. */
  Imin: number
  /** Least radius of gyration, mm. */
  rMin: number
  /** Elastic and plastic moduli for in-plane bending, mm³. */
  Wel: number
  Wpl: number
  /** Thickness that picks the material band (thickness, diameter or wall). */
  bandSize: number
  solid: boolean
}

export function sectionProps(s: SectionInput): SectionProps {
  switch (s.shape) {
    case 'flat': {
      const { width: w, thickness: t } = s
      const A = w * t
      const Imin = (Math.max(w, t) * Math.min(w, t) ** 3) / 12
      return {
        label: `flat ${w} × ${t} mm`,
        A,
        Imin,
        rMin: Math.sqrt(Imin / A),
        Wel: (t * w * w) / 6,
        Wpl: (t * w * w) / 4,
        bandSize: Math.min(w, t),
        solid: true,
      }
    }
    case 'round': {
      const d = s.diameter
      const A = (Math.PI * d * d) / 4
      const Imin = (Math.PI * d ** 4) / 64
      return { label: `round Ø${d} mm`, A, Imin, rMin: d / 4, Wel: (Math.PI * d ** 3) / 32, Wpl: d ** 3 / 6, bandSize: d, solid: true }
    }
    case 'tube': {
      const D = s.outerDiameter
      const di = D - 2 * s.wall
      const A = (Math.PI * (D * D - di * di)) / 4
      const Imin = (Math.PI * (D ** 4 - di ** 4)) / 64
      return {
        label: `tube Ø${D} × ${s.wall} mm`,
        A,
        Imin,
        rMin: Math.sqrt(Imin / A),
        Wel: (2 * Imin) / D,
        Wpl: (D ** 3 - di ** 3) / 6,
        bandSize: s.wall,
        solid: false,
      }
    }
  }
}

/** Solid circular pin: area and elastic modulus used by every basis. */
export function pinProps(d: number): { A: number; Wel: number; Wpl: number } {
  return { A: (Math.PI * d * d) / 4, Wel: (Math.PI * d ** 3) / 32, Wpl: d ** 3 / 6 }
}
