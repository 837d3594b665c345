import type { CalcInput } from './run'

export interface InputRow {
  group: string
  label: string
  value: number | string
  unit: string
}

const GEOMETRY_LABELS: Record<string, [string, string]> = {
  arm: ['Arm length l (pole to outer rhombus vertices)', 'mm'],
  side: ['Rhombus side s', 'mm'],
  long: ['Long links a', 'mm'],
  short: ['Short links b', 'mm'],
  ratio: ['Ratio μ placing pole, driven point and tracer', '—'],
  crank: ['Crank length r', 'mm'],
  crankPivotOffset: ['Crank pivot offset e from the pole', 'mm'],
}

/** Flattens a nested description (pin/link defaults) into readable rows. */
function flatten(group: string, prefix: string, value: unknown, out: InputRow[]) {
  if (value === undefined || value === null) return
  if (typeof value === 'object' && !Array.isArray(value)) {
    for (const [k, v] of Object.entries(value)) flatten(group, prefix ? `${prefix}.${k}` : k, v, out)
    return
  }
  out.push({ group, label: prefix, value: typeof value === 'number' || typeof value === 'string' ? value : String(value), unit: '' })
}

/** The inputs table of the calc package: every value the engineer entered, grouped. */
export function inputRowsOf(input: CalcInput): InputRow[] {
  const m = input.mechanism
  const rows: InputRow[] = [{ group: 'Mechanism', label: 'Type', value: m.mechanism === 'peaucellier' ? 'Peaucellier–Lipkin cell' : "Hart's inversor", unit: '' }]
  const geometry: Record<string, number | undefined> = { ...m.geometry, crankPivotOffset: m.geometry.crankPivotOffset ?? m.geometry.crank }
  for (const [key, value] of Object.entries(geometry)) {
    if (value === undefined) continue
    const [label, unit] = GEOMETRY_LABELS[key] ?? [key, 'mm']
    rows.push({ group: 'Geometry', label, value, unit })
  }
  rows.push({ group: 'Stroke', label: 'Margin kept from the toggle positions', value: m.toggleMarginDeg ?? 5, unit: '°' })
  for (const l of m.loads) {
    rows.push({ group: 'Load cases (at the tracer)', label: `${l.name}: Fx`, value: l.fx, unit: 'N' })
    rows.push({ group: 'Load cases (at the tracer)', label: `${l.name}: Fy`, value: l.fy, unit: 'N' })
  }
  if (m.selfWeight) flatten('Self-weight of links', '', m.selfWeight, rows)
  const c = input.checks
  if (c) {
    flatten('Design basis', '', c.basis, rows)
    rows.push({ group: 'Design basis', label: 'Load factor', value: c.factors.load, unit: '—' })
    rows.push({ group: 'Design basis', label: 'Dynamic factor', value: c.factors.dynamic, unit: '—' })
    flatten('Pins (all joints unless listed)', '', c.defaults.joint, rows)
    flatten('Links (all links unless listed)', '', c.defaults.link, rows)
    for (const [name, j] of Object.entries(c.joints)) flatten(`Joint ${name}`, '', j, rows)
    for (const [name, l] of Object.entries(c.links)) flatten(`Link ${name}`, '', l, rows)
    for (const [name, mat] of Object.entries(c.materials)) flatten(`Material ${name}`, '', mat, rows)
  }
  return rows
}
