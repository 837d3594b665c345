/**
 * The calc page's first view on the demo calcs: HTML bytes and server time (first request, then the
 * median of five), against the built app (`npm run build` first) on a fresh seeded database. The
 * goal: under 300 kB of HTML and under 500 ms. Signs in as the demo engineer in headless Chromium,
 * then times plain GETs of each calc page over localhost (transfer on loopback is negligible).
 * Alone: `tsx scripts/bench/calc-page.ts`.
 */
import { spawn, spawnSync } from 'node:child_process'
import { existsSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { chromium } from 'playwright-core'

const PORT = 3411
const base = `http://localhost:${PORT}`

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]

async function waitFor(url: string, ms: number) {
  const end = Date.now() + ms
  while (Date.now() < end) {
    try {
      if ((await fetch(url)).ok) return
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 300))
  }
  throw new Error(`${url} did not answer within ${ms / 1000} s`)
}

export default async function calcPageBench() {
  if (!existsSync('.next/BUILD_ID')) {
    console.log('calc page: skipped (no build; run `npm run build` first)')
    return
  }
  const dir = mkdtempSync(join(tmpdir(), 'inverso-page-bench-'))
  const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: 'production', DATABASE_URL: `file:${join(dir, 'bench.db')}`, SIGNING_KEY_DIR: join(dir, 'keys'), FILE_STORE_DIR: join(dir, 'files'), MAIL_FAKE_DIR: join(dir, 'mail'), APP_URL: base } as NodeJS.ProcessEnv
  const setup = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/setup-db.ts'], { env, stdio: 'ignore' })
  if (setup.status !== 0) throw new Error('seeding the bench database failed')
  const app = spawn('node_modules/.bin/next', ['start', '-p', String(PORT)], { env, stdio: 'ignore' })
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu'] })
  try {
    await waitFor(`${base}/sign-in`, 60_000)
    const page = await (await browser.newContext()).newPage()
    await page.goto(`${base}/sign-in`)
    await page.getByLabel('E-mail').fill('ines.vogt@feldmark.example')
    await page.getByLabel('Password').fill('demo-pass-2027')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(/\/projects$/)
    await page.getByRole('link', { name: /Carton erector/ }).click()
    await page.getByTestId('register').getByRole('link', { name: 'LC-001' }).waitFor()
    const calcs = await page.getByTestId('register').locator('a[href*="/calcs/"]').evaluateAll((as) => as.map((a) => [a.textContent ?? '', (a as HTMLAnchorElement).href]))
    console.log('calc page first view (HTML of the page itself; package, scripts and styles load after)')
    for (const [name, url] of calcs) {
      const times: number[] = []
      let bytes = 0
      for (let i = 0; i < 6; i++) {
        const t0 = performance.now()
        const res = await page.request.get(url)
        bytes = (await res.body()).length
        times.push(performance.now() - t0)
      }
      const [first, ...warm] = times
      const ok = bytes < 300 * 1024 && median(warm) < 500 ? 'ok' : 'OVER'
      console.log(`  ${name}: ${(bytes / 1024).toFixed(0)} kB HTML, first ${Math.round(first)} ms, then median ${Math.round(median(warm))} ms (${ok}: < 300 kB, < 500 ms)`)
    }
  } finally {
    await browser.close()
    app.kill('SIGTERM')
    rmSync(dir, { recursive: true, force: true })
  }
}

if (import.meta.url === `file://${process.argv[1]}`) await calcPageBench()
