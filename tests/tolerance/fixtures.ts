/** Shared set-ups of the tolerance tests: the registry's default geometries over a working range clear of the toggles. */
import { prepareTolerance, toleranceModelFor, type ToleranceInput } from '@/lib/tolerance'

export const PEAUCELLIER = toleranceModelFor('peaucellier', { arm: 250, side: 100, crank: 100 })
export const HART = toleranceModelFor('hart', { long: 240, short: 100, ratio: 0.3, crank: 40 })
export const RANGE = { crankMinDeg: -50, crankMaxDeg: 50 }

/** Every dimension exact except those in `keep` (id → ± mm). */
export function only(model: ToleranceInput['model'], keep: Record<string, number>, extra: Partial<ToleranceInput> = {}) {
  const ids = prepareTolerance({ model, workingRange: RANGE }).items.filter((i) => i.kind !== 'clearance').map((i) => i.id)
  return prepareTolerance({ model, workingRange: RANGE, tolerances: { ...Object.fromEntries(ids.map((id) => [id, 0])), ...keep }, ...extra })
}
