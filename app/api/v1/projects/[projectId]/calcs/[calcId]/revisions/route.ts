import { apiRoute, created, readJson } from '@/app/_lib/api'
import { rendererDeps } from '@/app/_lib/renderer'
import { createRevisionBody } from '@/lib/schemas/api'
import { getCalcDetail } from '@/server/calcs'
import { revisionJson } from '@/server/api-json'
import { getRevision, saveRevision } from '@/server/revisions'

type P = { projectId: string; calcId: string }

export const GET = apiRoute<P>(async ({ caller, params }) => ({ items: (await getCalcDetail(caller, params.projectId, params.calcId)).revisions }))

/** Saves the working inputs as a new revision and sends it to check. */
export const POST = apiRoute<P>(async ({ req, caller, params }) => {
  const hasBody = (req.headers.get('content-length') ?? '0') !== '0'
  if (hasBody) await readJson(req, createRevisionBody)
  const id = await saveRevision(caller, params.projectId, params.calcId, await rendererDeps())
  return created(await revisionJson((await getRevision(caller, params.projectId, params.calcId, id)).revision))
})
