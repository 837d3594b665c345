/**
 * `npm run load -- --url http://localhost:3200` — load figures against a running app (issue 13).
 *
 * Run it with the same DATABASE_URL as the app (after `npm run db:setup`, which seeds the demo):
 * it signs the demo engineer in by writing a session and an API token straight into the database,
 * then drives, one after the other, with `--connections` (50) for `--duration` seconds (10) each:
 *   - the register API      GET /api/v1/projects/:p/calcs                       (bearer token)
 *   - the calc page         GET /projects/:p/calcs/:c                          (session cookie)
 *   - the stored PDF        GET /api/v1/projects/:p/calcs/:c/revisions/:r/pdf  (A4, stored)
 *   - the same for an issued revision (each download of a sealed record is audited)
 *   - the register API again while Letter PDFs (rendered on request) run beside it (`--heavy`)
 * and prints requests/s, p50, p95, p99 and max latency and the non-2xx count of each. Several
 * `--url`s spread the connections over instances (see README, "Two instances").
 * Aims (issue 13): register p95 < 100 ms, calc page p95 < 1 s, stored PDF p95 < 200 ms, and no
 * request over 2 s while a heavy job runs.
 */
import { createRequire } from 'node:module'
import { parseArgs } from 'node:util'
import { and, desc, eq, isNotNull } from 'drizzle-orm'
import { db } from '@/db'
import { calcs, projects, revisions, users } from '@/db/schema'
import { createApiTokenForEmail } from '@/server/auth/api-tokens'
import { lucia } from '@/server/auth/lucia'
import { DEMO_PROJECT, DEMO_USERS } from '@/server/demo/demo-data'

interface Instance {
  on(event: 'response', fn: (client: unknown, status: number, bytes: number, ms: number) => void): void
}
type Autocannon = ((opts: Record<string, unknown>, done: (err: Error | null, result: { requests: { average: number }; non2xx: number; errors: number; timeouts: number }) => void) => Instance) & {
  track?: unknown
}
const autocannon = createRequire(import.meta.url)('autocannon') as Autocannon

const { values } = parseArgs({
  options: {
    url: { type: 'string', multiple: true, default: ['http://localhost:3200'] },
    connections: { type: 'string', default: '50' },
    duration: { type: 'string', default: '10' },
    only: { type: 'string' },
    heavy: { type: 'boolean', default: true },
  },
})
const urls = values.url!.map((u) => u.replace(/\/$/, ''))
const connections = Number(values.connections)
const duration = Number(values.duration)

async function fixtures() {
  const engineer = DEMO_USERS.find((u) => u.key === 'engineer')!
  const [user] = await db.select().from(users).where(eq(users.email, engineer.email))
  if (!user) throw new Error(`no demo engineer in ${process.env.DATABASE_URL}: run npm run db:setup against the app's database`)
  const [project] = await db.select().from(projects).where(eq(projects.code, DEMO_PROJECT.code))
  const [row] = await db
    .select({ calcId: calcs.id, revisionId: revisions.id })
    .from(revisions)
    .innerJoin(calcs, eq(calcs.id, revisions.calcId))
    .where(and(eq(calcs.projectId, project.id), isNotNull(revisions.pdfKey)))
    .orderBy(desc(revisions.createdAt))
    .limit(1)
  if (!row) throw new Error('no revision with a stored PDF in the demo project')
  // An issued revision too: its downloads are audited (a sealed record).
  const [issued] = await db
    .select({ calcId: calcs.id, revisionId: revisions.id })
    .from(revisions)
    .innerJoin(calcs, eq(calcs.id, revisions.calcId))
    .where(and(eq(calcs.projectId, project.id), eq(revisions.state, 'issued'), isNotNull(revisions.pdfKey)))
    .limit(1)
  const session = await lucia.createSession(user.id, {})
  const { token } = await createApiTokenForEmail(engineer.email, `load ${new Date().toISOString()}`)
  return { projectId: project.id, calcId: row.calcId, revisionId: row.revisionId, issued: issued ?? null, cookie: `${lucia.sessionCookieName}=${session.id}`, token }
}

const pct = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] : NaN)

async function run(name: string, path: string, headers: Record<string, string>, opts: { connections?: number; duration?: number } = {}) {
  const conns = opts.connections ?? connections
  const per = Math.max(1, Math.floor(conns / urls.length))
  const latencies: number[] = []
  const results = await Promise.all(
    urls.map(
      (base) =>
        new Promise<{ requests: { average: number }; non2xx: number; errors: number; timeouts: number }>((resolve, reject) => {
          const inst = autocannon({ url: base + path, connections: per, duration: opts.duration ?? duration, headers, timeout: 30 }, (err, result) => (err ? reject(err) : resolve(result)))
          inst.on('response', (_c, _s, _b, ms) => latencies.push(ms))
        }),
    ),
  )
  latencies.sort((a, b) => a - b)
  const rps = results.reduce((s, r) => s + r.requests.average, 0)
  const non2xx = results.reduce((s, r) => s + r.non2xx, 0)
  const errors = results.reduce((s, r) => s + r.errors + r.timeouts, 0)
  const line = { name, connections: per * urls.length, rps: Math.round(rps * 10) / 10, p50: Math.round(pct(latencies, 50)), p95: Math.round(pct(latencies, 95)), p99: Math.round(pct(latencies, 99)), max: Math.round(latencies.at(-1) ?? NaN), requests: latencies.length, non2xx, errors }
  console.log(`${name.padEnd(34)} ${String(line.rps).padStart(7)} req/s  p50 ${String(line.p50).padStart(5)} ms  p95 ${String(line.p95).padStart(5)} ms  p99 ${String(line.p99).padStart(5)} ms  max ${String(line.max).padStart(5)} ms  (${line.requests} requests, ${non2xx} non-2xx, ${errors} errors)`)
  return line
}

const f = await fixtures()
const bearer = { authorization: `Bearer ${f.token}` }
const base = `/api/v1/projects/${f.projectId}/calcs`
console.log(`load: ${urls.join(', ')} · ${connections} connections · ${duration} s per scenario\n`)
const all = {
  register: () => run('register API', base, bearer),
  calc: () => run('calc page', `/projects/${f.projectId}/calcs/${f.calcId}`, { cookie: f.cookie }),
  pdf: () => run('stored PDF (A4)', `${base}/${f.calcId}/revisions/${f.revisionId}/pdf`, bearer),
  issued: async () => (f.issued ? run('stored PDF (A4), issued revision', `${base}/${f.issued.calcId}/revisions/${f.issued.revisionId}/pdf`, bearer) : null),
  heavy: async () => {
    // One heavy job at a time (a Letter PDF is rendered on request) beside the register load.
    let stop = false
    let heavyDone = 0
    const heavyLoop = (async () => {
      while (!stop) {
        await fetch(`${urls[0]}${base}/${f.calcId}/revisions/${f.revisionId}/pdf?paper=LETTER`, { headers: bearer }).then((r) => r.arrayBuffer()).catch(() => undefined)
        heavyDone++
      }
    })()
    const line = await run('register API beside Letter renders', base, bearer)
    stop = true
    await heavyLoop
    console.log(`${''.padEnd(34)} (${heavyDone} Letter PDFs rendered meanwhile; aim: max under 2000 ms)`)
    return line
  },
}
const pick = values.only ? values.only.split(',') : Object.keys(all).filter((k) => k !== 'heavy' || values.heavy)
for (const k of pick) await all[k as keyof typeof all]()
process.exit(0)
