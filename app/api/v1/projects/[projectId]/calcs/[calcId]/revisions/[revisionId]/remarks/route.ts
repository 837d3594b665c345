import { apiRoute, created, readJson } from '@/app/_lib/api'
import { remarkBody } from '@/lib/schemas/api'
import { remarkJson } from '@/server/api-json'
import { addRemark, listRemarks } from '@/server/remarks'

type P = { projectId: string; calcId: string; revisionId: string }

export const GET = apiRoute<P>(async ({ caller, params }) => ({
  items: (await listRemarks(caller, params.projectId, params.calcId, params.revisionId)).map(remarkJson),
}))

/** A checker's remark on a step of the revision. */
export const POST = apiRoute<P>(async ({ req, caller, params }) => {
  const body = await readJson(req, remarkBody)
  const id = await addRemark(caller, params.projectId, params.calcId, { revisionId: params.revisionId, ...body })
  const rows = await listRemarks(caller, params.projectId, params.calcId, params.revisionId)
  return created(remarkJson(rows.find((r) => r.id === id)!))
})
