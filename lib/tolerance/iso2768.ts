/**
 * General tolerances for linear dimensions, ISO 2768-1 (1989) Table 1: permissible deviations (±, mm)
 * by tolerance class and nominal-size band. Values from memory; two secondary copies of the table
 * seen on the web agree with them except coarse 0.5–3 mm, which one gives as ±0.15 — check against
 * a copy of the standard before issue. Link lengths of the cells here fall in the bands above 6 mm.
 */

export type ToleranceClass = 'f' | 'm' | 'c' | 'v'

export const TOLERANCE_CLASS_NAMES: Record<ToleranceClass, string> = { f: 'fine', m: 'medium', c: 'coarse', v: 'very coarse' }

/** Upper ends of the nominal-size bands, mm: 0.5–3, over 3–6, over 6–30, … over 2000–4000. */
export const ISO2768_BANDS = [3, 6, 30, 120, 400, 1000, 2000, 4000] as const

/** ± deviation per band; null: no general tolerance in that band for the class. */
export const ISO2768_LINEAR: Record<ToleranceClass, readonly (number | null)[]> = {
  f: [0.05, 0.05, 0.1, 0.15, 0.2, 0.3, 0.5, null],
  m: [0.1, 0.1, 0.2, 0.3, 0.5, 0.8, 1.2, 2],
  c: [0.2, 0.3, 0.5, 0.8, 1.2, 2, 3, 4],
  v: [null, 0.5, 1, 1.5, 2.5, 4, 6, 8],
}

/** Where the values come from, as printed beside them. */
export const ISO2768_SOURCE = 'ISO 2768-1:1989, Table 1 (values from memory)'

export type GeneralTolerance =
  | { ok: true; plusMinus: number; band: string }
  | { ok: false; reason: string }

function bandLabel(i: number): string {
  return i === 0 ? '0.5–3 mm' : `over ${ISO2768_BANDS[i - 1]} to ${ISO2768_BANDS[i]} mm`
}

/** The ± general tolerance of a nominal size in a class, or why there is none. */
export function generalTolerance(cls: ToleranceClass, nominal: number): GeneralTolerance {
  if (!(nominal >= 0.5)) return { ok: false, reason: `nominal size ${nominal} mm is below 0.5 mm: ISO 2768-1 asks for the tolerance beside the dimension` }
  const i = ISO2768_BANDS.findIndex((top) => nominal <= top)
  if (i < 0) return { ok: false, reason: `nominal size ${nominal} mm is above 4000 mm, beyond ISO 2768-1's table` }
  const t = ISO2768_LINEAR[cls][i]
  if (t === null) return { ok: false, reason: `class ${cls} (${TOLERANCE_CLASS_NAMES[cls]}) gives no general tolerance ${bandLabel(i)}` }
  return { ok: true, plusMinus: t, band: bandLabel(i) }
}
