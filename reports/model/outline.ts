/**
 * Turns the template's outline into this package's numbers: sections and
 * figures with nothing to show are dropped and the rest are numbered without
 * gaps. Both renderings read these numbers, so they always agree.
 */
import type { Outline } from '../mdx/plugins'
import type { CalcResult } from '../types'

export interface Numbering {
  section: (number | null)[]
  figure: (number | null)[]
  backMatterStart: number
}

function has(result: CalcResult, stepSections: Set<string>, id: string, what: string): boolean {
  if (what === 'steps') return stepSections.has(id)
  if (what === 'positions') return (result.positions?.length ?? 0) > 0 || (result.loadCases?.length ?? 0) > 0
  if (what === 'checks') return (result.checks?.length ?? 0) > 0
  return true
}

function figureHas(result: CalcResult, component: string): boolean {
  if (component === 'Figure') return (result.positions?.length ?? 0) > 0 && (result.links?.length ?? 0) > 0
  if (component === 'Plot') return has(result, new Set(), '', 'positions')
  if (component === 'UtilisationChart') return (result.checks?.length ?? 0) > 0
  return true
}

export function numberOutline(outline: Outline, result: CalcResult): Numbering {
  const stepSections = new Set(result.steps.map((s) => s.section))
  let n = 0
  const section = outline.sections.map((s) => {
    const present = !s.when || s.when.split('|').some((w) => has(result, stepSections, s.id, w.trim()))
    return present ? ++n : null
  })
  let f = 0
  const figure = outline.figures.map((fig) =>
    (fig.section < 0 || section[fig.section] !== null) && figureHas(result, fig.component) ? ++f : null,
  )
  return { section, figure, backMatterStart: n + 1 }
}
