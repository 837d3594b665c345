// Bundles the report pipeline (reports/index.ts) into one ESM file outside the Next bundle.
// Next 16 route handlers resolve React's server build, which react-pdf cannot use, so the app
// loads this file at run time with a plain dynamic import (app/_lib/renderer.ts).
//
//   node scripts/build-reports.mjs                  build once (npm run build)
//   node scripts/build-reports.mjs --watch          build, then rebuild whenever a bundled file changes
//   node scripts/build-reports.mjs --watch -- CMD…  the same, running CMD (e.g. `next dev`) alongside;
//                                                   stops watching when CMD exits (npm run dev)
//
// Templates (reports/mechanisms/*/template.mdx) are not bundled: the pipeline reads them on every
// render, so an edited template shows on the next page load without a rebuild.
import { spawn } from 'node:child_process'
import { build, context } from 'esbuild'

const OUT = '.reports/index.mjs'
const options = {
  entryPoints: ['reports/index.ts'],
  outfile: OUT,
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  packages: 'external',
  jsx: 'automatic',
  tsconfig: 'tsconfig.json',
  logLevel: 'warning',
}

const args = process.argv.slice(2)
const watch = args.includes('--watch')
const dash = args.indexOf('--')
const command = dash >= 0 ? args.slice(dash + 1) : []

if (!watch) {
  await build(options)
  console.log(`report pipeline bundled into ${OUT}`)
} else {
  let first = true
  let firstDone
  const firstBuild = new Promise((resolve) => (firstDone = resolve))
  const ctx = await context({
    ...options,
    plugins: [
      {
        name: 'report-log',
        setup(b) {
          b.onEnd((result) => {
            const when = new Date().toLocaleTimeString()
            if (result.errors.length) console.log(`[reports] ${when} rebuild failed (${result.errors.length} errors); the previous bundle stays`)
            else console.log(`[reports] ${when} ${first ? 'bundled' : 'rebuilt'} ${OUT}`)
            first = false
            firstDone()
          })
        },
      },
    ],
  })
  // watch() starts with a full build; CMD starts after it, so the app never starts without a bundle.
  await ctx.watch()
  await firstBuild
  if (command.length === 0) {
    console.log('[reports] watching for changes (Ctrl+C to stop)')
  } else {
    const child = spawn(command[0], command.slice(1), { stdio: 'inherit' })
    const stop = (signal) => () => child.kill(signal)
    process.on('SIGINT', stop('SIGINT'))
    process.on('SIGTERM', stop('SIGTERM'))
    child.on('exit', async (code, signal) => {
      await ctx.dispose()
      process.exit(code ?? (signal ? 1 : 0))
    })
    child.on('error', async (err) => {
      console.error(`[reports] cannot start ${command[0]}: ${err.message}`)
      await ctx.dispose()
      process.exit(1)
    })
  }
}
