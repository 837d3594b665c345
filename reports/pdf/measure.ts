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
import { SANS } from './fonts'
import { BODY_BOTTOM, BODY_SIZE, BODY_TOP, LINE, PAGE_SIZE, contentWidth } from './styles'
import type { Paper } from '../types'

/** Layout constants of PdfStepBox, shared so the box and its estimate cannot drift apart. */
export const STEP = {
  numberWidth: 19,
  /** Right-hand margin column: the step's value, its criterion and verdict. */
  valueWidth: 84,
  /** The narrow checker column at the far right (tick, initials, remark number; stamped by finishPdf). */
  checkWidth: 24,
  gap: 6,
  padY: 2.2,
  marginBottom: 2,
  titleSize: 8.3,
  mathSize: 8.3,
  lineGap: 1.6,
  valueSize: 8.4,
  glyph: 6.4,
  refSize: 6.3,
  noteSize: 6.6,
  criterionSize: 6.8,
  tight: 1.28,
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

export interface StepLayout {
  /** Each formula as the lines it is set in, with its font size (shrunk to no less than 80 %, then split). */
  formula: MathLine[]
  substituted: MathLine[]
  /** The small line under the working: reference, where inputs come from, the step id. */
  refLine: string
}

export interface MathLine {
  tex: string
  size: number
}

function mathWidth(tex: string | undefined, size: number): number {
  return tex ? texToShape(tex, true).width * size : 0
}

function mathHeight(tex: string | undefined, size: number): number {
  if (!tex) return 0
  const m = texToShape(tex, true)
  return (m.ascent + m.descent) * size
}

/** Splits TeX at its top-level separators (`;\quad`, `,\;`, …), keeping each separator on the part before. */
function topLevelParts(tex: string): string[] {
  const parts: string[] = []
  let depth = 0
  let start = 0
  const sep = /^(;|,)\\(quad|;|\s)\s*/
  for (let i = 0; i < tex.length; i++) {
    const ch = tex[i]
    if (ch === '{') depth++
    else if (ch === '}') depth--
    else if (depth === 0 && (ch === ';' || ch === ',')) {
      const m = sep.exec(tex.slice(i))
      if (m) {
        parts.push(tex.slice(start, i + 1))
        start = i + m[0].length
        i = start - 1
      }
    }
  }
  parts.push(tex.slice(start))
  return parts.map((p) => p.trim()).filter(Boolean)
}

/** A formula set in the column: one line when it fits (shrunk at most to 80 %), else split at its separators. */
export function mathLines(tex: string | undefined, room: number): MathLine[] {
  if (!tex) return []
  const w = mathWidth(tex, STEP.mathSize)
  if (w <= room) return [{ tex, size: STEP.mathSize }]
  if (w * 0.8 <= room) return [{ tex, size: (room / w) * STEP.mathSize }]
  const parts = topLevelParts(tex)
  if (parts.length < 2) return [{ tex, size: Math.max(0.6, room / w) * STEP.mathSize }]
  const lines: string[] = []
  let cur = ''
  for (const p of parts) {
    const next = cur ? `${cur}\\; ${p}` : p
    if (cur && mathWidth(next, STEP.mathSize) > room) {
      lines.push(cur)
      cur = p
    } else cur = next
  }
  if (cur) lines.push(cur)
  return lines.map((l) => {
    const lw = mathWidth(l, STEP.mathSize)
    return { tex: l, size: lw > room ? Math.max(0.6, room / lw) * STEP.mathSize : STEP.mathSize }
  })
}

/** Width of the body column (between the number and the value column). */
export function bodyWidth(paper: Paper): number {
  return contentWidth(paper) - STEP.numberWidth - STEP.valueWidth - STEP.checkWidth - 2 * STEP.gap
}

export function refLineOf(v: StepView): string {
  return [v.source ? `per ${v.source}` : '', v.from ? `from ${v.from}` : '', v.id].filter(Boolean).join('  ·  ')
}

/** Decisions PdfStepBox and stepHeight share, so the estimate sees the box that is drawn. */
export function stepLayout(v: StepView, paper: Paper): StepLayout {
  const room = bodyWidth(paper)
  return { formula: mathLines(v.formula, room), substituted: mathLines(v.substituted, room), refLine: refLineOf(v) }
}

export function stepHeight(v: StepView, paper: Paper): number {
  const room = bodyWidth(paper)
  const layout = stepLayout(v, paper)
  let h = lineCount([{ text: v.title, size: STEP.titleSize, face: { family: SANS, bold: true } }], room) * STEP.titleSize * STEP.tight
  for (const l of [...layout.formula, ...layout.substituted]) h += STEP.lineGap + mathHeight(l.tex, l.size)
  h += STEP.lineGap + lineCount([{ text: layout.refLine, size: STEP.refSize, face: { family: SANS } }], room) * STEP.refSize * STEP.tight
  if (v.note) h += lineCount([{ text: v.note, size: STEP.noteSize, face: { family: SANS, italic: true } }], room) * STEP.noteSize * STEP.tight
  let side = lineCount([{ text: v.result || '—', size: STEP.valueSize, face: { family: SANS, bold: true } }], STEP.valueWidth - (v.utilisation !== undefined ? STEP.glyph + 3 : 0)) * STEP.valueSize * STEP.tight
  if (v.criterion) side += STEP.lineGap + mathHeight(v.criterion, STEP.criterionSize)
  if (v.verdictLabel) side += STEP.refSize * STEP.tight + 1
  return Math.max(h, side) + 2 * STEP.padY + STEP.marginBottom + 0.4
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
