import { apiRoute, created, readJson } from '@/app/_lib/api'
import { rendererDeps } from '@/app/_lib/renderer'
import { createRevisionBody } from '@/lib/schemas/api'
import { revisionJson } from '@/server/api-json'
import { getCalcDetail } from '@/server/calcs'
import { getRevision, saveRevision } from '@/server/revisions'

type P = { projectId: string; calcId: string }

export const GET = apiRoute<P>(async ({ caller, params }) => ({ items: (await getCalcDetail(caller, params.projectId, params.calcId)).revisions }))

/** Saves the working inputs as a new revision and sends it to the named checker. */
export const POST = apiRoute<P>(async ({ req, caller, params }) => {
  const hasBody = (req.headers.get('content-length') ?? '0') !== '0' || req.headers.has('content-type')
  const opts = hasBody ? await readJson(req, createRevisionBody) : {}
  const id = await saveRevision(caller, params.projectId, params.calcId, await rendererDeps(), opts)
  return created(await revisionJson((await getRevision(caller, params.projectId, params.calcId, id)).revision))
})
