'use server'

import { revalidatePath } from 'next/cache'
import { z } from 'zod'
import { dataAction, formAction } from '@/app/_lib/action'
import { rendererDeps } from '@/app/_lib/renderer'
import { transitionOf } from '@/lib/review/workflow'
import { remarkCloseSchema, remarkReplySchema, remarkSchema } from '@/lib/schemas/project'
import { localFileStore } from '@/lib/storage'
import { addAttachment } from '@/server/attachments'
import { saveInputs } from '@/server/calcs'
import { addRemark, closeRemark, replyToRemark } from '@/server/remarks'
import { saveRevision, transitionRevision, type SubmitOptions, type TransitionOptions } from '@/server/revisions'
import { setTick } from '@/server/ticks'

const calcPath = (projectId: string, calcId: string) => `/projects/${projectId}/calcs/${calcId}`

/** Validates and runs the inputs; saves them only when they are valid, so nothing saved is lost. */
export const saveInputsAction = dataAction(async (caller, projectId: string, calcId: string, values: unknown) => {
  const outcome = await saveInputs(caller, projectId, calcId, values)
  if (!outcome.ok) return { fieldErrors: outcome.fieldErrors, message: 'Not saved: check the marked fields. Your last saved inputs are unchanged.' }
  revalidatePath(calcPath(projectId, calcId))
  const { feasible, feasibility } = outcome.summary
  return { ok: true, message: feasible ? 'Saved and run.' : `Saved. ${feasibility}` }
})

export const saveRevisionAction = dataAction(async (caller, projectId: string, calcId: string, opts: SubmitOptions) => {
  await saveRevision(caller, projectId, calcId, await rendererDeps(), opts)
  revalidatePath(calcPath(projectId, calcId))
  return { ok: true, message: 'Revision saved and sent to check.' }
})

/** Any transition of the workflow table, by its action name. */
export const transitionAction = dataAction(async (caller, projectId: string, calcId: string, revisionId: string, action: string, opts: TransitionOptions) => {
  await transitionRevision(caller, projectId, calcId, revisionId, action, await rendererDeps(), opts)
  revalidatePath(calcPath(projectId, calcId))
  return { ok: true, message: transitionOf(action)?.done }
})

export const addAttachmentAction = formAction(z.object({ calcId: z.string().min(1) }), async ({ calcId }, { projectId, caller, formData }) => {
  const file = formData.get('file')
  if (!(file instanceof File) || file.size === 0) return { fieldErrors: { file: 'Choose a PDF file.' } }
  // The File itself: the service checks its size before reading a byte of it.
  await addAttachment(caller, projectId, calcId, file, localFileStore())
  revalidatePath(calcPath(projectId, calcId))
  return { ok: true, message: `${file.name} will be appended to the next revision.` }
})

export const addRemarkAction = formAction(remarkSchema, async ({ calcId, ...remark }, { projectId, caller }) => {
  await addRemark(caller, projectId, calcId, remark)
  revalidatePath(calcPath(projectId, calcId))
  return { ok: true, message: remark.stepId ? 'Remark recorded at the step.' : 'Remark on the whole calc recorded.' }
})

export const replyRemarkAction = formAction(remarkReplySchema, async ({ calcId, remarkId, text }, { projectId, caller }) => {
  await replyToRemark(caller, projectId, calcId, remarkId, text)
  revalidatePath(calcPath(projectId, calcId))
  return { ok: true, message: 'Reply added.' }
})

export const tickStepAction = dataAction(async (caller, projectId: string, calcId: string, revisionId: string, stepId: string, ticked: boolean) => {
  const ticks = await setTick(caller, projectId, calcId, revisionId, stepId, ticked)
  return { ok: true, data: { ticks: ticks.map((t) => ({ stepId: t.stepId, by: t.by, at: t.at.toISOString() })) } }
})

export const closeRemarkAction = formAction(remarkCloseSchema, async ({ calcId, remarkId }, { projectId, caller }) => {
  await closeRemark(caller, projectId, calcId, remarkId)
  revalidatePath(calcPath(projectId, calcId))
  return { ok: true, message: 'Remark closed.' }
})
