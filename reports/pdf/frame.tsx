/**
 * Every PDF sheet: a hairline at the head, the title block at the foot (drawn from TITLE_BLOCK in
 * styles.ts, the same data finish.ts draws and stamps from) and the calc number with its revision
 * along the outer margin. What changes as a revision moves through sign-off — its state, the names
 * and dates, the watermark, the sheet numbers — is left empty here and stamped by finishPdf, so
 * signing never renders the body again. A <Page> holds one section or a few short ones, which keeps
 * react-pdf's layout cost linear.
 */
import type { ReactNode } from 'react'
import { Page, Text, View } from '@react-pdf/renderer'
import { sectionAnchor } from '../model/context'
import { useReport } from '../model/react-context'
import type { ReportPackage } from '../types'
import { C, HEAD_RULE, MARGIN_X, OUTER_MARK, PAGE_SIZE, TITLE_BLOCK, TITLE_BLOCK_HEIGHT, s } from './styles'

/** Static text of a title-block cell (empty for the cells sign-off stamps). */
export function titleCellText(pkg: ReportPackage, id: string): string {
  switch (id) {
    case 'project':
      return `${pkg.project.code} · ${pkg.project.name}`
    case 'calc':
      return pkg.calc.number
    case 'rev':
      return pkg.revision.label
    case 'title':
      return pkg.calc.title
    default:
      return ''
  }
}

const labelStyle = { fontSize: TITLE_BLOCK.labelSize, fontStyle: 'italic' as const, color: C.muted, lineHeight: 1 }

function TitleBlock() {
  const { pkg } = useReport()
  const h = TITLE_BLOCK.rowHeight
  return (
    <View fixed style={{ position: 'absolute', bottom: TITLE_BLOCK.bottom, left: MARGIN_X, right: MARGIN_X, height: TITLE_BLOCK_HEIGHT, borderTopWidth: 0.9, borderBottomWidth: 0.9, borderColor: C.ink }}>
      <View style={{ position: 'absolute', left: 0, top: 0, bottom: 0, width: TITLE_BLOCK.bar, backgroundColor: C.accent }} />
      <View style={{ position: 'absolute', left: 0, right: 0, top: h, height: 0, borderTopWidth: 0.4, borderTopColor: C.rule }} />
      {TITLE_BLOCK.cells.map((c) => {
        const v = titleCellText(pkg, c.id)
        const big = c.id === 'calc'
        return (
          <View key={c.id} style={{ position: 'absolute', top: c.row * h, height: h, left: `${c.x0 * 100}%`, width: `${(c.x1 - c.x0) * 100}%`, paddingLeft: TITLE_BLOCK.padX + (c.x0 === 0 ? TITLE_BLOCK.bar : 0), borderLeftWidth: c.x0 === 0 ? 0 : 0.4, borderLeftColor: C.rule }}>
            <Text style={{ ...labelStyle, position: 'absolute', top: TITLE_BLOCK.labelBaseline - TITLE_BLOCK.labelSize * 0.8, left: TITLE_BLOCK.padX + (c.x0 === 0 ? TITLE_BLOCK.bar : 0) }}>{c.label}</Text>
            {v ? (
              <Text style={{ position: 'absolute', top: big ? 5 : TITLE_BLOCK.valueBaseline - TITLE_BLOCK.valueSize * 0.9, right: big ? 4 : undefined, left: big ? undefined : TITLE_BLOCK.padX + (c.x0 === 0 ? TITLE_BLOCK.bar : 0), fontSize: big ? 12 : TITLE_BLOCK.valueSize, fontWeight: 700, lineHeight: 1, maxLines: 1 }}>{v}</Text>
            ) : null}
          </View>
        )
      })}
    </View>
  )
}

function Head() {
  return <View fixed style={{ position: 'absolute', top: HEAD_RULE, left: MARGIN_X, right: MARGIN_X, height: 0, borderTopWidth: 0.4, borderTopColor: C.rule }} />
}

/** Calc number and revision along the outer margin, reading upward. */
function OuterMark() {
  const { pkg } = useReport()
  const [w, h] = PAGE_SIZE[pkg.paper]
  const len = 240
  return (
    <Text
      fixed
      style={{ position: 'absolute', left: w - OUTER_MARK.fromEdge - len / 2, top: h / 2 - OUTER_MARK.size / 2, width: len, textAlign: 'center', fontSize: OUTER_MARK.size, color: C.muted, letterSpacing: 0.6, lineHeight: 1, transform: 'rotate(-90deg)' }}
    >
      {`${pkg.calc.number} · rev ${pkg.revision.label}`}
    </Text>
  )
}

export function SectionHead({ id, number, title, first }: { id: string; number: number | string; title: string; first: boolean }) {
  return (
    // Bookmarks work on any node at runtime; react-pdf's types only list them on Page.
    <View style={[s.sectionHead, first ? {} : { marginTop: 14 }]} minPresenceAhead={90} id={sectionAnchor(id)} {...({ bookmark: { title: `${number}  ${title}`, fit: true } } as object)}>
      <Text style={s.sectionNum}>{String(number)}</Text>
      <Text style={s.sectionTitle}>{title}</Text>
    </View>
  )
}

export function PdfPage({ children }: { children?: ReactNode }) {
  const { pkg } = useReport()
  return (
    <Page size={pkg.paper} style={s.page}>
      <Head />
      {children}
      <OuterMark />
      <TitleBlock />
    </Page>
  )
}
