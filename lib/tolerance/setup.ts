/**
 * What varies: every hole-to-hole length of every link (from its first hole, as a link is usually
 * dimensioned from one datum hole), the frame distance O–C between the ground pivots, and every
 * link's eye on every pin (clearance). Each becomes a variable of the perturbed kinematics.
 */
import { generalTolerance, ISO2768_SOURCE, TOLERANCE_CLASS_NAMES, type ToleranceClass } from './iso2768'
import { anglesOver, compileLinkage, type CompiledLinkage, type Effect, type MechanismModelLike } from './kinematics'
import type { Vec } from '@/lib/linkage/vec'

/** Which eye, where: the query a pin-force direction function answers. */
export interface EyeQuery {
  joint: string
  link: string
  /** Index of the position (0 … positions − 1) and its crank angle. */
  position: number
  crankDeg: number
}

/**
 * The force each pin applies to each link's eye, per position: a function, or one record per
 * position keyed `joint@link` (e.g. `A@OA`). Only its direction is used; null, absent or zero
 * means not known at that eye.
 */
export type EyeForceInput = ((q: EyeQuery) => Vec | null | undefined) | Record<string, Vec>[]

export interface ToleranceInput {
  /** The engine's model: `getMechanism(id).model(geometry)` (cell, crank r, offset e). */
  model: MechanismModelLike
  /** The working range (the calc result's `workingRange`), crank angles in degrees. */
  workingRange: { crankMinDeg: number; crankMaxDeg: number }
  /** Positions evaluated over the working range, ends included (default 50). */
  positions?: number
  /** General tolerance class for every length without its own tolerance (default m). */
  toleranceClass?: ToleranceClass
  /** ± tolerance per item id (`OA`, `AD:A-O`, `frame:OC`), mm: overrides the class. */
  tolerances?: Record<string, number>
  /** Clearance hole − pin, mm, per joint (every eye on that pin) or per eye `joint@link`. */
  clearances?: Record<string, number>
  eyeForces?: EyeForceInput
}

export interface ToleranceItem {
  /** `OA`; `AD:A-O` for a hole of a link with three or more; `frame:OC`; `A@OA` for the eye of OA on pin A. */
  id: string
  kind: 'length' | 'frame' | 'clearance'
  label: string
  /** Nominal length, mm; for an eye, its clearance hole − pin, mm. */
  nominal: number
  /**
   * Half-range of the variable, mm: the ± tolerance of a length; for an eye whose force direction is
   * not known, ±c/2 along the link's axis. 0 for an eye with a known direction (see `fixed`).
   */
  plusMinus: number
  /** Eye with a known force direction: the pin's shift c/2 along that force, mm, the same in every sample. */
  fixed: number | null
  /** Where the tolerance comes from. */
  source: string
  link?: string
  joint?: string
}

export interface ToleranceSetup {
  linkage: CompiledLinkage
  items: ToleranceItem[]
  /** One per item, in the same order. */
  effects: Effect[]
  toleranceClass: ToleranceClass
  /** Things the reader should know: lengths without a general tolerance, eyes without a force direction. */
  notes: string[]
}

export class ToleranceInputError extends Error {
  constructor(
    readonly path: string,
    message: string,
  ) {
    super(message)
    this.name = 'ToleranceInputError'
  }
}

export const DEFAULT_POSITIONS = 50

/** Items and kinematics for one mechanism over its working range. */
export function prepareTolerance(input: ToleranceInput): ToleranceSetup {
  const cls = input.toleranceClass ?? 'm'
  const { crankMinDeg, crankMaxDeg } = input.workingRange
  const n = input.positions ?? DEFAULT_POSITIONS
  if (!Number.isInteger(n) || n < 3) throw new ToleranceInputError('positions', 'must be a whole number of at least 3')
  if (!(crankMaxDeg > crankMinDeg)) throw new ToleranceInputError('workingRange', 'the working range must run from a smaller to a larger crank angle')
  const linkage = compileLinkage(input.model, anglesOver(crankMinDeg, crankMaxDeg, n))
  const items: ToleranceItem[] = []
  const effects: Effect[] = []
  const notes: string[] = []
  const overrides = input.tolerances ?? {}
  const classSource = `${ISO2768_SOURCE}, class ${cls} (${TOLERANCE_CLASS_NAMES[cls]})`

  const tolerance = (id: string, nominal: number): { t: number; source: string } => {
    if (id in overrides) {
      const t = overrides[id]
      if (!(t >= 0)) throw new ToleranceInputError(`tolerances.${id}`, 'must be a number, not negative')
      return { t, source: 'stated for this dimension' }
    }
    const g = generalTolerance(cls, nominal)
    if (g.ok) return { t: g.plusMinus, source: `${classSource}, ${g.band}` }
    notes.push(`${id}: ${g.reason}; taken as exact — state its tolerance.`)
    return { t: 0, source: 'none (no general tolerance applies)' }
  }

  // Lengths: every hole of a link from its first hole.
  linkage.bodies.forEach((b) => {
    for (let k = 1; k < b.points.length; k++) {
      const id = b.points.length === 2 ? b.name : `${b.name}:${b.points[0]}-${b.points[k]}`
      const nominal = b.stations[k]
      const { t, source } = tolerance(id, nominal)
      const label = b.points.length === 2 ? `${b.kind === 'crank' ? 'crank' : 'link'} ${b.name}` : `link ${b.name}, hole ${b.points[k]} from hole ${b.points[0]}`
      items.push({ id, kind: 'length', label, nominal, plusMinus: t, fixed: null, source, link: b.name })
      effects.push({ mode: 'axial', point: b.first + k })
    }
  })
  // The frame: O–C along x (C = (e, 0)).
  const cJoint = linkage.joints.indexOf('C')
  const e = input.model.offset
  {
    const { t, source } = tolerance('frame:OC', e)
    items.push({ id: 'frame:OC', kind: 'frame', label: 'frame, crank pivot C from pole O', nominal: e, plusMinus: t, fixed: null, source })
    effects.push({ mode: 'ground', joint: cJoint })
  }
  for (const id of Object.keys(overrides)) {
    if (!items.some((i) => i.id === id)) throw new ToleranceInputError(`tolerances.${id}`, `no dimension "${id}"; the dimensions are ${items.map((i) => i.id).join(', ')}`)
  }

  // Eyes: every link on every pin.
  const clear = input.clearances ?? {}
  const eyeIds = linkage.bodies.flatMap((b) => b.points.map((j) => `${j}@${b.name}`))
  for (const [key, c] of Object.entries(clear)) {
    if (!linkage.joints.includes(key) && !eyeIds.includes(key)) {
      throw new ToleranceInputError(`clearances.${key}`, `no pin or eye "${key}"; pins: ${linkage.joints.join(', ')}; eyes: joint@link, e.g. ${eyeIds[0]}`)
    }
    if (!(c >= 0)) throw new ToleranceInputError(`clearances.${key}`, 'must be a number, not negative')
  }
  const n2 = linkage.anglesDeg.length
  const nb = linkage.bodies.length
  const forceAt = (joint: string, link: string, p: number): Vec | null => {
    const f = input.eyeForces
    if (!f) return null
    const v = typeof f === 'function' ? f({ joint, link, position: p, crankDeg: linkage.anglesDeg[p] }) : f[p]?.[`${joint}@${link}`]
    return v && Number.isFinite(v.x) && Number.isFinite(v.y) ? v : null
  }
  if (Array.isArray(input.eyeForces) && input.eyeForces.length !== n2) {
    throw new ToleranceInputError('eyeForces', `needs one record per position (${n2}), not ${input.eyeForces.length}`)
  }
  const unknownDirection: string[] = []
  linkage.bodies.forEach((b, bi) => {
    b.points.forEach((joint, k) => {
      const id = `${joint}@${b.name}`
      const c = clear[id] ?? clear[joint] ?? 0
      if (c === 0) return
      const point = b.first + k
      const dirs = new Float64Array(2 * n2)
      let known = 0
      for (let p = 0; p < n2; p++) {
        const f = forceAt(joint, b.name, p)
        const m = f ? Math.hypot(f.x, f.y) : 0
        if (!f || m === 0) continue
        known++
        // The force's direction in the link's own frame at its nominal angle.
        const a = linkage.bodyAngles[p * nb + bi]
        const ux = f.x / m
        const uy = f.y / m
        dirs[2 * p] = Math.cos(a) * ux + Math.sin(a) * uy
        dirs[2 * p + 1] = -Math.sin(a) * ux + Math.cos(a) * uy
      }
      const label = `eye of ${b.name} on pin ${joint}`
      const source = `clearance hole − pin = ${c} mm (inputs)`
      if (known > 0) {
        items.push({ id, kind: 'clearance', label, nominal: c, plusMinus: 0, fixed: c / 2, source, link: b.name, joint })
        effects.push({ mode: 'direction', point, dirs })
      } else {
        unknownDirection.push(id)
        items.push({ id, kind: 'clearance', label, nominal: c, plusMinus: c / 2, fixed: null, source, link: b.name, joint })
        effects.push({ mode: 'axial', point })
      }
    })
  })
  if (unknownDirection.length) {
    notes.push(`No pin force was given for ${unknownDirection.join(', ')}: the pin is taken anywhere within ±c/2 along the link's axis there, the worst side in the worst case.`)
  }
  return { linkage, items, effects, toleranceClass: cls, notes }
}

/** Values of the variables with every tolerance at nominal and every clearance at its stated shift. */
export function baseValues(setup: ToleranceSetup): Float64Array {
  return Float64Array.from(setup.items, (i) => i.fixed ?? 0)
}

/** The assumption of the clearance model, as the package prints it. */
export const CLEARANCE_ASSUMPTION =
  'Pin clearance: each pin is taken to sit against the side of each link eye it bears on, displaced from the hole centre by half the clearance (c/2, c = hole − pin diameter) in the direction of the force the pin applies to that link, at that position and under the load case analysed; the pins are taken as fixed in the frame at O and C. Where no force direction is known, the pin may sit anywhere within ±c/2 along the link axis (uniformly in the Monte Carlo run, on the worse side in the worst case). Wear, elastic deformation and load reversal within the stroke are not covered.'
