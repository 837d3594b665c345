/**
 * The PDF implementation of the template vocabulary. The MDX wrapper is where
 * pages are made: it walks the template's top-level sections, drops the ones
 * this package leaves empty, and starts a new <Page> unless a section says
 * `page="continue"`.
 */
import { Children, Fragment, isValidElement, type ReactElement, type ReactNode } from 'react'
import { Text, View } from '@react-pdf/renderer'
import type { ReportComponentProps, ReportComponents } from '../components'
import { attachmentLetter, backMatterSections } from '../model/back-matter'
import { tableView } from '../model/views'
import type { ReportContext } from '../model/context'
import { PdfTable } from './table'
import { useReport } from '../model/react-context'
import * as B from './blocks'
import { PdfPage, SectionHead } from './frame'
import { MathBlock } from './math'
import { A, Code, Em, H2, H3, LI, MathInline, OL, P, Strong, UL } from './prose'
import { PdfOtherSteps, PdfStep, PdfSteps } from './steps'
import { HEAD, HEAD_GAP, leadHeight, segmentBody } from './flow'
import { lineCount, pageBudget } from './measure'
import { registerBlockHeight } from './flow'
import { BODY_SIZE, LINE, contentWidth } from './styles'
import { SANS } from './fonts'
import { C } from './styles'

type SectionProps = ReportComponentProps['Section']

/** Outside the wrapper (never in a template's top level) a section is just its body. */
function Section({ children }: SectionProps) {
  return <View>{children}</View>
}
function BackMatter() {
  return null
}

function Appendices() {
  const { pkg, appendixPages } = useReport()
  return (
    <View>
      <Text style={{ marginBottom: 6 }}>The following documents are attached after this page, in this order.</Text>
      {pkg.attachments.map((a, i) => (
        <View key={i} style={{ flexDirection: 'row', marginBottom: 2 }}>
          <Text style={{ width: 70, fontWeight: 700 }}>{`Appendix ${attachmentLetter(pkg, i)}`}</Text>
          <Text style={{ flex: 1 }}>{a.name}</Text>
          <Text style={{ color: C.muted }}>{`${appendixPages[i] ?? '?'} page(s)`}</Text>
        </View>
      ))}
    </View>
  )
}

/**
 * The package's appendix: the steps the body leaves out (envelopes, the full working of components
 * identical to one shown in full), then the sweep tables, as direct children so the wrapper can cut
 * them into pages.
 */
function workingBody(ctx: ReportContext): ReactNode {
  const out: ReactNode[] = [
    <Text key="intro" style={{ marginBottom: 6 }}>
      The steps below support the body: the envelope of every load case over the working range, and the full working of components identical to one shown in full there. Their numbers follow the body's. The sweep tables list every solved position.
    </Text>,
  ]
  for (const [section, list] of ctx.appendixBySection) {
    if (!list.length) continue
    out.push(<Text key={`h-${section}`} style={{ fontSize: 9.4, fontWeight: 700, marginTop: 4, marginBottom: 3 }} minPresenceAhead={60}>{APPENDIX_HEADS[section] ?? section}</Text>)
    out.push(<PdfSteps key={`s-${section}`} section={section} appendix />)
  }
  for (const t of (ctx.pkg.result.tables ?? []).filter((x) => x.id.startsWith('tab.sweep'))) out.push(<PdfTable key={t.id} view={tableView(t, ctx.units)} size={6.6} />)
  return out
}

const APPENDIX_HEADS: Record<string, string> = {
  geometry: 'Geometry',
  kinematics: 'Kinematics',
  verification: 'Verification',
  statics: 'Statics: envelopes over the working range',
  checks: 'Component checks: the other steps',
}

const BACK_BODY: Record<string, (ctx: ReportContext) => ReactNode> = {
  working: (ctx) => workingBody(ctx),
  'further-steps': () => <PdfOtherSteps />,
  references: () => <B.References />,
  cautions: () => <B.Cautions />,
  // Sign-off changes these, so the PDF keeps them out of the rendered body: finishPdf writes them
  // into the sign-off record at the end, and the names into the strip at the foot of every page.
  revisions: () => <Text>The revision history and the checker’s remarks, with their replies, are in the sign-off record at the end of this package.</Text>,
  changes: () => <B.Changes />,
  signatures: () => <Text>Who prepared, checked, approved and issued this revision, and when, is printed at the foot of every page and in the sign-off record, with the server’s signature of each step.</Text>,
  appendices: () => <Appendices />,
}

interface Placed {
  id: string
  title: string
  number: number | string
  continues: boolean
  body: ReactNode
}

/** What one <Page> holds: section bodies, each with its heading unless it carries on a cut section. */
interface PageItem {
  key: string
  head?: Placed
  body: ReactNode
}

/**
 * MDX hands its wrapper one element, the compiled content, not the sections.
 * That content function is pure (props in, elements out, no hooks), so it is
 * called here to reach the top-level sections; fragments are unwrapped.
 */
function topLevel(children: ReactNode): ReactElement[] {
  const out: ReactElement[] = []
  for (const child of Children.toArray(children)) {
    if (!isValidElement(child)) continue
    const el = child as ReactElement<{ children?: ReactNode }>
    if (el.type === Section || el.type === BackMatter) out.push(el)
    else if (el.type === Fragment) out.push(...topLevel(el.props.children))
    else if (typeof el.type === 'function') out.push(...topLevel((el.type as (p: object) => ReactNode)(el.props)))
  }
  return out
}

function Paginate({ children, document }: { children?: ReactNode; document: (pages: ReactNode) => ReactNode }) {
  const ctx = useReport()
  const placed: Placed[] = []
  for (const child of topLevel(children)) {
    if (child.type === Section) {
      const p = (child as ReactElement<SectionProps>).props
      const n = ctx.numbering.section[Number(p.ordinal ?? -1)]
      if (n) placed.push({ id: p.id, title: p.title, number: n, continues: p.page === 'continue', body: p.children })
    } else if (child.type === BackMatter) {
      for (const sec of backMatterSections(ctx, ctx.numbering.backMatterStart)) {
        placed.push({ ...sec, body: BACK_BODY[sec.id](ctx) })
      }
    }
  }
  const pages: PageItem[][] = []
  const budget = pageBudget(ctx.pkg.paper)
  let used: number | null = null
  for (const sec of placed) {
    let startsPage = !(sec.continues && pages.length)
    const kids = Children.toArray(sec.body)
    // A continuing section whose heading and first block do not fit what is left starts a page.
    if (!startsPage) {
      const first = leadHeight(kids, ctx)
      if (used === null || first === null || used + HEAD_GAP + HEAD + first > budget) startsPage = true
    }
    const headUsed = startsPage ? HEAD : (used as number) + HEAD_GAP + HEAD
    const { segments, used: after } = segmentBody(sec.body, ctx, headUsed)
    const [first, ...rest] = segments
    const item: PageItem = { key: sec.id, head: sec, body: first }
    if (startsPage) pages.push([item])
    else pages[pages.length - 1].push(item)
    rest.forEach((body, i) => pages.push([{ key: `${sec.id}-${i + 1}`, body }]))
    used = after
  }
  return document(
    pages.map((items) => (
      <PdfPage key={items[0].key}>
        {items.map((it, i) => (
          <View key={it.key}>
            {it.head ? <SectionHead id={it.head.id} number={it.head.number} title={it.head.title} first={i === 0} /> : null}
            {it.body}
          </View>
        ))}
      </PdfPage>
    )),
  )
}

// Plain Text blocks of the back matter: their words at body size.
registerBlockHeight(Text, (el, ctx) => {
  const text = (Array.isArray(el.props.children) ? el.props.children : [el.props.children]).filter((c) => typeof c === 'string').join(' ')
  return lineCount([{ text, size: BODY_SIZE, face: { family: SANS } }], contentWidth(ctx.pkg.paper)) * BODY_SIZE * LINE + 8
})

export function pdfWrapper(document: (pages: ReactNode) => ReactNode) {
  return function Wrapper({ children }: { children?: ReactNode }) {
    return <Paginate document={document}>{children}</Paginate>
  }
}

export const pdfReportComponents: ReportComponents = {
  Section,
  TitleBlock: B.TitleBlock,
  InputsTable: B.InputsTable,
  Steps: PdfSteps,
  Step: PdfStep,
  OtherSteps: PdfOtherSteps,
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
  MathBlock,
  MathInline,
}

export const pdfMarkdownComponents = {
  p: P, h2: H2, h3: H3, ul: UL, ol: OL, li: LI, em: Em, strong: Strong, code: Code, a: A,
}
