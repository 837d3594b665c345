import { apiRoute } from '@/app/_lib/api'
import { revisionJson } from '@/server/api-json'
import { getRevision } from '@/server/revisions'

/** Inputs, result, state, signatures and hashes of one revision. */
export const GET = apiRoute<{ projectId: string; calcId: string; revisionId: string }>(async ({ caller, params }) =>
  revisionJson((await getRevision(caller, params.projectId, params.calcId, params.revisionId)).revision),
)
