import { apiRoute } from '@/app/_lib/api'
import { listMembers } from '@/server/members'

export const GET = apiRoute<{ projectId: string }>(async ({ caller, params }) => {
  const rows = await listMembers(caller, params.projectId)
  return { items: rows.map((m) => ({ id: m.userId, name: m.name, email: m.email, role: m.role, active: Boolean(m.active) })) }
})
