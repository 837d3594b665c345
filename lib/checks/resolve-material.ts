/** Finds a material by id in the user's additions first, then the library, and turns it into one shape. */
import { MATERIALS, type Material } from './materials'
import type { ChecksInput, MaterialInput } from './schema'

export function userMaterial(id: string, m: MaterialInput): Material {
  const bands = m.bands ?? [{ upTo: Number.POSITIVE_INFINITY, fy: m.fy ?? 0, fu: m.fu ?? 0 }]
  const steel = m.kind === 'steel'
  return {
    id,
    name: m.name ?? id,
    kind: m.kind,
    bandBy: m.bandBy,
    bands: [...bands].sort((a, b) => a.upTo - b.upTo),
    E: m.E,
    density: m.density ?? (steel ? 7850 : 2700),
    sources: {
      strength: m.source,
      E: m.source,
      density: m.density !== undefined ? m.source : 'not given; typical value used — common practice',
    },
  }
}

export type MaterialLookup = { ok: true; material: Material } | { ok: false; message: string }

export function findMaterial(id: string, input: Pick<ChecksInput, 'materials'>): MaterialLookup {
  const own = input.materials[id]
  if (own) return { ok: true, material: userMaterial(id, own) }
  const lib = MATERIALS[id]
  if (lib) return { ok: true, material: lib }
  const known = [...Object.keys(MATERIALS), ...Object.keys(input.materials)].join(', ')
  return { ok: false, message: `unknown material "${id}" (known: ${known})` }
}
