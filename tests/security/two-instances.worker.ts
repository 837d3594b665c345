/**
 * A second app instance for tests/security/two-instances.test.ts: its own process and its own
 * connection to the same SQLite file (DATABASE_URL). Says "ready", waits for "go" on stdin, then
 * drains the render jobs and the mail outbox under its own instance id, as the server's runners
 * do, and prints one JSON line with what it rendered and sent.
 */
import { createInterface } from 'node:readline'
import { dbClient } from '@/db'
import { drainOutbox } from '@/server/mail/outbox'
import { drainRenderJobs } from '@/server/render-jobs'
import type { RevisionDeps } from '@/server/revisions'

const instanceId = process.argv[2] ?? 'B'
const rendered: string[] = []
const sent: string[] = []
const pause = (ms: number) => new Promise((r) => setTimeout(r, ms))
const deps: RevisionDeps = {
  renderer: {
    renderBody: async () => {
      await pause(30)
      return new Uint8Array([37, 80, 68, 70])
    },
    finishPdf: async (b) => b,
  },
  store: {
    put: async (key: string) => {
      if (key.startsWith('bodies/')) rendered.push(key.slice('bodies/'.length, -'.pdf'.length))
    },
    get: async () => new Uint8Array([37, 80, 68, 70]),
  },
}

async function main() {
  await dbClient().execute('select 1')
  process.stdout.write('ready\n')
  const lines = createInterface({ input: process.stdin })
  for await (const line of lines) if (line.trim() === 'go') break
  const [renders, mail] = await Promise.all([
    drainRenderJobs(deps, { instanceId }),
    drainOutbox({
      instanceId,
      limit: 1000,
      sender: {
        send: async (m) => {
          await pause(10)
          sent.push(m.to)
        },
        close: () => undefined,
      },
    }),
  ])
  process.stdout.write(`${JSON.stringify({ instanceId, renders, mail, rendered, sent })}\n`)
  process.exit(0)
}

main().catch((err) => {
  process.stderr.write(`${err instanceof Error ? err.stack : String(err)}\n`)
  process.exit(1)
})
