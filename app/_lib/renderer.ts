import 'server-only'
import path from 'node:path'
import { pathToFileURL } from 'node:url'
import { localFileStore } from '@/lib/storage'
import type { RevisionDeps } from '@/server/revisions'

type ReportsModule = typeof import('@/reports')

let loaded: Promise<ReportsModule> | null = null

/**
 * The report pipeline runs outside the Next bundle (react-pdf cannot use React's server build that
 * route handlers resolve): `npm run build` bundles reports/ into .reports/index.mjs, loaded here.
 */
export function reports(): Promise<ReportsModule> {
  loaded ??= import(/* turbopackIgnore: true */ /* webpackIgnore: true */ pathToFileURL(path.join(process.cwd(), '.reports', 'index.mjs')).href) as Promise<ReportsModule>
  return loaded
}

export async function rendererDeps(): Promise<RevisionDeps> {
  const r = await reports()
  return { renderer: { renderPdf: (pkg) => r.renderPdf(pkg) }, store: localFileStore() }
}
