/**
 * The mechanism registry: the one list every layer reads (calc input schema, create-calc form,
 * input form, defaults, package inputs table, report templates and step numbering).
 *
 * Adding a mechanism: its folder here (geometry schema, fields, defaults, model), its report folder
 * `reports/mechanisms/<id>/` (template.mdx), and one row in BUILT_IN below. Tests and plug-ins may
 * add one at run time with `registerMechanism`.
 *
 * The approximate straight-line four-bars that every package compares with the calc's cell are a
 * second list: a folder each (its sizing rule) and one row in FOUR_BARS, or `registerFourBar`.
 */
import { STEP_SECTIONS } from '@/lib/contract'
import { chebyshev } from './chebyshev'
import { hart } from './hart'
import { hoeken } from './hoeken'
import { peaucellier } from './peaucellier'
import { roberts } from './roberts'
import { watt } from './watt'
import type { FourBarDef, GeometrySchema, MechanismDef, MechanismId, MechanismInputOf } from './types'

export type { FourBarDef, GeometryField, Geometry, GeometrySchema, MechanismDef, MechanismId, MechanismInputOf, MechanismModel } from './types'
export { defineFourBar, defineMechanism } from './types'
export { CRANK_FIELDS, crankShape, withCrank } from './crank'
export { fraction, nonNegative, num, positive } from './numbers'

/** The built-in mechanisms, in the order the create-calc form offers them. */
const BUILT_IN = [peaucellier, hart] as const

/** Typed `{ mechanism, geometry }` of the built-in mechanisms, for inputs built in code (tests, benches). */
export type BuiltInMechanismInput = MechanismInputOf<(typeof BUILT_IN)[number]>

const registry = new Map<MechanismId, MechanismDef>(BUILT_IN.map((m) => [m.id, m as unknown as MechanismDef]))

/** Adds a definition to one of the lists. Ids are unique; registering the same definition twice is a no-op. */
function addTo<D extends { id: string }>(list: Map<string, D>, what: string, def: D): void {
  const known = list.get(def.id)
  if (known && known !== def) throw new Error(`${what} "${def.id}" is already registered`)
  if (!/^[a-z][a-z0-9-]*$/.test(def.id)) throw new Error(`${what} id "${def.id}" must be lower-case letters, digits and -`)
  list.set(def.id, def)
}

/** Adds a mechanism at run time (tests, plug-ins). */
export function registerMechanism<S extends GeometrySchema>(def: MechanismDef<S>): void {
  addTo(registry, 'mechanism', def as unknown as MechanismDef)
}

export function mechanisms(): MechanismDef[] {
  return [...registry.values()]
}

export function mechanismIds(): MechanismId[] {
  return [...registry.keys()]
}

export function isMechanismId(id: unknown): id is MechanismId {
  return typeof id === 'string' && registry.has(id)
}

export function findMechanism(id: string): MechanismDef | undefined {
  return registry.get(id)
}

export function getMechanism(id: string): MechanismDef {
  const def = registry.get(id)
  if (!def) throw new Error(`unknown mechanism "${id}": ${mechanismChoiceMessage()}`)
  return def
}

/** Display name; the id itself for a mechanism this build does not know (an old stored calc). */
export function mechanismLabel(id: string): string {
  return registry.get(id)?.label ?? id
}

/** `must be "peaucellier" or "hart"`, from whatever is registered. */
export function mechanismChoiceMessage(): string {
  const ids = mechanismIds().map((id) => `"${id}"`)
  return `must be ${ids.length > 1 ? `${ids.slice(0, -1).join(', ')} or ${ids[ids.length - 1]}` : (ids[0] ?? 'a registered mechanism')}`
}

/** Order of the step sections in the package (numbering follows it). */
export function stepSectionsOf(id: string): readonly string[] {
  return registry.get(id)?.stepSections ?? STEP_SECTIONS
}

/**
 * Joint and link names of the mechanism with its crank (docs/engine.md), from its model at the default
 * geometry: ground joints O and C first, the others alphabetically; links in the cell's order, crank last.
 */
export function mechanismComponents(id: string): { joints: string[]; links: string[] } {
  const def = getMechanism(id)
  const { cell } = def.model(def.geometry.parse(def.defaultGeometry))
  const names = new Set(cell.links.flatMap((l) => l.points))
  names.delete('O')
  return { joints: ['O', 'C', ...[...names].sort()], links: [...cell.links.map((l) => l.name), 'CP'] }
}

/** The four-bars of the "Choice of mechanism", in the order the table lists them. */
const FOUR_BARS = [watt, chebyshev, roberts, hoeken] as const

const fourBarRegistry = new Map<string, FourBarDef>(FOUR_BARS.map((f) => [f.id, f as unknown as FourBarDef]))

/** Adds a four-bar to the comparison at run time (tests, plug-ins). */
export function registerFourBar<R extends Record<string, number>>(def: FourBarDef<R>): void {
  addTo(fourBarRegistry, 'four-bar', def as unknown as FourBarDef)
}

export function fourBars(): FourBarDef[] {
  return [...fourBarRegistry.values()]
}

export function getFourBar(id: string): FourBarDef {
  const def = fourBarRegistry.get(id)
  if (!def) throw new Error(`unknown four-bar "${id}": one of ${[...fourBarRegistry.keys()].join(', ')}`)
  return def
}
