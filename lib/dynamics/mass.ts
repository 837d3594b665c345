/**
 * Mass properties of the links, each taken as a slender bar of uniform section between its end
 * pins: m = ρ A L and I_G = m L²/12 about its middle (any machine-design or dynamics text —
 * common practice). Eyes, bosses and pins beyond that line are not in the bar; give them as
 * added masses at their joints when they matter.
 *
 * Units: density kg/m³, area mm², length mm → mass kg, inertia kg·mm².
 */
import { sectionProps } from '@/lib/checks/sections'
import type { SectionInput } from '@/lib/checks/schema'
import { linkLength, type LinkageModel } from '@/lib/linkage/model'

/** What a link is made of: its section area and its material's density, with where they come from. */
export interface LinkBody {
  /** Section area, mm². */
  area: number
  /** Density, kg/m³. */
  density: number
  /** The section as printed, e.g. `flat 20 × 5 mm`. */
  section?: string
  /** Where the density comes from (material source). */
  densitySource?: string
}

/** A point mass carried at a joint (tool or carriage at the tracer, a heavy pin), kg. */
export interface AddedMass {
  joint: string
  mass: number
  label?: string
}

export interface LinkMass {
  link: string
  /** Pin-to-pin length, mm. */
  length: number
  area: number
  density: number
  section?: string
  densitySource?: string
  /** m = ρ A L · 10⁻⁹ (mm³ → m³), kg. */
  mass: number
  /** I_G = m L²/12, kg·mm². */
  inertia: number
}

/** kg/m³ · mm² · mm → kg. */
export const MM3_TO_M3 = 1e-9

/** Mass and centroidal moment of inertia of a slender uniform bar. */
export function slenderBar(area: number, length: number, density: number): { mass: number; inertia: number } {
  const mass = density * area * length * MM3_TO_M3
  return { mass, inertia: (mass * length * length) / 12 }
}

/** A link body from a section of lib/checks (its gross area) and a density. */
export function bodyFromSection(section: SectionInput, density: number, densitySource?: string): LinkBody {
  const p = sectionProps(section)
  return { area: p.A, density, section: p.label, ...(densitySource ? { densitySource } : {}) }
}

/** Mass properties of every link of the model, in the model's link order. Every link needs a body. */
export function linkMasses(model: LinkageModel, bodies: Record<string, LinkBody>): LinkMass[] {
  return model.links.map((l) => {
    const b = bodies[l.name]
    if (!b) throw new Error(`no section and density given for link ${l.name}`)
    if (!(b.area > 0) || !(b.density > 0)) throw new Error(`link ${l.name}: area and density must be positive`)
    const length = linkLength(l)
    return {
      link: l.name,
      length,
      area: b.area,
      density: b.density,
      ...(b.section !== undefined ? { section: b.section } : {}),
      ...(b.densitySource !== undefined ? { densitySource: b.densitySource } : {}),
      ...slenderBar(b.area, length, b.density),
    }
  })
}
