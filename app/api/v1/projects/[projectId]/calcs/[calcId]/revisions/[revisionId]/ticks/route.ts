import { apiRoute } from '@/app/_lib/api'
import { listTicks } from '@/server/ticks'

export const GET = apiRoute<{ projectId: string; calcId: string; revisionId: string }>(async ({ caller, params }) => ({
  items: (await listTicks(caller, params.projectId, params.calcId, params.revisionId)).map((t) => ({ stepId: t.stepId, by: t.by, at: t.at.toISOString() })),
}))
