import 'server-only'
import { statSync } from 'node:fs'
import path from 'node:path'
import { pathToFileURL } from 'node:url'
import { localFileStore } from '@/lib/storage'
import { pooledRenderer } from '@/server/render-pool'
import type { RevisionDeps } from '@/server/revisions'

type ReportsModule = typeof import('@/reports')

let loaded: { promise: Promise<ReportsModule>; mtimeMs: number } | null = null

/**
 * The report pipeline runs outside the Next bundle (react-pdf cannot use React's server build that
 * route handlers resolve): `npm run build` bundles reports/ into .reports/index.mjs, loaded here.
 * In development `npm run dev` rebuilds that file when reports/ changes; a changed file is imported
 * again (a new URL per modification time, since Node caches modules by URL).
 */
export function reports(): Promise<ReportsModule> {
  const file = path.join(process.cwd(), '.reports', 'index.mjs')
  const dev = process.env.NODE_ENV === 'development'
  const mtimeMs = dev ? bundleMtime(file) : 0
  if (!loaded || (dev && loaded.mtimeMs !== mtimeMs)) {
    const url = pathToFileURL(file).href + (dev ? `?v=${mtimeMs}` : '')
    const promise = import(/* turbopackIgnore: true */ /* webpackIgnore: true */ url) as Promise<ReportsModule>
    promise.catch(() => {
      if (loaded?.promise === promise) loaded = null
    })
    loaded = { promise, mtimeMs }
  }
  return loaded.promise
}

function bundleMtime(file: string): number {
  try {
    return statSync(file).mtimeMs
  } catch {
    throw new Error(`${file} is missing: start the app with \`npm run dev\`, which bundles reports/ first (or run \`node scripts/build-reports.mjs\`).`)
  }
}

/** Package renders and stamps run in the worker pool (server/render-pool.ts), never on the request thread. */
export async function rendererDeps(): Promise<RevisionDeps> {
  return { renderer: pooledRenderer, store: localFileStore() }
}
