/**
 * Report rendering speed for the real demo calcs (seed inputs run through the engine and
 * checks): PDF cold (first render in a fresh process) and warm (median), CPU time, pages, bytes,
 * web HTML time, and as a yardstick the same HTML printed to PDF by a running headless Chromium
 * (`page.pdf()` on the loaded page, warm), with the ratio. Each package runs in its own process so
 * "cold" is honest. Aim: warm ratio ≤ 1 for every package, LC-001 cold under 2 s.
 * Run alone (the machine is shared): `NODE_ENV=production tsx scripts/bench/render.ts [name…]`.
 */
import { execFileSync } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'
import type { ReportPackage } from '../../reports/types'

const WARM_RUNS = Number(process.env.BENCH_WARM_RUNS ?? 5)
const CHROMIUM = '/usr/bin/chromium'
const NAMES = ['LC-001', 'LC-002', 'LC-003']

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

async function packageNamed(name: string): Promise<ReportPackage> {
  const { demoPackage, demoCalc } = await import('../../reports/demo')
  return demoPackage(demoCalc(name))
}

/**
 * The yardstick: the same package's web HTML printed by a headless Chromium that is already running,
 * on a page that has already loaded it — `page.pdf()` timed warm (median of WARM_RUNS after one
 * warm-up print), so neither the browser's start nor the page load is counted.
 */
async function chromiumWarm(html: string): Promise<{ warm: number; first: number; pages: number } | string> {
  const dir = mkdtempSync(join(tmpdir(), 'inverso-bench-'))
  try {
    const { chromium } = await import('playwright-core')
    const browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'] })
    try {
      const file = join(dir, 'report.html')
      writeFileSync(file, html)
      const page = await browser.newPage()
      await page.goto(pathToFileURL(file).href, { waitUntil: 'load' })
      const first = await timed(() => page.pdf({ format: 'A4', printBackground: true }))
      const times: number[] = []
      for (let i = 0; i < WARM_RUNS; i++) times.push((await timed(() => page.pdf({ format: 'A4', printBackground: true }))).ms)
      const pages = (Buffer.from(first.value).toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length
      return { warm: median(times), first: first.ms, pages }
    } finally {
      await browser.close()
    }
  } catch (err) {
    return `not usable here (${(err as Error).message.split('\n')[0]})`
  } finally {
    rmSync(dir, { recursive: true, force: true })
  }
}

/** One package in this process: the first render here is the cold one. */
async function benchOne(name: string): Promise<void> {
  const { renderPdf, renderWebDocument } = await import('../../reports/index')
  const { PDFDocument } = await import('pdf-lib')
  const pkg = await packageNamed(name)
  const cold = await timed(() => renderPdf(pkg))
  const pages = (await PDFDocument.load(cold.value)).getPageCount()
  const warm: number[] = []
  const warmCpu: number[] = []
  for (let i = 0; i < WARM_RUNS; i++) {
    const r = await timed(() => renderPdf(pkg))
    warm.push(r.ms)
    warmCpu.push(r.cpuMs)
  }
  const html = await renderWebDocument(pkg)
  const web = median(await Promise.all([0, 1, 2].map(async () => (await timed(() => renderWebDocument(pkg))).ms)))
  const pdfWarm = median(warm)
  console.log(`${name}: ${pages} pages, ${(cold.value.length / 1024).toFixed(0)} kB (${pkg.paper})`)
  console.log(`  pdf  cold ${fmt(cold.ms)} (cpu ${fmt(cold.cpuMs)}); warm median ${fmt(pdfWarm)} of ${WARM_RUNS} (cpu ${fmt(median(warmCpu))}; min ${fmt(Math.min(...warm))}, max ${fmt(Math.max(...warm))})`)
  console.log(`  web  warm median ${fmt(web)}; peak RSS ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB`)
  const c = await chromiumWarm(html)
  if (typeof c === 'string') console.log(`  yardstick: Chromium page.pdf() ${c}`)
  else {
    console.log(`  yardstick: Chromium page.pdf() of the same HTML, page loaded: first ${fmt(c.first)}, warm median ${fmt(c.warm)} of ${WARM_RUNS}, ${c.pages} pages`)
    console.log(`  ratio  react-pdf warm / Chromium warm = ${(pdfWarm / c.warm).toFixed(2)} (aim ≤ 1); react-pdf cold ${fmt(cold.ms)} (aim < 2000 ms for LC-001)`)
  }
}

export default async function bench(names: string[] = NAMES): Promise<void> {
  const self = fileURLToPath(import.meta.url)
  console.log(`NODE_ENV=${process.env.NODE_ENV ?? '(unset: production used)'}`)
  for (const name of names) {
    execFileSync(process.execPath, ['--import', 'tsx', self, '--one', name], {
      stdio: 'inherit',
      env: { ...process.env, NODE_ENV: process.env.NODE_ENV ?? 'production' },
    })
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const args = process.argv.slice(2)
  if (args[0] === '--one') await benchOne(args[1])
  else await bench(args.length ? args : NAMES)
}
