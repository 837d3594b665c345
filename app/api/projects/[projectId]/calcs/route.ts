import { handleApiError, requireProjectPermission } from '@/app/_lib/api'
import { createCalc } from '@/db/projects'
import { listRegister } from '@/db/queries'
import { AppError } from '@/lib/errors'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'
import { createCalcSchema } from '@/lib/schemas/project'

type Params = { params: Promise<{ projectId: string }> }

/** The calc register of a project, for the register table and for scripts. */
export async function GET(_req: Request, { params }: Params) {
  try {
    const { projectId } = await params
    await requireProjectPermission(projectId, 'project.view')
    const rows = await listRegister(projectId)
    return Response.json({ calcs: rows.map((r) => ({ ...r, updatedAt: r.updatedAt.toISOString() })) })
  } catch (err) {
    return handleApiError(err)
  }
}

/** Creates a draft calc; same rules as the form. */
export async function POST(req: Request, { params }: Params) {
  try {
    const { projectId } = await params
    const actor = await requireProjectPermission(projectId, 'calc.create')
    const parsed = createCalcSchema.safeParse(await req.json().catch(() => null))
    if (!parsed.success) throw new AppError('invalid', 'Invalid calc.', fieldErrorsOf(parsed.error))
    const id = await createCalc(projectId, parsed.data, actor.userId)
    return Response.json({ id }, { status: 201 })
  } catch (err) {
    return handleApiError(err)
  }
}
