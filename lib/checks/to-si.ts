/**
 * Input in US customary units is converted once, at the edge, field by field
 * through lib/units; everything after this runs in mm, N, MPa.
 */
import { inputToSI, type UnitSystem } from '@/lib/units'
import type { ChecksInput, JointInput, LinkInput, MaterialInput, PlateInput, SectionInput } from './schema'

type Conv = (v: number) => number
type Maybe = <T extends number | undefined>(v: T, c: Conv) => T

const m: Maybe = (v, c) => (v === undefined ? v : (c(v) as typeof v))

function convPlate(p: PlateInput | undefined, L: Conv): PlateInput | undefined {
  return p && { ...p, thickness: L(p.thickness) }
}

function convJoint(j: JointInput | undefined, L: Conv): JointInput | undefined {
  if (!j) return j
  return {
    ...j,
    pinDiameter: m(j.pinDiameter, L),
    holeDiameter: m(j.holeDiameter, L),
    gap: m(j.gap, L),
    middle: convPlate(j.middle, L),
    outer: convPlate(j.outer, L),
    plate1: convPlate(j.plate1, L),
    plate2: convPlate(j.plate2, L),
  }
}

function convSection(s: SectionInput | undefined, L: Conv): SectionInput | undefined {
  if (!s) return s
  switch (s.shape) {
    case 'flat':
      return { ...s, width: L(s.width), thickness: L(s.thickness) }
    case 'round':
      return { ...s, diameter: L(s.diameter) }
    case 'tube':
      return { ...s, outerDiameter: L(s.outerDiameter), wall: L(s.wall) }
  }
}

function convLink(l: LinkInput | undefined, L: Conv): LinkInput | undefined {
  if (!l) return l
  const e = l.eye
  return {
    ...l,
    length: m(l.length, L),
    section: convSection(l.section, L),
    eye: e && {
      ...e,
      thickness: m(e.thickness, L),
      width: m(e.width, L),
      holeDiameter: m(e.holeDiameter, L),
      pinDiameter: m(e.pinDiameter, L),
      edgeAlong: m(e.edgeAlong, L),
    },
  }
}

function convMaterial(x: MaterialInput, L: Conv, S: Conv, R: Conv): MaterialInput {
  return {
    ...x,
    fy: m(x.fy, S),
    fu: m(x.fu, S),
    E: S(x.E),
    density: m(x.density, R),
    bands: x.bands?.map((b) => ({ upTo: L(b.upTo), fy: S(b.fy), fu: S(b.fu) })),
  }
}

const mapValues = <T, U>(o: Record<string, T>, f: (v: T) => U): Record<string, U> =>
  Object.fromEntries(Object.entries(o).map(([k, v]) => [k, f(v)]))

/** Lengths in, stresses (E too) in ksi, densities in lb/in³ for US input; returns an SI input. */
export function checksInputToSI(input: ChecksInput): ChecksInput {
  if (input.units === 'SI') return input
  const sys: UnitSystem = input.units
  const L: Conv = (v) => inputToSI(v, sys, 'length')
  const S: Conv = (v) => inputToSI(v, sys, 'stress')
  const R: Conv = (v) => inputToSI(v, sys, 'density')
  return {
    ...input,
    units: 'SI',
    materials: mapValues(input.materials, (x) => convMaterial(x, L, S, R)),
    joints: mapValues(input.joints, (j) => convJoint(j, L) as JointInput),
    links: mapValues(input.links, (l) => convLink(l, L) as LinkInput),
    defaults: { joint: convJoint(input.defaults.joint, L), link: convLink(input.defaults.link, L) },
  }
}

/** A directly given force (lbf) or moment (lbf·in) in SI. */
export function forceToSI(v: number | undefined, sys: UnitSystem, kind: 'force' | 'moment'): number | undefined {
  return v === undefined ? undefined : inputToSI(v, sys, kind)
}
