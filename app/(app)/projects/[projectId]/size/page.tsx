import type { Metadata } from 'next'
import Link from 'next/link'
import { loadProjectContext } from '@/app/_lib/project-context'
import { can } from '@/lib/review/permissions'
import { SizingForm } from './sizing-form'

export const metadata: Metadata = { title: 'Size a cell' }

export default async function SizePage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params
  const { project, actor } = await loadProjectContext(projectId)
  return (
    <div className="flex flex-col gap-4">
      <div>
        <Link href={`/projects/${projectId}`} className="font-mono text-xs text-accent underline">
          {project.code} register
        </Link>
        <h1 className="h1">Size a straight-line cell</h1>
        <p className="mt-1 max-w-3xl text-sm text-ink/80">
          Say what the machine needs; the assistant tries Peaucellier cells and Hart&apos;s inversors on the straight line (e = r), keeps those that meet every
          constraint — measured by the calc&apos;s own engine — and ranks them by your goal. One click makes a proposal a draft calc.
        </p>
      </div>
      <SizingForm projectId={projectId} canCreate={can(actor, 'calc.create')} />
    </div>
  )
}
