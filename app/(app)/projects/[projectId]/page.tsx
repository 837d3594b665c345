import type { Metadata } from 'next'
import Link from 'next/link'
import { loadProjectContext } from '@/app/_lib/project-context'
import { can } from '@/lib/review/permissions'
import { ROLE_LABELS } from '@/lib/review/roles'
import { nextCalcNumber } from '@/server/calcs'
import { CreateCalcForm, ImportCalcForm } from './create-calc-form'
import { RegisterTable } from './register-table'
import { ProjectSearch } from './search-box'

export const metadata: Metadata = { title: 'Calc register' }

export default async function ProjectPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params
  const { project, actor, user } = await loadProjectContext(projectId)
  const canCreate = can(actor, 'calc.create')
  const proposed = canCreate ? await nextCalcNumber(user, projectId) : ''
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <div className="font-mono text-xs text-accent">{project.code}</div>
          <h1 className="h1">{project.name}</h1>
          <div className="text-xs text-ink/80">
            {project.client} · you are {actor.role ? ROLE_LABELS[actor.role] : 'site administrator'}
          </div>
        </div>
        <div className="ml-auto flex gap-2">
          {canCreate && (
            <Link href={`/projects/${projectId}/size`} className="btn-quiet">
              Size a cell
            </Link>
          )}
          <Link href={`/projects/${projectId}/materials`} className="btn-quiet">
            Materials
          </Link>
          {can(actor, 'member.manage') && (
            <Link href={`/projects/${projectId}/members`} className="btn-quiet" data-testid="manage-members">
              Members
            </Link>
          )}
        </div>
      </div>
      <section className="flex flex-col gap-2">
        <h2 className="h2">Calc register</h2>
        <RegisterTable projectId={projectId} />
      </section>
      <ProjectSearch projectId={projectId} />
      {canCreate && <CreateCalcForm projectId={projectId} proposedNumber={proposed} />}
      {canCreate && <ImportCalcForm projectId={projectId} />}
    </div>
  )
}
