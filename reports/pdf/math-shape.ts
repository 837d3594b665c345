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
// Only the packages the templates and the calc's TeX use (base, ams: \dfrac, \tfrac, \operatorname,
// bmatrix), the two that decide how a mistake shows (the TeX source, an undefined macro in red), and
// braket, which under AllPackages is what sets a bare `|` (|ΣF|) — kept so formulas keep their
// spacing. Each loaded package is one more macro table every control sequence is looked up in, and
// AllPackages costs ~0.15 s to load.
import 'mathjax-full/js/input/tex/base/BaseConfiguration.js'
import 'mathjax-full/js/input/tex/ams/AmsConfiguration.js'
import 'mathjax-full/js/input/tex/braket/BraketConfiguration.js'
import 'mathjax-full/js/input/tex/noerrors/NoErrorsConfiguration.js'
import 'mathjax-full/js/input/tex/noundefined/NoUndefinedConfiguration.js'
import type { LiteElement, LiteNode } from 'mathjax-full/js/adaptors/lite/Element.js'
import { asText, type MathText } from './math-text'
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
  /** Glyph runs set as text (see math-text.ts). */
  texts: MathText[]
}

interface Sink {
  d: string[]
  texts: MathText[]
}

const TEX_PACKAGES = ['base', 'ams', 'braket', 'noerrors', 'noundefined']

type Doc = ReturnType<typeof mathjax.document>
let state: { adaptor: LiteAdaptor; doc: Doc } | null = null

function engine() {
  if (!state) {
    const adaptor = liteAdaptor()
    RegisterHTMLHandler(adaptor)
    const doc = mathjax.document('', {
      InputJax: new TeX({ packages: TEX_PACKAGES }),
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
  const sink: Sink = { d: [], texts: [] }
  const toGrid: Affine = [1 / GRID, 0, 0, 1 / GRID, 0, 0]
  for (const child of adaptor.childNodes(svg)) collect(adaptor, child, toGrid, sink)
  const shape: MathShape = {
    viewBox: vb.map((v) => v / GRID) as MathShape['viewBox'],
    width: vb[2] / 1000,
    ascent: -vb[1] / 1000,
    descent: (vb[3] + vb[1]) / 1000,
    d: sink.d.join(''),
    texts: sink.texts,
  }
  cache.set(key, shape)
  return shape
}

function collect(adaptor: LiteAdaptor, node: LiteNode, m: Affine, sink: Sink): void {
  if (adaptor.kind(node) === '#text' || adaptor.kind(node) === '#comment') return
  const el = node as LiteElement
  const kind = adaptor.kind(el)
  const num = (name: string) => Number(adaptor.getAttribute(el, name) ?? 0)
  let here = multiply(m, parseTransform(adaptor.getAttribute(el, 'transform')))
  const text = kind === 'g' ? asText(adaptor, el, here) : null
  if (text) {
    sink.texts.push(text)
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
