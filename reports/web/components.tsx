/** The web implementation of the template vocabulary. */
import type { ReactNode } from 'react'
import type { ReportComponentProps, ReportComponents } from '../components'
import { attachmentLetter, backMatterSections } from '../model/back-matter'
import { sectionAnchor } from '../model/context'
import { watermarkFor, STATE_LABEL } from '../model/format'
import { useReport } from '../model/react-context'
import * as B from './blocks'
import { Tex } from './math'

function SectionShell({ id, n, title, continues, children }: { id: string; n: number | string; title: string; continues: boolean; children?: ReactNode }) {
  return (
    <section id={sectionAnchor(id)} className={continues ? 'inv-section inv-continue' : 'inv-section'}>
      <h2><span className="inv-section-n">{n}</span> {title}</h2>
      {children}
    </section>
  )
}

function Section({ id, title, ordinal, page, children }: ReportComponentProps['Section']) {
  const n = useReport().numbering.section[Number(ordinal ?? -1)]
  return n ? <SectionShell id={id} n={n} title={title} continues={page === 'continue'}>{children}</SectionShell> : null
}

function Appendices() {
  const { pkg } = useReport()
  return <ul className="inv-appendices">{pkg.attachments.map((a, i) => <li key={i}>Appendix {attachmentLetter(pkg, i)}: {a.name}</li>)}</ul>
}

const BACK_BODY: Record<string, () => ReactNode> = {
  'further-steps': () => <B.OtherSteps />,
  references: () => <B.References />,
  cautions: () => <B.Cautions />,
  revisions: () => <><B.RevisionHistory /><B.RemarksLog /></>,
  changes: () => <B.Changes />,
  signatures: () => <B.SignatureBlock />,
  appendices: () => <Appendices />,
  working: () => <B.AppendixSteps />,
}

function BackMatter() {
  const ctx = useReport()
  return (
    <>
      {backMatterSections(ctx, ctx.numbering.backMatterStart).map((s) => (
        <SectionShell key={s.id} id={s.id} n={s.number} title={s.title} continues={s.continues}>{BACK_BODY[s.id]()}</SectionShell>
      ))}
    </>
  )
}

function MathBlock({ tex }: { tex: string }) {
  return <div className="inv-math"><Tex tex={tex} display /></div>
}

export function Wrapper({ children }: { children?: ReactNode }) {
  const { pkg } = useReport()
  const mark = watermarkFor(pkg.revision.state)
  return (
    <article className="inv-report" data-state={pkg.revision.state} data-paper={pkg.paper.toLowerCase()}>
      <header className="inv-header">
        <div><small>Project</small>{`${pkg.project.code} · ${pkg.project.name}`}</div>
        <div><small>Calculation</small>{pkg.calc.number}</div>
        <div><small>Revision · state</small>{`${pkg.revision.label} · ${STATE_LABEL[pkg.revision.state]}`}</div>
      </header>
      {mark ? <div className="inv-watermark" aria-hidden="true" data-mark={mark} /> : null}
      {children}
    </article>
  )
}

/** Markdown headings sit inside numbered sections, so they step down a level. */
export const webMarkdownComponents = {
  h2: ({ children }: { children?: ReactNode }) => <h3>{children}</h3>,
  h3: ({ children }: { children?: ReactNode }) => <h4>{children}</h4>,
}

export const webReportComponents: ReportComponents = {
  Section,
  TitleBlock: B.TitleBlock,
  InputsTable: B.InputsTable,
  Steps: B.Steps,
  Step: B.Step,
  OtherSteps: B.OtherSteps,
  ResultsTable: B.ResultsTable,
  ChecksTable: B.ChecksTable,
  Criteria: B.Criteria,
  DesignBasis: B.DesignBasis,
  Assumptions: B.Assumptions,
  MaterialsTable: B.MaterialsTable,
  GoverningTables: B.GoverningTables,
  Figure: B.Figure,
  Plot: B.Plot,
  UtilisationChart: B.UtilisationChart,
  Verdict: B.Verdict,
  References: B.References,
  Cautions: B.Cautions,
  RevisionHistory: B.RevisionHistory,
  RemarksLog: B.RemarksLog,
  SignatureBlock: B.SignatureBlock,
  BackMatter,
  // The web compile leaves math to rehype-katex; these only serve templates that name them.
  MathBlock,
  MathInline: ({ tex }) => <Tex tex={tex} />,
}
