/**
 * What a mechanism declares to take part in calcs: its input (geometry schema, defaults, labels and
 * units), its name and its model for the linkage engine. Pure data and pure functions, so the
 * browser (input form), the server, the CLI and the report bundle read the same declaration.
 */
import type { z } from 'zod'
import type { InversorCell } from '@/lib/linkage/cells/cell'
import type { MechanismId } from '@/lib/contract'
import type { NumberRange } from '@/lib/bench/ranges'
import type { SizedFourBar } from '@/lib/fourbar/linkages'

export type { MechanismId }

/** One geometry input: where it sits in `geometry`, how the form and the package's inputs table name it. */
export interface GeometryField {
  /** Key inside `geometry`. */
  key: string
  /** Short label beside the form field, e.g. `Arm l`. */
  label: string
  /** Full wording in the package's inputs table, e.g. `Arm length l (pole to outer rhombus vertices)`. */
  description: string
  /** SI unit label (`mm`) or `—` for a pure number. */
  unit: string
  hint?: string
  /** Step of the number field (`0.01`); any value when absent. */
  step?: string
  /** The range a calc input must keep (lib/bench/ranges), checked at the field before the engine runs. */
  range?: NumberRange
}

/** Parsed geometry: numbers by key, defaults applied. */
export type Geometry = Record<string, number>

/** What the engine needs: the cell, the crank length r and the pole-to-crank-pivot offset e (mm). */
export interface MechanismModel {
  cell: InversorCell
  crank: number
  offset: number
}

/** Any zod schema whose output is a geometry (input: whatever the mechanism accepts). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type GeometrySchema = z.ZodType<Geometry, any>

export interface MechanismDef<S extends GeometrySchema = GeometrySchema, I extends MechanismId = MechanismId> {
  /** Stable id: stored with every calc and revision, used in inputs (`"mechanism": id`) and report lookups. */
  id: I
  /** Display name (create-calc form, register, calc page, package cover). */
  label: string
  /** zod schema of `geometry`; its output has every default applied. Messages as in docs/engine.md. */
  geometry: S
  /** Form fields and package rows, in display order. */
  fields: readonly GeometryField[]
  /** Geometry of a new calc: feasible, with a full stroke. */
  defaultGeometry: z.input<S>
  /** The engine's model for a parsed geometry. */
  model(geometry: z.output<S>): MechanismModel
  /** Order in which the package numbers the step sections; STEP_SECTIONS when absent. */
  stepSections?: readonly string[]
}

/** Declares a mechanism, its model and defaults type-checked against its geometry schema. */
export function defineMechanism<S extends GeometrySchema, I extends MechanismId>(def: MechanismDef<S, I>): MechanismDef<S, I> {
  return def
}

/** The `{ mechanism, geometry }` part of a calc input for one declared mechanism. */
export type MechanismInputOf<M> = M extends MechanismDef<infer S, infer I> ? { mechanism: I; geometry: z.input<S> } : never

/**
 * An approximate straight-line four-bar offered beside the exact cells in every package's "Choice of
 * mechanism" (not a calc mechanism of its own): a published linkage sized for the calc's stroke by
 * a rule, then analysed by lib/fourbar (tracer path, straightness, forces).
 */
export interface FourBarDef<R extends Record<string, number> = Record<string, number>> {
  /** Stable id (`watt`, …): the comparison's step ids are `cmp.<id>.straightness`. */
  id: string
  label: string
  /** Proportions that are a choice, as multiples of the stroke; the comparison uses these. */
  rule: R
  /** The linkage sized for stroke S (mm) by `rule`, in its own frame (see SizedFourBar). */
  size(S: number, rule: R): SizedFourBar
}

/** Declares a four-bar, its sizing type-checked against its rule. */
export function defineFourBar<R extends Record<string, number>>(def: FourBarDef<R>): FourBarDef<R> {
  return def
}
