import { apiRoute } from '@/app/_lib/api'
import { searchProject } from '@/server/search'

/** Calcs of the project whose number, title, input names, step titles or remarks contain `q`. */
export const GET = apiRoute<{ projectId: string }>(async ({ req, caller, params }) => {
  const q = new URL(req.url).searchParams.get('q') ?? ''
  return { items: await searchProject(caller, params.projectId, q) }
})
