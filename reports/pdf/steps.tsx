/**
 * Numbered steps: the unit a checker signs off, kept whole on a page. Each is set as a derivation:
 * title, the rule, the rule with its numbers, then a small line naming the reference, where the
 * inputs come from and the step id. The value sits in a right-hand margin column with its criterion,
 * and a narrow checker column at the far right is left for the tick, initials and remark numbers that
 * finishPdf stamps (positions from the step's named destination).
 */
import { Path, Svg, Text, View } from '@react-pdf/renderer'
import { stepAnchor } from '../model/context'
import { useReport } from '../model/react-context'
import { stepView, type StepView } from '../model/views'
import { MathSvg } from './math'
import { STEP, stepLayout } from './measure'
import { C } from './styles'

/**
 * The utilisation glyph: a small square whose lower part fills in proportion to u (a level gauge);
 * above 1 it is filled in the accent colour and the top edge is cut open.
 */
export function UGlyph({ u, size = STEP.glyph }: { u: number; size?: number }) {
  const k = Math.max(0, Math.min(1, u))
  const over = u > 1 + 1e-9
  const fill = (size - 1.2) * k
  return (
    <Svg width={size} height={size} viewBox={`0 0 ${size} ${size}`}>
      <Path d={`M0.4 0.4V${size - 0.4}H${size - 0.4}V0.4${over ? '' : 'Z'}`} stroke={over ? C.accent : C.ink} strokeWidth={0.6} fill="none" />
      {fill > 0.05 ? <Path d={`M0.9 ${size - 0.9 - fill}H${size - 0.9}V${size - 0.9}H0.9Z`} fill={over ? C.accent : C.ink} /> : null}
    </Svg>
  )
}

export function PdfStepBox({ v }: { v: StepView }) {
  const layout = stepLayout(v, useReport().pkg.paper)
  const attention = v.verdict === 'fail' || v.verdict === 'warn'
  return (
    <View wrap={false} id={stepAnchor(v.id)} style={{ flexDirection: 'row', paddingVertical: STEP.padY, marginBottom: STEP.marginBottom, borderBottomWidth: 0.4, borderBottomColor: C.hair }}>
      <Text style={{ width: STEP.numberWidth, fontSize: STEP.titleSize, fontWeight: 700, color: C.accent, lineHeight: STEP.tight }}>{v.n}</Text>
      <View style={{ flex: 1 }}>
        <Text style={{ fontSize: STEP.titleSize, fontWeight: 700, lineHeight: STEP.tight }}>{v.title}</Text>
        {[...layout.formula, ...layout.substituted].map((l, i) => (
          <View key={i} style={{ marginTop: STEP.lineGap }}>
            <MathSvg tex={l.tex} display size={l.size} />
          </View>
        ))}
        <Text style={{ marginTop: STEP.lineGap, fontSize: STEP.refSize, color: C.muted, lineHeight: STEP.tight }}>{layout.refLine}</Text>
        {v.note ? <Text style={{ fontSize: STEP.noteSize, fontStyle: 'italic', color: C.muted, lineHeight: STEP.tight }}>{v.note}</Text> : null}
      </View>
      <View style={{ width: STEP.valueWidth, marginLeft: STEP.gap, alignItems: 'flex-end' }}>
        <View style={{ flexDirection: 'row', alignItems: 'center' }}>
          {v.utilisation !== undefined ? (
            <View style={{ marginRight: 3 }}>
              <UGlyph u={v.utilisation} />
            </View>
          ) : null}
          <Text style={{ fontSize: STEP.valueSize, fontWeight: 700, lineHeight: STEP.tight, textAlign: 'right', color: v.verdict === 'fail' ? C.accent : C.ink }}>{v.result || '—'}</Text>
        </View>
        {v.criterion ? (
          <View style={{ marginTop: STEP.lineGap }}>
            <MathSvg tex={v.criterion} display size={STEP.criterionSize} />
          </View>
        ) : null}
        {v.verdictLabel ? <Text style={{ fontSize: STEP.refSize, lineHeight: STEP.tight, fontWeight: attention ? 700 : 400, color: attention ? C.accent : C.muted }}>{v.verdictLabel}</Text> : null}
      </View>
      <View style={{ width: STEP.checkWidth, marginLeft: STEP.gap, borderLeftWidth: 0.4, borderLeftColor: C.rule }} />
    </View>
  )
}

/** A section's steps, or the slice [from, to) of them when the wrapper has cut a long list into pages. */
export function PdfSteps({ section, from = 0, to, appendix }: { section: string; from?: number; to?: number; appendix?: boolean }) {
  const ctx = useReport()
  const list = ((appendix ? ctx.appendixBySection : ctx.bySection).get(section) ?? []).slice(from, to)
  return <View>{list.map(({ n, step }) => <PdfStepBox key={step.id} v={stepView(n, step, ctx)} />)}</View>
}

export function PdfStep({ id }: { id: string }) {
  const ctx = useReport()
  const n = ctx.numberOf.get(id)
  const step = ctx.pkg.result.steps.find((st) => st.id === id)
  return n && step ? <PdfStepBox v={stepView(n, step, ctx)} /> : null
}

export function PdfOtherSteps() {
  const ctx = useReport()
  return (
    <View>
      {ctx.otherSections.map((sec) => (
        <View key={sec}>
          <Text style={{ fontSize: 9.5, fontWeight: 700, marginBottom: 4 }}>{sec}</Text>
          <PdfSteps section={sec} />
        </View>
      ))}
    </View>
  )
}
