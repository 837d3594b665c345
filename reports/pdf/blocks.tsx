/** The report components, drawn with react-pdf primitives. */
import { Text, View } from '@react-pdf/renderer'
import { useReport } from '../model/react-context'
import type { FigureView } from '../model/figures'
import { diagramFigure, plotFigure, utilisationFigure } from '../model/figures'
import {
  cautions, checksTable, historyTable, inputsTable, references, remarksTable, signatories, tableView, titleView, verdictView,
} from '../model/views'
import { SceneSvg } from './scene'
import { PdfTable } from './table'
import { MONO } from './fonts'
import { C } from './styles'

function PdfFigure({ fig }: { fig: FigureView | null }) {
  if (!fig) return null
  return (
    <View wrap={false} style={{ marginBottom: 4 }}>
      <SceneSvg scene={fig.scene} />
      <Text style={{ fontSize: 7.6, color: C.muted, marginTop: 3, marginBottom: 10 }}>
        <Text style={{ fontWeight: 700, color: C.ink }}>{`${fig.label}. `}</Text>
        {fig.caption}
      </Text>
    </View>
  )
}

export function Figure({ at, caption, ordinal }: { at?: string; caption?: string; ordinal?: string }) {
  return <PdfFigure fig={diagramFigure(useReport(), at, caption, ordinal)} />
}
export function Plot({ kind, caption, ordinal }: { kind: string; caption?: string; ordinal?: string }) {
  return <PdfFigure fig={plotFigure(useReport(), kind, caption, ordinal)} />
}
export function UtilisationChart({ caption, ordinal }: { caption?: string; ordinal?: string }) {
  return <PdfFigure fig={utilisationFigure(useReport(), caption, ordinal)} />
}

export function TitleBlock() {
  const ctx = useReport()
  const t = titleView(ctx.pkg, ctx.resultHash)
  return (
    <View style={{ borderWidth: 1, borderColor: C.ink, marginBottom: 12 }} wrap={false}>
      <View style={{ backgroundColor: C.accent, paddingHorizontal: 10, paddingVertical: 8 }}>
        <Text style={{ fontSize: 7, color: '#dbe9f0', letterSpacing: 1 }}>CALCULATION PACKAGE</Text>
        <Text style={{ fontSize: 15, fontWeight: 700, color: '#ffffff' }}>{t.title}</Text>
      </View>
      {t.rows.map(([k, v]) => (
        <View key={k} style={{ flexDirection: 'row', borderTopWidth: 0.5, borderTopColor: C.rule, paddingHorizontal: 10, paddingVertical: 3 }}>
          <Text style={{ width: 90, fontSize: 7.4, color: C.muted }}>{k}</Text>
          <Text style={{ flex: 1, fontSize: k === 'Result SHA-256' ? 6.6 : 8.4, ...(k === 'Result SHA-256' ? { fontFamily: MONO } : {}) }}>{v}</Text>
        </View>
      ))}
    </View>
  )
}

export function Verdict() {
  const v = verdictView(useReport().pkg)
  if (!v) return null
  const colour = v.pass ? C.pass : C.fail
  return (
    <View wrap={false} style={{ flexDirection: 'row', alignItems: 'center', borderWidth: 1, borderColor: colour, backgroundColor: v.pass ? '#eef6f1' : '#fbeeec', padding: 8, marginBottom: 10 }}>
      <Text style={{ fontSize: 11, fontWeight: 700, color: colour, width: 56 }}>{v.pass ? 'PASS' : 'FAIL'}</Text>
      <View style={{ flex: 1 }}>
        <Text style={{ fontSize: 9.5, fontWeight: 700 }}>{v.headline}</Text>
        <Text style={{ fontSize: 8 }}>{v.detail}</Text>
      </View>
    </View>
  )
}

export function InputsTable() {
  const { pkg } = useReport()
  return pkg.inputRows.length ? <PdfTable view={inputsTable(pkg)} title={false} size={8} /> : null
}

export function ResultsTable({ section, id }: { section?: string; id?: string }) {
  const tables = (useReport().pkg.result.tables ?? []).filter((t) => (id ? t.id === id : !section || t.section === section))
  return <View>{tables.map((t) => <PdfTable key={t.id} view={tableView(t)} />)}</View>
}

export function ChecksTable() {
  const ctx = useReport()
  const checks = ctx.pkg.result.checks ?? []
  return checks.length ? <PdfTable view={checksTable(checks, ctx)} size={7} /> : null
}

export function References() {
  const r = references(useReport())
  const list = (items: string[], start: number) =>
    items.map((text, i) => (
      <View key={i} style={{ flexDirection: 'row', marginBottom: 2 }}>
        <Text style={{ width: 24, color: C.muted }}>{`[${start + i}]`}</Text>
        <Text style={{ flex: 1 }}>{text}</Text>
      </View>
    ))
  return (
    <View>
      {list(r.template, 1)}
      {r.cited.length ? <Text style={{ fontSize: 8.4, fontWeight: 700, marginTop: 8, marginBottom: 3 }}>Sources cited by the steps</Text> : null}
      {list(r.cited, r.template.length + 1)}
    </View>
  )
}

export function Cautions() {
  const items = cautions(useReport().pkg)
  return (
    <View>
      {items.map((c, i) => (
        <View key={i} wrap={false} style={{ flexDirection: 'row', marginBottom: 4, padding: i === 0 ? 6 : 0, backgroundColor: i === 0 ? '#fdf6e9' : undefined, borderLeftWidth: i === 0 ? 2 : 0, borderLeftColor: C.warn }}>
          <Text style={{ width: 14, color: C.warn, fontWeight: 700 }}>!</Text>
          <Text style={{ flex: 1, fontWeight: i === 0 ? 700 : 400 }}>{c}</Text>
        </View>
      ))}
    </View>
  )
}

export function RevisionHistory() {
  const { pkg } = useReport()
  return pkg.history.length ? <PdfTable view={historyTable(pkg)} size={7.6} /> : null
}

export function RemarksLog() {
  const ctx = useReport()
  return ctx.pkg.remarks.length ? <PdfTable view={remarksTable(ctx.pkg, ctx)} size={7.2} /> : <Text style={{ color: C.muted }}>No remarks recorded.</Text>
}

export function SignatureBlock() {
  const { pkg } = useReport()
  return (
    <View wrap={false} style={{ flexDirection: 'row', marginTop: 6 }}>
      {signatories(pkg).map((sg, i) => (
        <View key={sg.role} style={{ flex: 1, borderWidth: 0.8, borderColor: C.ink, marginLeft: i ? 8 : 0, padding: 6, height: 92 }}>
          <Text style={{ fontSize: 6.4, color: C.muted, letterSpacing: 0.4 }}>{sg.role.toUpperCase()}</Text>
          <Text style={{ fontSize: 9.5, fontWeight: 700 }}>{sg.name}</Text>
          <View style={{ flex: 1 }} />
          <View style={{ borderTopWidth: 0.5, borderTopColor: C.rule, paddingTop: 2, flexDirection: 'row', justifyContent: 'space-between' }}>
            <Text style={{ fontSize: 6.8, color: C.muted }}>Signature</Text>
            <Text style={{ fontSize: 7.4 }}>{sg.date === '—' ? 'not signed' : `Date ${sg.date}`}</Text>
          </View>
        </View>
      ))}
    </View>
  )
}
