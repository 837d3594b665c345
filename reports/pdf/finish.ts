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
import { PDFArray, PDFDict, PDFDocument, PDFHexString, PDFName, PDFNumber, PDFRef, PDFString, degrees, rgb, type PDFFont, type PDFPage } from 'pdf-lib'
import { attachmentLetter } from '../model/back-matter'
import { STATE_LABEL, formatDate, watermarkFor } from '../model/format'
import type { Attachment, RenderOptions, ReportPackage } from '../types'
import { titleCellText } from './frame'
import { STEP } from './measure'
import { BODY_BOTTOM, BODY_TOP, C, HEAD_RULE, MARGIN_X, OUTER_MARK, PAGE_SIZE, SIGN_OFF_CELLS, SIGN_OFF_ROLES, TITLE_BLOCK, TITLE_BLOCK_HEIGHT, contentWidth, titleCellAt, type TitleCellId } from './styles'

export async function countPages(attachments: Attachment[]): Promise<number[]> {
  return Promise.all(attachments.map(async (a) => (await PDFDocument.load(a.bytes, { updateMetadata: false })).getPageCount()))
}

const hex = (h: string) => rgb(parseInt(h.slice(1, 3), 16) / 255, parseInt(h.slice(3, 5), 16) / 255, parseInt(h.slice(5, 7), 16) / 255)
const INK = hex(C.ink)
const MUTED = hex(C.muted)
const RULE = hex(C.rule)
const ACCENT = hex(C.accent)

const fontBytes = new Map<string, Promise<Uint8Array>>()
/**
 * The full face, not the react-pdf subset (fonts/*.pdf.ttf): pdf-lib's subsetter drew the subset's
 * glyphs blank ("In check" stamped as "c  ck"); the shaping memo below keeps the full face cheap.
 */
function font(opts: RenderOptions, file: string) {
  const full = path.join(opts.fontsDir ?? path.join(opts.rootDir ?? process.cwd(), 'fonts'), file)
  if (!fontBytes.has(full)) fontBytes.set(full, readFile(/*turbopackIgnore: true*/ full).then((b) => new Uint8Array(b)))
  return fontBytes.get(full)!
}

interface Fonts {
  regular: PDFFont
  bold: PDFFont
  italic: PDFFont
  mono: PDFFont
}

type GlyphRun = unknown
type Layout = (text: string, features?: unknown) => GlyphRun
const runs = new WeakMap<Uint8Array, Map<string, GlyphRun>>()

/**
 * Embeds a face and memoises its shaping per text, across packages: pdf-lib shapes every string it
 * measures or draws (each title-block cell on every page) and would parse and shape the face anew
 * for each package. A run is only read (glyph ids, advances, code points), so one run serves every
 * document that embeds the same bytes.
 */
async function embed(doc: PDFDocument, data: Uint8Array): Promise<PDFFont> {
  const f = await doc.embedFont(data, { subset: true })
  const face = (f as unknown as { embedder?: { font?: { layout: Layout } } }).embedder?.font
  if (face) {
    let memo = runs.get(data)
    if (!memo) runs.set(data, (memo = new Map()))
    const memoised = memo
    const layout = face.layout.bind(face)
    face.layout = (text, features) => {
      if (features !== undefined) return layout(text, features)
      let run = memoised.get(text)
      if (run === undefined) memoised.set(text, (run = layout(text)))
      return run
    }
  }
  return f
}

const charSets = new WeakMap<PDFFont, Set<number>>()

/** Text the embedded face can encode; a minus the Sans lacks becomes a hyphen, anything else '?', rather than failing the stamp. */
function safe(f: PDFFont, text: string): string {
  let set = charSets.get(f)
  if (!set) charSets.set(f, (set = new Set(f.getCharacterSet())))
  return [...text].map((c) => (set.has(c.codePointAt(0)!) ? c : c === '\u2212' ? '-' : '?')).join('')
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
    this.y = h - BODY_TOP - 14
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
      if (this.y < BODY_BOTTOM + 6) this.newPage()
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

/** The sheet frame react-pdf draws on body pages (frame.tsx), drawn from the same TITLE_BLOCK data on the pages added here. */
function drawFrame(page: PDFPage, pkg: ReportPackage, f: Fonts) {
  const { width, height } = page.getSize()
  const cw = contentWidth(pkg.paper)
  const T = TITLE_BLOCK
  const top = T.bottom + TITLE_BLOCK_HEIGHT
  page.drawLine({ start: { x: MARGIN_X, y: height - HEAD_RULE }, end: { x: width - MARGIN_X, y: height - HEAD_RULE }, thickness: 0.4, color: RULE })
  page.drawLine({ start: { x: MARGIN_X, y: top }, end: { x: MARGIN_X + cw, y: top }, thickness: 0.9, color: INK })
  page.drawLine({ start: { x: MARGIN_X, y: T.bottom }, end: { x: MARGIN_X + cw, y: T.bottom }, thickness: 0.9, color: INK })
  page.drawLine({ start: { x: MARGIN_X, y: top - T.rowHeight }, end: { x: MARGIN_X + cw, y: top - T.rowHeight }, thickness: 0.4, color: RULE })
  page.drawRectangle({ x: MARGIN_X, y: T.bottom, width: T.bar, height: TITLE_BLOCK_HEIGHT, color: ACCENT })
  for (const c of T.cells) {
    const at = titleCellAt(pkg.paper, c.id)
    const pad = T.padX + (c.x0 === 0 ? T.bar : 0)
    if (c.x0 > 0) page.drawLine({ start: { x: at.x, y: at.top }, end: { x: at.x, y: at.top - T.rowHeight }, thickness: 0.4, color: RULE })
    page.drawText(c.label, { x: at.x + pad, y: at.top - T.labelBaseline, size: T.labelSize, font: f.italic, color: MUTED })
    const v = titleCellText(pkg, c.id)
    if (!v) continue
    if (c.id === 'calc') {
      const t = safe(f.bold, v)
      page.drawText(t, { x: at.x + at.width - 4 - f.bold.widthOfTextAtSize(t, 12), y: at.top - 15.6, size: 12, font: f.bold, color: INK })
    } else page.drawText(safe(f.bold, v), { x: at.x + pad, y: at.top - T.valueBaseline, size: T.valueSize, font: f.bold, color: INK, maxWidth: at.width - pad - 2 })
  }
  const mark = safe(f.regular, `${pkg.calc.number} · rev ${pkg.revision.label}`)
  const mw = f.regular.widthOfTextAtSize(mark, OUTER_MARK.size)
  page.drawText(mark, { x: width - OUTER_MARK.fromEdge + OUTER_MARK.size * 0.35, y: height / 2 - mw / 2, size: OUTER_MARK.size, font: f.regular, color: MUTED, rotate: degrees(90) })
}

/**
 * textkit sets an empty glyph run (the end of a wrapped line) in its fallback font, Helvetica, which
 * is never embedded. Those runs draw nothing; their font resource is pointed at the embedded Noto Sans
 * so that every font of the package is embedded.
 */
function embedFallbacks(doc: PDFDocument, pages: PDFPage[], regular: PDFFont) {
  const dropped = new Set<string>()
  for (const page of pages) {
    const fonts = page.node.Resources()?.lookupMaybe(PDFName.of('Font'), PDFDict)
    if (!fonts) continue
    for (const [name, ref] of fonts.entries()) {
      const dict = ref instanceof PDFRef ? doc.context.lookupMaybe(ref, PDFDict) : undefined
      const base = dict?.get(PDFName.of('BaseFont'))?.toString() ?? ''
      if (!/^\/Helvetica/.test(base)) continue
      fonts.set(name, regular.ref)
      if (ref instanceof PDFRef) dropped.add(ref.toString())
    }
  }
  for (const r of dropped) {
    const [num, gen] = r.split(' ').map(Number)
    doc.context.delete(PDFRef.of(num, gen))
  }
}

/** Writes a value into a title-block cell (the cells sign-off owns). */
function stampCell(page: PDFPage, pkg: ReportPackage, id: TitleCellId, text: string, font: PDFFont, color = INK, size: number = TITLE_BLOCK.valueSize) {
  const c = TITLE_BLOCK.cells.find((x) => x.id === id)!
  const at = titleCellAt(pkg.paper, id)
  const pad = TITLE_BLOCK.padX + (c.x0 === 0 ? TITLE_BLOCK.bar : 0)
  page.drawText(safe(font, text), { x: at.x + pad, y: at.top - TITLE_BLOCK.valueBaseline, size, font, color, maxWidth: at.width - pad - 2 })
}

/**
 * Where each step box starts: react-pdf writes a named destination for every element with an id
 * (`step-<id>`), [page /XYZ 0 y] with y measured from the page's top edge less its top padding.
 */
function stepPositions(doc: PDFDocument): Map<string, { page: number; top: number }> {
  const out = new Map<string, { page: number; top: number }>()
  const names = doc.catalog.lookupMaybe(PDFName.of('Names'), PDFDict)
  const dests = names?.lookupMaybe(PDFName.of('Dests'), PDFDict)
  if (!dests) return out
  const pageIndex = new Map(doc.getPages().map((p, i) => [p.ref.toString(), i]))
  const visit = (node: PDFDict) => {
    const arr = node.lookupMaybe(PDFName.of('Names'), PDFArray)
    if (arr) {
      for (let i = 0; i + 1 < arr.size(); i += 2) {
        const key = arr.lookup(i)
        const name = key instanceof PDFString || key instanceof PDFHexString ? key.decodeText() : ''
        const dest = arr.lookup(i + 1)
        if (!name.startsWith('step-') || !(dest instanceof PDFArray)) continue
        const ref = dest.get(0)
        const y = dest.lookup(3)
        const page = ref instanceof PDFRef ? pageIndex.get(ref.toString()) : undefined
        if (page !== undefined && y instanceof PDFNumber) out.set(name.slice(5), { page, top: y.asNumber() - BODY_TOP })
      }
    }
    const kids = node.lookupMaybe(PDFName.of('Kids'), PDFArray)
    if (kids) for (let i = 0; i < kids.size(); i++) visit(kids.lookup(i, PDFDict))
  }
  visit(dests)
  return out
}

/** A tick, the checker's initials and remark numbers in the checker column of each step box. */
function stampChecks(pages: PDFPage[], pkg: ReportPackage, f: Fonts, at: Map<string, { page: number; top: number }>) {
  const x = MARGIN_X + contentWidth(pkg.paper) - STEP.checkWidth + 2.5
  const initials = (name: string) => name.split(/\s+/).filter(Boolean).map((w) => w[0]).join('').toUpperCase()
  for (const t of pkg.signOff?.ticks ?? []) {
    const p = at.get(t.stepId)
    if (!p) continue
    const page = pages[p.page]
    const y = p.top - STEP.padY - 7
    page.drawSvgPath('M0 3.2 L2.4 6 L7.6 0', { x, y: y + 6.4, borderColor: INK, borderWidth: 0.9, scale: 1 })
    page.drawText(safe(f.regular, initials(t.by)), { x: x + 9, y: y + 0.6, size: 5.6, font: f.regular, color: INK })
  }
  pkg.remarks.forEach((r, i) => {
    if (!r.stepId) return
    const p = at.get(r.stepId)
    if (!p) return
    pages[p.page].drawText(`R${i + 1}`, { x, y: p.top - STEP.padY - 15, size: 5.8, font: f.bold, color: ACCENT })
  })
}

/** The sign-off record: every signature with its statement, the issue block, ticks, remarks and confirmed material values. */
function writeRecord(w: Writer, pkg: ReportPackage) {
  const so = pkg.signOff
  w.text('Sign-off record', { size: 13, bold: true, color: INK, gap: 6 })
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
  w.text('Steps ticked as verified by the checker (also stamped in each step’s checker column)', { size: 10.5, bold: true })
  const ticks = so?.ticks ?? []
  if (ticks.length === 0) w.text('No step was ticked.', { color: MUTED })
  else w.text(ticks.map((t) => `${t.number ?? t.stepId} (${t.by}, ${t.date})`).join(' · '), { gap: 6 })
  w.rule()
  w.text('Remarks', { size: 10.5, bold: true })
  if (pkg.remarks.length === 0) w.text('No remarks.', { color: MUTED })
  for (const r of pkg.remarks) {
    w.text(`R${pkg.remarks.indexOf(r) + 1} · ${r.stepId ? `at ${r.stepNumber ? `step ${r.stepNumber} (${r.stepId})` : r.stepId}` : 'whole calc'} — ${r.status} — ${r.author}, ${r.date}`, { bold: true, size: 8 })
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
  page.drawSvgPath(o.d, { x, y, scale: size / 1000, color: ACCENT, opacity: 0.12, borderWidth: 0, rotate: degrees(40) })
}

/**
 * Stamps `body` (react-pdf's output for this revision) for the state and signatures in `pkg`,
 * appends the sign-off record and the appendices. The result is the package as handed out.
 */
export async function finishPdf(body: Uint8Array, pkg: ReportPackage, opts: RenderOptions = {}): Promise<Uint8Array> {
  const date = new Date(pkg.generatedAt)
  const out = await PDFDocument.load(body, { updateMetadata: false })
  out.registerFontkit(fontkit)
  // Read in parallel, embed in a fixed order: object numbers must not depend on which read finished first.
  const [regularData, boldData, italicData, monoData] = await Promise.all(['NotoSans-Regular.ttf', 'NotoSans-Bold.ttf', 'NotoSans-Italic.ttf', 'NotoSansMono-Regular.ttf'].map((f) => font(opts, f)))
  const regular = await embed(out, regularData)
  const bold = await embed(out, boldData)
  const italic = await embed(out, italicData)
  const mono = await embed(out, monoData)
  const fonts = { regular, bold, italic, mono }
  const bodyPages = out.getPages()
  embedFallbacks(out, bodyPages, regular)
  const steps = stepPositions(out)
  const recordPages: PDFPage[] = []
  if (pkg.signOff) {
    const w = new Writer(out, fonts, pkg, (p) => {
      drawFrame(p, pkg, fonts)
      recordPages.push(p)
    })
    writeRecord(w, pkg)
  }
  // Attached documents go inside the sheet frame: each of their pages is scaled into the body area.
  const [pw, ph] = PAGE_SIZE[pkg.paper]
  const attached: PDFPage[] = []
  for (const [i, a] of pkg.attachments.entries()) {
    const src = await PDFDocument.load(a.bytes, { updateMetadata: false })
    const embedded = await out.embedPdf(src, src.getPageIndices())
    embedded.forEach((e, k) => {
      const page = out.addPage([pw, ph])
      drawFrame(page, pkg, fonts)
      const boxTop = ph - BODY_TOP - 14
      const boxH = boxTop - BODY_BOTTOM
      const cw = contentWidth(pkg.paper)
      const scale = Math.min(cw / e.width, boxH / e.height, 1)
      const w = e.width * scale
      const h = e.height * scale
      page.drawText(safe(bold, `Appendix ${attachmentLetter(pkg, i)}: ${a.name} — its page ${k + 1} of ${embedded.length}`), { x: MARGIN_X, y: ph - BODY_TOP - 4, size: 8.4, font: bold, color: INK, maxWidth: cw })
      page.drawRectangle({ x: MARGIN_X + (cw - w) / 2, y: boxTop - h, width: w, height: h, borderColor: RULE, borderWidth: 0.4 })
      page.drawPage(e, { x: MARGIN_X + (cw - w) / 2, y: boxTop - h, xScale: scale, yScale: scale })
      attached.push(page)
    })
  }
  const total = bodyPages.length + recordPages.length + attached.length

  const mark = watermarkFor(pkg.revision.state)
  const r = pkg.revision
  const signers = [r.engineer, r.checker, r.approver]
  const state = STATE_LABEL[r.state]
  const stateColour = ['returned', 'voided', 'withdrawn', 'superseded'].includes(r.state) ? ACCENT : INK
  stampChecks(bodyPages, pkg, fonts, steps)
  ;[...bodyPages, ...recordPages, ...attached].forEach((page, i) => {
    stampCell(page, pkg, 'sheet', `${i + 1} of ${total}`, bold)
    stampCell(page, pkg, 'state', state, bold, stateColour)
    SIGN_OFF_ROLES.forEach((role, k) => {
      const sg = signers[k]
      const text = sg.date ? `${sg.name} · ${formatDate(sg.date)}` : sg.name === '—' ? '—' : `${sg.name} · not signed`
      stampCell(page, pkg, SIGN_OFF_CELLS[role], text, regular, INK, 6.6)
    })
    if (pkg.signOff?.issue) page.drawText(`issued · verification code ${pkg.signOff.issue.code}`, { x: MARGIN_X, y: TITLE_BLOCK.bottom - 9, size: 6.2, font: mono, color: MUTED })
    if (mark) drawWatermark(page, mark, boldData)
  })
  out.setCreationDate(date)
  out.setModificationDate(date)
  return out.save({ useObjectStreams: false })
}
