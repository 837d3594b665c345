/**
 * Turns the template's outline into this package's numbers: sections and
 * figures with nothing to show are dropped and the rest are numbered without
 * gaps. Both renderings read these numbers, so they always agree.
 */
import type { Step } from '../../lib/contract'
import { stepSectionsOf } from '../../lib/mechanisms'
import type { Outline } from '../mdx/plugins'
import type { ReportPackage, ReportResult } from '../types'

export interface Numbering {
  section: (number | null)[]
  figure: (number | null)[]
  backMatterStart: number
}

function has(result: ReportResult, stepSections: Set<string>, id: string, what: string): boolean {
  if (what === 'steps') return stepSections.has(id)
  if (what === 'positions') return (result.positions?.length ?? 0) > 0 || (result.loadCases?.length ?? 0) > 0
  if (what === 'checks') return (result.checks?.length ?? 0) > 0
  return true
}

function figureHas(result: ReportResult, component: string, kind?: string): boolean {
  if (component === 'Plot' && kind === 'tolerance') return (result.tables ?? []).some((t) => t.id === 'tol.histogram')
  if (component === 'Figure') return (result.positions?.length ?? 0) > 0 && (result.links?.length ?? 0) > 0
  if (component === 'Plot') return has(result, new Set(), '', 'positions')
  if (component === 'UtilisationChart') return (result.checks?.length ?? 0) > 0
  return true
}

export function numberOutline(outline: Outline, result: ReportResult): Numbering {
  const stepSections = new Set(result.steps.map((s) => s.section))
  let n = 0
  const section = outline.sections.map((s) => {
    const present = !s.when || s.when.split('|').some((w) => has(result, stepSections, s.id, w.trim()))
    return present ? ++n : null
  })
  let f = 0
  const figure = outline.figures.map((fig) =>
    (fig.section < 0 || section[fig.section] !== null) && figureHas(result, fig.component, fig.kind) ? ++f : null,
  )
  return { section, figure, backMatterStart: n + 1 }
}

/** One step as the package numbers it. */
export interface StepOutlineEntry {
  id: string
  /** The number printed beside the step in the web view and the PDF, 1-based. */
  number: number
  title: string
  section: string
  /** Printed in the appendix (supporting working) rather than in the body. */
  appendix: boolean
}

/**
 * The package's step numbering, as data: the body's steps section by section in the order the
 * mechanism declares (registry `stepSections`), then any section the engine added in its own order,
 * within a section in result order; then the appendix's steps (`Step.appendix`) in the same order. Both renderings number from this, and anything else that shows
 * step numbers (remarks beside the calc page, the API) can call it instead of reading rendered HTML.
 * Pure: no template, no React.
 */
export function stepOutline(pkg: { calc: Pick<ReportPackage['calc'], 'type'>; result: { steps: readonly Step[] } }): StepOutlineEntry[] {
  const declared = stepSectionsOf(pkg.calc.type)
  let n = 0
  // The body's steps first, section by section; then the appendix's, in the same section order.
  return [false, true].flatMap((appendix) => {
    const grouped = new Map<string, Step[]>()
    for (const step of pkg.result.steps) {
      if (Boolean(step.appendix) !== appendix) continue
      const list = grouped.get(step.section) ?? []
      list.push(step)
      grouped.set(step.section, list)
    }
    const order = [...declared.filter((s) => grouped.has(s)), ...[...grouped.keys()].filter((s) => !declared.includes(s))]
    return order.flatMap((section) => (grouped.get(section) ?? []).map((step) => ({ id: step.id, number: ++n, title: step.title, section, appendix })))
  })
}
