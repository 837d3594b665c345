'use server'

import { revalidatePath } from 'next/cache'
import { dataAction, formAction } from '@/app/_lib/action'
import { z } from 'zod'
import { defaultCalcInputs } from '@/lib/calc/defaults'
import { AppError } from '@/lib/errors'
import { cloneCalcSchema, createCalcSchema, importCalcSchema, inviteSchema, memberRoleSchema, removeMemberSchema } from '@/lib/schemas/project'
import { calcInputOf, sizingInputSchema, type SizingProposal } from '@/lib/sizing'
import { cloneCalc, createCalc, importCalc, nextCalcNumber } from '@/server/calcs'
import { changeMemberRole, inviteMember, removeMember } from '@/server/members'

export const createCalcAction = formAction(createCalcSchema, async (data, { projectId, caller }) => {
  const calc = await createCalc(caller, projectId, data)
  revalidatePath(`/projects/${projectId}`)
  return { ok: true, message: `Calc ${data.number} created as a draft.`, redirectTo: `/projects/${projectId}/calcs/${calc.id}` }
})

export const cloneCalcAction = formAction(cloneCalcSchema, async ({ calcId, number, title }, { projectId, caller }) => {
  const calc = await cloneCalc(caller, projectId, calcId, { number, title })
  revalidatePath(`/projects/${projectId}`)
  return { ok: true, message: `Cloned as ${calc.number}.`, redirectTo: `/projects/${projectId}/calcs/${calc.id}` }
})

/** A calc input file (the CLI's JSON, as text) made into a new calc; its errors come back keyed `inputs.<path>`. */
export const importCalcAction = formAction(importCalcSchema.omit({ inputs: true }).extend({ inputs: z.string().min(2, 'Choose a calc input file (JSON).') }), async ({ number, title, inputs }, { projectId, caller }) => {
  let parsed: unknown
  try {
    parsed = JSON.parse(inputs)
  } catch {
    return { fieldErrors: { file: 'The file is not JSON: export a calc, or write one like examples/peaucellier.json.' }, message: 'Nothing imported.' }
  }
  try {
    const calc = await importCalc(caller, projectId, { number, title }, parsed)
    revalidatePath(`/projects/${projectId}`)
    return { ok: true, message: `Imported as ${calc.number}.`, redirectTo: `/projects/${projectId}/calcs/${calc.id}` }
  } catch (err) {
    if (err instanceof AppError && err.code === 'invalid' && err.fieldErrors) {
      return { message: 'Nothing imported: the file has errors at these fields.', data: { fileErrors: err.fieldErrors } }
    }
    throw err
  }
})

/** One click on a sizing proposal: a new draft calc with its geometry, the load and the stroke (pins and links at their defaults). */
export const calcFromProposalAction = dataAction(async (caller, projectId: string, request: unknown, proposal: SizingProposal, title: string) => {
  const req = sizingInputSchema.parse(request)
  const number = await nextCalcNumber(caller, projectId)
  const inputs = { ...defaultCalcInputs(proposal.mechanism), ...calcInputOf(proposal, req) }
  const name = title.trim().slice(0, 200) || `${proposal.label} for a ${req.stroke} mm stroke`
  const calc = await createCalc(caller, projectId, { number, title: name, calcType: proposal.mechanism }, inputs)
  revalidatePath(`/projects/${projectId}`)
  return { ok: true, message: `Draft ${calc.number} made.`, redirectTo: `/projects/${projectId}/calcs/${calc.id}` }
})

export const inviteMemberAction = formAction(inviteSchema, async (data, { projectId, caller }) => {
  const result = await inviteMember(caller, projectId, data)
  revalidatePath(`/projects/${projectId}/members`)
  return {
    ok: true,
    message: result.invited ? `Invitation sent to ${data.email}.` : `${data.email} already has an account and was added.`,
  }
})

export const changeRoleAction = formAction(memberRoleSchema, async ({ userId, role }, { projectId, caller }) => {
  await changeMemberRole(caller, projectId, userId, role)
  revalidatePath(`/projects/${projectId}/members`)
  return { ok: true, message: 'Role changed.' }
})

export const removeMemberAction = formAction(removeMemberSchema, async ({ userId }, { projectId, caller }) => {
  await removeMember(caller, projectId, userId)
  revalidatePath(`/projects/${projectId}/members`)
  return { ok: true, message: 'Member removed.' }
})
