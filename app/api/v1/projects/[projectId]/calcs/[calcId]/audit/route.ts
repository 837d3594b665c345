import { apiRoute } from '@/app/_lib/api'
import { auditCsv, calcAuditTrail } from '@/server/audit-trail'

/** The calc's audit trail: JSON, or CSV with `Accept: text/csv`. */
export const GET = apiRoute<{ projectId: string; calcId: string }>(async ({ req, caller, params }) => {
  const rows = await calcAuditTrail(caller, params.projectId, params.calcId)
  if (/\btext\/csv\b/.test(req.headers.get('accept') ?? '')) {
    return new Response(auditCsv(rows), { headers: { 'Content-Type': 'text/csv; charset=utf-8', 'Content-Disposition': 'attachment; filename="audit.csv"', 'Cache-Control': 'private, no-store' } })
  }
  return { items: rows }
})
