/**
 * The report pipeline: one MDX template per mechanism, rendered either as a
 * web page (HTML + KaTeX) or as a signed-off PDF (react-pdf + MathJax paths).
 * Pure Node: no Next.js, no __dirname; templates and fonts resolve from
 * `rootDir` (default `process.cwd()`).
 */
export { renderBody, renderPdf } from './pdf/render'
export { finishPdf } from './pdf/finish'
export { renderWebHtml, renderWebDocument } from './web/render'
export { sha256Hex, canonicalJson } from './hash'
export { formatValue, formatNumber, watermarkFor } from './model/format'
export { CAUTION_BASE } from './model/views'
export { stepOutline, type StepOutlineEntry } from './model/outline'
export { registerReportParts, type ReportParts, type DiagramBuilder } from './mechanisms'
export type * from './types'
export { TEMPLATE_VERSION } from './version'
