/**
 * Registers the shipped Noto TTFs with react-pdf once per fonts folder. TTF,
 * not WOFF: fontkit parses TTF markedly faster. The PDF faces are subsets
 * (`*.pdf.ttf`, fonts/SUBSETS.md): the scripts a package prints and only the
 * layout features a Latin/Greek text run uses (kern, liga, tnum, lnum), which
 * halves fontkit's shaping time. Hyphenation is switched off so words never
 * split unpredictably across lines.
 */
import { createRequire } from 'node:module'
import { dirname, join } from 'node:path'
import { Font } from '@react-pdf/renderer'
import type { RenderOptions } from '../types'

export const SANS = 'Noto Sans'
export const MONO = 'Noto Sans Mono'
/** Glyph runs inside formulas (see math-text.ts): KaTeX's copies of the TeX faces, shipped with katex. */
export const MATH_MAIN = 'KaTeX Main'
export const MATH_ITALIC = 'KaTeX Math Italic'
/** The text stack: Sans, with Mono filling in the symbols the Sans subset lacks. */
export const TEXT_STACK = [SANS, MONO]

let registered: string | null = null
let prepared: Promise<void> | null = null

const VARIANTS = [
  { fontFamily: SANS, fontWeight: 400, fontStyle: 'normal' },
  { fontFamily: SANS, fontWeight: 700, fontStyle: 'normal' },
  { fontFamily: SANS, fontWeight: 400, fontStyle: 'italic' },
  { fontFamily: SANS, fontWeight: 700, fontStyle: 'italic' },
  { fontFamily: MONO, fontWeight: 400, fontStyle: 'normal' },
  { fontFamily: MONO, fontWeight: 700, fontStyle: 'normal' },
  { fontFamily: MONO, fontWeight: 400, fontStyle: 'italic' },
  { fontFamily: MONO, fontWeight: 700, fontStyle: 'italic' },
  { fontFamily: MATH_MAIN, fontWeight: 400, fontStyle: 'normal' },
  { fontFamily: MATH_ITALIC, fontWeight: 400, fontStyle: 'normal' },
] as const

/** Resolved from wherever `katex` is installed, so the bundled module finds it too. */
function katexFont(file: string, opts: RenderOptions): string {
  const req = createRequire(join(opts.rootDir ?? process.cwd(), 'package.json'))
  return join(dirname(req.resolve('katex/package.json')), 'dist', 'fonts', file)
}

export function fontsDir(opts: RenderOptions = {}): string {
  return opts.fontsDir ?? join(opts.rootDir ?? process.cwd(), 'fonts')
}

/** The PDF subset of a shipped face: `NotoSans-Regular.ttf` → `NotoSans-Regular.pdf.ttf`. */
export function pdfFace(file: string): string {
  return file.replace(/\.ttf$/, '.pdf.ttf')
}

export function registerFonts(opts: RenderOptions = {}): void {
  const dir = fontsDir(opts)
  if (registered === dir) return
  const f = (file: string) => join(dir, pdfFace(file))
  Font.register({
    family: SANS,
    fonts: [
      { src: f('NotoSans-Regular.ttf'), fontWeight: 400, fontStyle: 'normal' },
      { src: f('NotoSans-Bold.ttf'), fontWeight: 700, fontStyle: 'normal' },
      { src: f('NotoSans-Italic.ttf'), fontWeight: 400, fontStyle: 'italic' },
      { src: f('NotoSans-BoldItalic.ttf'), fontWeight: 700, fontStyle: 'italic' },
    ],
  })
  // Mono doubles as the fallback for glyphs the Sans lacks (−, ≤, ≥, √, …), so it
  // needs every style the Sans uses; its upright faces stand in for italics.
  Font.register({
    family: MONO,
    fonts: [
      { src: f('NotoSansMono-Regular.ttf'), fontWeight: 400, fontStyle: 'normal' },
      { src: f('NotoSansMono-Bold.ttf'), fontWeight: 700, fontStyle: 'normal' },
      { src: f('NotoSansMono-Regular.ttf'), fontWeight: 400, fontStyle: 'italic' },
      { src: f('NotoSansMono-Bold.ttf'), fontWeight: 700, fontStyle: 'italic' },
    ],
  })
  // The italic face is registered as its own upright family: formulas pick faces by glyph, not by style.
  Font.register({ family: MATH_MAIN, src: katexFont('KaTeX_Main-Regular.ttf', opts), fontWeight: 400, fontStyle: 'normal' })
  Font.register({ family: MATH_ITALIC, src: katexFont('KaTeX_Math-Italic.ttf', opts), fontWeight: 400, fontStyle: 'normal' })
  // textkit falls back to Helvetica for a character no face of the stack has (a line break inside
  // a Text, for one); the name is mapped to the shipped Noto faces so that every font is embedded.
  Font.register({
    family: 'Helvetica',
    fonts: [
      { src: f('NotoSans-Regular.ttf'), fontWeight: 400, fontStyle: 'normal' },
      { src: f('NotoSans-Bold.ttf'), fontWeight: 700, fontStyle: 'normal' },
      { src: f('NotoSans-Italic.ttf'), fontWeight: 400, fontStyle: 'italic' },
      { src: f('NotoSans-BoldItalic.ttf'), fontWeight: 700, fontStyle: 'italic' },
    ],
  })
  Font.registerHyphenationCallback((word) => [word])
  registered = dir
  prepared = null
}

type Layout = (text: string, features?: unknown, ...rest: unknown[]) => unknown

/**
 * Loads every variant and memoises fontkit's `layout` per (text, features).
 * Shaping with Noto's GSUB/GPOS tables was the largest single cost of a
 * render, and a report repeats the same labels, units and numbers on every
 * page. Safe because textkit copies the positions it scales and only reads
 * the glyph run.
 */
export function prepareFonts(opts: RenderOptions = {}): Promise<void> {
  registerFonts(opts)
  prepared ??= (async () => {
    for (const v of VARIANTS) {
      await Font.load(v)
      const data = Font.getFont(v)?.data as unknown as { layout: Layout; __memo?: boolean } | null
      if (!data || data.__memo) continue
      const original = data.layout.bind(data)
      const memo = new Map<string, unknown>()
      data.layout = (text, features, ...rest) => {
        if (typeof text !== 'string' || rest.some((r) => r !== undefined && r !== 'ltr')) return original(text, features, ...rest)
        // No features and an empty list shape alike (measure.ts passes none, textkit passes []).
        const key = features == null || (Array.isArray(features) && features.length === 0) ? text : `${JSON.stringify(features)}\u0000${text}`
        let run = memo.get(key)
        if (run === undefined) {
          if (memo.size > 50_000) memo.clear()
          run = original(text, features, ...rest)
          memo.set(key, run)
        }
        return run
      }
      data.__memo = true
    }
  })()
  return prepared
}
