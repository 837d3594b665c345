/**
 * MDX template → PDF bytes. The template is compiled once (cached), fonts are
 * registered once, and every date in the file comes from `generatedAt`, so the
 * same package always gives the same bytes.
 */
import { Document, renderToBuffer } from '@react-pdf/renderer'
import { getMDXComponent } from 'mdx-bundler/client/index.js'
import type { ReactNode } from 'react'
import { compileTemplate, loadTemplate } from '../mdx/compile'
import { buildContext } from '../model/context'
import { ReportCtx } from '../model/react-context'
import type { RenderOptions, ReportPackage } from '../types'
import { countPages, finishPdf } from './finish'
import { pdfMarkdownComponents, pdfReportComponents, pdfWrapper } from './components'
import { prepareFonts } from './fonts'
import { contentWidth } from './styles'

const componentCache = new Map<string, ReturnType<typeof getMDXComponent>>()

/** The package as handed out: the body, stamped for its state and signatures (finishPdf). */
export async function renderPdf(pkg: ReportPackage, opts: RenderOptions = {}): Promise<Uint8Array> {
  return finishPdf(await renderBody(pkg, opts), pkg, opts)
}

/**
 * The body of the package, rendered by react-pdf: everything but what sign-off changes. It is
 * rendered once per revision and stored; each signature stamps it again (finishPdf).
 */
export async function renderBody(pkg: ReportPackage, opts: RenderOptions = {}): Promise<Uint8Array> {
  await prepareFonts(opts)
  const source = await loadTemplate(pkg.calc.type, opts)
  const compiled = await compileTemplate(source, 'pdf')
  let Content = componentCache.get(compiled.code)
  if (!Content) {
    Content = getMDXComponent(compiled.code)
    componentCache.set(compiled.code, Content)
  }
  const appendixPages = await countPages(pkg.attachments)
  const ctx = buildContext(pkg, compiled.meta, compiled.outline, { figureWidth: contentWidth(pkg.paper), appendixPages })
  const date = new Date(pkg.generatedAt)
  const doc = (children: ReactNode) => (
    <Document
      title={`${pkg.calc.number} rev ${pkg.revision.label} — ${pkg.calc.title}`}
      author={pkg.revision.engineer.name}
      subject={`${pkg.project.code} ${pkg.project.name}`}
      keywords={`${pkg.calc.type} calc-package`}
      creator={`Inverso reports (${pkg.templateVersion})`}
      producer={`Inverso engine ${pkg.engineVersion}`}
      creationDate={date}
      modificationDate={date}
      language="en"
      pageMode="useOutlines"
    >
      {children}
    </Document>
  )
  const element = (
    <ReportCtx.Provider value={ctx}>
      <Content components={{ ...pdfMarkdownComponents, ...pdfReportComponents, wrapper: pdfWrapper(doc) }} />
    </ReportCtx.Provider>
  )
  const buffer = await renderToBuffer(element)
  return new Uint8Array(buffer.buffer, buffer.byteOffset, buffer.byteLength)
}
