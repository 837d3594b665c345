/**
 * Input schema for the checks part of a calc. Only shape and sign are checked
 * here; rules that need the resolved description (hole vs pin, material
 * found, link long enough) live in validate.ts so the form and the CLI report
 * them at the same field paths.
 */
import { z } from 'zod'

const pos = (what: string) => z.number({ error: `${what} must be a number` }).positive({ error: `${what} must be positive` })
const nonNeg = (what: string) => z.number({ error: `${what} must be a number` }).nonnegative({ error: `${what} cannot be negative` })

export const strengthBandSchema = z.object({
  upTo: pos('band upper bound'),
  fy: pos('fy'),
  fu: pos('fu'),
})

/** A project member's own material. A source is required so every value in a package can be traced. */
export const materialSchema = z
  .object({
    name: z.string().optional(),
    kind: z.enum(['steel', 'aluminium']).default('steel'),
    bandBy: z.enum(['thickness', 'diameter']).default('thickness'),
    fy: pos('fy').optional(),
    fu: pos('fu').optional(),
    bands: z.array(strengthBandSchema).min(1).optional(),
    E: pos('E'),
    density: pos('density').optional(),
    source: z.string({ error: 'a source is required for every user material' }).trim().min(3, { error: 'a source is required for every user material' }),
  })
  .superRefine((m, ctx) => {
    const hasPair = m.fy !== undefined && m.fu !== undefined
    if (!hasPair && !m.bands) {
      ctx.addIssue({ code: 'custom', path: ['fy'], message: 'material has no strength values: give fy and fu (MPa) or bands' })
    }
    if (m.fy !== undefined && m.fu !== undefined && m.fu < m.fy) {
      ctx.addIssue({ code: 'custom', path: ['fu'], message: `fu (${m.fu}) must not be below fy (${m.fy})` })
    }
  })

export const plateSchema = z.object({
  thickness: pos('thickness'),
  material: z.string().optional(),
})

/** Everything optional so a joint can name only what differs from `defaults.joint`. */
export const jointSchema = z.object({
  pinDiameter: pos('pin diameter').optional(),
  holeDiameter: pos('hole diameter').optional(),
  pinMaterial: z.string().optional(),
  arrangement: z.enum(['single', 'double']).optional(),
  /** Double shear: the middle plate (fork tongue) and each of the two outer plates (clevis cheeks). */
  middle: plateSchema.optional(),
  outer: plateSchema.optional(),
  /** Single shear: the two lapped plates; default to middle / outer. */
  plate1: plateSchema.optional(),
  plate2: plateSchema.optional(),
  /** Clear gap between adjacent plates, mm (c in EN 1993-1-8 Fig. 3.11). */
  gap: nonNeg('gap').optional(),
  /** A replaceable pin gets the EN 1993-1-8 §3.13.2 serviceability checks. */
  replaceable: z.boolean().optional(),
})

export const sectionSchema = z.discriminatedUnion('shape', [
  z.object({ shape: z.literal('flat'), width: pos('width'), thickness: pos('thickness') }),
  z.object({ shape: z.literal('round'), diameter: pos('diameter') }),
  z.object({ shape: z.literal('tube'), outerDiameter: pos('outer diameter'), wall: pos('wall') }),
])

/** The eye at each end of a link, where the pin passes. Defaults from a flat section. */
export const eyeSchema = z.object({
  thickness: pos('eye thickness').optional(),
  /** Width across the force at the hole, mm; the hole is taken as centred. */
  width: pos('eye width').optional(),
  holeDiameter: pos('hole diameter').optional(),
  pinDiameter: pos('pin diameter').optional(),
  /** Distance from the hole edge to the end of the eye along the force, mm (a in EN Table 3.9 and AISC D5). */
  edgeAlong: pos('edge distance along the force').optional(),
  material: z.string().optional(),
  /** EN 1993-1-8 Table 3.9: A = thickness given, B = geometry given. */
  table39Type: z.enum(['A', 'B']).optional(),
})

export const linkSchema = z.object({
  section: sectionSchema.optional(),
  material: z.string().optional(),
  eye: eyeSchema.optional(),
  /** Pin-to-pin length, mm; taken from the engine's envelope when the mechanism is solved. */
  length: pos('length').optional(),
  effectiveLengthFactor: pos('effective length factor').optional(),
  /** EN 1993-1-1 Table 6.2 curve; solid sections use c, see docs/checks.md. */
  bucklingCurve: z.enum(['a0', 'a', 'b', 'c', 'd']).optional(),
})

export const basisSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('allowable'), factorOfSafety: pos('factor of safety').default(2) }),
  z.object({
    kind: z.literal('en1993'),
    gammaM0: pos('γM0').default(1.0),
    gammaM1: pos('γM1').default(1.0),
    gammaM2: pos('γM2').default(1.25),
    gammaM6ser: pos('γM6,ser').default(1.0),
  }),
  z.object({ kind: z.literal('aisc360'), method: z.enum(['LRFD', 'ASD']).default('LRFD') }),
])

export const factorsSchema = z.object({
  load: pos('load factor').default(1),
  dynamic: pos('dynamic factor').default(1),
})

export const checksInputSchema = z.object({
  units: z.enum(['SI', 'US']).default('SI'),
  basis: basisSchema,
  factors: factorsSchema.default({ load: 1, dynamic: 1 }),
  materials: z.record(z.string(), materialSchema).default({}),
  joints: z.record(z.string(), jointSchema).default({}),
  links: z.record(z.string(), linkSchema).default({}),
  defaults: z
    .object({ joint: jointSchema.optional(), link: linkSchema.optional() })
    .default({}),
})

export type ChecksInput = z.output<typeof checksInputSchema>
export type ChecksInputRaw = z.input<typeof checksInputSchema>
export type JointInput = z.output<typeof jointSchema>
export type LinkInput = z.output<typeof linkSchema>
export type SectionInput = z.output<typeof sectionSchema>
export type PlateInput = z.output<typeof plateSchema>
export type MaterialInput = z.output<typeof materialSchema>
export type Basis = z.output<typeof basisSchema>
export type Factors = z.output<typeof factorsSchema>
