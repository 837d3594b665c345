/**
 * Heights of step boxes, estimated before react-pdf lays anything out.
 *
 * react-pdf paginates a <Page> by laying out everything that is left after
 * each break again, so a section of N pages costs about N²/2 page layouts;
 * the checks of a real package run to 15 pages. Knowing how tall each step
 * box will be lets the wrapper cut long step lists into one <Page> per sheet,
 * which makes pagination linear. The numbers here mirror `PdfStepBox`: change
 * one, change the other. Text is measured with the same fontkit faces react-pdf
 * shapes with; wrapping is greedy on spaces and errs on the tall side, since an
 * estimate that is too short pushes a box onto a page of its own.
 */
import { Font } from '@react-pdf/renderer'
import type { StepView } from '../model/views'
import { texToShape } from './math-shape'
import { MONO, SANS } from './fonts'
import { BODY_BOTTOM, BODY_SIZE, BODY_TOP, LINE, PAGE_SIZE, contentWidth } from './styles'
import type { Paper } from '../types'

/** Layout constants of PdfStepBox, shared so the box and its estimate cannot drift apart. */
export const STEP = {
  numberWidth: 20,
  border: 2,
  padLeft: 6,
  padY: 1.5,
  marginBottom: 6,
  keyWidth: 58,
  keySize: 6.6,
  rowGap: 2.5,
  titleSize: 8.8,
  idSize: 6.2,
  badgeSize: 6.4,
  badgePadX: 4,
  mathSize: 8.6,
  resultSize: 9,
  resultLabel: 'Result   ',
  sourceSize: 7.2,
  sourceLine: 1.35,
  noteSize: 7,
  tight: 1.3,
} as const

interface Face {
  family: string
  bold?: boolean
  italic?: boolean
}

interface FontkitLike {
  unitsPerEm: number
  layout(text: string): { advanceWidth: number }
}

function fontOf(face: Face): FontkitLike | null {
  const desc = { fontFamily: face.family, fontWeight: face.bold ? 700 : 400, fontStyle: face.italic ? ('italic' as const) : ('normal' as const) }
  return (Font.getFont(desc)?.data as unknown as FontkitLike | undefined) ?? null
}

/** Width in points; 3 % wider than shaped, to stay on the safe side of a line break. */
export function textWidth(text: string, size: number, face: Face): number {
  const font = fontOf(face)
  // Before fonts are loaded (never in renderPdf) fall back to a generous average advance.
  if (!font) return text.length * size * 0.6
  return (font.layout(text).advanceWidth / font.unitsPerEm) * size * 1.03
}

/** Lines a greedy break on spaces needs; `lead` is width already taken on the first line. */
export function lineCount(words: { text: string; size: number; face: Face }[], width: number): number {
  let lines = 1
  let x = 0
  for (const w of words) {
    for (const part of w.text.split(/ +/).filter(Boolean)) {
      const ww = textWidth(part, w.size, w.face)
      const space = x > 0 ? textWidth(' ', w.size, w.face) : 0
      if (x > 0 && x + space + ww > width) {
        lines += 1
        x = ww
      } else x += space + ww
    }
  }
  return lines
}

/** Space kept between the substituted values and a result beside them. */
const RESULT_GAP = 12

export interface StepLayout {
  /** Font size of each formula: shrunk (to no less than 70 %) when it is wider than its column. */
  formulaSize: number
  substitutedSize: number
  /** The result sits under the substituted values instead of beside them. */
  resultBelow: boolean
}

function mathWidth(tex: string | undefined, size: number): number {
  return tex ? texToShape(tex, true).width * size : 0
}

function mathHeight(tex: string | undefined, size: number): number {
  if (!tex) return 0
  const m = texToShape(tex, true)
  return (m.ascent + m.descent) * size
}

const fit = (tex: string | undefined, room: number) => {
  const w = mathWidth(tex, STEP.mathSize)
  return w > room ? Math.max(0.7, room / w) * STEP.mathSize : STEP.mathSize
}

function resultWidth(v: StepView): number {
  return textWidth(STEP.resultLabel, STEP.keySize, { family: SANS }) + textWidth(v.result || '—', STEP.resultSize, { family: SANS, bold: true })
}

/** Decisions PdfStepBox and stepHeight share, so the estimate sees the box that is drawn. */
export function stepLayout(v: StepView, paper: Paper): StepLayout {
  const column = contentWidth(paper) - STEP.border - STEP.padLeft - STEP.numberWidth - STEP.keyWidth
  const substitutedSize = fit(v.substituted, column)
  return {
    formulaSize: fit(v.formula, column),
    substitutedSize,
    // A result that would have to wrap beside the values reads better whole on the next row.
    resultBelow: mathWidth(v.substituted, substitutedSize) + RESULT_GAP + resultWidth(v) > column,
  }
}

export function stepHeight(v: StepView, paper: Paper): number {
  const inner = contentWidth(paper) - STEP.border - STEP.padLeft - STEP.numberWidth
  const layout = stepLayout(v, paper)
  // The key labels set no line height, so they inherit the page's, already resolved to points at body size.
  const key = BODY_SIZE * LINE
  const badge = v.verdictLabel ? textWidth(v.verdictLabel, STEP.badgeSize, { family: SANS, bold: true }) + 2 * STEP.badgePadX : 0
  const titleLines = lineCount(
    [{ text: v.title, size: STEP.titleSize, face: { family: SANS, bold: true } }, { text: `   ${v.id}`, size: STEP.idSize, face: { family: MONO } }],
    inner - badge,
  )
  let h = Math.max(titleLines * STEP.titleSize * STEP.tight, v.verdictLabel ? STEP.badgeSize * STEP.tight + 1 : 0)
  if (v.formula) h += STEP.rowGap + Math.max(key, mathHeight(v.formula, layout.formulaSize))
  const result = [{ text: STEP.resultLabel, size: STEP.keySize, face: { family: SANS } }, { text: v.result || '—', size: STEP.resultSize, face: { family: SANS, bold: true } }]
  const subHeight = mathHeight(v.substituted, layout.substitutedSize)
  if (layout.resultBelow) {
    h += STEP.rowGap + Math.max(key, subHeight)
    h += STEP.rowGap + lineCount(result, inner - STEP.keyWidth) * STEP.resultSize * STEP.tight
  } else {
    const room = inner - STEP.keyWidth - mathWidth(v.substituted, layout.substitutedSize)
    h += STEP.rowGap + Math.max(key, subHeight, lineCount(result, room) * STEP.resultSize * STEP.tight)
  }
  const sourceLines = lineCount([{ text: v.source ?? '—', size: STEP.sourceSize, face: { family: SANS } }], inner - STEP.keyWidth)
  h += STEP.rowGap + Math.max(key, sourceLines * STEP.sourceSize * STEP.sourceLine)
  if (v.note) h += lineCount([{ text: v.note, size: STEP.noteSize, face: { family: SANS, italic: true } }], inner) * STEP.noteSize * STEP.tight
  return h + 2 * STEP.padY + STEP.marginBottom
}

/** Height a page offers to flowing content, kept a little short of the real thing. */
export function pageBudget(paper: Paper): number {
  return (PAGE_SIZE[paper][1] - BODY_TOP - BODY_BOTTOM) * 0.98
}

/**
 * Cuts a list of box heights into runs that each fit `budget`; the first run
 * fits `first` (what is left of a page already begun). Returns the index each
 * later run starts at; a leading 0 means not even the first box fits there.
 * A box taller than a whole page gets a run of its own and is left to wrap.
 */
export function cutPoints(heights: number[], first: number, budget: number): number[] {
  const cuts: number[] = []
  let room = first
  let inRun = 0
  heights.forEach((h, i) => {
    if (h > room && (inRun > 0 || room < budget)) {
      cuts.push(i)
      room = budget
      inRun = 0
    }
    room -= h
    inRun += 1
  })
  return cuts
}
