import { z } from 'zod'
import { analyse, DEFAULT_SWEEP_COUNT } from '@/lib/linkage'
import { MAX_POSITIONS, outOfRange, rangeMessage } from '@/lib/bench/ranges'
import { hasControl } from '@/lib/schemas/clean-text'
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

/** Largest crank speed the calc takes, rev/min (common practice for a linkage guide in a packaging machine). */
export const MAX_RPM = 1200
/** Largest tool mass at the tracer, kg. */
export const MAX_TOOL_MASS = 500

/** Largest Monte Carlo run per calc (each sample solves the cell at 50 positions; 20 000 take about 0.2 s here). */
export const MAX_SAMPLES = 20_000
/** Largest ± tolerance of a link length, mm. */
export const MAX_LENGTH_TOLERANCE = 5

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
  /** Crank speed (constant) and the tool's mass at the tracer: a case at speed beside every static case. */
  operatingSpeed: z
    .object({
      rpm: positive().max(MAX_RPM, { error: `must be at most ${MAX_RPM} rev/min: a guide cell beyond that belongs to a dynamic analysis of its own` }),
      toolMass: nonNegative().max(MAX_TOOL_MASS, { error: `must be at most ${MAX_TOOL_MASS} kg` }).optional(),
    })
    .optional(),
  /** Straightness of the built guide: link tolerances (a general class or per link) and the pins' clearance. */
  tolerances: z
    .object({
      toleranceClass: z.enum(['f', 'm', 'c', 'v'], { error: 'must be f, m, c or v (ISO 2768-1 fine, medium, coarse, very coarse)' }).optional(),
      lengths: z
        .record(z.string().max(20, { error: 'must be a link or frame name' }), nonNegative().max(MAX_LENGTH_TOLERANCE, { error: `must be at most ${MAX_LENGTH_TOLERANCE} mm` }))
        .refine((r) => Object.keys(r).length <= 50, { error: 'must list at most 50 lengths' })
        .optional(),
      samples: num()
        .int({ error: 'must be a whole number' })
        .min(0, { error: 'must be 0 (worst case only) or more' })
        .max(MAX_SAMPLES, { error: `must be at most ${MAX_SAMPLES}: a larger run belongs to a study of its own` })
        .optional(),
      seed: num().int({ error: 'must be a whole number' }).min(0, { error: 'must not be negative' }).max(2 ** 31, { error: 'must be below 2³¹' }).optional(),
      distribution: z.enum(['normal', 'uniform'], { error: 'must be normal or uniform' }).optional(),
      /** Per link or frame item: its own distribution in the Monte Carlo run. */
      distributions: z
        .record(z.string().max(20, { error: 'must be a link or frame name' }), z.enum(['normal', 'uniform'], { error: 'must be normal or uniform' }))
        .refine((r) => Object.keys(r).length <= 50, { error: 'must list at most 50 items' })
        .optional(),
    })
    .optional(),
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

/** Most load cases in one calc: each is solved at every position (common practice: a few cases describe a cell's duty). */
export const MAX_LOAD_CASES = 20
/** Longest load case name: a label in the package's tables and plots (common practice). */
export const MAX_LOAD_NAME = 60
/**
 * Most positions solved in one calc (load cases × positions): about a second of engine time and some
 * 30 MB of result on the 2-core server measured for issue 13 (1 × 10 000 positions: 0.6 s, 31 MB;
 * 50 × 1000: 2.5 s, 89 MB). Common practice: a few dozen positions per case show any cell.
 */
export const MAX_SOLVED_POSITIONS = 10000

/**
 * Bounds on new input beyond the schema, keyed by dotted path: geometry inside the ranges its
 * mechanism declares (GeometryField.range), the number and names of load cases, and the positions
 * solved. Only values of the right type are looked at; the schema reports the others. Checked on new
 * input (`calculate`), not by the schema, so inputs stored before these limits still read.
 */
export function mechanismBoundErrors(raw: unknown): Record<string, string> {
  const out: Record<string, string> = {}
  if (!raw || typeof raw !== 'object') return out
  const v = raw as { mechanism?: unknown; geometry?: unknown; loads?: unknown; sweep?: { count?: unknown }; crankAnglesDeg?: unknown }
  const def = typeof v.mechanism === 'string' ? findMechanism(v.mechanism) : undefined
  if (def && v.geometry && typeof v.geometry === 'object') {
    for (const f of def.fields) {
      const x = (v.geometry as Record<string, unknown>)[f.key]
      if (!f.range || typeof x !== 'number') continue
      if (!Number.isFinite(x)) out[`geometry.${f.key}`] = 'must be a number'
      else if (outOfRange(f.range, x)) out[`geometry.${f.key}`] = rangeMessage(f.range)
    }
  }
  const loads = Array.isArray(v.loads) ? v.loads : null
  if (loads && loads.length > MAX_LOAD_CASES) out.loads = `must hold from 1 to ${MAX_LOAD_CASES} load cases: each case is solved at every position; more belong in a second calc`
  else if (loads) {
    loads.forEach((l, i) => {
      const name = l && typeof l === 'object' ? (l as { name?: unknown }).name : undefined
      if (typeof name !== 'string') return
      if (name.length > MAX_LOAD_NAME) out[`loads.${i}.name`] = `must be at most ${MAX_LOAD_NAME} characters: a load case name is a label in the package's tables`
      else if (hasControl(name)) out[`loads.${i}.name`] = 'must not hold control characters (tabs, line breaks, NUL)'
    })
  }
  const angles = Array.isArray(v.crankAnglesDeg) ? v.crankAnglesDeg : null
  if (angles && angles.length > MAX_POSITIONS) out.crankAnglesDeg = `must hold at most ${MAX_POSITIONS} angles: at most ${MAX_POSITIONS} positions per load case`
  // Work per request is bounded: every load case is solved at every position.
  const count = v.sweep && typeof v.sweep === 'object' && typeof v.sweep.count === 'number' ? v.sweep.count : null
  const positions = count ?? angles?.length ?? DEFAULT_SWEEP_COUNT
  const cases = loads?.length ?? 0
  if (cases > 0 && cases <= MAX_LOAD_CASES && positions <= MAX_POSITIONS && cases * positions > MAX_SOLVED_POSITIONS) {
    out[count !== null ? 'sweep.count' : 'crankAnglesDeg'] =
      `must be at most ${Math.floor(MAX_SOLVED_POSITIONS / cases)} positions with ${cases} load cases: at most ${MAX_SOLVED_POSITIONS} positions are solved in one calc (load cases × positions)`
  }
  return out
}

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
  return analyseParsed(mechanismInputSchema.parse(raw))
}

/** runMechanism on an input already parsed by mechanismInputSchema. */
export function analyseParsed(input: ParsedMechanismInput): MechanismResult {
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
