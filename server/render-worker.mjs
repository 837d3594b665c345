// Runs in a worker thread of the render pool (server/render-pool.ts): loads the bundled report
// pipeline once and renders package bodies and stamps, so the server's request thread stays free.
import path from 'node:path'
import { pathToFileURL } from 'node:url'

let reports
const load = () => (reports ??= import(pathToFileURL(path.join(process.cwd(), '.reports', 'index.mjs')).href))

/** @param {{ kind: 'body' | 'finish', pkg: object, body?: Uint8Array }} task */
export default async function render(task) {
  const r = await load()
  const bytes = task.kind === 'body' ? await r.renderBody(task.pkg) : await r.finishPdf(task.body, task.pkg)
  return bytes
}
