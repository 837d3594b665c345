/**
 * The last pass over the PDF, with pdf-lib, and the only one a signature needs: the body that
 * react-pdf rendered once, when the revision was saved, is stamped with what sign-off changes —
 * the state in the title block, the names and dates in the sign-off strip, the watermark, page
 * numbers — and gets the sign-off record (signatures, issue block, ticks, remarks) and the
 * appendices at its end. Stamping takes a fraction of a second, so check, approve and issue never
 * render the package again. Fonts are the shipped Noto TTFs, embedded as subsets; dates come from
 * `generatedAt` and nothing random is written, so the same body and package give the same bytes.
 */
import { readFile } from 'node:fs/promises'
import path from 'node:path'
import fontkit from '@pdf-lib/fontkit'
import { PDFDocument, degrees, rgb, type PDFFont, type PDFPage } from 'pdf-lib'
import { STATE_LABEL, formatDate, watermarkFor } from '../model/format'
import type { Attachment, RenderOptions, ReportPackage } from '../types'
import { FOOTER, HEADER_TOP, MARGIN_X, PAGE_SIZE, SIGN_OFF_ROLES, TITLE_CELL_AT, contentWidth } from './styles'

export async function countPages(attachments: Attachment[]): Promise<number[]> {
  return Promise.all(attachments.map(async (a) => (await PDFDocument.load(a.bytes, { updateMetadata: false })).getPageCount()))
}

const hex = (h: string) => rgb(parseInt(h.slice(1, 3), 16) / 255, parseInt(h.slice(3, 5), 16) / 255, parseInt(h.slice(5, 7), 16) / 255)
const INK = hex('#1d2a33')
const MUTED = hex('#6b7780')
const FAIL = hex('#b03a2e')
const ACCENT = hex('#2f6f8f')
const PASS = hex('#3d7a57')

const fontBytes = new Map<string, Promise<Uint8Array>>()
function font(opts: RenderOptions, file: string) {
  const full = path.join(opts.fontsDir ?? path.join(opts.rootDir ?? process.cwd(), 'fonts'), file)
  if (!fontBytes.has(full)) fontBytes.set(full, readFile(/*turbopackIgnore: true*/ full).then((b) => new Uint8Array(b)))
  return fontBytes.get(full)!
}

interface Fonts {
  regular: PDFFont
  bold: PDFFont
  mono: PDFFont
}

/** Text the Noto subset can encode; anything else becomes '?' rather than failing the stamp. */
function safe(f: PDFFont, text: string): string {
  const set = new Set(f.getCharacterSet())
  return [...text].map((c) => (set.has(c.codePointAt(0)!) ? c : '?')).join('')
}

/** Simple flowing text for the record pages: wraps at `width`, starts a new page when one fills. */
class Writer {
  y = 0
  page!: PDFPage
  constructor(
    private doc: PDFDocument,
    private fonts: Fonts,
    private pkg: ReportPackage,
    private onPage: (p: PDFPage) => void,
  ) {
    this.newPage()
  }
  newPage() {
    const [w, h] = PAGE_SIZE[this.pkg.paper]
    this.page = this.doc.addPage([w, h])
    this.onPage(this.page)
    this.y = h - 96
  }
  text(s: string, o: { size?: number; bold?: boolean; mono?: boolean; color?: ReturnType<typeof rgb>; indent?: number; gap?: number } = {}) {
    const size = o.size ?? 8.6
    const f = o.mono ? this.fonts.mono : o.bold ? this.fonts.bold : this.fonts.regular
    const width = contentWidth(this.pkg.paper) - (o.indent ?? 0)
    const words = safe(f, s).split(/\s+/)
    let line = ''
    const lines: string[] = []
    for (const word of words) {
      const next = line ? `${line} ${word}` : word
      if (f.widthOfTextAtSize(next, size) > width && line) {
        lines.push(line)
        line = word
      } else line = next
    }
    if (line) lines.push(line)
    for (const l of lines) {
      if (this.y < 70) this.newPage()
      this.page.drawText(l, { x: MARGIN_X + (o.indent ?? 0), y: this.y, size, font: f, color: o.color ?? INK })
      this.y -= size * 1.4
    }
    this.y -= o.gap ?? 2
  }
  rule() {
    this.page.drawLine({ start: { x: MARGIN_X, y: this.y + 6 }, end: { x: PAGE_SIZE[this.pkg.paper][0] - MARGIN_X, y: this.y + 6 }, thickness: 0.6, color: MUTED })
    this.y -= 6
  }
}

/** The sheet frame react-pdf draws on body pages, drawn again on the record pages (same geometry as frame.tsx). */
function drawFrame(page: PDFPage, pkg: ReportPackage, f: Fonts) {
  const { width, height } = page.getSize()
  const cw = contentWidth(pkg.paper)
  const top = height - HEADER_TOP
  const rule = hex('#c9d2d8')
  page.drawRectangle({ x: MARGIN_X, y: top - 46, width: cw, height: 46, borderColor: INK, borderWidth: 0.8 })
  page.drawLine({ start: { x: MARGIN_X, y: top - 22.4 }, end: { x: MARGIN_X + cw, y: top - 22.4 }, thickness: 0.6, color: rule })
  const cell = (k: string, v: string, from: number, to: number, y0: number) => {
    page.drawText(k.toUpperCase(), { x: MARGIN_X + cw * from + 5, y: y0 - 7.5, size: 5.6, font: f.regular, color: MUTED })
    if (v) page.drawText(safe(f.bold, v), { x: MARGIN_X + cw * from + 5, y: y0 - 18.4, size: 7.4, font: f.bold, color: INK, maxWidth: cw * (to - from) - 8 })
    if (to < 1) page.drawLine({ start: { x: MARGIN_X + cw * to, y: y0 }, end: { x: MARGIN_X + cw * to, y: y0 - 22.4 }, thickness: 0.6, color: rule })
  }
  const t = TITLE_CELL_AT
  cell('Project', `${pkg.project.code} · ${pkg.project.name}`, 0, t.calc, top)
  cell('Calculation', pkg.calc.number, t.calc, t.rev, top)
  cell('Rev', pkg.revision.label, t.rev, t.state, top)
  cell('State', '', t.state, t.page, top)
  cell('Page', '', t.page, 1, top)
  cell('Client', pkg.project.client, 0, t.title, top - 22.4)
  cell('Title', pkg.calc.title, t.title, 1, top - 22.4)
  const fy = FOOTER.bottom + FOOTER.height
  page.drawLine({ start: { x: MARGIN_X, y: fy }, end: { x: width - MARGIN_X, y: fy }, thickness: 0.8, color: INK })
  SIGN_OFF_ROLES.forEach((role, k) => page.drawText(role.toUpperCase(), { x: MARGIN_X + (k * cw) / (SIGN_OFF_ROLES.length + 1), y: fy - 9.5, size: 5.6, font: f.regular, color: MUTED }))
}

/** The sign-off record: every signature with its statement, the issue block, ticks, remarks and confirmed material values. */
function writeRecord(w: Writer, pkg: ReportPackage) {
  const so = pkg.signOff
  w.text('Sign-off record', { size: 14, bold: true, color: ACCENT, gap: 6 })
  if (so?.issue) {
    w.text('Issue', { size: 10.5, bold: true })
    w.text(`Issued ${so.issue.date} by ${so.issue.approver} as revision ${pkg.revision.label}.`)
    w.text(`Content SHA-256 (inputs and results of this revision): ${so.issue.contentHash}`, { mono: true, size: 7.6 })
    w.text(`Verification code: ${so.issue.code} — anyone can check this package and whether it is still current on the server's public verification page.`, { bold: true, gap: 8 })
  }
  const r = pkg.revision
  w.text(`Revision ${r.label}: ${STATE_LABEL[r.state]}`, { size: 10.5, bold: true })
  for (const [role, sg] of [['Prepared by', r.engineer], ['Checked by', r.checker], ['Approved by', r.approver]] as const) {
    w.text(`${role}: ${sg.name}${sg.date ? `, ${formatDate(sg.date)}` : sg.name === '—' ? '' : ' (not signed)'}`)
  }
  w.rule()
  w.text('History of this revision', { size: 10.5, bold: true })
  const events = so?.events ?? []
  if (events.length === 0) w.text('None yet.', { color: MUTED })
  for (const e of events) {
    w.text(`${e.at.slice(0, 16).replace('T', ' ')} UTC — ${e.by}: ${e.what}${e.reason ? ` (${e.reason})` : ''}`)
    if (e.signature) w.text(`Ed25519 signature of the server over the statement: ${e.signature}`, { mono: true, size: 6.4, indent: 12, color: MUTED })
  }
  w.rule()
  w.text('Revisions of this calc', { size: 10.5, bold: true })
  for (const h of pkg.history) w.text(`Rev ${h.label} — ${STATE_LABEL[h.state]} — ${formatDate(h.date)}${h.note ? ` — ${h.note}` : ''}`)
  w.rule()
  w.text('Steps ticked as verified by the checker', { size: 10.5, bold: true })
  const ticks = so?.ticks ?? []
  if (ticks.length === 0) w.text('No step was ticked.', { color: MUTED })
  else w.text(ticks.map((t) => `${t.number ?? t.stepId} (${t.by}, ${t.date})`).join(' · '), { gap: 6 })
  w.rule()
  w.text('Remarks', { size: 10.5, bold: true })
  if (pkg.remarks.length === 0) w.text('No remarks.', { color: MUTED })
  for (const r of pkg.remarks) {
    w.text(`${r.stepId ? `At ${r.stepNumber ? `step ${r.stepNumber} (${r.stepId})` : r.stepId}` : 'Whole calc'} — ${r.status.toUpperCase()} — ${r.author}, ${r.date}`, { bold: true, size: 8 })
    w.text(r.text, { indent: 12, gap: 4 })
  }
  if (so?.confirmations.length) {
    w.rule()
    w.text('Material values confirmed against their standards before issue', { size: 10.5, bold: true })
    for (const c of so.confirmations) w.text(`${c.value} — confirmed by ${c.by}, ${c.date}`)
  }
}

interface Outline {
  /** SVG path of the text, 1 unit = 1/1000 em, y down, baseline at 0. */
  d: string
  /** Advance width, 1/1000 em. */
  width: number
}

const outlines = new Map<string, Outline>()

/**
 * The watermark is drawn as outlines, not text: it must not end up in the text a reader copies or
 * searches (a step's result would read "1 5 4 C H 9 …").
 */
function outlineOf(fontData: Uint8Array, text: string): Outline {
  const key = text
  const hit = outlines.get(key)
  if (hit) return hit
  const face = fontkit.create(fontData as Buffer)
  const run = face.layout(text)
  const k = 1000 / face.unitsPerEm
  let x = 0
  const parts: string[] = []
  run.glyphs.forEach((g, i) => {
    // fontkit's Path has scale/translate at run time; its typings leave them out.
    const path = g.path as unknown as { scale(sx: number, sy: number): { translate(dx: number, dy: number): { toSVG(): string } } }
    parts.push(path.scale(k, -k).translate(x, 0).toSVG())
    x += run.positions[i].xAdvance * k
  })
  const out = { d: parts.join(' '), width: x }
  outlines.set(key, out)
  return out
}

function drawWatermark(page: PDFPage, text: string, fontData: Uint8Array) {
  const { width, height } = page.getSize()
  const size = text.length > 9 ? 52 : text.length > 6 ? 84 : 120
  const o = outlineOf(fontData, text)
  const w = (o.width * size) / 1000
  const a = (40 * Math.PI) / 180
  // Rising at 40°, its middle on the page's centre.
  const x = width / 2 - (w / 2) * Math.cos(a) + (size / 3) * Math.sin(a)
  const y = height / 2 - (w / 2) * Math.sin(a) - (size / 3) * Math.cos(a)
  page.drawSvgPath(o.d, { x, y, scale: size / 1000, color: FAIL, opacity: 0.13, borderWidth: 0, rotate: degrees(40) })
}

/**
 * Stamps `body` (react-pdf's output for this revision) for the state and signatures in `pkg`,
 * appends the sign-off record and the appendices. The result is the package as handed out.
 */
export async function finishPdf(body: Uint8Array, pkg: ReportPackage, opts: RenderOptions = {}): Promise<Uint8Array> {
  const date = new Date(pkg.generatedAt)
  const out = await PDFDocument.load(body, { updateMetadata: false })
  out.registerFontkit(fontkit)
  const boldData = await font(opts, 'NotoSans-Bold.ttf')
  const [regular, bold, mono] = await Promise.all([
    font(opts, 'NotoSans-Regular.ttf').then((b) => out.embedFont(b, { subset: true })),
    out.embedFont(boldData, { subset: true }),
    font(opts, 'NotoSansMono-Regular.ttf').then((b) => out.embedFont(b, { subset: true })),
  ])
  const fonts = { regular, bold, mono }
  const bodyPages = out.getPages()
  const recordPages: PDFPage[] = []
  if (pkg.signOff) {
    const w = new Writer(out, fonts, pkg, (p) => {
      drawFrame(p, pkg, fonts)
      recordPages.push(p)
    })
    writeRecord(w, pkg)
  }
  const sources = await Promise.all(pkg.attachments.map((a) => PDFDocument.load(a.bytes, { updateMetadata: false })))
  const total = bodyPages.length + recordPages.length + sources.reduce((n, d) => n + d.getPageCount(), 0)

  const cw = contentWidth(pkg.paper)
  const mark = watermarkFor(pkg.revision.state)
  const r = pkg.revision
  const signers = [r.engineer, r.checker, r.approver]
  const state = safe(bold, STATE_LABEL[r.state])
  const stateColour = r.state === 'issued' ? PASS : ['returned', 'voided', 'withdrawn', 'superseded'].includes(r.state) ? FAIL : INK
  ;[...bodyPages, ...recordPages].forEach((page, i) => {
    const { height } = page.getSize()
    const top = height - HEADER_TOP - TITLE_CELL_AT.baseline
    page.drawText(`${i + 1} of ${total}`, { x: MARGIN_X + cw * TITLE_CELL_AT.page + 4, y: top, size: 7.2, font: bold, color: INK })
    page.drawText(state, { x: MARGIN_X + cw * TITLE_CELL_AT.state + 4, y: top, size: 7.2, font: bold, color: stateColour })
    const colW = cw / (SIGN_OFF_ROLES.length + 1)
    signers.forEach((sg, k) => {
      const text = sg.date ? `${sg.name} · ${formatDate(sg.date)}` : sg.name === '—' ? '—' : `${sg.name} · not signed`
      page.drawText(safe(regular, text), { x: MARGIN_X + k * colW, y: FOOTER.bottom + FOOTER.height - 17.5, size: 7, font: regular, color: INK, maxWidth: colW - 4 })
    })
    if (pkg.signOff?.issue) page.drawText(`Issued · code ${pkg.signOff.issue.code}`, { x: MARGIN_X, y: FOOTER.bottom - 9, size: 6.4, font: mono, color: MUTED })
    if (mark) drawWatermark(page, mark, boldData)
  })

  let pageNo = bodyPages.length + recordPages.length
  for (const [i, src] of sources.entries()) {
    const pages = await out.copyPages(src, src.getPageIndices())
    for (const page of pages) {
      out.addPage(page)
      pageNo += 1
      const stamp = `${pkg.calc.number} rev ${r.label} - Appendix ${String.fromCharCode(65 + i)}: ${pkg.attachments[i].name} - page ${pageNo} of ${total}`
      page.drawText(safe(regular, stamp), { x: 24, y: 12, size: 7, font: regular, color: MUTED, maxWidth: page.getSize().width - 48 })
    }
  }
  out.setCreationDate(date)
  out.setModificationDate(date)
  return out.save({ useObjectStreams: false })
}
