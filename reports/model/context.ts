/**
 * Everything a component needs besides its props, computed once per render:
 * step numbers (identical in the web view and the PDF because both read them
 * from here), section order and the template's front matter.
 */
import type { UnitSystem } from '../../lib/units/system'
import type { Step } from '../../lib/contract'
import type { ReportPackage } from '../types'
import { canonicalJson, sha256Hex } from '../hash'
import type { Outline } from '../mdx/plugins'
import { stepSectionsOf } from '../../lib/mechanisms'
import { numberOutline, stepOutline, type Numbering } from './outline'

export interface TemplateReference {
  id: string
  text: string
}

/** The front matter a template declares (step order is the mechanism's, lib/mechanisms). */
export interface TemplateMeta {
  title: string
  references: TemplateReference[]
}

export interface NumberedStep {
  n: number
  step: Step
}

export interface ReportContext {
  pkg: ReportPackage
  meta: TemplateMeta
  /** The body's steps by section (what `<Steps section>` prints). */
  bySection: Map<string, NumberedStep[]>
  /** The appendix's steps by section, in numbering order. */
  appendixBySection: Map<string, NumberedStep[]>
  /** Sections the engine produced that the template does not place; shown under "Further steps". */
  otherSections: string[]
  numberOf: Map<string, number>
  /** Width figures are drawn at, in points (the PDF's text width; the web scales it). */
  figureWidth: number
  /** Page count of each attachment, in order; the PDF counts them into "page n of N". */
  appendixPages: number[]
  /** SHA-256 of the canonical result JSON, printed on the cover. */
  resultHash: string
  numbering: Numbering
  /** The units values print in: SI, or US customary (the working stays in SI). */
  units: UnitSystem
}

export function readMeta(frontmatter: Record<string, unknown>): TemplateMeta {
  const list = (v: unknown): unknown[] => (Array.isArray(v) ? v : [])
  return {
    title: typeof frontmatter.title === 'string' ? frontmatter.title : '',
    references: list(frontmatter.references).flatMap((r) => {
      if (!r || typeof r !== 'object') return []
      const o = r as Record<string, unknown>
      return [{ id: String(o.id ?? ''), text: String(o.text ?? '') }]
    }),
  }
}

export function buildContext(
  pkg: ReportPackage,
  meta: TemplateMeta,
  outline: Outline,
  extra: { figureWidth: number; appendixPages?: number[] },
): ReportContext {
  // One numbering for everything: the same function the app calls for remarks (stepOutline).
  const byId = new Map(pkg.result.steps.map((s) => [s.id, s]))
  const bySection = new Map<string, NumberedStep[]>()
  const appendixBySection = new Map<string, NumberedStep[]>()
  const numberOf = new Map<string, number>()
  for (const entry of stepOutline(pkg)) {
    const into = entry.appendix ? appendixBySection : bySection
    const list = into.get(entry.section) ?? []
    list.push({ n: entry.number, step: byId.get(entry.id)! })
    into.set(entry.section, list)
    numberOf.set(entry.id, entry.number)
  }
  const declared = stepSectionsOf(pkg.calc.type)
  const otherSections = [...bySection.keys()].filter((s) => !declared.includes(s))
  return { pkg, meta, bySection, appendixBySection, otherSections, numberOf, figureWidth: extra.figureWidth, appendixPages: extra.appendixPages ?? [], resultHash: sha256Hex(canonicalJson(pkg.result)), numbering: numberOutline(outline, pkg.result), units: pkg.units ?? 'SI' }
}

/** Step anchors are shared by the web view, the PDF links and checker remarks. */
export function stepAnchor(stepId: string): string {
  return `step-${stepId}`
}

export function sectionAnchor(sectionId: string): string {
  return `sec-${sectionId}`
}
