import { MATERIALS } from './materials'

/** A library material value that the library marks "from memory" (not checked against a copy of its standard). */
export interface MemoryValue {
  /** `material.property`, e.g. `S355.strength` */
  key: string
  material: string
  property: string
  source: string
}

/** Every material name the inputs refer to: the values of `material` and `…Material` keys, at any depth. */
export function materialNamesIn(value: unknown, out = new Set<string>()): Set<string> {
  if (Array.isArray(value)) value.forEach((v) => materialNamesIn(v, out))
  else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      if (typeof v === 'string' && (k === 'material' || k.endsWith('Material'))) out.add(v)
      else if (k !== 'materials') materialNamesIn(v, out)
    }
  }
  return out
}

/**
 * The "from memory" library values a calc input uses. A material the input defines itself (a
 * project material, copied in with its own source) is not one of them.
 */
export function memoryValuesIn(inputs: unknown): MemoryValue[] {
  const own = (inputs as { materials?: Record<string, unknown> } | null)?.materials ?? {}
  const out: MemoryValue[] = []
  for (const name of [...materialNamesIn(inputs)].sort()) {
    const m = MATERIALS[name]
    if (!m || name in own) continue
    for (const [property, source] of Object.entries(m.sources)) {
      if (source.includes('from memory')) out.push({ key: `${name}.${property}`, material: name, property, source })
    }
  }
  return out
}
