import os from 'node:os'
import path from 'node:path'
import { Piscina } from 'piscina'
import type { ReportPackage } from '@/reports/types'
import type { ReportRenderer } from './package-deps'

/*
 * Package renders run in worker threads, never on the request thread: a pool sized to leave a core
 * for requests, a queue in front of it, and a time and memory budget per render. A render that
 * runs out of either fails alone; the pool replaces the worker.
 */
const RENDER_TIMEOUT_MS = Number(process.env.RENDER_TIMEOUT_MS || 60_000)
const RENDER_MEMORY_MB = Number(process.env.RENDER_MEMORY_MB || 768)

let pool: Piscina | null = null

function renderPool(): Piscina {
  pool ??= new Piscina({
    filename: path.join(/*turbopackIgnore: true*/ process.cwd(), 'server', 'render-worker.mjs'),
    minThreads: 1,
    maxThreads: Math.max(1, Math.min(2, os.availableParallelism() - 1)),
    maxQueue: 200,
    idleTimeout: 60_000,
    resourceLimits: { maxOldGenerationSizeMb: RENDER_MEMORY_MB },
  })
  return pool
}

async function run(task: { kind: 'body' | 'finish'; pkg: ReportPackage; body?: Uint8Array }): Promise<Uint8Array> {
  const out = (await renderPool().run(task, { signal: AbortSignal.timeout(RENDER_TIMEOUT_MS) })) as Uint8Array
  return new Uint8Array(out.buffer, out.byteOffset, out.byteLength)
}

/** The report renderer the app uses: the same pipeline as in tests, in the worker pool. */
export const pooledRenderer: ReportRenderer = {
  renderBody: (pkg) => run({ kind: 'body', pkg }),
  finishPdf: (body, pkg) => run({ kind: 'finish', pkg, body }),
}
