import type { Material } from './materials'

import { GENERAL_CAUTION } from '@/lib/cautions'

export { GENERAL_CAUTION }

export const FROM_MEMORY_CAUTION =
  'Some material values or clause details are marked "from memory": they were not checked against a copy of the source when this library was written. Verify them against the standard before issuing the package.'

/** Cautions that follow from what was used, deduplicated and in a stable order. */
export function cautionsFor(basisCaution: string, used: Material[], extra: string[] = []): string[] {
  const out = [GENERAL_CAUTION, basisCaution]
  const seen = new Set<string>()
  let memory = false
  for (const m of used) {
    if (seen.has(m.id)) continue
    seen.add(m.id)
    if (Object.values(m.sources).some((s) => s.includes('from memory'))) memory = true
    if (m.note) out.push(`${m.id}: ${m.note}`)
  }
  if (memory) out.push(FROM_MEMORY_CAUTION)
  return [...out, ...extra]
}
