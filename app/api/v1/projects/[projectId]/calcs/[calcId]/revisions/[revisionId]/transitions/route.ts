import { apiRoute, readJson } from '@/app/_lib/api'
import { rendererDeps } from '@/app/_lib/renderer'
import { transitionBody } from '@/lib/schemas/api'
import { revisionJson } from '@/server/api-json'
import { getRevision, transitionRevision } from '@/server/revisions'

/** One transition of the workflow table (`check`, `approve`, `issue`, …): 409 from the wrong state, 403 without the permission. */
export const POST = apiRoute<{ projectId: string; calcId: string; revisionId: string }>(async ({ req, caller, params }) => {
  const body = await readJson(req, transitionBody)
  await transitionRevision(caller, params.projectId, params.calcId, params.revisionId, body.action, await rendererDeps())
  return revisionJson((await getRevision(caller, params.projectId, params.calcId, params.revisionId)).revision)
})
