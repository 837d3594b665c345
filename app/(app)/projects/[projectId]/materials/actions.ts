'use server'

import { revalidatePath } from 'next/cache'
import { z } from 'zod'
import { formAction } from '@/app/_lib/action'
import { addMaterial } from '@/server/materials'

// FormData gives strings: numbers are coerced here, then the checks' own material schema judges them.
const num = (what: string) => z.coerce.number({ error: `${what} must be a number` })
const formSchema = z.object({
  name: z.string().trim().min(2, 'Give the material a name.').max(40).regex(/^[A-Za-z0-9+._ -]+$/, 'Use letters, digits, space and + . _ - only.'),
  kind: z.enum(['steel', 'aluminium']),
  fy: num('fy'),
  fu: num('fu'),
  E: num('E'),
  density: z.union([z.literal(''), num('density')]).optional(),
  source: z.string(),
})

export const addMaterialAction = formAction(formSchema, async ({ name, density, ...data }, { projectId, caller }) => {
  await addMaterial(caller, projectId, name, { ...data, ...(density === '' || density === undefined ? {} : { density }) })
  revalidatePath(`/projects/${projectId}/materials`)
  return { ok: true, message: `${name} added. Calcs in this project can now use it.` }
})
