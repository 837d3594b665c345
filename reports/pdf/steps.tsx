/** Numbered calculation steps: the unit a checker signs off, kept whole on a page. */
import { Text, View } from '@react-pdf/renderer'
import { stepAnchor } from '../model/context'
import { useReport } from '../model/react-context'
import { stepView, type StepView } from '../model/views'
import { MathSvg } from './math'
import { MONO } from './fonts'
import { STEP, stepLayout } from './measure'
import { C } from './styles'

const VERDICT_COLOUR: Record<string, string> = { pass: C.pass, fail: C.fail, warn: C.warn, info: C.muted }

const KEY = { width: STEP.keyWidth, fontSize: STEP.keySize, color: C.muted }
const ROW = { flexDirection: 'row' as const, alignItems: 'center' as const, marginTop: STEP.rowGap }

/**
 * Title line (with the step id), formula, values with the result in a fixed
 * right-hand column, source. Kept flat: react-pdf's cost grows with nodes.
 * Sizes come from STEP and stepLayout because `stepHeight` predicts this box's height.
 */
export function PdfStepBox({ v }: { v: StepView }) {
  const colour = VERDICT_COLOUR[v.verdict ?? 'info']
  const layout = stepLayout(v, useReport().pkg.paper)
  const result = (
    <Text style={{ flex: 1, textAlign: 'right', fontSize: STEP.resultSize, fontWeight: 700, lineHeight: STEP.tight }}>
      <Text style={{ fontSize: STEP.keySize, fontWeight: 400, color: C.muted }}>{STEP.resultLabel}</Text>
      {v.result || '—'}
    </Text>
  )
  return (
    <View wrap={false} id={stepAnchor(v.id)} style={{ flexDirection: 'row', marginBottom: STEP.marginBottom, borderLeftWidth: STEP.border, borderLeftColor: colour, paddingLeft: STEP.padLeft, paddingVertical: STEP.padY }}>
      <Text style={{ width: STEP.numberWidth, fontSize: 9.5, fontWeight: 700, color: C.accent, lineHeight: STEP.tight }}>{v.n}</Text>
      <View style={{ flex: 1 }}>
        <View style={{ flexDirection: 'row', alignItems: 'center' }}>
          <Text style={{ flex: 1, fontSize: STEP.titleSize, fontWeight: 700, lineHeight: STEP.tight }}>
            {v.title}
            <Text style={{ fontFamily: MONO, fontSize: STEP.idSize, fontWeight: 400, color: C.muted }}>{`   ${v.id}`}</Text>
          </Text>
          {v.verdictLabel ? (
            <Text style={{ fontSize: STEP.badgeSize, fontWeight: 700, color: '#ffffff', backgroundColor: colour, paddingHorizontal: STEP.badgePadX, paddingTop: 1, borderRadius: 2, lineHeight: STEP.tight }}>{v.verdictLabel}</Text>
          ) : null}
        </View>
        {v.formula ? (
          <View style={ROW}>
            <Text style={KEY}>Formula</Text>
            <MathSvg tex={v.formula} display size={layout.formulaSize} />
          </View>
        ) : null}
        <View style={ROW}>
          <Text style={KEY}>{v.substituted ? 'With values' : ''}</Text>
          {v.substituted ? <MathSvg tex={v.substituted} display size={layout.substitutedSize} /> : null}
          {layout.resultBelow ? null : result}
        </View>
        {/* A long substitution gets the row to itself; the result follows, never overlapping it. */}
        {layout.resultBelow ? (
          <View style={ROW}>
            <View style={{ width: STEP.keyWidth }} />
            {result}
          </View>
        ) : null}
        <View style={ROW}>
          <Text style={KEY}>Source</Text>
          <Text style={{ flex: 1, fontSize: STEP.sourceSize, lineHeight: STEP.sourceLine }}>{v.source ?? '—'}</Text>
        </View>
        {v.note ? <Text style={{ fontSize: STEP.noteSize, fontStyle: 'italic', color: C.muted, lineHeight: STEP.tight }}>{v.note}</Text> : null}
      </View>
    </View>
  )
}

/** A section's steps, or the slice [from, to) of them when the wrapper has cut a long list into pages. */
export function PdfSteps({ section, from = 0, to }: { section: string; from?: number; to?: number }) {
  const ctx = useReport()
  const list = (ctx.bySection.get(section) ?? []).slice(from, to)
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
