'use server'

import { revalidatePath } from 'next/cache'
import { z } from 'zod'
import { projectAction, projectDataAction } from '@/app/_lib/action'
import { addAttachment } from '@/db/attachments'
import { addRemark, closeRemark, respondToRemark } from '@/db/remarks'
import { remarkCloseSchema, remarkResponseSchema, remarkSchema } from '@/lib/schemas/project'
import { localFileStore } from '@/lib/storage'
import { rendererDeps } from '@/app/_lib/renderer'
import { getCalc } from '@/db/queries'
import { saveDraftInputs } from '@/db/calc-drafts'
import { advanceRevision, saveRevision, TRANSITIONS } from '@/db/revisions'
import { AppError } from '@/lib/errors'

async function calcOf(projectId: string, calcId: string) {
  const calc = await getCalc(projectId, calcId)
  if (!calc) throw new AppError('not_found', 'No such calc in this project.')
  return calc
}

/** Validates and runs the inputs; saves them only when they are valid, so nothing saved is lost. */
export const saveInputsAction = projectDataAction('calc.edit', async ({ projectId, user }, calcId: string, values: unknown) => {
  const outcome = await saveDraftInputs(await calcOf(projectId, calcId), values, user.id)
  if (!outcome.ok) return { fieldErrors: outcome.fieldErrors, message: 'Not saved: check the marked fields. Your last saved inputs are unchanged.' }
  revalidatePath(`/projects/${projectId}/calcs/${calcId}`)
  return { ok: true, message: outcome.feasible ? 'Saved and run.' : `Saved. ${outcome.message}` }
})

export const saveRevisionAction = projectDataAction('calc.submit', async ({ projectId, user }, calcId: string) => {
  await saveRevision(await calcOf(projectId, calcId), user.id, await rendererDeps())
  revalidatePath(`/projects/${projectId}/calcs/${calcId}`)
  return { ok: true, message: 'Revision saved and sent to check.' }
})

const PERMISSION = { check: 'calc.check', approve: 'calc.approve', issue: 'calc.issue' } as const

function transitionAction(step: keyof typeof TRANSITIONS) {
  return projectDataAction(PERMISSION[step], async ({ projectId, user }, calcId: string, revisionId: string) => {
    await advanceRevision(await calcOf(projectId, calcId), revisionId, step, user.id, await rendererDeps())
    revalidatePath(`/projects/${projectId}/calcs/${calcId}`)
    return { ok: true, message: `Revision ${TRANSITIONS[step].to}.` }
  })
}

export const checkRevisionAction = transitionAction('check')
export const approveRevisionAction = transitionAction('approve')
export const issueRevisionAction = transitionAction('issue')

export const addAttachmentAction = projectAction('calc.edit', z.object({ calcId: z.string().min(1) }), async ({ calcId }, { projectId, user, formData }) => {
  const file = formData?.get('file')
  if (!(file instanceof File) || file.size === 0) return { fieldErrors: { file: 'Choose a PDF file.' } }
  await addAttachment(await calcOf(projectId, calcId), { name: file.name, bytes: new Uint8Array(await file.arrayBuffer()) }, user.id, localFileStore())
  revalidatePath(`/projects/${projectId}/calcs/${calcId}`)
  return { ok: true, message: `${file.name} will be appended to the next revision.` }
})

export const addRemarkAction = projectAction('remark.create', remarkSchema, async ({ calcId, ...remark }, { projectId, user }) => {
  await addRemark(await calcOf(projectId, calcId), remark, user.id)
  revalidatePath(`/projects/${projectId}/calcs/${calcId}`)
  return { ok: true, message: `Remark on ${remark.stepId} recorded.` }
})

export const respondRemarkAction = projectAction('remark.respond', remarkResponseSchema, async ({ calcId, remarkId, response }, { projectId, user }) => {
  await respondToRemark(await calcOf(projectId, calcId), remarkId, response, user.id)
  revalidatePath(`/projects/${projectId}/calcs/${calcId}`)
  return { ok: true, message: 'Response recorded.' }
})

export const closeRemarkAction = projectAction('remark.create', remarkCloseSchema, async ({ calcId, remarkId }, { projectId, user }) => {
  await closeRemark(await calcOf(projectId, calcId), remarkId, user.id)
  revalidatePath(`/projects/${projectId}/calcs/${calcId}`)
  return { ok: true, message: 'Remark closed.' }
})
