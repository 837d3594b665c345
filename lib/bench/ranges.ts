/**
 * The range every number of a calc input must lie in, with the reason, checked at the field
 * before anything runs. Values are SI inside (mm, N, degrees); the limits are wide enough for
 * any cell this calc is meant for (bench-top guides to machine frames) and catch typing slips
 * such as an arm of 1e12 mm. `common practice` unless noted.
 */
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

const LINK: NumberRange = { min: 1, max: 5000, unit: 'mm', why: 'links from 1 mm to 5 m cover bench-top guides to machine frames' }
const LOAD: NumberRange = { min: -1e6, max: 1e6, unit: 'N', why: 'loads up to 1 MN either way; beyond that a pin-jointed cell is not the mechanism' }

/** First match wins; `*` stands for one path segment. */
export const RANGES: [pattern: string, range: NumberRange][] = [
  ['geometry.ratio', { min: 0.05, max: 0.95, unit: '—', why: 'μ places O, P and T along the links; near 0 or 1 the points crowd the link ends and k vanishes' }],
  ['geometry.crankPivotOffset', { min: 0, max: 5000, unit: 'mm', why: 'the crank pivot lies between the pole and 5 m from it' }],
  ['geometry.*', LINK],
  ['requiredStroke', { min: 1, max: 5000, unit: 'mm', why: 'a stroke from 1 mm to 5 m' }],
  ['toggleMarginDeg', { min: 0, max: 45, unit: '°', why: 'a margin of 0° to 45° of crank angle from each locked position' }],
  ['amplificationLimit', { min: 2, max: 10000, unit: '—', why: 'pin force per newton of load at which a position counts as locked' }],
  ['loads.*.fx', LOAD],
  ['loads.*.fy', LOAD],
  ['selfWeight.density', { min: 100, max: 25000, unit: 'kg/m³', why: 'from plastics to tungsten' }],
  ['selfWeight.area', { min: 0.1, max: 1e5, unit: 'mm²', why: 'a link section from 0.1 mm² to 0.1 m²' }],
  ['sweep.count', { min: 1, max: 10000, unit: '—', why: 'at most 10 000 positions', integer: true }],
  ['basis.gammaM0', { min: 1, max: 2, unit: '—', why: 'partial factors from 1.0 to 2.0 (EN 1993 recommends 1.0 to 1.25)' }],
  ['basis.gammaM1', { min: 1, max: 2, unit: '—', why: 'partial factors from 1.0 to 2.0 (EN 1993 recommends 1.0 to 1.25)' }],
  ['basis.gammaM2', { min: 1, max: 2, unit: '—', why: 'partial factors from 1.0 to 2.0 (EN 1993 recommends 1.0 to 1.25)' }],
  ['basis.gammaM6ser', { min: 1, max: 2, unit: '—', why: 'partial factors from 1.0 to 2.0 (EN 1993 recommends 1.0 to 1.25)' }],
  ['basis.factorOfSafety', { min: 1, max: 10, unit: '—', why: 'a factor of safety from 1 to 10' }],
  ['factors.load', { min: 1, max: 3, unit: '—', why: 'a load factor from 1.0 (service) to 3.0' }],
  ['factors.dynamic', { min: 1, max: 5, unit: '—', why: 'a dynamic factor from 1.0 (slow) to 5.0 (impact)' }],
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

/** `must be between 1 and 5000 mm: links from …`, with the limits in the unit shown (`show` converts from SI). */
export function rangeMessage(r: NumberRange, show: (v: number) => string = String, unit = r.unit): string {
  const u = unit === '—' ? '' : unit === '°' ? '°' : ` ${unit}`
  return `must be ${r.minExclusive ? 'above' : 'from'} ${show(r.min)}${u} to ${show(r.max)}${u}: ${r.why}`
}

export function outOfRange(r: NumberRange, value: number): boolean {
  if (r.integer && !Number.isInteger(value)) return true
  return (r.minExclusive ? value <= r.min : value < r.min) || value > r.max
}

/** Every number in the input tree with its dotted path. */
function numbersIn(node: unknown, prefix: string, out: [string, number][]) {
  if (typeof node === 'number') out.push([prefix, node])
  else if (Array.isArray(node)) node.forEach((v, i) => numbersIn(v, prefix ? `${prefix}.${i}` : String(i), out))
  else if (node && typeof node === 'object') for (const [k, v] of Object.entries(node)) numbersIn(v, prefix ? `${prefix}.${k}` : k, out)
  return out
}

/** Field errors for numbers outside their range, keyed by dotted path (limits in SI). */
export function rangeErrors(raw: unknown): Record<string, string> {
  const out: Record<string, string> = {}
  for (const [path, value] of numbersIn(raw, '', [])) {
    const r = rangeFor(path)
    if (!r) continue
    if (!Number.isFinite(value)) out[path] = 'must be a number'
    else if (outOfRange(r, value)) out[path] = rangeMessage(r)
  }
  return out
}
