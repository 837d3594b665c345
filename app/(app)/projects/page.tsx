import type { Metadata } from 'next'
import Link from 'next/link'
import { requirePageUser } from '@/app/_lib/session'
import { listProjects } from '@/server/projects'
import { ROLE_LABELS } from '@/lib/review/roles'
import { CreateProjectForm } from './create-project-form'

export const metadata: Metadata = { title: 'Projects' }

export default async function ProjectsPage() {
  const user = await requirePageUser()
  const projects = await listProjects(user)
  return (
    <div className="flex flex-col gap-6">
      <h1 className="h1">Projects</h1>
      {projects.length === 0 ? (
        <p className="panel p-6 text-ink/70">You are not a member of any project yet. An administrator adds you by invitation.</p>
      ) : (
        <ul className="grid gap-3 md:grid-cols-2 lg:grid-cols-3">
          {projects.map((p) => (
            <li key={p.id}>
              <Link href={`/projects/${p.id}`} className="panel block p-4 hover:border-accent">
                <div className="font-mono text-xs text-accent">{p.code}</div>
                <div className="mt-1 font-semibold">{p.name}</div>
                <div className="mt-2 flex justify-between text-xs text-ink/60">
                  <span>{p.client}</span>
                  <span>
                    {p.calcCount} calc{p.calcCount === 1 ? '' : 's'} · {p.role ? ROLE_LABELS[p.role] : 'admin'}
                  </span>
                </div>
              </Link>
            </li>
          ))}
        </ul>
      )}
      {user.isAdmin && <CreateProjectForm />}
    </div>
  )
}
