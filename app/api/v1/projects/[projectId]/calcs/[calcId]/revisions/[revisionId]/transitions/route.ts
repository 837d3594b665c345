import { apiRoute, readJson } from '@/app/_lib/api'
import { rendererDeps } from '@/app/_lib/renderer'
import { transitionBody } from '@/lib/schemas/api'
import { revisionJson } from '@/server/api-json'
import { getRevision, transitionRevision } from '@/server/revisions'

/**
 * One transition of the workflow table (`return`, `resubmit`, `check`, `approve`, `issue`,
 * `withdraw`, `void`): 409 from the wrong state or while remarks block it, 403 without the
 * permission, 422 for a missing password or reason.
 */
export const POST = apiRoute<{ projectId: string; calcId: string; revisionId: string }>(async ({ req, caller, params }) => {
  const { action, ...opts } = await readJson(req, transitionBody)
  await transitionRevision(caller, params.projectId, params.calcId, params.revisionId, action, await rendererDeps(), opts)
  return revisionJson((await getRevision(caller, params.projectId, params.calcId, params.revisionId)).revision)
})
