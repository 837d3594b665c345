/** Numbered calculation steps: the unit a checker signs off, kept whole on a page. */
import { Text, View } from '@react-pdf/renderer'
import { stepAnchor } from '../model/context'
import { useReport } from '../model/react-context'
import { stepView, type StepView } from '../model/views'
import { MathSvg } from './math'
import { MONO } from './fonts'
import { C } from './styles'

const VERDICT_COLOUR: Record<string, string> = { pass: C.pass, fail: C.fail, warn: C.warn, info: C.muted }

const KEY = { width: 58, fontSize: 6.6, color: C.muted }
const ROW = { flexDirection: 'row' as const, alignItems: 'center' as const, marginTop: 2.5 }

/**
 * Title line (with the step id), formula, values with the result in a fixed
 * right-hand column, source. Kept flat: react-pdf's cost grows with nodes.
 */
export function PdfStepBox({ v }: { v: StepView }) {
  const colour = VERDICT_COLOUR[v.verdict ?? 'info']
  return (
    <View wrap={false} id={stepAnchor(v.id)} style={{ flexDirection: 'row', marginBottom: 6, borderLeftWidth: 2, borderLeftColor: colour, paddingLeft: 6, paddingVertical: 1.5 }}>
      <Text style={{ width: 20, fontSize: 9.5, fontWeight: 700, color: C.accent, lineHeight: 1.3 }}>{v.n}</Text>
      <View style={{ flex: 1 }}>
        <View style={{ flexDirection: 'row', alignItems: 'center' }}>
          <Text style={{ flex: 1, fontSize: 8.8, fontWeight: 700, lineHeight: 1.3 }}>
            {v.title}
            <Text style={{ fontFamily: MONO, fontSize: 6.2, fontWeight: 400, color: C.muted }}>{`   ${v.id}`}</Text>
          </Text>
          {v.verdictLabel ? (
            <Text style={{ fontSize: 6.4, fontWeight: 700, color: '#ffffff', backgroundColor: colour, paddingHorizontal: 4, paddingTop: 1, borderRadius: 2, lineHeight: 1.3 }}>{v.verdictLabel}</Text>
          ) : null}
        </View>
        {v.formula ? (
          <View style={ROW}>
            <Text style={KEY}>Formula</Text>
            <MathSvg tex={v.formula} display size={8.6} />
          </View>
        ) : null}
        <View style={ROW}>
          <Text style={KEY}>{v.substituted ? 'With values' : ''}</Text>
          {v.substituted ? <MathSvg tex={v.substituted} display size={8.6} /> : null}
          <Text style={{ flex: 1, textAlign: 'right', fontSize: 9, fontWeight: 700, lineHeight: 1.3 }}>
            <Text style={{ fontSize: 6.6, fontWeight: 400, color: C.muted }}>{'Result   '}</Text>
            {v.result || '—'}
          </Text>
        </View>
        <View style={ROW}>
          <Text style={KEY}>Source</Text>
          <Text style={{ flex: 1, fontSize: 7.2, lineHeight: 1.35 }}>{v.source ?? '—'}</Text>
        </View>
        {v.note ? <Text style={{ fontSize: 7, fontStyle: 'italic', color: C.muted, lineHeight: 1.3 }}>{v.note}</Text> : null}
      </View>
    </View>
  )
}

export function PdfSteps({ section }: { section: string }) {
  const ctx = useReport()
  const list = ctx.bySection.get(section) ?? []
  return <View>{list.map(({ n, step }) => <PdfStepBox key={step.id} v={stepView(n, step)} />)}</View>
}

export function PdfStep({ id }: { id: string }) {
  const ctx = useReport()
  const n = ctx.numberOf.get(id)
  const step = ctx.pkg.result.steps.find((st) => st.id === id)
  return n && step ? <PdfStepBox v={stepView(n, step)} /> : null
}

export function PdfOtherSteps() {
  const ctx = useReport()
  return (
    <View>
      {ctx.otherSections.map((sec) => (
        <View key={sec}>
          <Text style={{ fontSize: 10, fontWeight: 700, marginBottom: 4 }}>{sec}</Text>
          <PdfSteps section={sec} />
        </View>
      ))}
    </View>
  )
}
