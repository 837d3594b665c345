/**
 * How values read in both renderings. One formatter, so the PDF, the web view
 * and the tests agree on every digit.
 */
import { STATE_LABELS, STATES } from '../../lib/review/workflow'
import type { StepVerdict } from '../../lib/contract'
import type { RevisionState } from '../types'
import { formatNumber as fmt, formatUtilisation as fmtU } from '../../lib/units/format'
import { displayUnit, kindOfSILabel, outputFromSI, type UnitSystem } from '../../lib/units/system'

/**
 * Every number goes through the one formatter of lib/units (four significant figures, a true minus
 * sign, utilisations rounded up to three decimals). `digits` is accepted for old callers and ignored:
 * a value reads the same in a table, a step and the verdict.
 */
export function formatNumber(n: number, _digits?: number): string {
  return fmt(n)
}

/** A value with its unit: as computed (SI), or converted to US customary when the package prints in US units. */
export function formatValue(value: number | string | boolean | undefined, unit?: string, system: UnitSystem = 'SI'): string {
  if (value === undefined) return ''
  const kind = system === 'US' && typeof value === 'number' && unit ? kindOfSILabel(unit) : null
  if (kind) return formatValue(outputFromSI(value as number, 'US', kind), displayUnit('US', kind))
  const body =
    typeof value === 'number' ? formatNumber(value) : typeof value === 'boolean' ? (value ? 'yes' : 'no') : value
  if (!unit || unit === '—') return body
  return unit === '°' ? `${body}°` : `${body} ${unit}`
}

/**
 * A step's result: in the SI units its working is written in and, in a US package, the same value in
 * US customary units after it, so the substituted line and the result can still be checked together.
 */
export function formatResult(value: number | string | boolean | undefined, unit: string | undefined, system: UnitSystem = 'SI'): string {
  const si = formatValue(value, unit)
  const us = system === 'US' ? formatValue(value, unit, 'US') : si
  return us === si ? si : `${si} (${us})`
}

/** A table column's unit and the factor-free conversion of its values in the package's system. */
export function columnUnit(unit: string | undefined, system: UnitSystem): { unit: string | undefined; show: (v: number) => number } {
  const kind = system === 'US' && unit ? kindOfSILabel(unit) : null
  return kind ? { unit: displayUnit('US', kind), show: (v) => outputFromSI(v, 'US', kind) } : { unit, show: (v) => v }
}

/** The utilisation as printed everywhere: three decimals, rounded up (a failing 1.0003 reads 1.001). */
export function formatUtilisation(u: number): string {
  return fmtU(u)
}

/** How the value column words a verdict: only what needs the reader's attention is marked. */
export const VERDICT_LABEL: Record<StepVerdict, string> = {
  pass: '',
  fail: 'fails',
  warn: 'see note',
  info: '',
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
