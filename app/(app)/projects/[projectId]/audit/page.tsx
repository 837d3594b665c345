import type { Metadata } from 'next'
import Link from 'next/link'
import { AuditTable } from '@/app/_components/audit-table'
import { loadProjectContext } from '@/app/_lib/project-context'
import { projectAuditTrail } from '@/server/audit-trail'

export const metadata: Metadata = { title: 'Project audit trail' }

export default async function ProjectAuditPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params
  const { user, project } = await loadProjectContext(projectId)
  const rows = await projectAuditTrail(user, projectId)
  return (
    <div className="flex flex-col gap-4">
      <Link href={`/projects/${projectId}`} className="font-mono text-xs text-accent underline">
        {project.code} register
      </Link>
      <h1 className="h1">Audit trail of {project.code}</h1>
      <AuditTable rows={rows} csvHref={`/api/v1/projects/${projectId}/audit?format=csv`} />
    </div>
  )
}
