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
