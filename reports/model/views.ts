/**
 * Plain-data views of the package for components: both renderings draw the
 * same strings, so they can only differ in layout, never in content.
 */
import { GENERAL_CAUTION } from '../../lib/cautions'
import { mechanismLabel } from '../../lib/mechanisms'
import type { CheckItem, LoadCaseEnvelope, PositionResult, Step, Table } from '../../lib/contract'
import type { ReportPackage } from '../types'
import type { ReportContext } from './context'
import { STATE_LABEL, VERDICT_LABEL, columnUnit, formatDate, formatNumber, formatResult, formatUtilisation, formatValue } from './format'
import type { UnitSystem } from '../../lib/units/system'

export interface StepView {
  n: number
  id: string
  title: string
  formula?: string
  substituted?: string
  /** The value column: `1 894 N`, `0.992`, `met`. */
  result: string
  /** Set for a strength check: its utilisation, for the glyph beside the value. */
  utilisation?: number
  /** The criterion the value is judged by, as TeX (`\le 10^{-9}`). */
  criterion?: string
  source?: string
  /** Where the inputs come from: `F_eye = 1 052 N, step 46`. */
  from?: string
  verdict?: Step['verdict']
  verdictLabel?: string
  note?: string
}

export function stepView(n: number, step: Step, ctx?: Pick<ReportContext, 'numberOf' | 'units'>): StepView {
  const numberOf = ctx?.numberOf
  const isCheck = step.id.startsWith('chk.') && step.unit === '—' && typeof step.value === 'number'
  const from = step.refs?.length
    ? step.refs.map((r) => `${r.what}, step ${numberOf?.get(r.stepId) ?? r.stepId}`).join('; ')
    : undefined
  return {
    n,
    id: step.id,
    title: step.title,
    formula: step.formula,
    substituted: step.substituted,
    result: isCheck ? formatUtilisation(step.value as number) : formatResult(step.value, step.unit, ctx?.units),
    utilisation: isCheck ? (step.value as number) : undefined,
    criterion: step.criterion,
    source: step.source,
    from,
    verdict: step.verdict,
    verdictLabel: step.verdict ? VERDICT_LABEL[step.verdict] || undefined : undefined,
    note: step.note,
  }
}

export interface TableView {
  id: string
  title: string
  headers: string[]
  /** True where the column holds numbers and should align right. */
  numeric: boolean[]
  rows: string[][]
  /** Rows to set in bold (e.g. the governing value). */
  strong?: boolean[]
}

export function tableView(table: Table, system: UnitSystem = 'SI'): TableView {
  const numeric = table.columns.map((c) => table.rows.some((r) => typeof r[c.key] === 'number'))
  const units = table.columns.map((c) => columnUnit(c.unit, system))
  return {
    id: table.id,
    title: table.title,
    headers: table.columns.map((c, i) => (units[i].unit ? `${c.label} [${units[i].unit}]` : c.label)),
    numeric,
    rows: table.rows.map((row) =>
      table.columns.map((c, i) => {
        const v = row[c.key]
        if (v === null || v === undefined) return '—'
        if (typeof v === 'number') return formatNumber(units[i].show(v))
        if (typeof v === 'boolean') return v ? 'yes' : 'no'
        return v
      }),
    ),
  }
}

const stepRef = (ctx: ReportContext, id: string | undefined) => (id ? String(ctx.numberOf.get(id) ?? '—') : '—')

/** Per component one row: its governing strength check, the utilisation, and the step with the working. */
export function componentTable(checks: CheckItem[], ctx: ReportContext): TableView {
  const components = [...new Set(checks.map((c) => c.component))]
  const rows = components.map((name) => {
    const own = checks.filter((c) => c.component === name && c.kind !== 'detailing')
    const g = own.find((c) => c.governing) ?? own[0]
    if (!g) return [name, '—', '—', '—', '—', '—', '—']
    return [name, g.check, formatValue(g.demand, g.unit, ctx.units), formatValue(g.capacity, g.unit, ctx.units), formatUtilisation(g.utilisation), g.pass ? '' : 'fails', stepRef(ctx, g.stepId)]
  })
  return {
    id: 'components',
    title: 'Governing check of each component',
    headers: ['component', 'governing check', 'demand E_d', 'resistance R_d', 'u', '', 'step'],
    numeric: [false, false, true, true, true, false, true],
    rows,
  }
}

/** Dimensional rules: met or not met, never a utilisation. */
export function detailingTable(checks: CheckItem[], ctx: ReportContext): TableView | null {
  const rules = checks.filter((c) => c.kind === 'detailing')
  if (!rules.length) return null
  return {
    id: 'detailing',
    title: 'Detailing rules',
    headers: ['component', 'rule', 'required', 'provided', '', 'step'],
    numeric: [false, false, true, true, false, true],
    rows: rules.map((c) => [c.component, c.check, formatValue(c.demand, c.unit, ctx.units), formatValue(c.capacity, c.unit, ctx.units), c.pass ? 'met' : 'not met', stepRef(ctx, c.stepId)]),
  }
}

/** What the verdict rests on besides strength: stroke, straightness, transmission angle, detailing. */
export function criteriaTable(ctx: ReportContext): TableView | null {
  const r = ctx.pkg.result
  const rows: string[][] = (r.criteria ?? []).map((c) => [c.label, c.required, c.provided, c.pass ? 'met' : 'not met', stepRef(ctx, c.stepId)])
  const rules = (r.checks ?? []).filter((c) => c.kind === 'detailing')
  if (rules.length) {
    const failed = rules.filter((c) => !c.pass)
    rows.push(['Detailing rules (table in the component checks)', `${rules.length} rules`, failed.length ? `${failed.length} not met` : 'all met', failed.length ? 'not met' : 'met', stepRef(ctx, (failed[0] ?? rules[0]).stepId)])
  }
  const v = r.verdict
  if (v && (r.checks?.length ?? 0) > 0) {
    rows.push(['Largest utilisation of a strength check', 'u ≤ 1', `u = ${formatUtilisation(v.maxUtilisation)}`, v.maxUtilisation <= 1 + 1e-9 ? 'met' : 'not met', stepRef(ctx, v.governingStepId)])
  }
  if (!rows.length) return null
  return { id: 'criteria', title: 'What the verdict rests on', headers: ['criterion', 'required', 'provided', '', 'step'], numeric: [false, true, true, false, true], rows }
}

export function materialsTable(pkg: ReportPackage): TableView | null {
  const m = pkg.result.materials ?? []
  if (!m.length) return null
  const stress = columnUnit('MPa', pkg.units ?? 'SI')
  return {
    id: 'materials',
    title: 'Materials',
    headers: ['material', 'used for', 'band', `f_y [${stress.unit}]`, `f_u [${stress.unit}]`, `E [${stress.unit}]`, 'source as stored'],
    numeric: [false, false, false, true, true, true, false],
    rows: m.map((r) => [r.id, r.usedFor.join(', '), r.band, formatNumber(stress.show(r.fy)), formatNumber(stress.show(r.fu)), formatNumber(stress.show(r.E)), r.source]),
  }
}

/** The crank angles where any envelope value of a load case occurs, ascending. */
function governingAngles(env: LoadCaseEnvelope): number[] {
  const angles = new Set<number>()
  for (const l of Object.values(env.links)) {
    if (l.maxTension.value !== 0) angles.add(l.maxTension.crankDeg)
    if (l.maxCompression.value !== 0) angles.add(l.maxCompression.crankDeg)
    if (l.maxMoment) angles.add(l.maxMoment.crankDeg)
  }
  for (const p of Object.values(env.pins)) angles.add(p.crankDeg)
  for (const e of Object.values(env.eyes ?? {})) angles.add(e.crankDeg)
  for (const r of Object.values(env.reactions ?? {})) angles.add(r.crankDeg)
  angles.add(env.driveTorque.crankDeg)
  return [...angles].sort((a, b) => a - b)
}

/**
 * Per load case one table of the positions where something governs: crank angle, tracer, every link
 * force, every pin resultant and eye force, the pivot reactions and the drive torque; the last column is
 * the largest value over the working range, which the checks use.
 */
export function governingTables(ctx: ReportContext): TableView[] {
  const r = ctx.pkg.result
  const cases = r.loadCases ?? []
  return (r.envelope ?? []).flatMap((env, i) => {
    const positions = cases.find((c) => c.name === env.loadCase)?.positions ?? cases[i]?.positions ?? []
    if (!positions.length) return []
    let angles = governingAngles(env)
    // Keep the table on the page: at most six positions (the ends and the most frequent governors).
    if (angles.length > 6) angles = [angles[0], ...angles.slice(1, -1).slice(0, 4), angles[angles.length - 1]]
    const at = angles.map((a) => positions.reduce((best, p) => (Math.abs(p.crankDeg - a) < Math.abs(best.crankDeg - a) ? p : best), positions[0]))
    const row = (label: string, siUnit: string, get: (p: PositionResult) => number | undefined, largest: number | undefined): string[] => {
      const { unit, show } = columnUnit(siUnit, ctx.units)
      return [
        label,
        unit ?? siUnit,
        ...at.map((p) => {
          const v = clean(get(p))
          return v === undefined ? '—' : formatNumber(show(v))
        }),
        largest === undefined ? '' : formatNumber(show(largest)),
      ]
    }
    // Solver noise (1e-13 N in a link that carries nothing) prints as 0, as the envelope reports it.
    const noise = 1e-9 * Math.max(1, ...Object.values(env.pins).map((p) => p.value))
    const clean = (v: number | undefined) => (v !== undefined && Math.abs(v) < noise ? 0 : v)
    const rows: string[][] = [row('tracer y_T', 'mm', (p) => p.tracer.y, undefined)]
    for (const [name, l] of Object.entries(env.links)) {
      const gov = l.maxTension.value >= -l.maxCompression.value ? l.maxTension.value : l.maxCompression.value
      rows.push(row(`axial force N_${name}`, 'N', (p) => p.linkForces[name], gov))
      if (l.maxMoment) rows.push(row(`moment M_${name}`, 'N·mm', (p) => p.linkMoments?.[name], l.maxMoment.value))
    }
    for (const [name, e] of Object.entries(env.eyes ?? {})) {
      if (e.across > 0) rows.push(row(`eye force F_eye,${name} (across)`, 'N', () => undefined, e.value))
    }
    for (const [j, p] of Object.entries(env.pins)) rows.push(row(`pin force F_${j}`, 'N', (q) => q.pinForces[j]?.magnitude, p.value))
    for (const [g, x] of Object.entries(env.reactions ?? {})) rows.push(row(`reaction at ${g}`, 'N', (q) => q.reactions[g]?.magnitude, x.value))
    rows.push(row('drive torque τ', 'N·mm', (p) => p.driveTorque, env.driveTorque.value))
    return [
      {
        id: `governing-${env.slug ?? i}`,
        title: `Load case “${env.loadCase}”: the positions where a value governs`,
        headers: ['quantity', 'unit', ...at.map((p) => `θ = ${formatNumber(p.crankDeg)}°`), 'largest'],
        numeric: [false, false, ...at.map(() => true), true],
        rows,
      },
    ]
  })
}

export function inputsTable(pkg: ReportPackage): TableView {
  return {
    id: 'inputs',
    title: 'Inputs',
    headers: ['group', 'quantity', 'value', 'unit'],
    numeric: [false, false, true, false],
    rows: pkg.inputRows.map((r) => {
      const { unit, show } = columnUnit(r.unit, pkg.units ?? 'SI')
      return [r.group, r.label, typeof r.value === 'number' ? formatNumber(show(r.value)) : r.value, unit || '—']
    }),
  }
}

export function historyTable(pkg: ReportPackage): TableView {
  return {
    id: 'history',
    title: 'Revision history',
    headers: ['rev', 'state', 'date', 'note'],
    numeric: [false, false, false, false],
    rows: pkg.history.map((h) => [h.label, STATE_LABEL[h.state], formatDate(h.date), h.note]),
  }
}

export function remarksTable(pkg: ReportPackage, ctx: ReportContext): TableView {
  return {
    id: 'remarks',
    title: 'Remarks log',
    headers: ['step', 'date', 'by', 'remark', 'status'],
    numeric: [false, false, false, false, false],
    rows: pkg.remarks.map((r) => [
      r.stepId ? `${ctx.numberOf.get(r.stepId) ?? '—'} · ${r.stepId}` : 'general',
      formatDate(r.date),
      `${r.author} (${r.role})`,
      r.text,
      r.status,
    ]),
  }
}

/** The one wording of the general caution, shared with the app footer and the checks. */
export const CAUTION_BASE = GENERAL_CAUTION

export function cautions(pkg: ReportPackage): string[] {
  const f = pkg.result.feasibility
  // The result carries the general caution too; print it once.
  const own = (pkg.result.cautions ?? []).filter((c) => c !== CAUTION_BASE)
  return [CAUTION_BASE, ...(f && !f.ok ? [f.message] : []), ...own]
}

/** The mechanism's references (template), the codes and material standards the inputs call for, then every other source cited. */
export function references(ctx: ReportContext): { template: string[]; cited: string[] } {
  const template = [...ctx.meta.references.map((r) => r.text), ...(ctx.pkg.result.basis?.references ?? [])]
  const cited: string[] = []
  const seen = new Set<string>()
  const push = (s: string | undefined) => {
    if (!s || seen.has(s)) return
    seen.add(s)
    cited.push(s)
  }
  // Codes, clauses and books the steps follow; plain words (geometry, input, statics) are not citations.
  for (const s of ctx.pkg.result.steps) if (s.source && /§|Table|Eq\.|Fig\.|Shigley|Coxeter|Kempe|AISC|EN \d/.test(s.source)) push(s.source.replace(/^(per )?/, ''))
  return { template, cited }
}

export interface SignatoryView {
  role: string
  name: string
  date: string
}

export function signatories(pkg: ReportPackage): SignatoryView[] {
  const r = pkg.revision
  return [
    { role: 'Engineer', name: r.engineer.name, date: formatDate(r.engineer.date) },
    { role: 'Checker', name: r.checker.name, date: formatDate(r.checker.date) },
    { role: 'Approver', name: r.approver.name, date: formatDate(r.approver.date) },
  ]
}

export interface VerdictView {
  pass: boolean
  headline: string
  /** The governing strength check, its utilisation and its step. */
  governing: string | null
  utilisation: number | null
  unmet: string[]
}

export function verdictView(pkg: ReportPackage, ctx?: ReportContext): VerdictView | null {
  const v = pkg.result.verdict
  if (!v) return null
  const step = v.governingStepId ? ctx?.numberOf.get(v.governingStepId) : undefined
  const hasChecks = (pkg.result.checks?.length ?? 0) > 0
  return {
    pass: v.pass,
    headline: v.pass ? 'The guide meets every criterion of this calculation.' : 'The guide does not meet every criterion of this calculation.',
    governing: hasChecks ? `Governing strength check: ${v.governing}${step ? ` (step ${step})` : ''}` : v.governing,
    utilisation: hasChecks ? v.maxUtilisation : null,
    unmet: v.unmet ?? [],
  }
}

export interface TitleView {
  title: string
  rows: [string, string][]
}

/** The cover block. The hash ties the printed numbers to the frozen result. */
export function titleView(pkg: ReportPackage, resultHash: string): TitleView {
  return {
    title: pkg.calc.title,
    rows: [
      ['project', `${pkg.project.code} — ${pkg.project.name}`],
      ['client', pkg.project.client],
      ['calculation', `${pkg.calc.number}, ${mechanismLabel(pkg.calc.type)}`],
      // The state is not printed here: it changes as the revision is signed (the title block carries it).
      ['revision', pkg.revision.label],
      ['basis', pkg.result.basis?.label ?? '—'],
      ...(pkg.units === 'US' ? [['units', 'US customary (in, lbf, lbf·in, ksi); the working is in SI, the units of the clauses, each result followed by its US value'] as [string, string]] : []),
      ['generated', `${formatDate(pkg.generatedAt)} · engine ${pkg.engineVersion} · template ${pkg.templateVersion}`],
      ['result SHA-256', resultHash],
    ],
  }
}

/** The "changes since" section: what changed from the calc's revision before, in words and three tables. */
export interface ChangesView {
  summary: string
  tables: TableView[]
}

export function changesView(ctx: ReportContext): ChangesView | null {
  const c = ctx.pkg.changes
  if (!c) return null
  const was = `rev ${c.since}`
  const now = /^[A-Z]+$/.test(ctx.pkg.revision.label) ? `rev ${ctx.pkg.revision.label}` : ctx.pkg.revision.label
  const verdict = (v: { pass: boolean; governing: string; maxUtilisation: number }) =>
    `${v.pass ? 'PASS' : 'FAIL'}, governed by ${v.governing} (u = ${formatUtilisation(v.maxUtilisation)})`
  const count = (n: number, what: string) => `${n} ${what}${n === 1 ? '' : 's'}`
  const summary = [
    c.verdict.changed
      ? `The verdict changed: ${was} ${verdict(c.verdict.from)}; ${now} ${verdict(c.verdict.to)}.`
      : `The verdict is unchanged: ${verdict(c.verdict.to)}${c.verdict.from.maxUtilisation !== c.verdict.to.maxUtilisation ? ` (${was}: u = ${formatUtilisation(c.verdict.from.maxUtilisation)})` : ''}.`,
    `Since ${was}, ${count(c.inputs.length, 'input')}, ${count(c.values.length, 'step value')} and ${count(c.checks.length, 'check')} changed.`,
  ].join(' ')
  const show = (v: number | string | null) => (v === null ? '—' : typeof v === 'number' ? formatNumber(v) : v)
  const pct = (p: number | null) => (p === null ? '—' : `${p > 0 ? '+' : ''}${formatNumber(p)} %`)
  const pass = (p: boolean | null) => (p === null ? '—' : p ? 'pass' : 'fails')
  const tables: TableView[] = [
    {
      id: 'changes-inputs',
      title: `Inputs changed (${c.inputs.length})`,
      headers: ['input', 'unit', was, now],
      numeric: [false, false, true, true],
      rows: c.inputs.map((r) => [r.input, r.unit || '—', show(r.from), show(r.to)]),
    },
    {
      id: 'changes-checks',
      title: `Checks whose utilisation or verdict changed (${c.checks.length})`,
      headers: ['component · check', `u ${was}`, `u ${now}`, 'change', 'verdict'],
      numeric: [false, true, true, true, false],
      rows: c.checks.map((k) => [k.title, k.from === null ? '—' : formatUtilisation(k.from), k.to === null ? '—' : formatUtilisation(k.to), k.change === null ? '—' : formatNumber(k.change), `${pass(k.fromPass)} → ${pass(k.toPass)}`]),
    },
    {
      id: 'changes-values',
      title: `Step values changed (${c.values.length})`,
      headers: ['step', 'value', 'unit', was, now, 'change', '%'],
      numeric: [true, false, false, true, true, true, true],
      rows: c.values.map((v) => [stepRef(ctx, v.id), v.title, v.unit || '—', show(v.from), show(v.to), v.change === null ? '—' : formatNumber(v.change), pct(v.percent)]),
    },
  ]
  return { summary, tables: tables.filter((t) => t.rows.length > 0) }
}
