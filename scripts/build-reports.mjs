// Bundles the report pipeline (reports/index.ts) into one ESM file outside the Next bundle.
// Next 16 route handlers resolve React's server build, which react-pdf cannot use, so the app
// loads this file at run time with a plain dynamic import (app/_lib/renderer.ts).
import { build } from 'esbuild'

await build({
  entryPoints: ['reports/index.ts'],
  outfile: '.reports/index.mjs',
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  packages: 'external',
  jsx: 'automatic',
  tsconfig: 'tsconfig.json',
  logLevel: 'warning',
})
console.log('report pipeline bundled into .reports/index.mjs')
