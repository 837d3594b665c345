import { auditCsv, type AuditRow } from '@/server/audit-trail'

export const wantsCsv = (req: Request) => /\btext\/csv\b/.test(req.headers.get('accept') ?? '') || new URL(req.url).searchParams.get('format') === 'csv'

export function auditCsvResponse(rows: AuditRow[]) {
  return new Response(auditCsv(rows), {
    headers: { 'Content-Type': 'text/csv; charset=utf-8', 'Content-Disposition': 'attachment; filename="audit.csv"', 'Cache-Control': 'private, no-store' },
  })
}
