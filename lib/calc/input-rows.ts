import { getMechanism } from '@/lib/mechanisms'
import { displayUnit, kindOfSILabel, type UnitSystem } from '@/lib/units/system'
import type { CalcInput } from './run'
import { DEFAULT_MIN_TRANSMISSION_DEG, DEFAULT_STRAIGHTNESS_TOLERANCE } from './mechanism'

export interface InputRow {
  group: string
  label: string
  value: number | string
  unit: string
}

/** Labels and units of the nested keys (pins, links, basis, self-weight, materials), by dotted key. */
const KEY_LABELS: Record<string, [string, string]> = {
  kind: ['Kind', ''],
  gammaM0: ['Partial factor γM0', '—'],
  gammaM1: ['Partial factor γM1', '—'],
  gammaM2: ['Partial factor γM2', '—'],
  gammaM6ser: ['Partial factor γM6,ser', '—'],
  factorOfSafety: ['Factor of safety', '—'],
  method: ['Method', ''],
  pinDiameter: ['Pin diameter d', 'mm'],
  holeDiameter: ['Hole diameter d₀', 'mm'],
  pinMaterial: ['Pin material', ''],
  arrangement: ['Arrangement', ''],
  'middle.thickness': ['Middle plate thickness', 'mm'],
  'middle.material': ['Middle plate material', ''],
  'outer.thickness': ['Outer plate thickness (each)', 'mm'],
  'outer.material': ['Outer plate material', ''],
  'plate1.thickness': ['Plate 1 thickness', 'mm'],
  'plate1.material': ['Plate 1 material', ''],
  'plate2.thickness': ['Plate 2 thickness', 'mm'],
  'plate2.material': ['Plate 2 material', ''],
  gap: ['Gap between plates c', 'mm'],
  replaceable: ['Replaceable pin', ''],
  'section.shape': ['Section', ''],
  'section.width': ['Section width', 'mm'],
  'section.thickness': ['Section thickness', 'mm'],
  'section.diameter': ['Bar diameter', 'mm'],
  'section.outerDiameter': ['Tube outer diameter', 'mm'],
  'section.wall': ['Tube wall', 'mm'],
  material: ['Material', ''],
  'eye.thickness': ['Eye thickness', 'mm'],
  'eye.width': ['Eye width across the force', 'mm'],
  'eye.holeDiameter': ['Eye hole diameter', 'mm'],
  'eye.pinDiameter': ['Eye pin diameter', 'mm'],
  'eye.edgeAlong': ['Eye end distance a (hole edge to end)', 'mm'],
  'eye.material': ['Eye material', ''],
  'eye.table39Type': ['EN 1993-1-8 Table 3.9 type', ''],
  length: ['Length between pins', 'mm'],
  effectiveLengthFactor: ['Effective length factor K', '—'],
  bucklingCurve: ['Buckling curve', ''],
  density: ['Density', 'kg/m³'],
  area: ['Section area', 'mm²'],
  g: ['Gravity g', 'm/s²'],
  directionDeg: ['Direction of gravity', '°'],
  fy: ['Yield strength f_y', 'MPa'],
  fu: ['Tensile strength f_u', 'MPa'],
  E: ['Modulus E', 'MPa'],
  source: ['Source', ''],
  name: ['Name', ''],
}

const VALUE_LABELS: Record<string, string> = {
  en1993: 'EN 1993-1-8 §3.13 with EN 1993-1-1',
  aisc360: 'AISC 360-16 §D5 and §J7',
  allowable: 'Allowable stress with a factor of safety',
  double: 'double shear (fork)',
  single: 'single shear (lapped)',
  flat: 'flat bar',
  round: 'round bar',
  tube: 'tube',
}

/** Flattens a nested description (pin/link defaults, basis) into labelled rows. */
function flatten(group: string, prefix: string, value: unknown, out: InputRow[], system: UnitSystem = 'SI') {
  if (value === undefined || value === null) return
  if (typeof value === 'object' && !Array.isArray(value)) {
    for (const [k, v] of Object.entries(value)) flatten(group, prefix ? `${prefix}.${k}` : k, v, out, system)
    return
  }
  const [label, siUnit] = KEY_LABELS[prefix] ?? [prefix, '']
  // Check inputs given in US customary units are printed as given, with their own units.
  const kind = system === 'US' ? kindOfSILabel(siUnit) : null
  const unit = kind ? displayUnit('US', kind) : siUnit
  const shown = typeof value === 'boolean' ? (value ? 'yes' : 'no') : typeof value === 'string' ? (VALUE_LABELS[value] ?? value) : (value as number)
  out.push({ group, label, value: shown, unit })
}

/** The inputs table of the calc package: every value the engineer entered, grouped. */
export function inputRowsOf(input: CalcInput): InputRow[] {
  const m = input.mechanism
  const def = getMechanism(m.mechanism)
  const rows: InputRow[] = [{ group: 'Mechanism', label: 'Type', value: def.label, unit: '' }]
  // The parsed geometry: defaults (e.g. e = r) shown as the values the calc used.
  const geometry = def.geometry.parse(m.geometry)
  for (const f of def.fields) {
    const value = geometry[f.key]
    if (value !== undefined) rows.push({ group: 'Geometry', label: f.description, value, unit: f.unit })
  }
  if (m.requiredStroke) rows.push({ group: 'Working range', label: 'Stroke the machine needs', value: m.requiredStroke, unit: 'mm' })
  if (m.workingRange) {
    rows.push({ group: 'Working range', label: 'End stop, crank angle', value: m.workingRange.fromDeg, unit: '°' })
    rows.push({ group: 'Working range', label: 'Other end stop, crank angle', value: m.workingRange.toDeg, unit: '°' })
  }
  rows.push({ group: 'Working range', label: 'Margin kept from the locked positions', value: m.toggleMarginDeg ?? 5, unit: '°' })
  rows.push({
    group: 'Working range',
    label: m.minTransmissionAngleDeg === undefined ? 'Smallest transmission angle (default, common practice)' : 'Smallest transmission angle',
    value: m.minTransmissionAngleDeg ?? DEFAULT_MIN_TRANSMISSION_DEG,
    unit: '°',
  })
  rows.push({
    group: 'Working range',
    label: m.straightnessTolerance === undefined ? 'Straightness tolerance (default)' : 'Straightness tolerance',
    value: m.straightnessTolerance ?? DEFAULT_STRAIGHTNESS_TOLERANCE,
    unit: 'mm',
  })
  for (const l of m.loads) {
    rows.push({ group: 'Load cases (at the tracer)', label: `${l.name}: Fx`, value: l.fx, unit: 'N' })
    rows.push({ group: 'Load cases (at the tracer)', label: `${l.name}: Fy`, value: l.fy, unit: 'N' })
  }
  if (m.selfWeight) flatten('Self-weight of links', '', m.selfWeight, rows)
  if (m.tolerances) {
    const t = m.tolerances
    rows.push({ group: 'Straightness as built', label: 'General tolerance class (ISO 2768-1)', value: t.toleranceClass ?? 'm', unit: '' })
    for (const [item, pm] of Object.entries(t.lengths ?? {})) rows.push({ group: 'Straightness as built', label: `Tolerance of ${item} (±)`, value: pm, unit: 'mm' })
    rows.push({ group: 'Straightness as built', label: 'Monte Carlo samples', value: t.samples ?? 2000, unit: '' })
    rows.push({ group: 'Straightness as built', label: 'Seed of the random stream', value: t.seed ?? 1, unit: '' })
    rows.push({ group: 'Straightness as built', label: 'Distribution of each length', value: t.distribution ?? 'normal', unit: '' })
  }
  if (m.operatingSpeed) {
    rows.push({ group: 'Operating speed', label: 'Crank speed n (constant)', value: m.operatingSpeed.rpm, unit: 'rev/min' })
    rows.push({ group: 'Operating speed', label: 'Tool and carriage mass at T', value: m.operatingSpeed.toolMass ?? 0, unit: 'kg' })
  }
  const c = input.checks
  if (c) {
    const sys = c.units
    flatten('Design basis', '', c.basis, rows, sys)
    rows.push({ group: 'Design basis', label: 'Load factor', value: c.factors.load, unit: '—' })
    rows.push({ group: 'Design basis', label: 'Dynamic factor', value: c.factors.dynamic, unit: '—' })
    flatten('Pins (all joints unless listed)', '', c.defaults.joint, rows, sys)
    flatten('Links (all links unless listed)', '', c.defaults.link, rows, sys)
    for (const [name, j] of Object.entries(c.joints)) flatten(`Joint ${name}`, '', j, rows, sys)
    for (const [name, l] of Object.entries(c.links)) flatten(`Link ${name}`, '', l, rows, sys)
    for (const [name, mat] of Object.entries(c.materials)) flatten(`Material ${name}`, '', mat, rows, sys)
  }
  return rows
}
