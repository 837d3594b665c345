/**
 * Plain-data views of the package for components: both renderings draw the
 * same strings, so they can only differ in layout, never in content.
 */
import { GENERAL_CAUTION } from '../../lib/cautions'
import { mechanismLabel } from '../../lib/mechanisms'
import type { CheckItem, Step, Table } from '../../lib/contract'
import type { ReportPackage } from '../types'
import type { ReportContext } from './context'
import { STATE_LABEL, VERDICT_LABEL, formatDate, formatNumber, formatUtilisation, formatValue } from './format'

export interface StepView {
  n: number
  id: string
  title: string
  formula?: string
  substituted?: string
  result: string
  source?: string
  verdict?: Step['verdict']
  verdictLabel?: string
  note?: string
}

export function stepView(n: number, step: Step): StepView {
  return {
    n,
    id: step.id,
    title: step.title,
    formula: step.formula,
    substituted: step.substituted,
    result: formatValue(step.value, step.unit),
    source: step.source,
    verdict: step.verdict,
    verdictLabel: step.verdict ? VERDICT_LABEL[step.verdict] : undefined,
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
}

export function tableView(table: Table): TableView {
  const numeric = table.columns.map((c) => table.rows.some((r) => typeof r[c.key] === 'number'))
  return {
    id: table.id,
    title: table.title,
    headers: table.columns.map((c) => (c.unit ? `${c.label} [${c.unit}]` : c.label)),
    numeric,
    rows: table.rows.map((row) =>
      table.columns.map((c) => {
        const v = row[c.key]
        if (v === null || v === undefined) return '—'
        if (typeof v === 'number') return formatNumber(v, c.digits)
        if (typeof v === 'boolean') return v ? 'yes' : 'no'
        return v
      }),
    ),
  }
}

export function checksTable(checks: CheckItem[], ctx: ReportContext): TableView {
  return {
    id: 'checks-summary',
    title: 'Component checks',
    headers: ['Step', 'Component', 'Check', 'Clause', 'Demand', 'Capacity', 'u', ''],
    numeric: [true, false, false, false, true, true, true, false],
    rows: checks.map((c) => [
      String(ctx.numberOf.get(c.stepId) ?? '—'),
      c.component,
      // The basis is stated once in the design basis; the governing check of each component is named.
      c.governing ? `${c.check} — governs` : c.check,
      c.clause,
      formatValue(c.demand, c.unit),
      formatValue(c.capacity, c.unit),
      formatUtilisation(c.utilisation),
      c.pass ? 'PASS' : 'FAIL',
    ]),
  }
}

export function inputsTable(pkg: ReportPackage): TableView {
  return {
    id: 'inputs',
    title: 'Inputs',
    headers: ['Group', 'Quantity', 'Value', 'Unit'],
    numeric: [false, false, true, false],
    rows: pkg.inputRows.map((r) => [
      r.group,
      r.label,
      typeof r.value === 'number' ? formatNumber(r.value) : r.value,
      r.unit || '—',
    ]),
  }
}

export function historyTable(pkg: ReportPackage): TableView {
  return {
    id: 'history',
    title: 'Revision history',
    headers: ['Rev', 'State', 'Date', 'Note'],
    numeric: [false, false, false, false],
    rows: pkg.history.map((h) => [h.label, STATE_LABEL[h.state], formatDate(h.date), h.note]),
  }
}

export function remarksTable(pkg: ReportPackage, ctx: ReportContext): TableView {
  return {
    id: 'remarks',
    title: 'Remarks log',
    headers: ['Step', 'Date', 'By', 'Remark', 'Status'],
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

/** Template references first, then every distinct source the steps and checks cite. */
export function references(ctx: ReportContext): { template: string[]; cited: string[] } {
  const cited: string[] = []
  const seen = new Set<string>()
  const push = (s: string | undefined) => {
    if (!s || seen.has(s)) return
    seen.add(s)
    cited.push(s)
  }
  for (const s of ctx.pkg.result.steps) push(s.source)
  for (const c of ctx.pkg.result.checks ?? []) push(c.clause)
  return { template: ctx.meta.references.map((r) => r.text), cited }
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

export function verdictView(pkg: ReportPackage): { pass: boolean; headline: string; detail: string } | null {
  const v = pkg.result.verdict
  if (!v) return null
  return {
    pass: v.pass,
    headline: v.pass ? 'All checks pass' : 'One or more checks fail',
    detail: `Largest utilisation ${formatUtilisation(v.maxUtilisation)} — ${v.governing}`,
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
      ['Project', `${pkg.project.code} — ${pkg.project.name}`],
      ['Client', pkg.project.client],
      ['Calculation', `${pkg.calc.number} (${mechanismLabel(pkg.calc.type)})`],
      // The state is not printed here: it changes as the revision is signed (the title block carries it).
      ['Revision', pkg.revision.label],
      ['Generated', `${formatDate(pkg.generatedAt)} · engine ${pkg.engineVersion} · template ${pkg.templateVersion}`],
      ['Result SHA-256', resultHash],
    ],
  }
}
