'use server'

import { revalidatePath } from 'next/cache'
import { dataAction } from '@/app/_lib/action'
import { saveInputs } from '@/server/calcs'

/**
 * Saves the working inputs from the bench (by hand or automatically). Nothing is saved unless the
 * inputs are in range, valid and feasible; the answer names the fields otherwise.
 */
export const saveWorkingInputsAction = dataAction(async (caller, projectId: string, calcId: string, values: unknown) => {
  const outcome = await saveInputs(caller, projectId, calcId, values)
  if (!outcome.ok) return { fieldErrors: outcome.fieldErrors, message: 'Not saved: check the marked fields. The last saved inputs are unchanged.' }
  revalidatePath(`/projects/${projectId}/calcs/${calcId}`)
  return { ok: true, message: 'Saved.', data: { savedAt: new Date().toISOString() } }
})
