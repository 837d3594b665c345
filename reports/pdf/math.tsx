/**
 * Math in the PDF: vector outlines and glyph runs from `texToShape`, placed so inline math
 * sits on the text baseline and display math carries its number at the right.
 */
import { Canvas, Font, Text, View } from '@react-pdf/renderer'
import { BODY_SIZE, C, LINE } from './styles'
import { type MathShape, texToShape } from './math-shape'

/** The part of pdfkit's document that react-pdf's Canvas painter hands on (every call returns the painter). */
interface Painter {
  save(): Painter
  restore(): Painter
  rect(x: number, y: number, w: number, h: number): Painter
  clip(): Painter
  scale(s: number): Painter
  translate(x: number, y: number): Painter
  path(d: string): Painter
  fill(color?: string): Painter
  fillColor(color: string): Painter
  font(src: unknown, family: string, size: number): Painter
  text(text: string, x: number, y: number, options: Record<string, unknown>): Painter
}

function faceData(family: string): unknown {
  return Font.getFont({ fontFamily: family, fontWeight: 400, fontStyle: 'normal' })?.data ?? null
}

/**
 * Draws a formula straight onto the page: its outline as one path and its glyph runs as text
 * (math-text.ts), clipped to its box as an Svg would be. A Canvas, not an Svg with a Text per run:
 * react-pdf lays out every Svg Text with the whole textkit pipeline (bidi, line breaking, font
 * substitution) in every render, which for the ~7000 one- and two-glyph runs of a package cost more
 * than the rest of the math. pdfkit sets each run at its baseline from the same fontkit face
 * (shaped through the memo in fonts.ts), so the page shows the same glyphs at the same places.
 */
function paintFormula(m: MathShape, width: number, height: number) {
  const [x0, y0, vw, vh] = m.viewBox
  return (painter: Painter) => {
    // Yoga measures a Canvas by painting it into a recorder when its size is not fixed; ours always is.
    if (typeof painter.text !== 'function' || !vw || !vh) return null
    painter.rect(0, 0, width, height).clip()
    painter.scale(width / vw).translate(-x0, -y0)
    if (m.d) painter.path(m.d).fill(C.ink)
    painter.fillColor(C.ink)
    for (const t of m.texts) {
      const data = faceData(t.family)
      if (!data) continue
      // The family names the face in pdfkit's cache, so a face is opened once per document.
      painter.font(data, `inverso-math ${t.family}`, t.size).text(t.text, t.x, t.y, { lineBreak: false, baseline: 'alphabetic' })
    }
    return null
  }
}

export function MathSvg({ tex, display, size }: { tex: string; display: boolean; size: number }) {
  const m = texToShape(tex, display)
  const width = m.width * size
  const height = (m.ascent + m.descent) * size
  return <Canvas style={{ width, height }} paint={paintFormula(m, width, height) as (p: unknown) => null} />
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
