/**
 * How values read in both renderings. One formatter, so the PDF, the web view
 * and the tests agree on every digit.
 */
import { STATE_LABELS, STATES } from '../../lib/review/workflow'
import type { StepVerdict } from '../../lib/contract'
import type { RevisionState } from '../types'

// ASCII hyphen-minus: the shipped Noto Sans has no U+2212, and copied numbers must paste as numbers.
const MINUS = '-'

/** Digits follow magnitude: a few significant figures, never scientific notation. */
export function formatNumber(n: number, digits?: number): string {
  if (!Number.isFinite(n)) return String(n)
  const a = Math.abs(n)
  const d = digits ?? (a === 0 ? 0 : a >= 1000 ? 0 : a >= 100 ? 1 : a >= 1 ? 2 : 3)
  let s = a.toFixed(d)
  if (Number(s) === 0) return d === 0 ? '0' : (0).toFixed(d)
  const [int, frac] = s.split('.')
  // A thin space groups thousands only from five digits on, as drawings do.
  const grouped = int.length > 4 ? int.replace(/\B(?=(\d{3})+(?!\d))/g, '\u2009') : int
  s = frac ? `${grouped}.${frac}` : grouped
  return n < 0 ? MINUS + s : s
}

export function formatValue(value: number | string | boolean | undefined, unit?: string): string {
  if (value === undefined) return ''
  const body =
    typeof value === 'number' ? formatNumber(value) : typeof value === 'boolean' ? (value ? 'yes' : 'no') : value
  if (!unit || unit === '—') return body
  return unit === '°' ? `${body}°` : `${body} ${unit}`
}

/** Same digits as the step that shows the working, so the two always read alike. */
export function formatUtilisation(u: number): string {
  return formatNumber(u)
}

export const VERDICT_LABEL: Record<StepVerdict, string> = {
  pass: 'PASS',
  fail: 'FAIL',
  warn: 'WARN',
  info: 'INFO',
}

/** The same state names as the app's. */
export const STATE_LABEL: Record<RevisionState, string> = STATE_LABELS

/** Watermark shown across every page, or null for states that may be relied on. */
export function watermarkFor(state: RevisionState): string | null {
  return STATES[state].watermark
}

export function formatDate(iso: string | undefined): string {
  return iso ? iso.slice(0, 10) : '—'
}
