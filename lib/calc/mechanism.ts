import { z } from 'zod'
import { analyse } from '@/lib/linkage'
import type { MechanismResult } from '@/lib/contract'
import { findMechanism, getMechanism, mechanismChoiceMessage, mechanisms, nonNegative, num, positive, type BuiltInMechanismInput, type Geometry } from '@/lib/mechanisms'
import { ENGINE_VERSION } from './version'

/*
 * Input of the straight-line linkage calc. Keys are stable (scripts and saved
 * revisions use them). Lengths mm, forces N, angles degrees. Numbers arrive as
 * JSON numbers here; form layers coerce strings before parsing. `geometry` is
 * checked by the schema of the mechanism the registry (lib/mechanisms) names.
 */
/** Smallest transmission angle kept over the working range unless the engineer states one — common practice. */
export const DEFAULT_MIN_TRANSMISSION_DEG = 30
/** Straightness the guide must hold over the working range unless the engineer states it, mm. */
export const DEFAULT_STRAIGHTNESS_TOLERANCE = 0.1

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
  /** End stops of the working range as crank angles; statics and checks are solved over it. */
  workingRange: z
    .object({ fromDeg: num(), toDeg: num() })
    .refine((w) => w.fromDeg !== w.toDeg, { error: 'the two end stops must differ', path: ['toDeg'] })
    .optional(),
  /** Smallest transmission angle allowed over the working range (common practice: 30°). */
  minTransmissionAngleDeg: nonNegative().max(90, { error: 'must be at most 90' }).default(DEFAULT_MIN_TRANSMISSION_DEG),
  /** Largest deviation of the tracer from a straight line allowed over the working range, mm. */
  straightnessTolerance: positive().default(DEFAULT_STRAIGHTNESS_TOLERANCE),
  amplificationLimit: num().gt(1, { error: 'must be greater than 1' }).default(100),
}

const mechanismId = z.string({ error: () => mechanismChoiceMessage() }).refine((id) => findMechanism(id) !== undefined, { error: () => mechanismChoiceMessage() })

/** The common keys of every mechanism; `geometry` is checked against the named mechanism's schema below. */
export const mechanismCommonSchema = z.object({ mechanism: mechanismId, geometry: z.unknown().optional(), ...common })

/**
 * The calc's mechanism input for whatever the registry holds when it parses (a discriminated union on
 * `mechanism`, built at parse time, so a mechanism registered later is accepted too). Every field error
 * is reported at once: geometry errors beside errors in the loads.
 */
export const mechanismInputSchema = mechanismCommonSchema
  .superRefine(
    (v, ctx) => {
      const def = typeof v.mechanism === 'string' ? findMechanism(v.mechanism) : undefined
      if (def && v.geometry === undefined) ctx.addIssue({ code: 'custom', path: ['geometry'], message: 'is required' })
      else if (def) {
        const g = def.geometry.safeParse(v.geometry)
        if (!g.success) for (const issue of g.error.issues) ctx.addIssue({ code: 'custom', path: ['geometry', ...issue.path], message: issue.message })
      }
      if (v.sweep && v.crankAnglesDeg) ctx.addIssue({ code: 'custom', path: ['crankAnglesDeg'], message: 'give either sweep or crankAnglesDeg, not both' })
      if (v.workingRange && (v.sweep || v.crankAnglesDeg)) ctx.addIssue({ code: 'custom', path: ['workingRange'], message: 'give either workingRange or sweep/crankAnglesDeg, not both' })
      const names = new Set<string>()
      if (Array.isArray(v.loads)) {
        v.loads.forEach((l, i) => {
          if (!l || typeof l.name !== 'string') return
          if (names.has(l.name)) ctx.addIssue({ code: 'custom', path: ['loads', i, 'name'], message: `repeats the load case name "${l.name}"` })
          names.add(l.name)
        })
      }
    },
    { when: () => true },
  )
  .transform((v) => ({ ...v, geometry: getMechanism(v.mechanism).geometry.parse(v.geometry) as Geometry }))

/** The input of any registered mechanism, as the schema reads it (geometry unchecked by the type). */
export type AnyMechanismInput = z.input<typeof mechanismInputSchema>
/** A typed input of a built-in mechanism: what code that builds inputs (tests, benches) writes. */
/**
 * The same input as a discriminated union over the mechanisms registered now, each with its own
 * geometry schema: for documentation (OpenAPI). Parsing goes through `mechanismInputSchema`.
 */
export function mechanismInputUnionSchema() {
  const options = mechanisms().map((m) => mechanismCommonSchema.extend({ mechanism: z.literal(m.id), geometry: m.geometry }))
  return z.discriminatedUnion('mechanism', options as [(typeof options)[number], ...(typeof options)[number][]])
}

export type MechanismInput = Omit<AnyMechanismInput, 'mechanism' | 'geometry'> & BuiltInMechanismInput
export type ParsedMechanismInput = z.output<typeof mechanismInputSchema>

/**
 * Runs the calc. Geometric infeasibility is a result (feasibility.ok = false,
 * no positions), not an exception; only a malformed input throws (ZodError).
 */
export function runMechanism(raw: MechanismInput | AnyMechanismInput): MechanismResult {
  const input = mechanismInputSchema.parse(raw)
  const { cell, crank, offset } = getMechanism(input.mechanism).model(input.geometry)
  const out = analyse({
    cell,
    crank,
    offset,
    loads: input.loads,
    selfWeight: input.selfWeight,
    sweep: input.sweep,
    anglesDeg: input.crankAnglesDeg,
    marginDeg: input.toggleMarginDeg,
    amplificationLimit: input.amplificationLimit,
    workingRange: input.workingRange,
    requiredStroke: input.requiredStroke,
    minTransmissionDeg: input.minTransmissionAngleDeg,
    straightnessTolerance: input.straightnessTolerance,
  })
  return { mechanism: input.mechanism, engineVersion: ENGINE_VERSION, ...out }
}
