import { apiRoute, created, readJson } from '@/app/_lib/api'
import { replyBody } from '@/lib/schemas/api'
import { remarkJson } from '@/server/api-json'
import { listRemarks, replyToRemark } from '@/server/remarks'

/** A reply in the remark's thread; an engineer's reply marks the remark answered. */
export const POST = apiRoute<{ projectId: string; calcId: string; revisionId: string; remarkId: string }>(async ({ req, caller, params }) => {
  const body = await readJson(req, replyBody)
  await replyToRemark(caller, params.projectId, params.calcId, params.remarkId, body.text)
  const rows = await listRemarks(caller, params.projectId, params.calcId, params.revisionId)
  return created(remarkJson(rows.find((r) => r.id === params.remarkId)!))
})
