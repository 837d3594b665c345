import { and, eq } from 'drizzle-orm'
import { z } from 'zod'
import { handleApiError, requireProjectPermission } from '@/app/_lib/api'
import { rendererDeps } from '@/app/_lib/renderer'
import { db } from '@/db'
import { getCalc, getProject } from '@/db/queries'
import { renderRevisionPdf } from '@/db/revisions'
import { revisions } from '@/db/schema'
import { AppError } from '@/lib/errors'
import { sha256Hex } from '@/lib/calc/hash'

type Params = { params: Promise<{ projectId: string; calcId: string; revisionId: string }> }

const query = z.object({ paper: z.enum(['A4', 'LETTER']).default('A4') })

/**
 * A revision's PDF. A4 is the stored, hashed record (checked against its hash before sending).
 * US Letter, and any superseded revision (so it carries the SUPERSEDED watermark), are rendered on
 * demand from the same frozen revision; the stored record stays as it was signed.
 */
export async function GET(req: Request, { params }: Params) {
  try {
    const { projectId, calcId, revisionId } = await params
    await requireProjectPermission(projectId, 'pdf.download')
    const parsed = query.safeParse(Object.fromEntries(new URL(req.url).searchParams))
    if (!parsed.success) throw new AppError('invalid', 'paper must be A4 or LETTER', { paper: 'must be A4 or LETTER' })
    const [project, calc] = await Promise.all([getProject(projectId), getCalc(projectId, calcId)])
    const [rev] = calc ? await db.select().from(revisions).where(and(eq(revisions.id, revisionId), eq(revisions.calcId, calc.id))) : []
    if (!project || !calc || !rev) throw new AppError('not_found', 'No such revision.')
    const deps = await rendererDeps()
    let bytes: Uint8Array
    if (parsed.data.paper === 'A4' && rev.pdfKey && rev.state !== 'superseded') {
      bytes = await deps.store.get(rev.pdfKey)
      if (sha256Hex(bytes) !== rev.pdfHash) throw new Error(`stored PDF of revision ${rev.id} does not match its hash`)
    } else {
      bytes = await renderRevisionPdf(rev.id, deps, parsed.data.paper)
    }
    const name = `${project.code}_${calc.number}_rev${rev.label}_${parsed.data.paper}.pdf`.replace(/[^A-Za-z0-9._-]/g, '_')
    return new Response(Buffer.from(bytes), {
      headers: { 'Content-Type': 'application/pdf', 'Content-Disposition': `attachment; filename="${name}"`, 'Cache-Control': 'private, no-store' },
    })
  } catch (err) {
    return handleApiError(err)
  }
}
