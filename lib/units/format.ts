/**
 * The one number formatter. Every number Inverso prints — in a step's TeX, in a note, in a table,
 * in the PDF and the web view, on the calc page — goes through `roundShown`, so a value reads the
 * same wherever it appears. Rules:
 *
 * - four significant figures; from 1000 up, whole numbers (no figure of an integer part is lost);
 * - below 10⁻³ (residuals of the verification steps) a power of ten;
 * - a true minus sign (U+2212) in text, TeX's own minus in formulas;
 * - thin-space groups of three from five integer digits on (text only);
 * - utilisations to three decimals, rounded up: a failing 1.0003 reads 1.001, never 1.000;
 * - `direction: 'up' | 'down'` rounds away from or toward the limit, so a comparison that fails
 *   never reads as if it held (`formatPair`).
 */

export const MINUS = '\u2212'
const THIN = '\u2009'
/** Significant figures of every printed number. */
export const SIGNIFICANT = 4
/** Below this magnitude a number is written as a power of ten. */
const SMALL = 1e-3

export type Direction = 'nearest' | 'up' | 'down'

function roundTo(x: number, step: number, dir: Direction): number {
  // The 1e-9 guard keeps binary noise (0.56 * 1000 = 560.0000000000001) from moving a figure.
  const q = x / step
  const r = dir === 'up' ? Math.ceil(q - 1e-9) : dir === 'down' ? Math.floor(q + 1e-9) : Math.round(q)
  return r * step
}

/**
 * x / 10^e and m · 10^e for a power of ten: 10^e itself underflows to 0 below 10⁻³⁰⁷, which turned the
 * smallest doubles (5e-324) into NaN; there the power is applied in two steps.
 */
const divPow10 = (x: number, e: number): number => (e < -300 ? (x * 1e20) / 10 ** (e + 20) : x / 10 ** e)
const mulPow10 = (m: number, e: number): number => (e < -300 ? (m * 10 ** (e + 20)) / 1e20 : m * 10 ** e)

/** Decimal places shown for |x| (0 from 1000 up). */
function decimalsOf(x: number): number {
  const a = Math.abs(x)
  if (a >= 1000) return 0
  return Math.max(0, SIGNIFICANT - 1 - Math.floor(Math.log10(a)))
}

/** The value as it is shown: rounded to its printed figures. */
export function roundShown(x: number, dir: Direction = 'nearest'): number {
  if (!Number.isFinite(x) || x === 0) return x
  if (Math.abs(x) < SMALL) {
    const e = Math.floor(Math.log10(Math.abs(x)))
    return Number(mulPow10(roundTo(divPow10(x, e), 10 ** -(SIGNIFICANT - 2), dir), e).toPrecision(SIGNIFICANT - 1))
  }
  let d = decimalsOf(x)
  let r = roundTo(x, 10 ** -d, dir)
  // Rounding may carry into the next decade (999.96 → 1000): count the figures again.
  if (decimalsOf(r) !== d && r !== 0) {
    d = decimalsOf(r)
    r = roundTo(x, 10 ** -d, dir)
  }
  return Number(r.toFixed(d))
}

function digitsOf(x: number, group: boolean): string {
  const d = Math.abs(x) >= 1000 ? 0 : decimalsOf(x)
  const s = Math.abs(x).toFixed(Math.min(20, d)).replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '')
  if (!group) return s
  const [int, frac] = s.split('.')
  const grouped = int.length > 4 ? int.replace(/\B(?=(\d{3})+(?!\d))/g, THIN) : int
  return frac ? `${grouped}.${frac}` : grouped
}

const SUPER: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' }

/** Plain text: `52 500`, `7.302`, `−180`, `2.1×10⁻¹³`. */
export function formatNumber(x: number, dir: Direction = 'nearest'): string {
  if (!Number.isFinite(x)) return 'n/a'
  const r = roundShown(x, dir)
  if (r === 0) return '0'
  const sign = r < 0 ? MINUS : ''
  if (Math.abs(r) < SMALL) {
    const e = Math.floor(Math.log10(Math.abs(r)))
    const m = Number(divPow10(Math.abs(r), e).toPrecision(SIGNIFICANT - 1))
    return `${sign}${m}×10${[...String(e)].map((c) => SUPER[c]).join('')}`
  }
  return sign + digitsOf(r, true)
}

/** TeX: `52500`, `-180`, `2.1 \times 10^{-13}`; the same figures as `formatNumber`. */
export function texNumber(x: number, dir: Direction = 'nearest'): string {
  if (!Number.isFinite(x)) return '\\text{n/a}'
  const r = roundShown(x, dir)
  if (r === 0) return '0'
  const sign = r < 0 ? '-' : ''
  if (Math.abs(r) < SMALL) {
    const e = Math.floor(Math.log10(Math.abs(r)))
    const m = Number(divPow10(Math.abs(r), e).toPrecision(SIGNIFICANT - 1))
    return `${sign}${m} \\times 10^{${e}}`
  }
  return sign + digitsOf(r, false)
}

/** Bracketed when negative, for a value put into an expression. */
export const texNumberP = (x: number): string => (roundShown(x) < 0 ? `\\left(${texNumber(x)}\\right)` : texNumber(x))

/**
 * A check is met when u ≤ 1 + MET_TOLERANCE (lib/checks/report.ts): a relative allowance for binary
 * noise in demand and capacity.
 */
export const MET_TOLERANCE = 1e-9

/**
 * Utilisation as shown: three decimals, rounded up, so a value above 1 never reads as 1.000 — and,
 * with the same relative allowance as the verdict, a met check never reads as 1.001.
 */
export function utilisationShown(u: number): number {
  if (!Number.isFinite(u)) return u
  return Math.max(0, Number((Math.ceil((u / 0.001) * (1 - MET_TOLERANCE)) * 0.001).toFixed(3)))
}

export function formatUtilisation(u: number): string {
  return Number.isFinite(u) ? utilisationShown(u).toFixed(3) : 'n/a'
}

/**
 * A demand and a capacity as a comparison shows them: when the check fails the demand is rounded
 * up and the capacity down, so the printed numbers never make a failing check look met.
 */
export function shownPair(demand: number, capacity: number, fails: boolean): [number, number] {
  return fails ? [roundShown(demand, 'up'), roundShown(capacity, 'down')] : [roundShown(demand), roundShown(capacity)]
}
