import type { Metadata } from 'next'
import Link from 'next/link'
import { notFound } from 'next/navigation'
import { loadProjectContext } from '@/app/_lib/project-context'
import { listMembers } from '@/server/members'
import { can } from '@/lib/review/permissions'
import { ROLE_LABELS } from '@/lib/review/roles'
import { InviteForm } from './invite-form'
import { MemberRowActions } from './member-row-actions'

export const metadata: Metadata = { title: 'Members' }

export default async function MembersPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params
  const { user, project, actor } = await loadProjectContext(projectId)
  if (!can(actor, 'member.manage')) notFound()
  const members = await listMembers(user, projectId)
  return (
    <div className="flex flex-col gap-5">
      <div>
        <Link href={`/projects/${projectId}`} className="font-mono text-xs text-accent underline">
          {project.code}
        </Link>
        <h1 className="h1">Members of {project.name}</h1>
      </div>
      <table className="panel w-full text-left text-sm">
        <thead className="bg-paper text-xs text-ink/70">
          <tr>
            <th className="px-3 py-2">Name</th>
            <th className="px-3 py-2">E-mail</th>
            <th className="px-3 py-2">Role</th>
            <th className="px-3 py-2">Account</th>
            <th className="px-3 py-2">Change</th>
          </tr>
        </thead>
        <tbody>
          {members.map((m) => (
            <tr key={m.userId} className="border-t border-rule">
              <td className="px-3 py-1.5">{m.name}</td>
              <td className="px-3 py-1.5 font-mono text-xs">{m.email}</td>
              <td className="px-3 py-1.5">{ROLE_LABELS[m.role]}</td>
              <td className="px-3 py-1.5">{m.active ? 'active' : 'invited'}</td>
              <td className="px-3 py-1.5">
                <MemberRowActions projectId={projectId} userId={m.userId} role={m.role} name={m.name} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <InviteForm projectId={projectId} />
    </div>
  )
}
