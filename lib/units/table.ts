/**
 * The one table of unit conversions. Every factor is the exact definition
 * (NIST SP 811, Appendix B; 1 in = 25.4 mm and 1 lb = 0.45359237 kg exactly,
 * standard gravity 9.80665 m/s² exactly), so no rounded constant appears
 * anywhere else in the code base. SI inside is mm, N, N·mm, MPa, mm², kg/m³.
 */

const IN_MM = 25.4
const LBF_N = 4.4482216152605 // 0.45359237 kg × 9.80665 m/s², exact
const PSI_MPA = LBF_N / (IN_MM * IN_MM)

export type QuantityKind = 'length' | 'area' | 'force' | 'moment' | 'stress' | 'density' | 'dimensionless'

interface UnitDef {
  kind: QuantityKind
  /** Multiply a value in this unit by `toSI` to get the SI-inside unit of its kind. */
  toSI: number
}

export const UNITS = {
  mm: { kind: 'length', toSI: 1 },
  m: { kind: 'length', toSI: 1000 },
  in: { kind: 'length', toSI: IN_MM },
  ft: { kind: 'length', toSI: 12 * IN_MM },
  'mm²': { kind: 'area', toSI: 1 },
  'in²': { kind: 'area', toSI: IN_MM * IN_MM },
  N: { kind: 'force', toSI: 1 },
  kN: { kind: 'force', toSI: 1000 },
  lbf: { kind: 'force', toSI: LBF_N },
  kip: { kind: 'force', toSI: 1000 * LBF_N },
  'N·mm': { kind: 'moment', toSI: 1 },
  'N·m': { kind: 'moment', toSI: 1000 },
  'lbf·in': { kind: 'moment', toSI: LBF_N * IN_MM },
  'kip·in': { kind: 'moment', toSI: 1000 * LBF_N * IN_MM },
  MPa: { kind: 'stress', toSI: 1 },
  GPa: { kind: 'stress', toSI: 1000 },
  psi: { kind: 'stress', toSI: PSI_MPA },
  ksi: { kind: 'stress', toSI: 1000 * PSI_MPA },
  'kg/m³': { kind: 'density', toSI: 1 },
  // lb/in³ → kg/m³: 0.45359237 kg / (0.0254 m)³
  'lb/in³': { kind: 'density', toSI: 0.45359237 / (0.0254 * 0.0254 * 0.0254) },
  '—': { kind: 'dimensionless', toSI: 1 },
} as const satisfies Record<string, UnitDef>

export type Unit = keyof typeof UNITS

export function isUnit(u: string): u is Unit {
  return Object.prototype.hasOwnProperty.call(UNITS, u)
}

/** A value in `unit` expressed in the SI-inside unit of the same kind. */
export function toSI(value: number, unit: Unit): number {
  return value * UNITS[unit].toSI
}

/** A value in the SI-inside unit expressed in `unit`. */
export function fromSI(value: number, unit: Unit): number {
  return value / UNITS[unit].toSI
}

export function kindOf(unit: Unit): QuantityKind {
  return UNITS[unit].kind
}

/** Direct conversion between two units of the same kind; a mismatch is a programming error. */
export function convert(value: number, from: Unit, to: Unit): number {
  if (UNITS[from].kind !== UNITS[to].kind) {
    throw new Error(`cannot convert ${from} (${UNITS[from].kind}) to ${to} (${UNITS[to].kind})`)
  }
  return fromSI(toSI(value, from), to)
}
