import { execFileSync } from 'node:child_process'
import { PDFDocument } from 'pdf-lib'

/** pdftotext output with all runs of whitespace (including thin spaces and line breaks) collapsed. */
export function pdfText(bytes: Uint8Array): string {
  const raw = execFileSync('pdftotext', ['-layout', '-', '-'], { input: bytes, maxBuffer: 64 * 1024 * 1024 }).toString('utf8')
  return squash(raw)
}

/** Content-stream order, which keeps rotated text (the watermark) in one piece. */
export function pdfRawText(bytes: Uint8Array): string {
  return squash(execFileSync('pdftotext', ['-raw', '-', '-'], { input: bytes, maxBuffer: 64 * 1024 * 1024 }).toString('utf8'))
}

export function squash(s: string): string {
  return s.replace(/[\s\u2009\u00a0]+/g, ' ').trim()
}

export async function pageCount(bytes: Uint8Array): Promise<number> {
  return (await PDFDocument.load(bytes, { updateMetadata: false })).getPageCount()
}

/**
 * Share of the first page's pixels tinted red (the watermark's colour at its opacity), read from
 * poppler's raster: the watermark is drawn as outlines, so it is seen, not extracted as text.
 */
export function redTint(bytes: Uint8Array, page = 1): number {
  const ppm = execFileSync('pdftoppm', ['-r', '24', '-f', String(page), '-l', String(page), '-'], { input: bytes, maxBuffer: 64 * 1024 * 1024 })
  // Binary PPM: "P6\n<w> <h>\n255\n" then RGB triplets.
  const header = ppm.subarray(0, 32).toString('latin1').split(/\s+/)
  const [w, h] = [Number(header[1]), Number(header[2])]
  const start = ppm.length - w * h * 3
  let red = 0
  for (let i = start; i < ppm.length; i += 3) if (ppm[i] - ppm[i + 1] > 8 && ppm[i] - ppm[i + 2] > 8) red += 1
  return red / (w * h)
}

/**
 * Share of dark pixels inside the box of each word of a page that pdftotext finds at or below
 * `fromY` (pt from the top): whether the glyphs a word's text stands for are drawn at all, which the
 * text layer cannot tell (a face missing the glyphs still extracts its text).
 */
export function inkOfWords(bytes: Uint8Array, page: number, fromY: number): { word: string; ink: number }[] {
  const xml = execFileSync('pdftotext', ['-bbox', '-f', String(page), '-l', String(page), '-', '-'], { input: bytes, maxBuffer: 64 * 1024 * 1024 }).toString('utf8')
  const dpi = 150
  const k = dpi / 72
  const out: { word: string; ink: number }[] = []
  for (const m of xml.matchAll(/<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/g)) {
    const [x0, y0, x1, y1] = m.slice(1, 5).map(Number)
    if (y0 < fromY) continue
    const args = ['-r', String(dpi), '-gray', '-f', String(page), '-l', String(page), '-x', String(Math.floor(x0 * k)), '-y', String(Math.floor(y0 * k)), '-W', String(Math.max(1, Math.ceil((x1 - x0) * k))), '-H', String(Math.max(1, Math.ceil((y1 - y0) * k))), '-']
    const pgm = execFileSync('pdftoppm', args, { input: bytes, maxBuffer: 16 * 1024 * 1024 })
    // Binary PGM: "P5\n<w> <h>\n255\n" then one byte per pixel.
    const header = pgm.subarray(0, 32).toString('latin1').split(/\s+/)
    const n = Number(header[1]) * Number(header[2])
    let dark = 0
    for (let i = pgm.length - n; i < pgm.length; i++) if (pgm[i] < 128) dark += 1
    out.push({ word: m[5], ink: dark / n })
  }
  return out
}
