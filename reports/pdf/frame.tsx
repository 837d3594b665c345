/**
 * Every PDF page: the title block on top and the sign-off strip at the bottom.
 * What changes as a revision moves through sign-off — its state, the checker's
 * and approver's names and dates, the watermark, the page numbers — is left
 * out here and stamped by finishPdf, so signing never renders the body again.
 * A <Page> holds one section or a few short ones, which keeps react-pdf's
 * layout cost linear.
 */
import type { ReactNode } from 'react'
import { Page, Text, View } from '@react-pdf/renderer'
import { formatDate } from '../model/format'
import { sectionAnchor } from '../model/context'
import { useReport } from '../model/react-context'
import { C, FOOTER, HEADER_TOP, MARGIN_X, SIGN_OFF_ROLES, TITLE_CELLS, s } from './styles'

const label = { fontSize: 5.6, color: C.muted, letterSpacing: 0.3, lineHeight: 1.2 }
const value = { fontSize: 7.4, fontWeight: 700 as const, lineHeight: 1.25 }

function Cell({ k, v, flex, last }: { k: string; v?: string; flex: number; last?: boolean }) {
  return (
    <View style={{ flex, height: 22, paddingHorizontal: 5, paddingTop: 2.5, borderRightWidth: last ? 0 : 0.6, borderRightColor: C.rule }}>
      <Text style={label}>{k.toUpperCase()}</Text>
      {v ? <Text style={value}>{v}</Text> : null}
    </View>
  )
}

function Header() {
  const { pkg } = useReport()
  return (
    <View fixed style={{ position: 'absolute', top: HEADER_TOP, left: MARGIN_X, right: MARGIN_X, height: 46, borderWidth: 0.8, borderColor: C.ink }}>
      <View style={{ flexDirection: 'row', height: 22.4, borderBottomWidth: 0.6, borderBottomColor: C.rule }}>
        <Cell k="Project" v={`${pkg.project.code} · ${pkg.project.name}`} flex={TITLE_CELLS.project} />
        <Cell k="Calculation" v={pkg.calc.number} flex={TITLE_CELLS.calc} />
        <Cell k="Rev" v={pkg.revision.label} flex={TITLE_CELLS.rev} />
        {/* State and page number are stamped by finishPdf, keeping every page static for react-pdf. */}
        <Cell k="State" flex={TITLE_CELLS.state} />
        <Cell k="Page" flex={TITLE_CELLS.page} last />
      </View>
      <View style={{ flexDirection: 'row', height: 22 }}>
        <Cell k="Client" v={pkg.project.client} flex={3} />
        <Cell k="Title" v={pkg.calc.title} flex={4.1} last />
      </View>
    </View>
  )
}

function Footer() {
  const { pkg } = useReport()
  return (
    <View fixed style={{ position: 'absolute', bottom: FOOTER.bottom, left: MARGIN_X, right: MARGIN_X, height: FOOTER.height, borderTopWidth: 0.8, borderTopColor: C.ink, flexDirection: 'row', paddingTop: 3 }}>
      {/* Names and dates are stamped by finishPdf as the revision is signed. */}
      {SIGN_OFF_ROLES.map((role) => (
        <View key={role} style={{ flex: 1 }}>
          <Text style={label}>{role.toUpperCase()}</Text>
        </View>
      ))}
      <View style={{ flex: 1, alignItems: 'flex-end' }}>
        <Text style={label}>{`GENERATED ${formatDate(pkg.generatedAt)}`}</Text>
        <Text style={{ fontSize: 6.4, color: C.muted, lineHeight: 1.25 }}>{`engine ${pkg.engineVersion} · ${pkg.templateVersion}`}</Text>
      </View>
    </View>
  )
}

export function SectionHead({ id, number, title, first }: { id: string; number: number; title: string; first: boolean }) {
  return (
    // Bookmarks work on any node at runtime; react-pdf's types only list them on Page.
    <View style={[s.sectionHead, first ? {} : { marginTop: 16 }]} minPresenceAhead={80} id={sectionAnchor(id)} {...({ bookmark: { title: `${number}  ${title}`, fit: true } } as object)}>
      <Text style={s.sectionNum}>{String(number)}</Text>
      <Text style={s.sectionTitle}>{title}</Text>
    </View>
  )
}

export function PdfPage({ children }: { children?: ReactNode }) {
  const { pkg } = useReport()
  return (
    <Page size={pkg.paper} style={s.page}>
      <Header />
      {children}
      <Footer />
    </Page>
  )
}
