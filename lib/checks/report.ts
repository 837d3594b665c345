/**
 * Turns the bases' CheckSpecs into the shared result shapes: CheckItems, one
 * Step per check with its working, a design-force step per component and the
 * summary table. The governing flag is set here so every basis gets it alike.
 */
import type { CheckItem, Step, Table } from '@/lib/contract'
import { formatNumber, MET_TOLERANCE, utilisationShown } from '@/lib/units/format'
import { fmt, type CheckSpec, type Demand } from './spec'

export interface ComponentResult {
  items: CheckItem[]
  steps: Step[]
}

function where(d?: Demand): string {
  if (!d) return ''
  if (d.raw === 0 && d.crankDeg === undefined && d.loadCase !== 'direct') return 'no such force over the working range (zero)'
  return d.crankDeg === undefined ? `force given directly (${d.loadCase})` : `load case “${d.loadCase}”, crank angle ${formatNumber(d.crankDeg)}°`
}

const SYMBOL: Record<string, string> = { T: 'T_d', C: 'C_d', M: 'M_d', E: 'F_{\\mathrm{eye},d}', F: 'F_d' }
const TEX_UNIT: Record<string, string> = { T: '\\text{N}', C: '\\text{N}', M: '\\text{N}{\\cdot}\\text{mm}', E: '\\text{N}', F: '\\text{N}' }
const UNIT: Record<string, string> = { T: 'N', C: 'N', M: 'N·mm', E: 'N', F: 'N' }

/**
 * The design forces of one component: each envelope value × load factor × dynamic factor, one line
 * each, with the engine's step it comes from. The value is the first (governing) force, in N.
 */
export function forceStep(id: string, title: string, demands: [string, Demand | undefined][], factors: { load: number; dynamic: number }): Step {
  const shown = demands.filter((x): x is [string, Demand] => x[1] !== undefined && (x[1].value > 0 || x[0] === 'F' || x[0] === 'T'))
  const line = ([k, d]: [string, Demand]) => `${SYMBOL[k] ?? k} = ${fmt(d.raw)} \\cdot ${fmt(factors.load)} \\cdot ${fmt(factors.dynamic)} = ${fmt(d.value)}\\ ${TEX_UNIT[k] ?? '\\text{N}'}`
  const forces = shown.filter(([k]) => k !== 'M').map(([, d]) => d)
  const first = forces.reduce<Demand | undefined>((a, d) => (!a || d.value > a.value ? d : a), undefined)
  const refs = shown.filter(([, d]) => d.stepId).map(([k, d]) => ({ stepId: d.stepId!, what: `${k === 'E' ? 'F_eye' : k} = ${formatNumber(d.raw)} ${UNIT[k] ?? 'N'}` }))
  return {
    id,
    section: 'checks',
    title,
    formula: 'F_d = F_{\\mathrm{env}} \\cdot \\gamma_{\\mathrm{load}} \\cdot \\gamma_{\\mathrm{dyn}}',
    substituted: shown.length ? shown.map(line).join(',\\quad ') : '\\text{none}',
    value: first ? first.value : 0,
    unit: 'N',
    source: 'largest envelope value over the working range and the load cases × the factors of the inputs',
    verdict: 'info',
    note: shown.length ? shown.map(([k, d]) => `${k === 'E' ? 'F_eye' : k}: ${where(d)}`).join('; ') : undefined,
    refs,
  }
}

export function evaluate(kind: 'pin' | 'link', name: string, basis: string, specs: CheckSpec[], forceStepId?: string): ComponentResult {
  const component = `${kind} ${name}`
  const items: CheckItem[] = []
  const steps: Step[] = []
  for (const s of specs) {
    if (!(s.capacity > 0) || !Number.isFinite(s.capacity) || !Number.isFinite(s.demand)) {
      throw new Error(`internal: ${component} ${s.key} gave demand ${s.demand}, capacity ${s.capacity}; the input validation should have caught this`)
    }
    const utilisation = s.demand / s.capacity
    const pass = utilisation <= 1 + MET_TOLERANCE
    const stepId = `chk.${kind}.${name}.${s.key}`
    const checkKind = s.kind ?? 'strength'
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
      kind: checkKind,
    })
    const at = where(s.governedBy)
    steps.push({
      id: stepId,
      section: 'checks',
      title: `${component}: ${s.title}`,
      formula: s.formula,
      substituted: s.substituted,
      // A detailing rule is met or not; a strength check reports its utilisation, rounded up.
      value: checkKind === 'detailing' ? (pass ? 'met' : 'not met') : utilisationShown(utilisation),
      unit: '—',
      source: s.ref ?? s.clause,
      verdict: pass ? 'pass' : 'fail',
      criterion: checkKind === 'detailing' ? undefined : 'u = E_d / R_d \\le 1',
      note: [at ? `Governed by ${at}` : '', s.note ?? ''].filter(Boolean).join('; ') || undefined,
      ...(forceStepId && s.governedBy ? { refs: [{ stepId: forceStepId, what: 'design force' }] } : {}),
    })
  }
  let g = -1
  items.forEach((it, i) => {
    if (it.kind === 'detailing') return
    if (g < 0 || it.utilisation > items[g].utilisation) g = i
  })
  if (g >= 0) items[g].governing = true
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
