import { apiRoute } from '@/app/_lib/api'
import { auditCsvResponse, wantsCsv } from '@/app/_lib/csv'
import { projectAuditTrail } from '@/server/audit-trail'

/** The project's audit trail: JSON, or CSV with `Accept: text/csv` or `?format=csv`. */
export const GET = apiRoute<{ projectId: string }>(async ({ req, caller, params }) => {
  const rows = await projectAuditTrail(caller, params.projectId)
  return wantsCsv(req) ? auditCsvResponse(rows) : { items: rows }
})
