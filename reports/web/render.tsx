/**
 * MDX template → static HTML. Same template, same numbering and same data
 * views as the PDF; math is typeset by rehype-katex (the app ships KaTeX's
 * CSS) and styled by `reports/web/report.css`.
 */
import { readFile } from 'node:fs/promises'
import { join } from 'node:path'
import { getMDXComponent } from 'mdx-bundler/client/index.js'
import { renderToStaticMarkup } from 'react-dom/server'
import { compileTemplate, loadTemplate } from '../mdx/compile'
import { buildContext } from '../model/context'
import { ReportCtx } from '../model/react-context'
import type { RenderOptions, ReportPackage } from '../types'
import { Wrapper, webMarkdownComponents, webReportComponents } from './components'

/** Figures are drawn at this width in points and scale with the column. */
const FIGURE_WIDTH = 640

const componentCache = new Map<string, ReturnType<typeof getMDXComponent>>()

export async function renderWebHtml(pkg: ReportPackage, opts: RenderOptions = {}): Promise<string> {
  const compiled = await compileTemplate(await loadTemplate(pkg.calc.type, opts), 'web')
  let Content = componentCache.get(compiled.code)
  if (!Content) {
    Content = getMDXComponent(compiled.code)
    componentCache.set(compiled.code, Content)
  }
  const ctx = buildContext(pkg, compiled.meta, compiled.outline, { figureWidth: FIGURE_WIDTH })
  return renderToStaticMarkup(
    <ReportCtx.Provider value={ctx}>
      <Content components={{ ...webMarkdownComponents, ...webReportComponents, wrapper: Wrapper }} />
    </ReportCtx.Provider>,
  )
}

/**
 * A standalone HTML document with the report and KaTeX CSS inlined, for
 * previews and for printing from a browser. KaTeX's fonts load from `fontBase`.
 */
export async function renderWebDocument(pkg: ReportPackage, opts: RenderOptions = {}): Promise<string> {
  const root = opts.rootDir ?? process.cwd()
  const katexDir = join(root, 'node_modules', 'katex', 'dist')
  const [body, css, katexCss] = await Promise.all([
    renderWebHtml(pkg, opts),
    readFile(join(root, 'reports', 'web', 'report.css'), 'utf8'),
    readFile(join(katexDir, 'katex.min.css'), 'utf8'),
  ])
  const title = `${pkg.calc.number} rev ${pkg.revision.label} — ${pkg.calc.title}`
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><base href="file://${katexDir}/"><title>${escapeHtml(title)}</title><style>${katexCss}</style><style>${css}</style><style>@page { size: ${pkg.paper === 'LETTER' ? 'letter' : 'A4'}; }</style></head><body>${body}</body></html>`
}

function escapeHtml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;')
}
