/**
 * Issue 13, "Two instances": two app processes on one SQLite file (WAL) each run the render-job
 * runner and the mail outbox sender. Every job and every mail is taken by one instance only: each
 * package body is rendered exactly once and each mail sent exactly once, whichever instance wins
 * each claim (the conditional UPDATE of server/render-jobs.ts and server/mail/outbox.ts).
 * Instance A is this test process; instance B is a child process with its own connection.
 */
import { spawn } from 'node:child_process'
import { createInterface } from 'node:readline'
import { inArray, isNull } from 'drizzle-orm'
import { describe, expect, it } from 'vitest'
import { db } from '@/db'
import { outbox, renderJobs, revisions } from '@/db/schema'
import { DEMO_CALCS } from '@/server/demo/demo-data'
import { drainOutbox, enqueueMail } from '@/server/mail/outbox'
import { drainRenderJobs } from '@/server/render-jobs'
import { createCalc } from '@/server/calcs'
import { saveRevision, type RevisionDeps } from '@/server/revisions'
import { useSeededDemo } from '../helpers/demo'

const demo = useSeededDemo()

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms))

/** Starts instance B and resolves once it has opened the database; `go()` starts its drains, `result` is its report. */
async function startInstanceB() {
  const child = spawn('npx', ['tsx', 'tests/security/two-instances.worker.ts', 'B'], { env: { ...process.env }, stdio: ['pipe', 'pipe', 'pipe'] })
  let stderr = ''
  child.stderr.on('data', (d) => (stderr += String(d)))
  const lines = createInterface({ input: child.stdout })
  const it = lines[Symbol.asyncIterator]()
  const first = await it.next()
  if (first.value !== 'ready') throw new Error(`instance B did not start: ${first.value ?? ''} ${stderr}`)
  const result = (async () => {
    const next = await it.next()
    const code = await new Promise<number | null>((r) => (child.exitCode !== null ? r(child.exitCode) : child.on('exit', r)))
    if (code !== 0 || !next.value) throw new Error(`instance B failed (exit ${code}): ${stderr}`)
    return JSON.parse(next.value) as { renders: number; mail: { sent: number }; rendered: string[]; sent: string[] }
  })()
  return { go: () => child.stdin.write('go\n'), result }
}

describe('two instances on one database', () => {
  it('each render job and each mail is done exactly once', async () => {
    // Work for both: one revision of each of a dozen calcs (each save queues a render job), and mail.
    // One per calc: a later save would supersede a revision whose package is still queued.
    const ids = await Promise.all(DEMO_CALCS.map((c) => demo.calcId(c.number)))
    for (let i = 0; i < 9; i++) ids.push((await createCalc(demo.people.engineer, demo.projectId, { number: `TWO-${i}`, title: `Two instances ${i}`, calcType: i % 2 ? 'hart' : 'peaucellier' })).id)
    const saved: string[] = []
    for (const id of ids) saved.push(await saveRevision(demo.people.engineer, demo.projectId, id, A.deps, { reason: 'two instances', confirmFailing: true }))
    for (let i = 0; i < 40; i++) await enqueueMail({ to: `instance${i}@feldmark.example`, subject: `Two instances ${i}`, text: 'x' })
    const jobs = await db.select().from(renderJobs).where(inArray(renderJobs.revisionId, saved))
    expect(jobs).toHaveLength(saved.length)
    const mails = await db.select({ id: outbox.id, to: outbox.to }).from(outbox).where(isNull(outbox.sentAt))
    expect(mails.length).toBeGreaterThanOrEqual(40)

    const b = await startInstanceB()
    b.go()
    await pause(20)
    const [rendersA, mailA] = await Promise.all([drainRenderJobs(A.deps, { instanceId: 'A' }), drainOutbox({ instanceId: 'A', limit: 1000, sender: A.sender })])
    const fromB = await b.result

    // Every job rendered once, by one of the two; none twice, none left.
    const all = [...A.rendered, ...fromB.rendered]
    expect(new Set(all).size).toBe(all.length)
    expect(new Set(all)).toEqual(new Set(saved))
    expect(rendersA + fromB.renders).toBe(saved.length)
    for (const job of await db.select().from(renderJobs).where(inArray(renderJobs.revisionId, saved))) {
      expect(job.state).toBe('done')
      expect(job.attempts).toBe(1)
      expect(['A', 'B']).toContain(job.claimedBy)
    }
    const revs = await db.select({ id: revisions.id, pdfKey: revisions.pdfKey }).from(revisions).where(inArray(revisions.id, saved))
    for (const r of revs) expect(r.pdfKey).toBeTruthy()

    // Every mail sent once, by one of the two; none twice, none left.
    const sent = [...A.sent, ...fromB.sent]
    expect(sent.length).toBe(mails.length)
    expect(new Set(sent).size).toBe(new Set(mails.map((m) => m.to)).size)
    expect(mailA.sent + fromB.mail.sent).toBe(mails.length)
    expect(await db.select().from(outbox).where(isNull(outbox.sentAt))).toHaveLength(0)

    // Both instances took part (the work is spread, not merely serialised by one of them).
    console.log(`instance A rendered ${rendersA} and sent ${mailA.sent}; instance B rendered ${fromB.renders} and sent ${fromB.mail.sent}`)
  }, 120_000)
})

/** Instance A: this process, with a renderer and a mail sender that record what they did. */
const A = {
  rendered: [] as string[],
  sent: [] as string[],
  deps: {} as RevisionDeps,
  sender: {
    send: async (m: { to: string }) => {
      await pause(10)
      A.sent.push(m.to)
    },
    close: () => undefined,
  },
}
A.deps = {
  renderer: {
    renderBody: async () => {
      await pause(30)
      return new Uint8Array([37, 80, 68, 70])
    },
    finishPdf: async (b) => b,
  },
  store: {
    put: async (key: string) => {
      if (key.startsWith('bodies/')) A.rendered.push(key.slice('bodies/'.length, -'.pdf'.length))
    },
    get: async () => new Uint8Array([37, 80, 68, 70]),
  },
}
