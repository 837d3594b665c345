/**
 * The last pass over the PDF, with pdf-lib: page numbers go into the title
 * block here rather than through react-pdf's `render` prop, which re-lays out
 * every page and cost about a third of the render time; attached PDFs are
 * appended as appendices and stamped. Dates are set from `generatedAt`, and
 * nothing time- or random-dependent is written, so output stays reproducible.
 */
import { PDFDocument, StandardFonts, rgb } from 'pdf-lib'
import type { Attachment, ReportPackage } from '../types'
import { HEADER_TOP, MARGIN_X, contentWidth, PAGE_NUMBER_CELL } from './styles'

export async function countPages(attachments: Attachment[]): Promise<number[]> {
  return Promise.all(attachments.map(async (a) => (await PDFDocument.load(a.bytes, { updateMetadata: false })).getPageCount()))
}

// Standard fonts only encode WinAnsi; stamps are kept to ASCII.
const ascii = (s: string) => s.replace(/[^\x20-\x7e]/g, '?')

export async function finishPdf(report: Uint8Array, pkg: ReportPackage, date: Date): Promise<Uint8Array> {
  const out = await PDFDocument.load(report, { updateMetadata: false })
  const bold = await out.embedFont(StandardFonts.HelveticaBold)
  const regular = await out.embedFont(StandardFonts.Helvetica)
  const reportPages = out.getPageCount()
  const sources = await Promise.all(pkg.attachments.map((a) => PDFDocument.load(a.bytes, { updateMetadata: false })))
  const total = reportPages + sources.reduce((n, d) => n + d.getPageCount(), 0)
  const ink = rgb(0.114, 0.165, 0.2)

  const x = MARGIN_X + contentWidth(pkg.paper) * PAGE_NUMBER_CELL.fromLeft + 4
  out.getPages().forEach((page, i) => {
    const { height } = page.getSize()
    page.drawText(`${i + 1} of ${total}`, { x, y: height - HEADER_TOP - PAGE_NUMBER_CELL.baseline, size: 7.2, font: bold, color: ink })
  })

  let pageNo = reportPages
  for (const [i, src] of sources.entries()) {
    const pages = await out.copyPages(src, src.getPageIndices())
    for (const page of pages) {
      out.addPage(page)
      pageNo += 1
      const stamp = `${pkg.calc.number} rev ${pkg.revision.label} - Appendix ${String.fromCharCode(65 + i)}: ${ascii(pkg.attachments[i].name)} - page ${pageNo} of ${total}`
      page.drawText(stamp, { x: 24, y: 12, size: 7, font: regular, color: rgb(0.35, 0.4, 0.45), maxWidth: page.getSize().width - 48 })
    }
  }
  out.setCreationDate(date)
  out.setModificationDate(date)
  return out.save({ useObjectStreams: false })
}
