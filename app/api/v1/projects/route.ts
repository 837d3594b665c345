import { apiRoute } from '@/app/_lib/api'
import { listProjects } from '@/server/projects'

export const GET = apiRoute(async ({ caller }) => {
  const rows = await listProjects(caller)
  return { items: rows.map((p) => ({ id: p.id, code: p.code, name: p.name, client: p.client, role: p.role, calcCount: p.calcCount })) }
})
