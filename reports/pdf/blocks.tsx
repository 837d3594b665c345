/** The report components, drawn with react-pdf primitives. */
import { Text, View } from '@react-pdf/renderer'
import { useReport } from '../model/react-context'
import type { ReportContext } from '../model/context'
import type { FigureView } from '../model/figures'
import { diagramFigure, plotFigure, utilisationFigure } from '../model/figures'
import {
  cautions, changesView, componentTable, criteriaTable, detailingTable, governingTables, historyTable, inputsTable, materialsTable, references, remarksTable, signatories, tableView, titleView, verdictView,
} from '../model/views'
import { formatUtilisation } from '../model/format'
import { UGlyph } from './steps'
import { SceneSvg } from './scene'
import { PdfTable } from './table'
import { MONO } from './fonts'
import { BODY_SIZE, C, LINE } from './styles'
import { registerBlockExpand, registerBlockHeight, tableHeight } from './flow'
import { lineCount } from './measure'
import { SANS } from './fonts'

function PdfFigure({ fig }: { fig: FigureView | null }) {
  if (!fig) return null
  return (
    <View wrap={false} style={{ marginBottom: 4 }}>
      <SceneSvg scene={fig.scene} />
      <Text style={{ fontSize: 7.4, color: C.muted, marginTop: 3, marginBottom: 8 }}>
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
    <View style={{ marginBottom: 10 }} wrap={false}>
      <Text style={{ fontSize: 17, fontWeight: 700, lineHeight: 1.2, marginBottom: 6 }}>{t.title}</Text>
      {t.rows.map(([k, v]) => (
        <View key={k} style={{ flexDirection: 'row', marginBottom: 1.5 }}>
          <Text style={{ width: 82, fontSize: 7.4, fontStyle: 'italic', color: C.muted }}>{k}</Text>
          <Text style={{ flex: 1, fontSize: k === 'result SHA-256' ? 6.6 : 8.4, ...(k === 'result SHA-256' ? { fontFamily: MONO } : {}) }}>{v}</Text>
        </View>
      ))}
    </View>
  )
}

/** The verdict: a bar in the accent colour, the finding in words, the governing utilisation with its glyph. */
export function Verdict() {
  const ctx = useReport()
  const v = verdictView(ctx.pkg, ctx)
  if (!v) return null
  return (
    <View wrap={false} style={{ flexDirection: 'row', marginBottom: 8, marginTop: 2 }}>
      <View style={{ width: 3, backgroundColor: v.pass ? C.ink : C.accent, marginRight: 8 }} />
      <View style={{ flex: 1 }}>
        <Text style={{ fontSize: 9.6, fontWeight: 700, color: v.pass ? C.ink : C.accent }}>{`${v.pass ? 'Holds' : 'Does not hold'}. ${v.headline}`}</Text>
        {v.governing ? (
          <View style={{ flexDirection: 'row', alignItems: 'flex-start', marginTop: 1.5 }}>
            {v.utilisation !== null ? (
              <View style={{ flexDirection: 'row', alignItems: 'center', width: 84 }}>
                <UGlyph u={v.utilisation} />
                <Text style={{ fontSize: 8.2, fontWeight: 700, marginLeft: 3 }}>{`u = ${formatUtilisation(v.utilisation)}`}</Text>
              </View>
            ) : null}
            <Text style={{ flex: 1, fontSize: 8.2 }}>{v.governing}</Text>
          </View>
        ) : null}
        {v.unmet.length ? <Text style={{ fontSize: 8.2, color: C.accent }}>{`Not met: ${v.unmet.join('; ')}.`}</Text> : null}
      </View>
    </View>
  )
}

export function Criteria() {
  const view = criteriaTable(useReport())
  return view ? <PdfTable view={view} size={7.6} /> : null
}

function Lines({ items }: { items: string[] }) {
  return (
    <View style={{ marginBottom: 5 }}>
      {items.map((t, i) => (
        <View key={i} style={{ flexDirection: 'row', marginBottom: 2 }} wrap={false}>
          <Text style={{ width: 11, color: C.accent }}>–</Text>
          <Text style={{ flex: 1 }}>{t}</Text>
        </View>
      ))}
    </View>
  )
}

export function DesignBasis() {
  const b = useReport().pkg.result.basis
  return b ? <Lines items={b.statements} /> : null
}

export function Assumptions() {
  const b = useReport().pkg.result.basis
  return b ? <Lines items={b.assumptions} /> : null
}

export function InputsTable() {
  const { pkg } = useReport()
  return pkg.inputRows.length ? <PdfTable view={inputsTable(pkg)} title={false} size={7.4} /> : null
}

export function MaterialsTable() {
  const view = materialsTable(useReport().pkg)
  return view ? <PdfTable view={view} size={7} /> : null
}

export function GoverningTables() {
  const tables = governingTables(useReport())
  return <View>{tables.map((t) => <PdfTable key={t.id} view={t} size={7} />)}</View>
}

export function ResultsTable({ section, id }: { section?: string; id?: string }) {
  const ctx = useReport()
  const tables = (ctx.pkg.result.tables ?? []).filter((t) => t.id !== 'checks-summary' && (id ? t.id === id : !section || t.section === section))
  return <View>{tables.map((t) => <PdfTable key={t.id} view={tableView(t, ctx.units)} size={6.8} />)}</View>
}

export function ChecksTable() {
  const ctx = useReport()
  const checks = ctx.pkg.result.checks ?? []
  if (!checks.length) return null
  const detailing = detailingTable(checks, ctx)
  return (
    <View>
      <PdfTable view={componentTable(checks, ctx)} size={7.2} />
      {detailing ? <PdfTable view={detailing} size={7.2} /> : null}
    </View>
  )
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
        <View key={i} wrap={false} style={{ flexDirection: 'row', marginBottom: 4 }}>
          <Text style={{ width: 14, color: C.accent, fontWeight: 700 }}>!</Text>
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

/** What changed since the calc's revision before: the verdict in words, then inputs, checks and step values. */
export function Changes() {
  const v = changesView(useReport())
  if (!v) return null
  return (
    <View>
      <Text style={{ marginBottom: 6 }}>{v.summary}</Text>
      {v.tables.map((t) => <PdfTable key={t.id} view={t} size={7} />)}
    </View>
  )
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

/*
 * Heights of the blocks as drawn above, for the wrapper's page breaks (flow.tsx). Estimates err on
 * the tall side: a block that would not fit starts the next page instead of being split by react-pdf.
 */
const textLines = (text: string, size: number, width: number) => lineCount([{ text, size, face: { family: SANS } }], width)
const figureHeight = (fig: FigureView | null, width: number) => (fig ? fig.scene.height + textLines(`${fig.label}. ${fig.caption}`, 7.4, width) * 7.4 * 1.42 + 15 : 0)
const linesHeight = (items: string[], width: number) => items.reduce((a, t) => a + textLines(t, BODY_SIZE, width - 11) * BODY_SIZE * LINE + 2, 5)

registerBlockHeight(TitleBlock, (_el, ctx, width) => 17 * 1.2 + 6 + titleView(ctx.pkg, ctx.resultHash).rows.reduce((a, [, v]) => a + textLines(v, 8.4, width - 82) * 8.4 * LINE + 1.5, 0) + 10)
registerBlockHeight(Verdict, (_el, ctx, width) => {
  const v = verdictView(ctx.pkg, ctx)
  if (!v) return 0
  return 9.6 * LINE + textLines(v.governing ?? '', 8.2, width - 90) * 8.2 * LINE + (v.unmet.length ? textLines(v.unmet.join('; '), 8.2, width - 11) * 8.2 * LINE : 0) + 12
})
registerBlockHeight(Criteria, (_el, ctx, width) => {
  const v = criteriaTable(ctx)
  return v ? tableHeight(v, 7.6, true, width) + 8 : 0
})
registerBlockHeight(DesignBasis, (_el, ctx, width) => linesHeight(ctx.pkg.result.basis?.statements ?? [], width))
registerBlockHeight(Assumptions, (_el, ctx, width) => linesHeight(ctx.pkg.result.basis?.assumptions ?? [], width))
registerBlockHeight(InputsTable, (_el, ctx, width) => (ctx.pkg.inputRows.length ? tableHeight(inputsTable(ctx.pkg), 7.4, false, width) + 8 : 0))
registerBlockHeight(MaterialsTable, (_el, ctx, width) => {
  const v = materialsTable(ctx.pkg)
  return v ? tableHeight(v, 7, true, width) + 8 : 0
})
registerBlockHeight(GoverningTables, (_el, ctx, width) => governingTables(ctx).reduce((a, t) => a + tableHeight(t, 7, true, width) + 8, 0))
registerBlockHeight(ChecksTable, (_el, ctx, width) => {
  const checks = ctx.pkg.result.checks ?? []
  if (!checks.length) return 0
  const d = detailingTable(checks, ctx)
  return tableHeight(componentTable(checks, ctx), 7.2, true, width) + 8 + (d ? tableHeight(d, 7.2, true, width) + 8 : 0)
})
registerBlockHeight(Figure, (el, ctx, width) => figureHeight(diagramFigure(ctx, el.props.at as string | undefined, el.props.caption as string | undefined, el.props.ordinal as string | undefined), width))
registerBlockHeight(Plot, (el, ctx, width) => figureHeight(plotFigure(ctx, String(el.props.kind), el.props.caption as string | undefined, el.props.ordinal as string | undefined), width))
registerBlockHeight(References, (_el, ctx, width) => {
  const r = references(ctx)
  return linesHeight([...r.template, ...r.cited], width - 13) + (r.cited.length ? 20 : 0)
})
registerBlockHeight(Cautions, (_el, ctx, width) => linesHeight(cautions(ctx.pkg), width - 3))

registerBlockHeight(Changes, (_el, ctx, width) => {
  const v = changesView(ctx)
  return v ? linesHeight([v.summary], width + 11) + v.tables.reduce((a, t) => a + tableHeight(t, 7, true, width) + 8, 0) : 0
})
const resultsTables = (el: { props: Record<string, unknown> }, ctx: ReportContext) => {
  const { section, id } = el.props as { section?: string; id?: string }
  return (ctx.pkg.result.tables ?? []).filter((t) => t.id !== 'checks-summary' && (id ? t.id === id : !section || t.section === section)).map((t) => tableView(t, ctx.units))
}
registerBlockHeight(ResultsTable, (el, ctx, width) => resultsTables(el, ctx).reduce((a, t) => a + tableHeight(t, 6.8, true, width) + 8, 0))
registerBlockExpand(ResultsTable, (el, ctx) => resultsTables(el, ctx).map((t) => <PdfTable key={t.id} view={t} size={6.8} />))
registerBlockExpand(Changes, (_el, ctx) => {
  const v = changesView(ctx)
  return v ? [<Text key="summary" style={{ marginBottom: 6 }}>{v.summary}</Text>, ...v.tables.map((t) => <PdfTable key={t.id} view={t} size={7} />)] : []
})
registerBlockExpand(InputsTable, (_el, ctx) => (ctx.pkg.inputRows.length ? [<PdfTable key="inputs" view={inputsTable(ctx.pkg)} title={false} size={7.4} />] : []))
registerBlockExpand(GoverningTables, (_el, ctx) => governingTables(ctx).map((t) => <PdfTable key={t.id} view={t} size={7} />))
registerBlockExpand(ChecksTable, (_el, ctx) => {
  const checks = ctx.pkg.result.checks ?? []
  if (!checks.length) return []
  const d = detailingTable(checks, ctx)
  return [<PdfTable key="components" view={componentTable(checks, ctx)} size={7.2} />, ...(d ? [<PdfTable key="detailing" view={d} size={7.2} />] : [])]
})
