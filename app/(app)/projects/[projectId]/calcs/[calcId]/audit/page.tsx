import type { Metadata } from 'next'
import Link from 'next/link'
import { AuditTable } from '@/app/_components/audit-table'
import { loadProjectContext } from '@/app/_lib/project-context'
import { calcAuditTrail } from '@/server/audit-trail'

export const metadata: Metadata = { title: 'Audit trail' }

export default async function CalcAuditPage({ params }: { params: Promise<{ projectId: string; calcId: string }> }) {
  const { projectId, calcId } = await params
  const { user } = await loadProjectContext(projectId)
  const rows = await calcAuditTrail(user, projectId, calcId)
  return (
    <div className="flex flex-col gap-4">
      <Link href={`/projects/${projectId}/calcs/${calcId}`} className="font-mono text-xs text-accent underline">
        back to the calc
      </Link>
      <h1 className="h1">Audit trail of the calc</h1>
      <AuditTable rows={rows} csvHref={`/api/v1/projects/${projectId}/calcs/${calcId}/audit?format=csv`} />
    </div>
  )
}
