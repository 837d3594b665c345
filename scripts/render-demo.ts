/**
 * Renders every demo calc (the seed's inputs run through the real engine and checks) to out/demo:
 * PDFs (A4 and US Letter, a draft, one in check with an appended attachment), their pages as PNGs
 * for a visual check, and the standalone web document of each.
 */
import { execFileSync } from 'node:child_process'
import { mkdirSync, rmSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { readFileSync } from 'node:fs'
import fontkit from '@pdf-lib/fontkit'
import { PDFDocument } from 'pdf-lib'
import { renderPdf, renderWebDocument, type ReportPackage } from '../reports/index'
import { DEMO_CALCS, demoPackage } from '../reports/demo'


async function sampleAttachment(): Promise<Uint8Array> {
  const doc = await PDFDocument.create()
  const page = doc.addPage([595.28, 841.89])
  // An embedded face, so the sample does not bring an unembedded standard font into the package.
  doc.registerFontkit(fontkit)
  const font = await doc.embedFont(readFileSync(join(process.cwd(), 'fonts', 'NotoSans-Regular.ttf')), { subset: true })
  page.drawText('Supplier data sheet: pin material certificate (sample)', { x: 60, y: 760, size: 14, font })
  doc.setCreationDate(new Date('2025-01-01T00:00:00Z'))
  doc.setModificationDate(new Date('2025-01-01T00:00:00Z'))
  return doc.save()
}

async function main() {
  const out = join(process.cwd(), 'out', 'demo')
  rmSync(out, { recursive: true, force: true })
  mkdirSync(out, { recursive: true })
  const first = DEMO_CALCS[0]
  const withAttachment = demoPackage(first, { state: 'in-check' })
  withAttachment.attachments = [{ name: 'Pin material certificate.pdf', bytes: await sampleAttachment() }]
  const jobs: [string, ReportPackage][] = [
    ...DEMO_CALCS.map((c): [string, ReportPackage] => [`demo-${c.number}`, demoPackage(c)]),
    [`demo-${first.number}-letter`, demoPackage(first, { paper: 'LETTER' })],
    [`demo-${first.number}-draft`, demoPackage(first, { state: 'draft' })],
    [`demo-${first.number}-in-check-attachment`, withAttachment],
    // The AISC calc as an engineer working in US customary units gets it.
    [`demo-${DEMO_CALCS[1].number}-us`, { ...demoPackage(DEMO_CALCS[1]), units: 'US' }],
  ]
  for (const [name, pkg] of jobs) {
    const t0 = performance.now()
    const pdf = await renderPdf(pkg)
    const file = join(out, `${name}.pdf`)
    writeFileSync(file, pdf)
    execFileSync('pdftoppm', ['-r', '60', '-png', file, join(out, name)])
    console.log(`${name}.pdf  ${(pdf.length / 1024).toFixed(0)} kB  ${Math.round(performance.now() - t0)} ms`)
  }
  for (const c of DEMO_CALCS) writeFileSync(join(out, `demo-${c.number}.html`), await renderWebDocument(demoPackage(c)))
  console.log(`written to ${out}`)
}

main().catch((err) => {
  console.error(err)
  process.exit(1)
})
