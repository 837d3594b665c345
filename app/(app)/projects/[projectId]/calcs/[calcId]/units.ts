import { fromSI, kindOfSILabel, toSI, displayUnit, type UnitSystem } from '@/lib/units'
import type { InputFieldDef } from './input-fields'

type Tree = Record<string, unknown>

function getPath(tree: Tree, path: string): unknown {
  return path.split('.').reduce<unknown>((node, key) => (node && typeof node === 'object' ? (node as Tree)[key] : undefined), tree)
}

function setPath(tree: Tree, path: string, value: unknown) {
  const keys = path.split('.')
  let node = tree
  for (const key of keys.slice(0, -1)) node = (node[key] ??= {}) as Tree
  node[keys[keys.length - 1]] = value
}

/** Six significant digits: enough for any drawing, and a US value typed in survives the round trip. */
const round = (x: number) => Number(x.toPrecision(6))

/** The unit a field shows in `system` (fields without a physical unit keep theirs). */
export function unitFor(def: InputFieldDef, system: UnitSystem): string | undefined {
  const kind = def.unit ? kindOfSILabel(def.unit) : null
  return kind ? displayUnit(system, kind) : def.unit
}

/**
 * Converts the numeric fields of the editor between SI (how inputs are stored and computed) and
 * the person's unit system. Load components are forces. Returns a new object.
 */
export function convertInputs<T extends Tree>(values: T, defs: InputFieldDef[], system: UnitSystem, direction: 'toDisplay' | 'toSI'): T {
  if (system === 'SI') return values
  const out = structuredClone(values) as Tree
  const convert = (path: string, siUnit: string) => {
    const kind = kindOfSILabel(siUnit)
    const v = getPath(out, path)
    if (!kind || typeof v !== 'number' || !Number.isFinite(v)) return
    const unit = displayUnit(system, kind)
    setPath(out, path, direction === 'toSI' ? toSI(v, unit) : round(fromSI(v, unit)))
  }
  for (const def of defs) if (def.unit) convert(def.path, def.unit)
  const loads = (out.loads as unknown[] | undefined) ?? []
  loads.forEach((_, i) => {
    convert(`loads.${i}.fx`, 'N')
    convert(`loads.${i}.fy`, 'N')
  })
  return out as T
}

/** The display unit of an SI unit label in `system` (`mm` → `in`), or the label itself. */
export function displayUnitOf(siUnit: string | undefined, system: UnitSystem): string | undefined {
  const kind = siUnit ? kindOfSILabel(siUnit) : null
  return kind ? displayUnit(system, kind) : siUnit
}

/** An SI value as a field shows it: the stored digits in SI, six significant digits in US units. */
export function showValue(value: number, siUnit: string | undefined, system: UnitSystem): string {
  const kind = siUnit ? kindOfSILabel(siUnit) : null
  if (system === 'SI' || !kind) return String(Number(value.toPrecision(12)))
  return String(round(fromSI(value, displayUnit(system, kind))))
}

/** A number typed in the field's display unit, as stored (SI). SI input is stored exactly as typed. */
export function storeValue(value: number, siUnit: string | undefined, system: UnitSystem): number {
  const kind = siUnit ? kindOfSILabel(siUnit) : null
  if (system === 'SI' || !kind) return value
  return toSI(value, displayUnit(system, kind))
}
