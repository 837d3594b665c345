/**
 * An app process for tests/security/kill-during-save.test.ts: saves revisions of one calc, one after
 * another, printing "saved" after each, until the test kills it (SIGKILL) somewhere in the middle.
 */
import type { Caller } from '@/server/access'
import { saveRevision, type RevisionDeps } from '@/server/revisions'

const [caller, projectId, calcId] = [JSON.parse(process.argv[2]) as Caller, process.argv[3], process.argv[4]]
const deps: RevisionDeps = {
  renderer: { renderBody: async () => new Uint8Array([37, 80, 68, 70]), finishPdf: async (b) => b },
  store: { put: async () => {}, get: async () => new Uint8Array([37, 80, 68, 70]) },
}

async function main() {
  for (let i = 0; ; i++) {
    await saveRevision(caller, projectId, calcId, deps, { reason: `save ${i} before the crash`, confirmFailing: true })
    process.stdout.write('saved\n')
  }
}

main().catch((err) => {
  process.stderr.write(`${err instanceof Error ? err.stack : String(err)}\n`)
  process.exit(1)
})
