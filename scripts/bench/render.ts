/**
 * Report rendering speed: the demo package to PDF cold and warm (median),
 * peak memory, page count, the web HTML, and as a yardstick the same HTML
 * printed to PDF by headless Chromium. Run alone with `tsx scripts/bench/render.ts`.
 */
import { execFileSync } from 'node:child_process'
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { pathToFileURL } from 'node:url'

const WARM_RUNS = 7
const CHROMIUM = '/usr/bin/chromium'

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)]
}

async function timed<T>(fn: () => Promise<T>): Promise<{ ms: number; cpuMs: number; value: T }> {
  const c0 = process.cpuUsage()
  const t0 = performance.now()
  const value = await fn()
  const c = process.cpuUsage(c0)
  return { ms: performance.now() - t0, cpuMs: (c.user + c.system) / 1000, value }
}

const fmt = (ms: number) => `${Math.round(ms)} ms`

export default async function bench(): Promise<void> {
  // React picks its build when first loaded; the production build is the one that ships.
  const env = process.env as Record<string, string | undefined>
  env.NODE_ENV ??= 'production'
  const { renderPdf, renderWebHtml, renderWebDocument } = await import('../../reports/index')
  const { PDFDocument } = await import('pdf-lib')
  const { peaucellierPackage } = await import('../../tests/reports/fixtures/peaucellier')
  const pkg = peaucellierPackage()

  const cold = await timed(() => renderPdf(pkg))
  const pages = (await PDFDocument.load(cold.value)).getPageCount()
  const warm: number[] = []
  const warmCpu: number[] = []
  for (let i = 0; i < WARM_RUNS; i++) {
    const r = await timed(() => renderPdf(pkg))
    warm.push(r.ms)
    warmCpu.push(r.cpuMs)
  }
  const webCold = await timed(() => renderWebHtml(peaucellierPackage({ paper: 'LETTER' })))
  const web: number[] = []
  for (let i = 0; i < 5; i++) web.push((await timed(() => renderWebHtml(pkg))).ms)
  const mem = process.memoryUsage()
  const maxRssMb = process.resourceUsage().maxRSS / 1024

  console.log(`NODE_ENV=${process.env.NODE_ENV}; demo package, ${pages} pages (${pkg.paper})`)
  console.log(`pdf  cold ${fmt(cold.ms)} (cpu ${fmt(cold.cpuMs)})`)
  console.log(`pdf  warm median ${fmt(median(warm))} of ${WARM_RUNS} (cpu ${fmt(median(warmCpu))}; min ${fmt(Math.min(...warm))}, max ${fmt(Math.max(...warm))})`)
  console.log(`web  cold ${fmt(webCold.ms)}, warm median ${fmt(median(web))}`)
  console.log(`mem  peak RSS ${maxRssMb.toFixed(0)} MB, heap used now ${(mem.heapUsed / 2 ** 20).toFixed(0)} MB`)

  const dir = mkdtempSync(join(tmpdir(), 'inverso-bench-'))
  try {
    const html = join(dir, 'report.html')
    const pdf = join(dir, 'chromium.pdf')
    writeFileSync(html, await renderWebDocument(pkg))
    const t0 = performance.now()
    execFileSync(CHROMIUM, [
      '--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync', '--no-pdf-header-footer', `--print-to-pdf=${pdf}`, pathToFileURL(html).href,
    ], { stdio: 'ignore', timeout: 120_000 })
    const ms = performance.now() - t0
    const chromePages = (await PDFDocument.load(readFileSync(pdf))).getPageCount()
    console.log(`yardstick: Chromium print-to-pdf of the web HTML ${fmt(ms)} (process start included), ${chromePages} pages`)
  } catch (err) {
    console.log(`yardstick: Chromium not usable here (${(err as Error).message.split('\n')[0]})`)
  } finally {
    rmSync(dir, { recursive: true, force: true })
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  await bench()
}
