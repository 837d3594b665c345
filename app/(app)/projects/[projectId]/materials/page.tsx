import type { Metadata } from 'next'
import Link from 'next/link'
import { loadProjectContext } from '@/app/_lib/project-context'
import { listMaterials } from '@/server/materials'
import { MATERIALS } from '@/lib/checks'
import { can } from '@/lib/review/permissions'
import { MaterialForm } from './material-form'

export const metadata: Metadata = { title: 'Materials' }

export default async function MaterialsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params
  const { user, project, actor } = await loadProjectContext(projectId)
  const own = await listMaterials(user, projectId)
  const rows = [
    ...Object.values(MATERIALS).map((m) => ({ key: m.id, name: m.id, origin: 'library', fy: m.bands[0].fy, fu: m.bands[0].fu, E: m.E, source: m.sources.strength })),
    ...own.map((m) => ({ key: m.id, name: m.name, origin: 'project', fy: m.data.fy ?? m.data.bands?.[0].fy, fu: m.data.fu ?? m.data.bands?.[0].fu, E: m.data.E, source: m.source })),
  ]
  return (
    <div className="flex flex-col gap-5">
      <div>
        <Link href={`/projects/${projectId}`} className="font-mono text-xs text-accent underline">
          {project.code}
        </Link>
        <h1 className="h1">Materials</h1>
        <p className="text-xs text-ink/60">Library values are the thinnest band of the product standard; the checks pick the band from the actual size.</p>
      </div>
      <table className="panel w-full text-left text-sm" data-testid="materials">
        <thead className="bg-paper text-xs text-ink/70">
          <tr>
            {['Name', 'From', 'fy [MPa]', 'fu [MPa]', 'E [MPa]', 'Source'].map((h) => (
              <th key={h} className="px-3 py-2">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.key} className="border-t border-rule align-top">
              <td className="px-3 py-1.5 font-mono">{r.name}</td>
              <td className="px-3 py-1.5">{r.origin}</td>
              <td className="px-3 py-1.5 text-right">{r.fy}</td>
              <td className="px-3 py-1.5 text-right">{r.fu}</td>
              <td className="px-3 py-1.5 text-right">{r.E}</td>
              <td className="px-3 py-1.5 text-xs text-ink/70">{r.source}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {can(actor, 'material.create') && <MaterialForm projectId={projectId} />}
    </div>
  )
}
