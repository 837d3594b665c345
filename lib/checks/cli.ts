/**
 * Single-component mode of `npm run calc`: an input without a `mechanism`
 * key names one pin or link and its design force directly. Returns data, not
 * text, so the calc script decides how to print; nothing here exits.
 */
import type { CheckItem } from '@/lib/contract'
import { fromSI, kindOfSILabel, displayUnit, type UnitSystem } from '@/lib/units'
import { z } from 'zod'
import { checkComponent, type ChecksResult } from './run'
import { rangeErrors } from '@/lib/bench/ranges'
import { checksInputSchema } from './schema'
import { forceToSI } from './to-si'
import { ChecksInputError, sizeIssues, zodIssues, type FieldIssue } from './validate'

const num = (what: string) => z.number({ error: `${what} must be a number` })

export const componentSchema = z.union([
  z.object({ joint: z.string().min(1), force: num('force').nonnegative({ error: 'force cannot be negative' }) }),
  z.object({
    link: z.string().min(1),
    tension: num('tension').nonnegative({ error: 'tension is a magnitude; give it as a positive number' }).optional(),
    compression: num('compression').nonnegative({ error: 'compression is a magnitude; give it as a positive number' }).optional(),
    moment: num('moment').nonnegative({ error: 'moment is a magnitude' }).optional(),
    /** Largest pin force on the eye (default: the larger axial force) and whether it may act across the link. */
    eye: num('eye').nonnegative({ error: 'eye is a magnitude' }).optional(),
    across: z.boolean().optional(),
  }),
])

export const singleComponentSchema = checksInputSchema.extend({ component: componentSchema })

export type CliResult = { ok: true; units: UnitSystem; result: ChecksResult } | { ok: false; issues: FieldIssue[] }

/** Demand and capacity in the display units of `system`; SI results pass through unchanged. */
export function checksInUnits(checks: CheckItem[], system: UnitSystem): CheckItem[] {
  if (system === 'SI') return checks
  return checks.map((c) => {
    const kind = kindOfSILabel(c.unit)
    if (!kind) return c
    const u = displayUnit(system, kind)
    return { ...c, demand: fromSI(c.demand, u), capacity: fromSI(c.capacity, u), unit: u }
  })
}

export function runChecksCli(json: unknown): CliResult {
  const p = singleComponentSchema.safeParse(json)
  // Every number in its range (lib/bench/ranges; US input compared in SI) and every text and count in
  // its size first; where the schema speaks of the same field, the bound says more.
  const ranges = [...Object.entries(rangeErrors(json)).map(([path, message]) => ({ path, message })), ...sizeIssues(json)]
  if (!p.success) {
    const issues = zodIssues(p.error)
    return { ok: false, issues: [...ranges, ...issues.filter((i) => !ranges.some((r) => r.path === i.path))] }
  }
  if (ranges.length > 0) return { ok: false, issues: ranges }
  const { component, ...input } = p.data
  const sys = input.units
  try {
    const result =
      'joint' in component
        ? checkComponent(input, component.joint, { kind: 'joint', force: forceToSI(component.force, sys, 'force') ?? 0 })
        : checkComponent(input, component.link, {
            kind: 'link',
            tension: forceToSI(component.tension, sys, 'force'),
            compression: forceToSI(component.compression, sys, 'force'),
            moment: forceToSI(component.moment, sys, 'moment'),
          })
    return { ok: true, units: sys, result: { ...result, checks: checksInUnits(result.checks, sys) } }
  } catch (e) {
    if (e instanceof ChecksInputError) return { ok: false, issues: e.issues }
    throw e
  }
}
