'use server'

import { revalidatePath } from 'next/cache'
import { z } from 'zod'
import { formAction } from '@/app/_lib/action'
import { createApiToken, revokeApiToken } from '@/server/auth/api-tokens'

export const createTokenAction = formAction(z.object({ name: z.string().trim().min(1, 'Give the token a name.').max(80, 'Use at most 80 characters.') }), async ({ name }, { caller }) => {
  const t = await createApiToken(caller, name)
  revalidatePath('/settings')
  return { ok: true, message: `Token “${t.name}” created. Copy it now: it is shown only once.`, data: { token: t.token } }
})

export const revokeTokenAction = formAction(z.object({ tokenId: z.string().min(1) }), async ({ tokenId }, { caller }) => {
  await revokeApiToken(caller, tokenId)
  revalidatePath('/settings')
  return { ok: true, message: 'Token revoked.' }
})
