/** What the sizing assistant is asked (one schema for the CLI, the API and the form). SI: mm, N, degrees. */
import { z } from 'zod'

const mm = (what: string) => z.number({ error: `${what} must be a number in mm` })

export const SIZING_GOALS = ['pin-force', 'torque', 'footprint'] as const
export type SizingGoal = (typeof SIZING_GOALS)[number]
export const GOAL_LABELS: Record<SizingGoal, string> = {
  'pin-force': 'smallest peak pin force',
  torque: 'smallest peak drive torque',
  footprint: 'smallest footprint',
}

export const sizingInputSchema = z
  .object({
    /** Full travel the tracer must make along the line, mm. */
    stroke: mm('the stroke').min(1, { error: 'must be at least 1 mm' }).max(2000, { error: 'must be at most 2000 mm' }),
    /**
     * Distance of the line from the pole O, mm: a value (met to ±0.5 mm) or a range. Left out, the
     * assistant tries offsets from half the stroke to twice it.
     */
    offset: z
      .union([
        mm('the offset').positive({ error: 'must be positive' }),
        z.object({ min: mm('the smallest offset').positive({ error: 'must be positive' }), max: mm('the largest offset').positive({ error: 'must be positive' }) }),
      ])
      .optional(),
    /** Box every joint must stay in over the stroke: `width` across the line (x), `height` along it (y), mm. */
    envelope: z.object({ width: mm('the width').positive({ error: 'must be positive' }), height: mm('the height').positive({ error: 'must be positive' }) }).optional(),
    /** Smallest transmission angle allowed anywhere in the cell over the stroke, degrees (0–90). */
    minTransmissionDeg: z.number().min(0, { error: 'must be from 0° to 80°' }).max(80, { error: 'must be from 0° to 80°' }).default(30),
    /** Load at the tracer, N: `fx` across the line, `fy` along it. */
    load: z.object({ fx: z.number({ error: 'must be a number in N' }), fy: z.number({ error: 'must be a number in N' }) }),
    goal: z.enum(SIZING_GOALS, { error: 'must be "pin-force", "torque" or "footprint"' }).default('pin-force'),
    mechanisms: z.array(z.enum(['peaucellier', 'hart'], { error: 'must be "peaucellier" or "hart"' })).min(1).default(['peaucellier', 'hart']),
    /** Crank angle kept from each locked position, degrees (as in the calc). */
    toggleMarginDeg: z.number().min(0).max(45).default(5),
    /** Proposals per mechanism. */
    count: z.number().int().min(1).max(10).default(3),
  })
  .superRefine((v, ctx) => {
    if (v.offset && typeof v.offset === 'object' && v.offset.min > v.offset.max) ctx.addIssue({ code: 'custom', path: ['offset', 'max'], message: 'must not be below the smallest offset' })
  })

export type SizingInput = z.input<typeof sizingInputSchema>
export type SizingRequest = z.output<typeof sizingInputSchema>
