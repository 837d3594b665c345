import { describe, expect, it } from 'vitest'
import { PDFDocument, StandardFonts } from 'pdf-lib'
import { CAUTION_BASE, finishPdf, formatValue, renderBody, renderPdf, sha256Hex, watermarkFor } from '@/reports/index'
import { peaucellierPackage } from './fixtures/peaucellier'
import { hartPackage } from './fixtures/hart'
import { inkOfWords, pageCount, pdfRawText, pdfText, redTint, squash } from './helpers'

const SLOW = 180_000

describe('renderPdf', () => {
  for (const paper of ['A4', 'LETTER'] as const) {
    it(`renders the Peaucellier package on ${paper} with every step value and the cautions`, async () => {
      const pkg = peaucellierPackage({ paper })
      const bytes = await renderPdf(pkg)
      const doc = await PDFDocument.load(bytes)
      expect(doc.getPageCount()).toBeGreaterThanOrEqual(10)
      const size = doc.getPage(0).getSize()
      expect(Math.round(size.width)).toBe(paper === 'A4' ? 595 : 612)
      const text = pdfText(bytes)
      for (const step of pkg.result.steps) {
        expect(text, `step ${step.id}`).toContain(squash(formatValue(step.value, step.unit)))
        expect(text).toContain(step.id)
      }
      expect(text).toContain(squash(CAUTION_BASE))
      for (const c of pkg.result.cautions ?? []) expect(text).toContain(squash(c))
      expect(text).toContain(`1 of ${doc.getPageCount()}`)
      // The fixture is a checked revision: its watermark is drawn, never extracted with the text.
      expect(redTint(bytes)).toBeGreaterThan(0.01)
      expect(pdfRawText(bytes)).not.toMatch(/CHECKED — NOT APPROVED|DRAFT/)
    }, SLOW)
  }

  it('gives byte-identical output for the same package', async () => {
    const a = await renderPdf(peaucellierPackage())
    const b = await renderPdf(peaucellierPackage())
    expect(a.length).toBe(b.length)
    expect(Buffer.from(a).equals(Buffer.from(b))).toBe(true)
    expect(sha256Hex(a)).toBe(sha256Hex(b))
  }, SLOW)

  it('watermarks every state the workflow marks, and leaves an issued revision clean', async () => {
    // The accent colour marks failing values too, so the watermark is measured against the issued
    // (unmarked) rendering of the same package: it adds a tint over a large part of the page.
    const clean = redTint(await renderPdf(peaucellierPackage({ state: 'issued' })))
    expect(watermarkFor('issued')).toBeNull()
    for (const state of ['draft', 'in-check', 'superseded'] as const) {
      expect(watermarkFor(state), state).toBeTruthy()
      expect(redTint(await renderPdf(peaucellierPackage({ state }))) - clean, state).toBeGreaterThan(0.01)
    }
  }, SLOW)

  it('appends attached PDFs as stamped appendix pages', async () => {
    const att = await PDFDocument.create()
    const page = att.addPage([400, 300])
    page.drawText('ATTACHED-SHEET-MARKER', { x: 40, y: 150, size: 12, font: await att.embedFont(StandardFonts.Helvetica) })
    const pkg = peaucellierPackage()
    pkg.attachments = [{ name: 'Bearing data.pdf', bytes: await att.save() }]
    const body = await renderBody(pkg)
    const bytes = await finishPdf(body, pkg)
    const n = await pageCount(bytes)
    expect(n).toBe((await pageCount(body)) + 1)
    const text = pdfText(bytes)
    expect(text).toContain('ATTACHED-SHEET-MARKER')
    // Lettered after the package's own appendix (A, the working in full), inside the sheet frame.
    expect(text).toContain('Appendix B: Bearing data.pdf — its page 1 of 1')
    expect(text).toContain(`${n} of ${n}`)
    expect(text).toContain(`1 of ${n}`)
  }, SLOW)

  it('renders the Hart template and leaves out sections the result does not fill', async () => {
    const pkg = hartPackage()
    const bytes = await renderPdf(pkg)
    const text = pdfText(bytes)
    for (const step of pkg.result.steps) expect(text).toContain(squash(formatValue(step.value, step.unit)))
    expect(text).toContain('Geometry')
    expect(text).not.toContain('Kinematics')
    expect(text).not.toContain('Component checks')
    expect(redTint(bytes)).toBeGreaterThan(0.01)
  }, SLOW)

  it('keeps symbols the Sans face lacks (minus, ≤) through the Mono fallback', async () => {
    const pkg = peaucellierPackage()
    pkg.result = { ...pkg.result, cautions: ['Keep u ≤ 1 at −20 °C.'] }
    expect(pdfText(await renderPdf(pkg))).toContain('Keep u ≤ 1 at −20 °C.')
  }, SLOW)

  // The PDF faces are subsets (fonts/SUBSETS.md) that keep the full faces' scripts, for names like these.
  it('prints Latin Extended, Vietnamese and Cyrillic names in the body and in the stamped title block', async () => {
    const pkg = peaucellierPackage()
    pkg.result = { ...pkg.result, cautions: ['Checked on site in Łódź by Çelik, Țară, Nguyễn and Соколов.'] }
    pkg.revision = { ...pkg.revision, engineer: { ...pkg.revision.engineer, name: 'Zdeněk Dvořák' }, checker: { ...pkg.revision.checker, name: 'Ирина Соколова' } }
    const bytes = await renderPdf(pkg)
    const text = pdfText(bytes)
    expect(text).toContain('Checked on site in Łódź by Çelik, Țară, Nguyễn and Соколов.')
    expect(text).toContain('Zdeněk Dvořák')
    expect(text).toContain('Ирина Соколова')
    // Every word stamped into the title block is drawn, not only present in the text layer: a face
    // that lacked the glyphs once stamped "c  ck" for "In check" and an empty sheet cell.
    const doc = await PDFDocument.load(bytes, { updateMetadata: false })
    const height = doc.getPage(0).getHeight()
    const words = inkOfWords(bytes, 1, height - 70)
    expect(words.map((w) => w.word)).toEqual(expect.arrayContaining(['Соколова', 'Dvořák', 'of']))
    for (const w of words) expect({ word: w.word, drawn: w.ink > 0.02 }).toEqual({ word: w.word, drawn: true })
  }, SLOW)
})
