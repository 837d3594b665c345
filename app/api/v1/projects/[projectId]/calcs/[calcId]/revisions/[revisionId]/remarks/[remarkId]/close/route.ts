import { apiRoute } from '@/app/_lib/api'
import { remarkJson } from '@/server/api-json'
import { closeRemark, listRemarks } from '@/server/remarks'

/** The checker closes a remark. */
export const POST = apiRoute<{ projectId: string; calcId: string; revisionId: string; remarkId: string }>(async ({ caller, params }) => {
  await closeRemark(caller, params.projectId, params.calcId, params.remarkId)
  const rows = await listRemarks(caller, params.projectId, params.calcId, params.revisionId)
  return remarkJson(rows.find((r) => r.id === params.remarkId)!)
})
