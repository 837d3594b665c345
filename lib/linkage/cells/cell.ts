import type { LinkDef } from '../model'
import type { Vec } from '../vec'
import type { MechanismId } from '@/lib/contract'

/** A formula as shown in a step: symbols, then with the values put in. */
export interface TexPair {
  formula: string
  substituted: string
}

/**
 * An inversor cell with its pole O at the origin: it keeps the tracer T on the
 * ray O→P at |OT| = k/|OP| for every position of the driven point P in its
 * working ring rhoMin ≤ |OP| ≤ rhoMax. Both ends of the ring are toggles (the
 * cell goes flat or folds), so the generic crank code only needs the ring.
 */
export interface InversorCell {
  /** Id of the mechanism this cell belongs to (the registry's id, lib/mechanisms). */
  mechanism: MechanismId
  /** Set when the proportions themselves make the cell impossible. */
  invalid: { kind: string; message: string } | null
  /** Inversion constant k = |OP|·|OT|, mm². */
  k: number
  rhoMin: number
  rhoMax: number
  /** Links of the cell without the crank, pole O among their points. */
  links: LinkDef[]
  /** Every joint of the cell for a given P (O and T included); null outside the ring. */
  place(p: Vec): Record<string, Vec> | null
  /**
   * place() into a flat array, same arithmetic, no objects: joint k of `joints` (place()'s key
   * order) at out[at + 2k], out[at + 2k + 1]; false outside the ring. For the sweep's hot loop.
   */
  placeInto?(px: number, py: number, out: Float64Array, at: number): boolean
  joints?: string[]
  /** Angles watched for toggle: [vertex, one end, other end]; 0° means the two links are in line. */
  transmission: [string, string, string][]
  tex: { k: TexPair; rhoMin: TexPair; rhoMax: TexPair }
  /** Plain-text names of the ring's ends, for messages: e.g. "l − s", "√k". */
  rhoMinName: string
  rhoMaxName: string
  /** Why the middle of the line cannot be reached when the crank reaches past rhoMax. */
  splitReason: string
  /** Points, links and the source of the closed form, for the report. */
  source: string
}

/** Clamps the tiny negative values rounding leaves under a square root at a flat position. */
export const sqrt0 = (x: number): number => Math.sqrt(Math.max(0, x))

export const inRing = (rho: number, lo: number, hi: number): boolean =>
  rho >= lo * (1 - 1e-12) && rho <= hi * (1 + 1e-12)
