/**
 * The component vocabulary templates may use. Both renderings implement this
 * exact set with these props, so a template that renders on the web renders
 * in the PDF too. MDX passes attribute values as strings.
 */
import type { ReactNode } from 'react'

export interface ReportComponentProps {
  /** `when`: `steps`, `positions` or `checks`, joined by `|`; the section is left out when none is present. */
  /** `page="continue"` keeps the section on the previous section's page in the PDF (and in print). */
  Section: { id: string; title: string; when?: string; page?: string; ordinal?: string; children?: ReactNode }
  TitleBlock: Record<string, never>
  InputsTable: Record<string, never>
  Steps: { section: string }
  Step: { id: string }
  OtherSteps: Record<string, never>
  ResultsTable: { section?: string; id?: string }
  ChecksTable: Record<string, never>
  /** The criteria the verdict rests on (stroke, straightness, transmission angle, detailing, strength). */
  Criteria: Record<string, never>
  /** The design basis and the assumptions in words, generated from the calc's inputs. */
  DesignBasis: Record<string, never>
  Assumptions: Record<string, never>
  MaterialsTable: Record<string, never>
  /** Per load case the positions where a value governs, with pin forces and pivot reactions. */
  GoverningTables: Record<string, never>
  Figure: { at?: string; caption?: string; ordinal?: string }
  Plot: { kind: string; caption?: string; ordinal?: string }
  UtilisationChart: { caption?: string; ordinal?: string }
  Verdict: Record<string, never>
  References: Record<string, never>
  Cautions: Record<string, never>
  RevisionHistory: Record<string, never>
  RemarksLog: Record<string, never>
  SignatureBlock: Record<string, never>
  BackMatter: Record<string, never>
  MathBlock: { tex: string; number?: string }
  MathInline: { tex: string }
}

export type ReportComponents = {
  [K in keyof ReportComponentProps]: (props: ReportComponentProps[K]) => ReactNode
}

export const FIGURE_COMPONENTS = ['Figure', 'Plot', 'UtilisationChart']

/** Sections BackMatter expands into, in order; empty ones are skipped in both renderings. */
export const BACK_MATTER = [
  { id: 'further-steps', title: 'Further steps', continues: false },
  { id: 'references', title: 'References', continues: true },
  { id: 'cautions', title: 'Cautions and limits', continues: true },
  { id: 'revisions', title: 'Revision history and remarks', continues: true },
  { id: 'changes', title: 'Changes since the previous revision', continues: true },
  { id: 'signatures', title: 'Signatures', continues: true },
  { id: 'working', title: 'Appendix: working in full', continues: false },
] as const

export interface BackMatterSection {
  id: string
  title: string
  number: number | string
  continues: boolean
}
