import { z } from 'zod'
import { analyse, hartCell, peaucellierCell, type InversorCell } from '@/lib/linkage'
import type { MechanismResult } from './types'
import { ENGINE_VERSION } from './version'

/*
 * Input of the straight-line linkage calc. Keys are stable (scripts and saved
 * revisions use them). Lengths mm, forces N, angles degrees. Numbers arrive as
 * JSON numbers here; form layers coerce strings before parsing.
 */
const num = () => z.number({ error: (iss) => (iss.input === undefined ? 'is required' : 'must be a number') })
const positive = () => num().positive({ error: 'must be positive' })
const nonNegative = () => num().nonnegative({ error: 'must not be negative' })

const load = z.object({
  name: z.string({ error: 'must be a text' }).min(1, { error: 'must not be empty' }),
  fx: num(),
  fy: num(),
})

const common = {
  loads: z.array(load, { error: 'must be a list of { name, fx, fy }' }).min(1, { error: 'needs at least one load case' }),
  selfWeight: z
    .object({
      density: positive(),
      area: positive(),
      g: positive().default(9.81),
      directionDeg: num().default(-90),
    })
    .optional(),
  sweep: z
    .object({
      fromDeg: num(),
      toDeg: num(),
      count: num().int({ error: 'must be a whole number' }).min(1, { error: 'must be at least 1' }).max(10000, { error: 'must be at most 10000' }),
    })
    .optional(),
  crankAnglesDeg: z.array(num()).min(1, { error: 'needs at least one angle' }).max(10000, { error: 'must hold at most 10000 angles' }).optional(),
  toggleMarginDeg: nonNegative().default(5),
  /** Full stroke the machine needs along the line, mm; checked against the usable stroke. */
  requiredStroke: positive().optional(),
  amplificationLimit: num().gt(1, { error: 'must be greater than 1' }).default(100),
}

const peaucellier = z.object({
  mechanism: z.literal('peaucellier'),
  geometry: z.object({ arm: positive(), side: positive(), crank: positive(), crankPivotOffset: nonNegative().optional() }),
  ...common,
})

const hart = z.object({
  mechanism: z.literal('hart'),
  geometry: z.object({
    long: positive(),
    short: positive(),
    ratio: num().gt(0, { error: 'must be between 0 and 1' }).lt(1, { error: 'must be between 0 and 1' }),
    crank: positive(),
    crankPivotOffset: nonNegative().optional(),
  }),
  ...common,
})

export const mechanismInputSchema = z
  .discriminatedUnion('mechanism', [peaucellier, hart], { error: 'must be "peaucellier" or "hart"' })
  .superRefine((v, ctx) => {
    if (v.sweep && v.crankAnglesDeg) ctx.addIssue({ code: 'custom', path: ['crankAnglesDeg'], message: 'give either sweep or crankAnglesDeg, not both' })
    const names = new Set<string>()
    v.loads.forEach((l, i) => {
      if (names.has(l.name)) ctx.addIssue({ code: 'custom', path: ['loads', i, 'name'], message: `repeats the load case name "${l.name}"` })
      names.add(l.name)
    })
  })

export type MechanismInput = z.input<typeof mechanismInputSchema>
type ParsedInput = z.output<typeof mechanismInputSchema>

function cellOf(input: ParsedInput): InversorCell {
  return input.mechanism === 'peaucellier'
    ? peaucellierCell({ arm: input.geometry.arm, side: input.geometry.side })
    : hartCell({ long: input.geometry.long, short: input.geometry.short, ratio: input.geometry.ratio })
}

/**
 * Runs the calc. Geometric infeasibility is a result (feasibility.ok = false,
 * no positions), not an exception; only a malformed input throws (ZodError).
 */
export function runMechanism(raw: MechanismInput): MechanismResult {
  const input = mechanismInputSchema.parse(raw)
  const g = input.geometry
  const out = analyse({
    cell: cellOf(input),
    crank: g.crank,
    offset: g.crankPivotOffset ?? g.crank,
    loads: input.loads,
    selfWeight: input.selfWeight,
    sweep: input.sweep,
    anglesDeg: input.crankAnglesDeg,
    marginDeg: input.toggleMarginDeg,
    amplificationLimit: input.amplificationLimit,
  })
  return { mechanism: input.mechanism, engineVersion: ENGINE_VERSION, ...out }
}
