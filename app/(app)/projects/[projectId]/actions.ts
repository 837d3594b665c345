'use server'

import { revalidatePath } from 'next/cache'
import { formAction } from '@/app/_lib/action'
import { createCalcSchema, inviteSchema, memberRoleSchema, removeMemberSchema } from '@/lib/schemas/project'
import { createCalc } from '@/server/calcs'
import { changeMemberRole, inviteMember, removeMember } from '@/server/members'

export const createCalcAction = formAction(createCalcSchema, async (data, { projectId, caller }) => {
  const calc = await createCalc(caller, projectId, data)
  revalidatePath(`/projects/${projectId}`)
  return { ok: true, message: `Calc ${data.number} created as a draft.`, redirectTo: `/projects/${projectId}/calcs/${calc.id}` }
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
