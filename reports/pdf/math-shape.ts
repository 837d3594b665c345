/**
 * TeX → vector outline for the PDF. MathJax (SVG output, no font cache) draws
 * each glyph as a path; the tree is flattened into one path string so
 * react-pdf draws a formula as a single shape. Results are cached by TeX.
 */
import { mathjax } from 'mathjax-full/js/mathjax.js'
import { TeX } from 'mathjax-full/js/input/tex.js'
import { SVG } from 'mathjax-full/js/output/svg.js'
import { liteAdaptor, type LiteAdaptor } from 'mathjax-full/js/adaptors/liteAdaptor.js'
import { RegisterHTMLHandler } from 'mathjax-full/js/handlers/html.js'
import { AllPackages } from 'mathjax-full/js/input/tex/AllPackages.js'
import type { LiteElement, LiteNode } from 'mathjax-full/js/adaptors/lite/Element.js'
import { type Affine, multiply, parseTransform, rectPath, transformPath } from './affine'

/**
 * Outline coordinates are written in units of GRID/1000 em: 1/200 em is
 * 0.05 pt at 10 pt, far below what paper or a zoomed screen shows, and it
 * saves digits and lets MathJax's many tiny segments collapse away.
 */
const GRID = 5

export interface MathShape {
  /** viewBox in outline units (200 = 1 em). */
  viewBox: [number, number, number, number]
  /** Sizes in em. */
  width: number
  ascent: number
  descent: number
  d: string
  /** Numbers set as text (see `asNumber`), in outline units, baseline-left origin. */
  numbers: MathNumber[]
}

export interface MathNumber {
  x: number
  y: number
  size: number
  text: string
}

interface Sink {
  d: string[]
  numbers: MathNumber[]
}

type Doc = ReturnType<typeof mathjax.document>
let state: { adaptor: LiteAdaptor; doc: Doc } | null = null

function engine() {
  if (!state) {
    const adaptor = liteAdaptor()
    RegisterHTMLHandler(adaptor)
    const doc = mathjax.document('', {
      InputJax: new TeX({ packages: AllPackages.filter((p) => p !== 'bussproofs') }),
      OutputJax: new SVG({ fontCache: 'none' }),
    })
    state = { adaptor, doc }
  }
  return state
}

const cache = new Map<string, MathShape>()

export function texToShape(tex: string, display: boolean): MathShape {
  // Equation numbers are drawn by the layout, never by MathJax.
  const clean = tex.replace(/\\tag\*?\{[^}]*\}/g, '')
  const key = `${display ? 'D' : 'I'}${clean}`
  const hit = cache.get(key)
  if (hit) return hit
  const { adaptor, doc } = engine()
  const container = doc.convert(clean, { display }) as LiteElement
  const svg = adaptor.firstChild(container) as LiteElement
  const vb = (adaptor.getAttribute(svg, 'viewBox') ?? '0 0 0 0').split(/\s+/).map(Number) as [number, number, number, number]
  const sink: Sink = { d: [], numbers: [] }
  const toGrid: Affine = [1 / GRID, 0, 0, 1 / GRID, 0, 0]
  for (const child of adaptor.childNodes(svg)) collect(adaptor, child, toGrid, sink)
  const shape: MathShape = {
    viewBox: vb.map((v) => v / GRID) as MathShape['viewBox'],
    width: vb[2] / 1000,
    ascent: -vb[1] / 1000,
    descent: (vb[3] + vb[1]) / 1000,
    d: sink.d.join(''),
    numbers: sink.numbers,
  }
  cache.set(key, shape)
  return shape
}

/** Upright digits and the decimal point, as MathJax tags them (data-c is the code point in hex). */
const NUMBER_GLYPH = /^(3[0-9]|2E)$/

/**
 * A number (`mn`) of plain digits comes back as text instead of outlines. The
 * substituted values of real steps are mostly numbers, and outlines cost about
 * 4 kB a digit; as text they cost a few bytes, and a reader can search and copy
 * them. KaTeX_Main has MathJax's digit shapes and advances (0.5 em, point
 * 0.278 em), so the run lands where the outlines would have been.
 */
function asNumber(adaptor: LiteAdaptor, el: LiteElement, m: Affine): MathNumber | null {
  if (adaptor.getAttribute(el, 'data-mml-node') !== 'mn' || m[1] !== 0 || m[2] !== 0 || Math.abs(m[0] + m[3]) > 1e-9) return null
  let text = ''
  for (const child of adaptor.childNodes(el)) {
    if (adaptor.kind(child) !== 'path') return null
    const c = adaptor.getAttribute(child as LiteElement, 'data-c') ?? ''
    if (!NUMBER_GLYPH.test(c)) return null
    text += String.fromCharCode(parseInt(c, 16))
  }
  if (!text) return null
  // The root flips y, so m[3] is negative: the text itself is drawn upright at the baseline.
  return { x: m[4], y: m[5], size: 1000 * m[0], text }
}

function collect(adaptor: LiteAdaptor, node: LiteNode, m: Affine, sink: Sink): void {
  if (adaptor.kind(node) === '#text' || adaptor.kind(node) === '#comment') return
  const el = node as LiteElement
  const kind = adaptor.kind(el)
  const num = (name: string) => Number(adaptor.getAttribute(el, name) ?? 0)
  let here = multiply(m, parseTransform(adaptor.getAttribute(el, 'transform')))
  const number = kind === 'g' ? asNumber(adaptor, el, here) : null
  if (number) {
    sink.numbers.push(number)
    return
  }
  const out = sink.d
  if (kind === 'svg') {
    // Nested svg (e.g. stretchy delimiters): position, then map its viewBox to its size.
    const vb = (adaptor.getAttribute(el, 'viewBox') ?? '').split(/\s+/).map(Number)
    here = multiply(m, [1, 0, 0, 1, num('x'), num('y')])
    if (vb.length === 4 && vb[2] && vb[3]) {
      const w = parseFloat(adaptor.getAttribute(el, 'width') ?? '') || vb[2]
      const h = parseFloat(adaptor.getAttribute(el, 'height') ?? '') || vb[3]
      here = multiply(here, [w / vb[2], 0, 0, h / vb[3], -vb[0] * (w / vb[2]), -vb[1] * (h / vb[3])])
    }
  } else if (kind === 'path') {
    const d = adaptor.getAttribute(el, 'd')
    if (d) out.push(transformPath(d, here))
    return
  } else if (kind === 'rect') {
    out.push(rectPath(num('x'), num('y'), num('width'), num('height'), here))
    return
  } else if (kind === 'line') {
    // Lines come from enclosures; draw them as thin rectangles of their stroke width.
    const w = Number(adaptor.getAttribute(el, 'stroke-width') ?? 60) || 60
    const [x1, y1, x2, y2] = [num('x1'), num('y1'), num('x2'), num('y2')]
    const horizontal = Math.abs(y2 - y1) < Math.abs(x2 - x1)
    out.push(horizontal
      ? rectPath(Math.min(x1, x2), y1 - w / 2, Math.abs(x2 - x1), w, here)
      : rectPath(x1 - w / 2, Math.min(y1, y2), w, Math.abs(y2 - y1), here))
    return
  }
  for (const child of adaptor.childNodes(el)) collect(adaptor, child, here, sink)
}
