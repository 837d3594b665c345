/**
 * Issue 13: kill the server during a save and find no incomplete revision after restart. A child
 * process saves revisions of one calc in a loop and is killed with SIGKILL in the middle of one;
 * then every revision on record is whole (its render job is there, exactly one is open, the rest
 * superseded) and, once the jobs run, every one has its package. A save is one transaction
 * (server/revisions.ts); the package is rendered after it, by a job that survives the crash.
 */
import { spawn } from 'node:child_process'
import { createInterface } from 'node:readline'
import { eq, inArray } from 'drizzle-orm'
import { describe, expect, it } from 'vitest'
import { db } from '@/db'
import { renderJobs, revisions } from '@/db/schema'
import { drainRenderJobs } from '@/server/render-jobs'
import type { RevisionDeps } from '@/server/revisions'
import { useSeededDemo } from '../helpers/demo'

const demo = useSeededDemo()

const fake: RevisionDeps = {
  renderer: { renderBody: async () => new Uint8Array([37, 80, 68, 70]), finishPdf: async (b) => b },
  store: { put: async () => {}, get: async () => new Uint8Array([37, 80, 68, 70]) },
}

describe('a crash in the middle of a save', () => {
  it('leaves only whole revisions, each of which gets its package', async () => {
    const calcId = await demo.calcId('LC-003')
    // Node itself (not npx, whose child would outlive the kill), with tsx as its loader.
    const child = spawn(process.execPath, ['--import', 'tsx', 'tests/security/kill-during-save.worker.ts', JSON.stringify(demo.people.engineer), demo.projectId, calcId], { env: { ...process.env }, stdio: ['ignore', 'pipe', 'pipe'] })
    let stderr = ''
    child.stderr.on('data', (d) => (stderr += String(d)))
    let saved = 0
    for await (const line of createInterface({ input: child.stdout })) {
      if (line === 'saved') saved++
      // Kill it a moment into the next save, at a different point each run.
      if (saved === 4) {
        await new Promise((r) => setTimeout(r, Math.random() * 40))
        child.kill('SIGKILL')
        break
      }
    }
    await new Promise((r) => (child.exitCode !== null || child.signalCode ? r(null) : child.on('exit', r)))
    expect(saved, stderr).toBe(4)
    const revs = await db.select().from(revisions).where(eq(revisions.calcId, calcId))
    // Four saves finished; a fifth was either committed whole or not at all.
    expect(revs.length === 4 || revs.length === 5).toBe(true)
    expect(revs.filter((r) => r.state === 'in-check')).toHaveLength(1)
    expect(revs.filter((r) => r.state !== 'in-check').every((r) => r.state === 'superseded')).toBe(true)
    const jobs = await db.select().from(renderJobs).where(inArray(renderJobs.revisionId, revs.map((r) => r.id)))
    expect(new Set(jobs.map((j) => j.revisionId))).toEqual(new Set(revs.map((r) => r.id)))
    // After the restart the runner renders them all, superseded ones included.
    await drainRenderJobs(fake)
    const after = await db.select().from(revisions).where(eq(revisions.calcId, calcId))
    expect(after.every((r) => r.pdfKey && r.pdfHash)).toBe(true)
  }, 120_000)
})
