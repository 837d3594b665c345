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
import { texToShape } from './math-shape'
import { contentWidth } from './styles'

const componentCache = new Map<string, ReturnType<typeof getMDXComponent>>()

/** The display TeX of every step: the steps' boxes set each of them (measure.ts, steps.tsx). */
function stepFormulas(pkg: ReportPackage): string[] {
  return pkg.result.steps.flatMap((s) => [s.formula, s.substituted, s.criterion]).filter((t): t is string => !!t)
}

/**
 * The first render in a process compiles the template, and the main thread mostly waits for
 * esbuild meanwhile: typeset the step formulas (needed anyway, and cached by TeX) until it is done,
 * one at a time so esbuild's replies are not kept waiting. Same shapes, whatever the timing.
 */
async function typesetWhile(pending: Promise<unknown>, texs: string[]): Promise<void> {
  let settled = false
  pending.then(() => (settled = true), () => (settled = true))
  for (const tex of texs) {
    await new Promise((resolve) => setImmediate(resolve))
    if (settled) return
    texToShape(tex, true)
  }
}

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
  const compiling = compileTemplate(source, 'pdf')
  await typesetWhile(compiling, stepFormulas(pkg))
  const compiled = await compiling
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
