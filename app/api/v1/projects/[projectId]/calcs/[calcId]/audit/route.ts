import { apiRoute } from '@/app/_lib/api'
import { auditCsvResponse, wantsCsv } from '@/app/_lib/csv'
import { calcAuditTrail } from '@/server/audit-trail'

/** The calc's audit trail: JSON, or CSV with `Accept: text/csv` or `?format=csv`. */
export const GET = apiRoute<{ projectId: string; calcId: string }>(async ({ req, caller, params }) => {
  const rows = await calcAuditTrail(caller, params.projectId, params.calcId)
  return wantsCsv(req) ? auditCsvResponse(rows) : { items: rows }
})
