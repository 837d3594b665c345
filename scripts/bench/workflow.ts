/**
 * Sign-off speed: every workflow action on a demo calc, timed as the service runs it (what a
 * request waits for), with the real report pipeline and a temporary database. Saving for check
 * renders the package body once; every later action only stamps it.
 */
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'

export default async function workflowBench() {
  const dir = mkdtempSync(path.join(tmpdir(), 'inverso-bench-'))
  process.env.DATABASE_URL = `file:${path.join(dir, 'bench.db')}`
  process.env.SIGNING_KEY_DIR = path.join(dir, 'keys')
  process.env.SMTP_PORT = '1' // the outbox only queues; nothing is sent during the bench
  const { db } = await import('@/db')
  const { migrateDb } = await import('@/db/migrate')
  const { localFileStore } = await import('@/lib/storage')
  const { finishPdf, renderBody } = await import('@/reports')
  const { DEMO_PASSWORD } = await import('@/server/demo/demo-data')
  const { saveRevision, transitionRevision } = await import('@/server/revisions')
  const { drainRenderJobs } = await import('@/server/render-jobs')
  const { seededPeople } = await import('./workflow-seed')
  await migrateDb(db)
  const deps = { renderer: { renderBody, finishPdf }, store: localFileStore(path.join(dir, 'files')) }
  const { people, projectId, calcIds } = await seededPeople()

  const time = async <T>(fn: () => Promise<T>): Promise<[T, number]> => {
    const t = performance.now()
    const out = await fn()
    return [out, performance.now() - t]
  }
  const opts = { password: DEMO_PASSWORD, confirmMaterials: true as const, reason: 'bench' }
  const rows: string[][] = []
  // The first calc warms the template, fonts and signing key; the figures are from the others.
  for (const [i, number] of ['LC-003', 'LC-001', 'LC-002'].entries()) {
    const calcId = calcIds[number]
    const [rev, submit] = await time(() => saveRevision(people.engineer, projectId, calcId, deps, { reason: 'bench', confirmFailing: true }))
    // Off the request path in the app (render runner, worker pool); timed here for reference.
    const [, render] = await time(() => drainRenderJobs(deps))
    const steps: [string, keyof typeof people][] = [
      ['return', 'checker'],
      ['resubmit', 'engineer'],
      ['check', 'checker'],
      ['approve', 'approver'],
      ['issue', 'approver'],
      ['void', 'approver'],
    ]
    const times: number[] = []
    for (const [action, who] of steps) times.push((await time(() => transitionRevision(people[who], projectId, calcId, rev, action, deps, opts)))[1])
    if (i > 0) rows.push([number, ...[submit, render, ...times].map((ms) => ms.toFixed(0))])
  }
  console.log('workflow action, ms as the service runs it (warm; includes argon2 password checks and the PDF stamp)')
  console.log(['calc', 'save for check', '(background render)', 'return', 'resubmit', 'check', 'approve', 'issue', 'void'].join('\t'))
  for (const r of rows) console.log(r.join('\t'))
}
