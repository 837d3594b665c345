import type { Metadata } from 'next'
import Link from 'next/link'
import { notFound } from 'next/navigation'
import { StateBadge } from '@/app/_components/state-badge'
import { loadProjectContext } from '@/app/_lib/project-context'
import { getCalc, listRevisions } from '@/db/queries'
import { CALC_TYPE_LABELS } from '@/lib/schemas/project'

export const metadata: Metadata = { title: 'Calc' }

export default async function CalcPage({ params }: { params: Promise<{ projectId: string; calcId: string }> }) {
  const { projectId, calcId } = await params
  const { project } = await loadProjectContext(projectId)
  const calc = await getCalc(projectId, calcId)
  if (!calc) notFound()
  const revisions = await listRevisions(calcId)
  return (
    <div className="flex flex-col gap-4">
      <div>
        <Link href={`/projects/${projectId}`} className="font-mono text-xs text-accent underline">
          {project.code} register
        </Link>
        <h1 className="h1">
          <span className="font-mono">{calc.number}</span> {calc.title}
        </h1>
        <div className="mt-1 flex items-center gap-2 text-xs text-ink/60">
          {CALC_TYPE_LABELS[calc.calcType]} <StateBadge state={calc.state} />
        </div>
      </div>
      <section className="panel p-4">
        <h2 className="h2">Revisions</h2>
        {revisions.length === 0 ? (
          <p className="mt-2 text-ink/60">No revision saved yet.</p>
        ) : (
          <ul className="mt-2">
            {revisions.map((r) => (
              <li key={r.id} className="flex gap-3">
                <span className="font-mono">{r.label}</span> <StateBadge state={r.state} />
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  )
}
