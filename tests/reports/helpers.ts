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
