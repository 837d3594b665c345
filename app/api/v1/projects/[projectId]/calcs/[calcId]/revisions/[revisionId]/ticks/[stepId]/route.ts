import { apiRoute, readJson } from '@/app/_lib/api'
import { tickBody } from '@/lib/schemas/api'
import { setTick } from '@/server/ticks'

type P = { projectId: string; calcId: string; revisionId: string; stepId: string }

const json = (rows: Awaited<ReturnType<typeof setTick>>) => ({ items: rows.map((t) => ({ stepId: t.stepId, by: t.by, at: t.at.toISOString() })) })

/** The checker ticks a step as verified (`{ ticked: false }` takes the tick back); answers every tick of the revision. */
export const PUT = apiRoute<P>(async ({ req, caller, params }) => {
  const hasBody = req.headers.has('content-type')
  const { ticked } = hasBody ? await readJson(req, tickBody) : { ticked: true }
  return json(await setTick(caller, params.projectId, params.calcId, params.revisionId, decodeURIComponent(params.stepId), ticked))
})

export const DELETE = apiRoute<P>(async ({ caller, params }) => json(await setTick(caller, params.projectId, params.calcId, params.revisionId, decodeURIComponent(params.stepId), false)))
