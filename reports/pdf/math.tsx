/**
 * Math in the PDF: vector outlines from `texToShape`, placed so inline math
 * sits on the text baseline and display math carries its number at the right.
 */
import { Path, Svg, Text, View } from '@react-pdf/renderer'
import { BODY_SIZE, C, LINE } from './styles'
import { texToShape } from './math-shape'

export function MathSvg({ tex, display, size }: { tex: string; display: boolean; size: number }) {
  const m = texToShape(tex, display)
  return (
    <Svg width={m.width * size} height={(m.ascent + m.descent) * size} viewBox={m.viewBox.join(' ')}>
      <Path d={m.d} fill={C.ink} />
      {m.texts.map((t, i) => (
        <Text key={i} x={t.x} y={t.y} fill={C.ink} style={{ fontFamily: t.family, fontSize: t.size }}>{t.text}</Text>
      ))}
    </Svg>
  )
}

export function MathBlock({ tex, number }: { tex: string; number?: string }) {
  return (
    <View style={{ flexDirection: 'row', alignItems: 'center', marginVertical: 5 }} wrap={false}>
      <View style={{ width: 40 }} />
      <View style={{ flex: 1, alignItems: 'center' }}>
        <MathSvg tex={tex} display size={BODY_SIZE * 1.1} />
      </View>
      <Text style={{ width: 40, textAlign: 'right', color: C.muted }}>{number ? `(${number})` : ''}</Text>
    </View>
  )
}

/**
 * Distance from the bottom of a text line box to its baseline, as a fraction
 * of the font size. Measured for Noto Sans at LINE line height.
 */
export const BASELINE_DEPTH = (LINE - 1.069 - 0.293) / 2 + 0.293 + 0.05

/** TeX glyphs have a smaller x-height than Noto Sans; this brings them level. */
export const MATH_SCALE = 1.08

/**
 * One inline formula as a flex item of a paragraph row. The row aligns items
 * at their bottoms, and every item is a line box deep below its baseline, so
 * baselines line up. The outline itself is absolutely positioned, because
 * react-pdf measures Svg heights wrongly inside flowing rows.
 */
export function MathInlineItem({ tex, size = BODY_SIZE * MATH_SCALE, marginRight = 0 }: { tex: string; size?: number; marginRight?: number }) {
  const m = texToShape(tex, false)
  const depth = BASELINE_DEPTH * BODY_SIZE
  const height = Math.max(LINE * BODY_SIZE, m.ascent * size + depth)
  return (
    <View style={{ width: m.width * size, height, marginRight }}>
      <View style={{ position: 'absolute', left: 0, top: height - depth - m.ascent * size }}>
        <MathSvg tex={tex} display={false} size={size} />
      </View>
    </View>
  )
}
