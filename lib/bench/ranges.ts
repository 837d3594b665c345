/**
 * The range every number of a calc input must lie in, with the reason, checked at the field
 * before anything runs (`parseCalcInput`, the single-component CLI and the bench form all read this
 * one table). Values are SI inside (mm, N, N·mm, MPa, degrees); the limits are wide enough for any
 * cell this calc is meant for (bench-top guides to machine frames) and catch typing slips such as an
 * arm of 1e12 mm, which would otherwise run into Infinity or NaN deep in the engine.
 * `common practice` unless noted. This file imports only lib/units, so every layer of lib may read it.
 */
import { inputToSI, outputFromSI, kindOfSILabel, displayUnit, type UnitSystem } from '@/lib/units'

export interface NumberRange {
  min: number
  max: number
  /** SI unit label of the limits ('mm', 'N', '°', '—'). */
  unit: string
  /** Why the range is what it is: shown after the limits. */
  why: string
  /** The lower limit itself is not allowed (a length must be above 0). */
  minExclusive?: boolean
  /** Whole numbers only. */
  integer?: boolean
}

/** Geometry of the built-in cells (their fields name these ranges, lib/mechanisms). */
export const LINK_RANGE: NumberRange = { min: 1, max: 5000, unit: 'mm', why: 'links from 1 mm to 5 m cover bench-top guides to machine frames' }
export const RATIO_RANGE: NumberRange = { min: 0.05, max: 0.95, unit: '—', why: 'μ places O, P and T along the links; near 0 or 1 the points crowd the link ends and k vanishes' }
export const OFFSET_RANGE: NumberRange = { min: 0, max: 5000, unit: 'mm', why: 'the crank pivot lies between the pole and 5 m from it' }

const LOAD: NumberRange = { min: -1e6, max: 1e6, unit: 'N', why: 'loads up to 1 MN either way; beyond that a pin-jointed cell is not the mechanism' }
const ANGLE: NumberRange = { min: -360, max: 360, unit: '°', why: 'a crank angle within one turn either way' }
const FORCE: NumberRange = { min: 0, max: 1e6, unit: 'N', why: 'a force up to 1 MN; beyond that a pin-jointed cell is not the mechanism' }
const STRENGTH: NumberRange = { min: 10, max: 3000, unit: 'MPa', why: 'strengths from soft aluminium (tens of MPa) to the strongest pin steels (about 2000 MPa)' }
const DENSITY: NumberRange = { min: 100, max: 25000, unit: 'kg/m³', why: 'from plastics to tungsten' }
const PARTIAL: NumberRange = { min: 1, max: 2, unit: '—', why: 'partial factors from 1.0 to 2.0 (EN 1993 recommends 1.0 to 1.25)' }

/** At most this many crank positions per load case (sweep.count, crankAnglesDeg). */
export const MAX_POSITIONS = 2000
/** First match wins; `*` stands for one path segment. */
export const RANGES: [pattern: string, range: NumberRange][] = [
  ['geometry.ratio', RATIO_RANGE],
  ['geometry.crankPivotOffset', OFFSET_RANGE],
  ['geometry.*', LINK_RANGE],
  ['requiredStroke', { min: 1, max: 5000, unit: 'mm', why: 'a stroke from 1 mm to 5 m' }],
  ['toggleMarginDeg', { min: 0, max: 45, unit: '°', why: 'a margin of 0° to 45° of crank angle from each locked position' }],
  ['amplificationLimit', { min: 2, max: 10000, unit: '—', why: 'pin force per newton of load at which a position counts as locked' }],
  ['minTransmissionAngleDeg', { min: 0, max: 90, unit: '°', why: 'a transmission angle lies between 0° and 90° (30° is the usual least)' }],
  ['straightnessTolerance', { min: 0.001, max: 100, unit: 'mm', why: 'from 1 µm (beyond what the pins hold) to 100 mm' }],
  ['loads.*.fx', LOAD],
  ['loads.*.fy', LOAD],
  ['selfWeight.density', DENSITY],
  ['selfWeight.area', { min: 0.1, max: 1e5, unit: 'mm²', why: 'a link section from 0.1 mm² to 0.1 m²' }],
  ['selfWeight.g', { min: 0.1, max: 100, unit: 'm/s²', why: 'gravity or a machine acceleration up to about 10 g' }],
  ['selfWeight.directionDeg', ANGLE],
  ['sweep.count', { min: 1, max: MAX_POSITIONS, unit: '—', why: `at most ${MAX_POSITIONS} positions per load case`, integer: true }],
  ['sweep.fromDeg', ANGLE],
  ['sweep.toDeg', ANGLE],
  ['crankAnglesDeg.*', ANGLE],
  ['workingRange.fromDeg', ANGLE],
  ['workingRange.toDeg', ANGLE],
  ['basis.gammaM0', PARTIAL],
  ['basis.gammaM1', PARTIAL],
  ['basis.gammaM2', PARTIAL],
  ['basis.gammaM6ser', PARTIAL],
  ['basis.factorOfSafety', { min: 1, max: 10, unit: '—', why: 'a factor of safety from 1 to 10' }],
  ['factors.load', { min: 1, max: 3, unit: '—', why: 'a load factor from 1.0 (service) to 3.0' }],
  ['factors.dynamic', { min: 1, max: 5, unit: '—', why: 'a dynamic factor from 1.0 (slow) to 5.0 (impact)' }],
  ['materials.*.fy', STRENGTH],
  ['materials.*.fu', STRENGTH],
  ['materials.*.E', { min: 10000, max: 400000, unit: 'MPa', why: 'a modulus from 10 GPa to 400 GPa (aluminium about 70 GPa, steel about 210 GPa)' }],
  ['materials.*.density', DENSITY],
  ['materials.*.bands.*.upTo', { min: 1, max: 1000, unit: 'mm', why: 'a strength band up to a thickness or diameter from 1 mm to 1 m' }],
  ['materials.*.bands.*.fy', STRENGTH],
  ['materials.*.bands.*.fu', STRENGTH],
  ['component.force', FORCE],
  ['component.tension', FORCE],
  ['component.compression', FORCE],
  ['component.eye', FORCE],
  ['component.moment', { min: 0, max: 1e9, unit: 'N·mm', why: 'a moment up to 1 MN·m' }],
  ['*.*.pinDiameter', { min: 2, max: 200, unit: 'mm', why: 'pins from 2 mm to 200 mm' }],
  ['*.*.holeDiameter', { min: 2, max: 210, unit: 'mm', why: 'holes from 2 mm to 210 mm' }],
  ['*.*.gap', { min: 0, max: 100, unit: 'mm', why: 'a gap between plates of 0 to 100 mm' }],
  ['*.*.*.thickness', { min: 0.5, max: 200, unit: 'mm', why: 'plates and bars from 0.5 mm to 200 mm thick' }],
  ['*.*.*.width', { min: 2, max: 500, unit: 'mm', why: 'bars and eyes from 2 mm to 500 mm wide' }],
  ['*.*.*.edgeAlong', { min: 1, max: 500, unit: 'mm', why: 'an eye end distance from 1 mm to 500 mm' }],
  ['*.*.*.holeDiameter', { min: 2, max: 210, unit: 'mm', why: 'holes from 2 mm to 210 mm' }],
  ['*.*.*.pinDiameter', { min: 2, max: 200, unit: 'mm', why: 'pins from 2 mm to 200 mm' }],
  ['*.*.*.diameter', { min: 2, max: 500, unit: 'mm', why: 'round bars from 2 mm to 500 mm' }],
  ['*.*.*.outerDiameter', { min: 2, max: 500, unit: 'mm', why: 'tubes from 2 mm to 500 mm' }],
  ['*.*.*.wall', { min: 0.5, max: 100, unit: 'mm', why: 'tube walls from 0.5 mm to 100 mm' }],
  ['*.*.length', { min: 1, max: 5000, unit: 'mm', why: 'links from 1 mm to 5 m' }],
  ['*.*.effectiveLengthFactor', { min: 0.5, max: 5, unit: '—', why: 'K from 0.5 to 5' }],
]

function matches(pattern: string, path: string): boolean {
  const p = pattern.split('.')
  const q = path.split('.')
  return p.length === q.length && p.every((s, i) => s === '*' || s === q[i])
}

export function rangeFor(path: string): NumberRange | undefined {
  return RANGES.find(([pattern]) => matches(pattern, path))?.[1]
}

/** `must be from 1 mm to 5000 mm: links from …`, with the limits in the unit shown (`show` converts from SI). */
export function rangeMessage(r: NumberRange, show: (v: number) => string = String, unit = r.unit): string {
  const u = unit === '—' ? '' : unit === '°' ? '°' : ` ${unit}`
  return `must be ${r.integer ? 'a whole number ' : ''}${r.minExclusive ? 'above' : 'from'} ${show(r.min)}${u} to ${show(r.max)}${u}: ${r.why}`
}

export function outOfRange(r: NumberRange, value: number): boolean {
  if (r.integer && !Number.isInteger(value)) return true
  return (r.minExclusive ? value <= r.min : value < r.min) || value > r.max
}

/**
 * The keys of the pin and link part of an input: in `"units": "US"` their numbers are inches, lbf,
 * lbf·in, ksi and lb/in³ (docs/checks.md); the mechanism part is always SI.
 */
const CHECKS_PART = new Set(['materials', 'joints', 'links', 'defaults', 'component'])

/** Every number in the input tree with its dotted path (arrays longer than `maxArray` are not walked: their length is refused first). */
function numbersIn(node: unknown, prefix: string, out: [string, number][], maxArray: number) {
  if (typeof node === 'number') out.push([prefix, node])
  else if (Array.isArray(node)) {
    if (node.length <= maxArray) node.forEach((v, i) => numbersIn(v, prefix ? `${prefix}.${i}` : String(i), out, maxArray))
  } else if (node && typeof node === 'object') for (const [k, v] of Object.entries(node)) numbersIn(v, prefix ? `${prefix}.${k}` : k, out, maxArray)
  return out
}

export interface RangeOptions {
  /** Leave `geometry.*` to the mechanism's own schema (a registered mechanism declares its own fields). */
  skipGeometry?: boolean
}

/**
 * Field errors for numbers outside their range, keyed by dotted path. Limits are SI; an input in
 * `"units": "US"` has its pin and link numbers compared in SI and the message gives the limits in
 * the units it was typed in.
 */
export function rangeErrors(raw: unknown, opts: RangeOptions = {}): Record<string, string> {
  const out: Record<string, string> = {}
  const system: UnitSystem = raw && typeof raw === 'object' && (raw as { units?: unknown }).units === 'US' ? 'US' : 'SI'
  for (const [path, value] of numbersIn(raw, '', [], MAX_POSITIONS)) {
    if (opts.skipGeometry && path.startsWith('geometry.')) continue
    const r = rangeFor(path)
    if (!r) continue
    if (!Number.isFinite(value)) {
      out[path] = 'must be a number'
      continue
    }
    const kind = system === 'US' && CHECKS_PART.has(path.split('.')[0]) ? kindOfSILabel(r.unit) : null
    if (!kind) {
      if (outOfRange(r, value)) out[path] = rangeMessage(r)
      continue
    }
    const si = inputToSI(value, system, kind)
    // Compare with a hair of slack: a limit typed in US units may convert back a few ulps outside.
    const slack = 1e-9 * Math.max(Math.abs(r.min), Math.abs(r.max))
    if (si < r.min - slack || si > r.max + slack || (r.minExclusive && si <= r.min)) {
      out[path] = rangeMessage(r, (v) => String(Number(outputFromSI(v, system, kind).toPrecision(4))), displayUnit(system, kind))
    }
  }
  return out
}
