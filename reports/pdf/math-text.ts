/**
 * Glyph runs of a formula set as text instead of outlines. Outlines cost a
 * few kB a glyph in every PDF content stream and in every layout and render
 * pass; a real package has ~8000 of them. KaTeX's fonts (shipped with katex)
 * are the same TeX faces MathJax draws, with the same advances, so a run of
 * them lands where the outlines would have been — and numbers, variables and
 * operators become searchable text. Every run is checked before it is used:
 * each glyph's outline must have the font glyph's bounding box (so a large
 * delimiter variant never turns into a small one) and sit at the font's
 * advance from its neighbour (so kerns and corrections MathJax added stay
 * outlines). Anything that fails stays an outline.
 */
import { Font } from '@react-pdf/renderer'
import type { LiteAdaptor } from 'mathjax-full/js/adaptors/liteAdaptor.js'
import type { LiteElement } from 'mathjax-full/js/adaptors/lite/Element.js'
import type { Affine } from './affine'
import { MATH_ITALIC, MATH_MAIN } from './fonts'

export interface MathText {
  /** Baseline-left origin and size, in outline units. */
  x: number
  y: number
  size: number
  text: string
  family: string
}

interface Glyph {
  advanceWidth: number
  bbox: { minX: number; minY: number; maxX: number; maxY: number }
}
interface FontLike {
  unitsPerEm: number
  hasGlyphForCodePoint(cp: number): boolean
  glyphForCodePoint(cp: number): Glyph
}

const TEXT_NODES = new Set(['mi', 'mn', 'mo', 'mtext'])
// Outline and glyph boxes agree to a few units of the 1000-unit em when they are the same glyph.
const BOX_TOLERANCE = 12
const ADVANCE_TOLERANCE = 1

function face(family: string): FontLike | null {
  return (Font.getFont({ fontFamily: family, fontWeight: 400, fontStyle: 'normal' })?.data as unknown as FontLike | undefined) ?? null
}

/** MathJax tags italic variables with Mathematical Alphanumeric code points; KaTeX's italic face uses the plain ones. */
function mapCode(cp: number): { family: string; cp: number } {
  if (cp === 0x210e) return { family: MATH_ITALIC, cp: 0x68 }
  if (cp >= 0x1d434 && cp <= 0x1d44d) return { family: MATH_ITALIC, cp: 0x41 + cp - 0x1d434 }
  if (cp >= 0x1d44e && cp <= 0x1d467) return { family: MATH_ITALIC, cp: 0x61 + cp - 0x1d44e }
  if (cp >= 0x1d6e2 && cp <= 0x1d6fa) return { family: MATH_ITALIC, cp: 0x391 + cp - 0x1d6e2 }
  if (cp >= 0x1d6fc && cp <= 0x1d714) return { family: MATH_ITALIC, cp: 0x3b1 + cp - 0x1d6fc }
  return { family: MATH_MAIN, cp }
}

const boxes = new Map<string, [number, number, number, number]>()

/**
 * Bounding box of an outline's points (control points included, as in a TrueType glyf header).
 * MathJax writes the same path for every use of a glyph, so boxes are kept by path.
 */
function outlineBox(d: string): [number, number, number, number] {
  let box = boxes.get(d)
  if (!box) {
    box = computeBox(d)
    if (boxes.size > 20_000) boxes.clear()
    boxes.set(d, box)
  }
  return box
}

function computeBox(d: string): [number, number, number, number] {
  const box: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity]
  let cmd = ''
  let axis = 0
  for (const tok of d.match(/[A-Za-z]|-?(?:\d+\.?\d*|\.\d+)/g) ?? []) {
    if (/[A-Za-z]/.test(tok)) {
      cmd = tok
      axis = cmd === 'V' ? 1 : 0
      continue
    }
    const v = Number(tok)
    box[axis] = Math.min(box[axis], v)
    box[axis + 2] = Math.max(box[axis + 2], v)
    if (cmd !== 'H' && cmd !== 'V') axis = 1 - axis
  }
  return box
}

const glyphs = new WeakMap<FontLike, Map<number, Glyph | null>>()

/** A face's glyph for a code point (its advance and box; decoding the outline for the box is the dear part), or null. */
function glyphOf(font: FontLike, cp: number): Glyph | null {
  let byCode = glyphs.get(font)
  if (!byCode) glyphs.set(font, (byCode = new Map()))
  let g = byCode.get(cp)
  if (g === undefined) {
    if (font.unitsPerEm !== 1000 || !font.hasGlyphForCodePoint(cp)) g = null
    else {
      const glyph = font.glyphForCodePoint(cp)
      const b = glyph.bbox
      g = { advanceWidth: glyph.advanceWidth, bbox: { minX: b.minX, minY: b.minY, maxX: b.maxX, maxY: b.maxY } }
    }
    byCode.set(cp, g)
  }
  return g
}

const near = (a: number, b: number, tol: number) => Math.abs(a - b) <= tol

/** The run a `g` of glyph outlines stands for, or null when any glyph cannot be matched. */
export function asText(adaptor: LiteAdaptor, el: LiteElement, m: Affine): MathText | null {
  if (!TEXT_NODES.has(adaptor.getAttribute(el, 'data-mml-node') ?? '')) return null
  // Upright, unstretched placements only; the root flips y, so m[3] is -m[0].
  if (m[1] !== 0 || m[2] !== 0 || Math.abs(m[0] + m[3]) > 1e-9) return null
  let text = ''
  let family = ''
  let pen = 0
  for (const child of adaptor.childNodes(el)) {
    if (adaptor.kind(child) !== 'path') return null
    const path = child as LiteElement
    const code = parseInt(adaptor.getAttribute(path, 'data-c') ?? '', 16)
    if (!Number.isFinite(code)) return null
    const mapped = mapCode(code)
    if (family && mapped.family !== family) return null
    family = mapped.family
    const font = face(family)
    const glyph = font ? glyphOf(font, mapped.cp) : null
    if (!glyph) return null
    const t = (adaptor.getAttribute(path, 'transform') ?? '').match(/^translate\(([-\d.]+)(?:[ ,]+([-\d.]+))?\)$/)
    const dx = t ? Number(t[1]) : 0
    if ((t && Number(t[2] ?? 0) !== 0) || !near(dx, pen, ADVANCE_TOLERANCE)) return null
    const [x0, y0, x1, y1] = outlineBox(adaptor.getAttribute(path, 'd') ?? '')
    const b = glyph.bbox
    if (!near(x0, b.minX, BOX_TOLERANCE) || !near(y0, b.minY, BOX_TOLERANCE) || !near(x1, b.maxX, BOX_TOLERANCE) || !near(y1, b.maxY, BOX_TOLERANCE)) return null
    text += String.fromCodePoint(mapped.cp)
    pen += glyph.advanceWidth
  }
  return text ? { x: m[4], y: m[5], size: 1000 * m[0], text, family } : null
}
