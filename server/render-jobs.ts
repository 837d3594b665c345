import { and, asc, eq, inArray, isNull, lt, or } from 'drizzle-orm'
import { db, type Tx } from '@/db'
import { renderJobs, revisions } from '@/db/schema'
import { sha256Hex } from '@/lib/calc/hash'
import { INSTANCE_ID } from './mail/outbox'
import { bodyKey, type RevisionDeps } from './package-deps'
import { packageToRender } from './report-package'

/*
 * Saving a revision only writes it; its package is rendered here, off the request path: the body
 * once (react-pdf, in the app's worker pool), then stamped for its state. Until then the revision
 * shows "package being prepared" and cannot be signed. A job is claimed with one conditional UPDATE
 * for a limited time, so with several instances one renders it, and a crash mid-render leaves a
 * claim that runs out and is taken over.
 */

export const MAX_RENDER_ATTEMPTS = 3
const CLAIM_MS = 5 * 60_000

/** Queues the package of a revision, in the transaction that writes it; call `kickRenderRunner` after commit. */
export async function enqueueRender(tx: Tx, revisionId: string) {
  await tx.insert(renderJobs).values({ revisionId })
}

/** Where each revision's package stands, for the revision panel. */
export async function renderStatus(revisionIds: string[]) {
  if (revisionIds.length === 0) return new Map<string, { state: string; stage: string | null; error: string | null }>()
  const rows = await db
    .select({ revisionId: renderJobs.revisionId, state: renderJobs.state, stage: renderJobs.stage, error: renderJobs.error })
    .from(renderJobs)
    .where(inArray(renderJobs.revisionId, revisionIds))
    .orderBy(asc(renderJobs.id))
  return new Map(rows.map((r) => [r.revisionId, { state: r.state, stage: r.stage, error: r.error }]))
}

async function stage(id: number, text: string) {
  await db.update(renderJobs).set({ stage: text }).where(eq(renderJobs.id, id))
}

async function runOne(job: { id: number; revisionId: string; attempts: number }, deps: RevisionDeps) {
  const [rev] = await db.select().from(revisions).where(eq(revisions.id, job.revisionId))
  const others = await db.select().from(revisions).where(eq(revisions.calcId, rev.calcId))
  const pkg = await packageToRender(rev, others, deps.store)
  await stage(job.id, 'rendering the package body')
  const body = await deps.renderer.renderBody(pkg)
  await deps.store.put(bodyKey(rev.id), body)
  await stage(job.id, 'stamping the sign-off')
  const pdf = await deps.renderer.finishPdf(body, pkg)
  const pdfHash = sha256Hex(pdf)
  const pdfKey = `pdf/${pdfHash}.pdf`
  await deps.store.put(pdfKey, pdf)
  await db.transaction(async (tx) => {
    // Only a revision still without its package gets this one (a sealed row refuses any change anyway).
    await tx.update(revisions).set({ pdfKey, pdfHash }).where(and(eq(revisions.id, rev.id), isNull(revisions.pdfKey)))
    await tx.update(renderJobs).set({ state: 'done', stage: null, finishedAt: new Date(), claimedUntil: null }).where(eq(renderJobs.id, job.id))
  })
}

/** Renders every due package once (the server runs this on an interval; tests call it). */
export async function drainRenderJobs(deps: RevisionDeps, opts: { instanceId?: string; now?: Date } = {}) {
  const me = opts.instanceId ?? INSTANCE_ID
  let done = 0
  for (;;) {
    const now = opts.now ?? new Date()
    const [due] = await db
      .select({ id: renderJobs.id, revisionId: renderJobs.revisionId, attempts: renderJobs.attempts })
      .from(renderJobs)
      .where(or(eq(renderJobs.state, 'queued'), and(eq(renderJobs.state, 'running'), lt(renderJobs.claimedUntil, now))))
      .orderBy(asc(renderJobs.id))
      .limit(1)
    if (!due) return done
    const claimed = await db
      .update(renderJobs)
      .set({ state: 'running', claimedBy: me, claimedUntil: new Date(now.getTime() + CLAIM_MS), attempts: due.attempts + 1, stage: 'starting' })
      .where(and(eq(renderJobs.id, due.id), or(eq(renderJobs.state, 'queued'), and(eq(renderJobs.state, 'running'), lt(renderJobs.claimedUntil, now)))))
    if (claimed.rowsAffected === 0) continue
    try {
      await runOne(due, deps)
      done += 1
    } catch (err) {
      console.error('[render] package of revision', due.revisionId, 'failed', err)
      const last = due.attempts + 1 >= MAX_RENDER_ATTEMPTS
      await db
        .update(renderJobs)
        .set({ state: last ? 'failed' : 'queued', stage: null, claimedUntil: null, error: err instanceof Error ? err.message.slice(0, 500) : String(err) })
        .where(eq(renderJobs.id, due.id))
    }
  }
}

const loop = globalThis as unknown as { __inversoRender?: { deps: RevisionDeps; running: boolean; again: boolean; timer?: NodeJS.Timeout } }

export function kickRenderRunner() {
  kick()
}

function kick() {
  const s = loop.__inversoRender
  if (!s) return
  if (s.running) {
    s.again = true
    return
  }
  s.running = true
  void drainRenderJobs(s.deps)
    .catch((err: unknown) => console.error('[render] runner', err))
    .finally(() => {
      s.running = false
      if (s.again) {
        s.again = false
        kick()
      }
    })
}

/** Starts this process's render runner: at once when a save enqueues a job, and every few seconds for claims left by others. */
export function startRenderRunner(deps: RevisionDeps, intervalMs = 5000) {
  if (loop.__inversoRender) return
  loop.__inversoRender = { deps, running: false, again: false }
  loop.__inversoRender.timer = setInterval(kick, intervalMs)
  loop.__inversoRender.timer.unref()
  kick()
}
