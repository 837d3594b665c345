'use server'

import { revalidatePath } from 'next/cache'
import { projectAction } from '@/app/_lib/action'
import { inviteMember } from '@/lib/auth/invitations'
import { createCalc } from '@/db/projects'
import { changeMemberRole, removeMember } from '@/db/members'
import { createCalcSchema, inviteSchema, memberRoleSchema, removeMemberSchema } from '@/lib/schemas/project'

export const createCalcAction = projectAction('calc.create', createCalcSchema, async (data, { projectId, user }) => {
  const id = await createCalc(projectId, data, user.id)
  revalidatePath(`/projects/${projectId}`)
  return { ok: true, message: `Calc ${data.number} created as a draft.`, redirectTo: `/projects/${projectId}/calcs/${id}` }
})

export const inviteMemberAction = projectAction('member.manage', inviteSchema, async (data, { projectId, user }) => {
  const result = await inviteMember({ projectId, email: data.email, role: data.role, invitedBy: { id: user.id, name: user.name } })
  revalidatePath(`/projects/${projectId}/members`)
  return {
    ok: true,
    message: result.invited ? `Invitation sent to ${data.email}.` : `${data.email} already has an account and was added.`,
  }
})

export const changeRoleAction = projectAction('member.manage', memberRoleSchema, async ({ userId, role }, { projectId, user }) => {
  await changeMemberRole(projectId, userId, role, user.id)
  revalidatePath(`/projects/${projectId}/members`)
  return { ok: true, message: 'Role changed.' }
})

export const removeMemberAction = projectAction('member.manage', removeMemberSchema, async ({ userId }, { projectId, user }) => {
  await removeMember(projectId, userId, user.id)
  revalidatePath(`/projects/${projectId}/members`)
  return { ok: true, message: 'Member removed.' }
})
