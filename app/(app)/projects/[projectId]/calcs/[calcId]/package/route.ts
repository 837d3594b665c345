import { apiRoute } from '@/app/_lib/api'
import { reports } from '@/app/_lib/renderer'
import { AppError } from '@/lib/errors'
import { getCalcPackage } from '@/server/calc-view'

type P = { projectId: string; calcId: string }

/**
 * The calc package as an HTML fragment, fetched by the calc page when the package is asked for, so
 * the page itself stays light. `?view=working` or a revision id, as on the page.
 */
export const GET = apiRoute<P>(async ({ req, caller, params }) => {
  const view = new URL(req.url).searchParams.get('view') ?? undefined
  const pkg = await getCalcPackage(caller, params.projectId, params.calcId, view)
  if (!pkg) throw new AppError('invalid', 'The working inputs have errors; fix them in the form to see the package.')
  const html = await (await reports()).renderWebHtml(pkg)
  return new Response(html, { headers: { 'Content-Type': 'text/html; charset=utf-8', 'Cache-Control': 'private, no-store' } })
})
