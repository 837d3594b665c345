/**
 * Turns the sparse input (a joint or link names only what differs from the
 * defaults) into complete descriptions, collecting every problem as a
 * { path, message } at the field the engineer has to change.
 */
import { strengthFor, type Material } from './materials'
import { findMaterial } from './resolve-material'
import type { ChecksInput, JointInput, LinkInput, PlateInput } from './schema'
import { sectionProps, type SectionProps } from './sections'

export interface FieldIssue {
  path: string
  message: string
}

export interface ResolvedPlate {
  role: string
  thickness: number
  material: Material
  fy: number
  fu: number
  band: string
  /** Fraction of the pin force this plate carries in bearing. */
  share: number
}

export interface ResolvedJoint {
  name: string
  d: number
  d0: number
  pin: { material: Material; fy: number; fu: number; band: string }
  arrangement: 'single' | 'double'
  shearPlanes: 1 | 2
  plates: ResolvedPlate[]
  gap: number
  replaceable: boolean
}

export interface ResolvedEye {
  t: number
  w: number
  d0: number
  d: number
  a: number
  /** Edge distance across the force from hole edge, (w − d0)/2. */
  c: number
  material: Material
  fy: number
  fu: number
  band: string
  table39Type: 'A' | 'B'
}

export interface ResolvedLink {
  name: string
  section: SectionProps
  material: Material
  fy: number
  fu: number
  band: string
  eye: ResolvedEye
  length: number
  K: number
  curve: 'a0' | 'a' | 'b' | 'c' | 'd'
}

export const DEFAULT_PIN_MATERIAL = 'C45+QT'
export const DEFAULT_PLATE_MATERIAL = 'S355'
/** Default clearance d0 − d for a running pin, mm — common practice, smaller than AISC D5.2's 1/32 in. */
export const DEFAULT_CLEARANCE = 0.1

type Collector = FieldIssue[]

/** Path of a field: the joint's own entry if it set it, else the default's, else the joint's. */
function where(input: ChecksInput, group: 'joints' | 'links', name: string, field: string, sub?: string): string {
  const own = (input[group][name] ?? {}) as Record<string, unknown>
  const def = ((group === 'joints' ? input.defaults.joint : input.defaults.link) ?? {}) as Record<string, unknown>
  const tail = sub ? `${field}.${sub}` : field
  const has = (o: Record<string, unknown>) => (sub ? (o[field] as Record<string, unknown> | undefined)?.[sub] !== undefined : o[field] !== undefined)
  if (has(own)) return `${group}.${name}.${tail}`
  if (has(def)) return `defaults.${group === 'joints' ? 'joint' : 'link'}.${tail}`
  return `${group}.${name}.${tail}`
}

function material(input: ChecksInput, id: string, path: string, issues: Collector): Material | null {
  const found = findMaterial(id, input)
  if (!found.ok) {
    issues.push({ path, message: found.message })
    return null
  }
  return found.material
}

function mergePlate(a?: PlateInput, b?: PlateInput): PlateInput | undefined {
  if (!a && !b) return undefined
  return { ...a, ...b } as PlateInput
}

export function mergedJoint(input: ChecksInput, name: string): JointInput {
  const d = input.defaults.joint ?? {}
  const j = input.joints[name] ?? {}
  return {
    ...d,
    ...j,
    middle: mergePlate(d.middle, j.middle),
    outer: mergePlate(d.outer, j.outer),
    plate1: mergePlate(d.plate1, j.plate1),
    plate2: mergePlate(d.plate2, j.plate2),
  }
}

export function resolveJoint(input: ChecksInput, name: string, issues: Collector): ResolvedJoint | null {
  const j = mergedJoint(input, name)
  const at = (f: string, sub?: string) => where(input, 'joints', name, f, sub)
  const start = issues.length
  if (j.pinDiameter === undefined) {
    issues.push({ path: at('pinDiameter'), message: `joint ${name} has no pin diameter (give joints.${name}.pinDiameter or defaults.joint.pinDiameter)` })
    return null
  }
  const d = j.pinDiameter
  const d0 = j.holeDiameter ?? d + DEFAULT_CLEARANCE
  if (d0 < d) issues.push({ path: at('holeDiameter'), message: `hole (${d0} mm) must not be smaller than the pin (${d} mm)` })
  const pinMat = material(input, j.pinMaterial ?? DEFAULT_PIN_MATERIAL, at('pinMaterial'), issues)
  const arrangement = j.arrangement ?? 'double'
  const roles: [string, 'middle' | 'outer' | 'plate1' | 'plate2', number][] =
    arrangement === 'double'
      ? [['middle plate', 'middle', 1], ['outer plate', 'outer', 0.5]]
      : [['plate 1', 'plate1', 1], ['plate 2', 'plate2', 1]]
  const plates: ResolvedPlate[] = []
  for (const [role, key, share] of roles) {
    const fallback = key === 'plate1' ? 'middle' : key === 'plate2' ? 'outer' : key
    const p = j[key] ?? j[fallback]
    const field = j[key] ? key : fallback
    if (!p) {
      issues.push({ path: at(key), message: `joint ${name} (${arrangement} shear) needs its ${role} described: thickness and material` })
      continue
    }
    const m = material(input, p.material ?? DEFAULT_PLATE_MATERIAL, at(field, 'material'), issues)
    if (!m) continue
    const s = strengthFor(m, p.thickness)
    plates.push({ role, thickness: p.thickness, material: m, fy: s.fy, fu: s.fu, band: `${m.id}, ${s.band}`, share })
  }
  if (!pinMat || issues.length > start) return null
  const ps = strengthFor(pinMat, d)
  return {
    name,
    d,
    d0,
    pin: { material: pinMat, fy: ps.fy, fu: ps.fu, band: `${pinMat.id}, ${ps.band}` },
    arrangement,
    shearPlanes: arrangement === 'double' ? 2 : 1,
    plates,
    gap: j.gap ?? 0,
    replaceable: j.replaceable ?? true,
  }
}

export function mergedLink(input: ChecksInput, name: string): LinkInput {
  const d = input.defaults.link ?? {}
  const l = input.links[name] ?? {}
  return { ...d, ...l, eye: d.eye || l.eye ? { ...d.eye, ...l.eye } : undefined }
}

export function resolveLink(input: ChecksInput, name: string, envelopeLength: number | undefined, issues: Collector): ResolvedLink | null {
  const l = mergedLink(input, name)
  const at = (f: string, sub?: string) => where(input, 'links', name, f, sub)
  const start = issues.length
  if (!l.section) {
    issues.push({ path: at('section'), message: `link ${name} has no section (give links.${name}.section or defaults.link.section)` })
    return null
  }
  const section = sectionProps(l.section)
  if (l.section.shape === 'tube' && 2 * l.section.wall >= l.section.outerDiameter) {
    issues.push({ path: at('section', 'wall'), message: `wall (${l.section.wall} mm) must be less than half the outer diameter (${l.section.outerDiameter} mm)` })
  }
  const matId = l.material ?? DEFAULT_PLATE_MATERIAL
  const mat = material(input, matId, at('material'), issues)
  const eye = l.eye ?? {}
  const flat = l.section.shape === 'flat' ? l.section : null
  const t = eye.thickness ?? flat?.thickness
  const w = eye.width ?? flat?.width
  if (t === undefined || w === undefined) {
    issues.push({ path: at('eye'), message: `link ${name} is a ${l.section.shape} section: describe its eye (thickness and width at the hole)` })
    return null
  }
  const dj = mergedJoint(input, '')
  const d = eye.pinDiameter ?? dj.pinDiameter
  if (d === undefined) {
    issues.push({ path: at('eye', 'pinDiameter'), message: `link ${name}: give eye.pinDiameter (or defaults.joint.pinDiameter)` })
    return null
  }
  const d0 = eye.holeDiameter ?? dj.holeDiameter ?? d + DEFAULT_CLEARANCE
  if (d0 < d) issues.push({ path: at('eye', 'holeDiameter'), message: `hole (${d0} mm) must not be smaller than the pin (${d} mm)` })
  if (w <= d0) issues.push({ path: at('eye', 'width'), message: `eye width (${w} mm) must be larger than the hole (${d0} mm)` })
  const c = (w - d0) / 2
  const a = eye.edgeAlong ?? Math.max(c, 0)
  const length = l.length ?? envelopeLength
  if (length === undefined) {
    issues.push({ path: at('length'), message: `link ${name}: give its pin-to-pin length` })
  } else if (length <= d0) {
    issues.push({ path: at('length'), message: `link too short for its holes: pin-to-pin length ${length} mm must exceed the hole diameter ${d0} mm` })
  }
  const eyeMat = eye.material ? material(input, eye.material, at('eye', 'material'), issues) : mat
  if (!mat || !eyeMat || length === undefined || issues.length > start) return null
  const s = strengthFor(mat, section.bandSize)
  const se = strengthFor(eyeMat, t)
  return {
    name,
    section,
    material: mat,
    fy: s.fy,
    fu: s.fu,
    band: `${mat.id}, ${s.band}`,
    eye: { t, w, d0, d, a, c, material: eyeMat, fy: se.fy, fu: se.fu, band: `${eyeMat.id}, ${se.band}`, table39Type: eye.table39Type ?? 'A' },
    length,
    K: l.effectiveLengthFactor ?? 1,
    // Solid flats and rounds are curve c in EN 1993-1-1 Table 6.2; c is also the cold-formed tube curve, the safe side for tubes of unknown make.
    curve: l.bucklingCurve ?? 'c',
  }
}
