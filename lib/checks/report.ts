/**
 * Turns the bases' CheckSpecs into the shared result shapes: CheckItems, one
 * Step per check with its working, a design-force step per component and the
 * summary table. The governing flag is set here so every basis gets it alike.
 */
import type { CheckItem, Step, Table } from '@/lib/contract'
import { fmt, type CheckSpec, type Demand } from './spec'

export interface ComponentResult {
  items: CheckItem[]
  steps: Step[]
}

/** The same 4 significant digits as `fmt`, as plain text (the value is printed, not typeset). */
function plain(x: number): string {
  return fmt(x).replace(/ \\cdot 10\^\{(-?\d+)\}/, 'e$1')
}

function where(d?: Demand): string {
  if (!d) return ''
  return d.crankDeg === undefined ? ` (${d.loadCase})` : ` (load case ${d.loadCase}, crank ${fmt(d.crankDeg)}°)`
}

export function forceStep(id: string, title: string, demands: [string, Demand | undefined][], factors: { load: number; dynamic: number }): Step {
  const shown = demands.filter((x): x is [string, Demand] => x[1] !== undefined)
  return {
    id,
    section: 'checks',
    title,
    formula: 'F_{d} = \\max_{\\text{load cases}} F_{env} \\cdot \\gamma_{load} \\cdot \\gamma_{dyn}',
    substituted: shown.map(([k, d]) => `${k} = ${fmt(d.raw)} \\cdot ${fmt(factors.load)} \\cdot ${fmt(factors.dynamic)} = ${fmt(d.value)}`).join(',\\; '),
    value: shown.length ? shown.map(([k, d]) => `${k} ${plain(d.value)}${where(d)}`).join('; ') : 'none',
    unit: 'N / N·mm',
    source: 'envelope of the engine over the stroke × user factors',
    verdict: 'info',
  }
}

export function evaluate(kind: 'pin' | 'link', name: string, basis: string, specs: CheckSpec[]): ComponentResult {
  const component = `${kind} ${name}`
  const items: CheckItem[] = []
  const steps: Step[] = []
  for (const s of specs) {
    if (!(s.capacity > 0) || !Number.isFinite(s.capacity) || !Number.isFinite(s.demand)) {
      throw new Error(`internal: ${component} ${s.key} gave demand ${s.demand}, capacity ${s.capacity}; the input validation should have caught this`)
    }
    const utilisation = s.demand / s.capacity
    const pass = utilisation <= 1 + 1e-9
    const stepId = `chk.${kind}.${name}.${s.key}`
    items.push({
      component,
      check: s.title,
      basis,
      clause: s.clause,
      demand: s.demand,
      capacity: s.capacity,
      unit: s.unit,
      utilisation,
      pass,
      governing: false,
      loadCase: s.governedBy?.loadCase,
      crankDeg: s.governedBy?.crankDeg,
      stepId,
    })
    steps.push({
      id: stepId,
      section: 'checks',
      title: `${component}: ${s.title}`,
      formula: s.formula,
      substituted: s.substituted,
      value: Number(utilisation.toFixed(4)),
      unit: '—',
      source: s.clause,
      verdict: pass ? 'pass' : 'fail',
      note: `demand ${fmt(s.demand)} ${s.unit}, capacity ${fmt(s.capacity)} ${s.unit}, utilisation ${fmt(utilisation)}${where(s.governedBy)}${s.note ? `; ${s.note}` : ''}`,
    })
  }
  let g = -1
  items.forEach((it, i) => {
    if (g < 0 || it.utilisation > items[g].utilisation) g = i
  })
  if (g >= 0) {
    items[g].governing = true
    steps[g].note = `GOVERNING for ${component}. ${steps[g].note ?? ''}`
  }
  return { items, steps }
}

export function summaryTable(items: CheckItem[]): Table {
  return {
    id: 'checks-summary',
    section: 'checks',
    title: 'Component checks',
    columns: [
      { key: 'component', label: 'Component' },
      { key: 'check', label: 'Check' },
      { key: 'clause', label: 'Clause' },
      { key: 'demand', label: 'Demand', digits: 1 },
      { key: 'capacity', label: 'Capacity', digits: 1 },
      { key: 'unit', label: 'Unit' },
      { key: 'utilisation', label: 'Utilisation', digits: 3 },
      { key: 'pass', label: 'Pass' },
      { key: 'governing', label: 'Governing' },
      { key: 'loadCase', label: 'Load case' },
      { key: 'crankDeg', label: 'Crank', unit: '°', digits: 1 },
    ],
    rows: items.map((i) => ({
      component: i.component,
      check: i.check,
      clause: i.clause,
      demand: i.demand,
      capacity: i.capacity,
      unit: i.unit,
      utilisation: i.utilisation,
      pass: i.pass,
      governing: i.governing,
      loadCase: i.loadCase ?? null,
      crankDeg: i.crankDeg ?? null,
    })),
  }
}
