import type { InversorCell } from './cells/cell'
import { envelopeOfArrays } from './envelope'
import { assessGeometry, type StrokeRange } from './geometry'
import { straightness } from './kinematic-checks'
import { placeAt } from './crank'
import type { KinematicSample, StrokeLimits } from '@/lib/contract'
import { linkLength } from './model'
import { caseSlugs, type ReportContext } from './report/context'
import { geometrySteps } from './report/geometry-steps'
import { sweepSteps } from './report/sweep-steps'
import { sweepTables } from './report/tables'
import type { LinkageResult, Step } from '@/lib/contract'
import { sampleObjects, sweepArrays, type LoadInput } from './sweep'
import { plain, tex } from './tex'
import type { Criterion } from '@/lib/contract'
import { DEG, mag } from './vec'

export interface AnalyseInput {
  cell: InversorCell
  crank: number
  offset: number
  loads: LoadInput[]
  /** Link self-weight: density kg/m³, section mm², g m/s², direction of gravity from +x, degrees. */
  selfWeight?: { density: number; area: number; g: number; directionDeg: number }
  sweep?: { fromDeg: number; toDeg: number; count: number }
  anglesDeg?: number[]
  marginDeg: number
  amplificationLimit: number
  /** End stops of the working range as crank angles, degrees. */
  workingRange?: { fromDeg: number; toDeg: number }
  /** Full stroke the machine needs, mm: without `workingRange` the working range is the crank range that gives it. */
  requiredStroke?: number
  /** Smallest transmission angle allowed over the working range, degrees. */
  minTransmissionDeg: number
  /** Largest deviation of the tracer from a straight line allowed over the working range, mm. */
  straightnessTolerance: number
}

/** The engine's result: the contract's LinkageResult (the calc layer adds the mechanism id and engine version). */
export type AnalyseOutput = LinkageResult

export const DEFAULT_SWEEP_COUNT = 41

/** Positions of the full range to the locked positions, kinematics only. */
export const KINEMATIC_SAMPLES = 121

/** |T_y| at crank angle θ (degrees), or NaN out of reach. */
function halfAt(cell: InversorCell, e: number, r: number, deg: number): number {
  const j = placeAt(cell, e, r, deg * DEG)
  return j ? Math.abs(j.T.y) : Number.NaN
}

/**
 * The working range: the user's positions or sweep, the end stops the engineer states, the crank range
 * that gives the required stroke (symmetric about the mid position, found by bisection on the monotone
 * half stroke), or, with none of these, the usable stroke short of the toggles.
 */
export function workingRangeOf(input: AnalyseInput, usable: StrokeRange): StrokeLimits & { source: 'positions' | 'end-stops' | 'required-stroke' | 'usable' } {
  const { cell, crank: r, offset: e } = input
  const limits = (lo: number, hi: number) => {
    let half = 0
    for (let i = 0; i <= 60; i++) {
      const h = halfAt(cell, e, r, lo + ((hi - lo) * i) / 60)
      if (Number.isFinite(h)) half = Math.max(half, h)
    }
    return { crankMinDeg: lo, crankMaxDeg: hi, half }
  }
  const list = input.anglesDeg ?? (input.sweep ? [input.sweep.fromDeg, input.sweep.toDeg] : null)
  if (list) return { ...limits(Math.min(...list), Math.max(...list)), source: 'positions' }
  if (input.workingRange) {
    const { fromDeg, toDeg } = input.workingRange
    return { ...limits(Math.min(fromDeg, toDeg), Math.max(fromDeg, toDeg)), source: 'end-stops' }
  }
  const want = input.requiredStroke ? input.requiredStroke / 2 : null
  if (want !== null && want < usable.half) {
    let lo = 0
    let hi = usable.crankMaxDeg
    for (let i = 0; i < 80; i++) {
      const mid = (lo + hi) / 2
      if (halfAt(cell, e, r, mid) < want) lo = mid
      else hi = mid
    }
    return { crankMinDeg: -hi, crankMaxDeg: hi, half: want, source: 'required-stroke' }
  }
  return { ...usable, source: 'usable' }
}

/** Crank angles to solve: the user's list, or the working range in DEFAULT_SWEEP_COUNT positions. */
function anglesOf(input: AnalyseInput, working: StrokeLimits): number[] {
  if (input.anglesDeg) return input.anglesDeg
  const s = input.sweep ?? { fromDeg: working.crankMinDeg, toDeg: working.crankMaxDeg, count: DEFAULT_SWEEP_COUNT }
  if (s.count === 1) return [s.fromDeg]
  return Array.from({ length: s.count }, (_, i) => s.fromDeg + ((s.toDeg - s.fromDeg) * i) / (s.count - 1))
}

/** Smallest transmission angle of the cell at its joints (0° = links in line). */
function minTransmission(cell: InversorCell, j: Record<string, { x: number; y: number }>): number {
  let min = 90
  for (const [v, a, b] of cell.transmission) {
    const ux = j[a].x - j[v].x
    const uy = j[a].y - j[v].y
    const wx = j[b].x - j[v].x
    const wy = j[b].y - j[v].y
    const c = (ux * wx + uy * wy) / (mag(ux, uy) * mag(wx, wy))
    const g = Math.acos(Math.min(1, Math.max(-1, c))) / DEG
    min = Math.min(min, g, 180 - g)
  }
  return min
}

/** Tracer and transmission angle at n crank angles from lo to hi (kinematics only). */
export function kinematicSamples(cell: InversorCell, e: number, r: number, lo: number, hi: number, n: number): KinematicSample[] {
  const out: KinematicSample[] = []
  for (let i = 0; i < n; i++) {
    const crankDeg = n === 1 ? lo : lo + ((hi - lo) * i) / (n - 1)
    const j = placeAt(cell, e, r, crankDeg * DEG)
    if (j) out.push({ crankDeg, tracer: { x: j.T.x, y: j.T.y }, transmissionAngleDeg: minTransmission(cell, j) })
  }
  return out
}

/** A link's self-weight per mm of length, N/mm: kg/m³ · mm² · 1e-9 m³/mm³ · m/s². */
export function selfWeightPerMm(sw: { density: number; area: number; g: number }): number {
  return sw.density * sw.area * 1e-9 * sw.g
}

/** The self-weight per mm as a vector in its direction, or null without self-weight (what every load case carries). */
export function weightPerMmOf(sw: AnalyseInput['selfWeight']): { x: number; y: number } | null {
  if (!sw) return null
  const perMm = selfWeightPerMm(sw)
  return { x: perMm * Math.cos(sw.directionDeg * DEG), y: perMm * Math.sin(sw.directionDeg * DEG) }
}

/** The whole linkage calculation for one inversor cell: geometry, sweep, statics, checks, steps. */
export function analyse(input: AnalyseInput): AnalyseOutput {
  const { cell, crank: r, offset: e } = input
  const v = assessGeometry(cell, e, r, input.marginDeg)
  const sw = input.selfWeight
  const perMm = sw ? selfWeightPerMm(sw) : 0
  const weightPerMm = weightPerMmOf(sw)
  const working = v.feasibility.ok ? workingRangeOf(input, v.usable) : null
  // The sweep computes in flat arrays; the envelopes read them, and the result's objects are built once, here.
  const flat = working
    ? sweepArrays({ cell, crank: r, offset: e, anglesDeg: anglesOf(input, working), loads: input.loads, weightPerMm, amplificationLimit: input.amplificationLimit })
    : null
  const sweep = flat ? sampleObjects(flat, false) : null
  // The full range to the locked positions (kinematics only) and a dense sample of the working range.
  const kinematics = v.path ? kinematicSamples(cell, e, r, v.stroke.crankMinDeg, v.stroke.crankMaxDeg, KINEMATIC_SAMPLES) : []
  const dense = working ? kinematicSamples(cell, e, r, working.crankMinDeg, working.crankMaxDeg, 201) : []
  const slugs = sweep ? caseSlugs(sweep.cases.map((c) => c.name)) : []
  const envelopes = flat ? flat.cases.map((c, i) => envelopeOfArrays(flat, c, slugs[i])) : []
  const first = sweep?.cases[0]?.samples.map((s) => s.position) ?? []
  const ctx: ReportContext = {
    cell,
    crank: r,
    offset: e,
    marginDeg: input.marginDeg,
    amplificationLimit: input.amplificationLimit,
    verdict: v,
    loads: input.loads,
    selfWeight: sw ? { density: sw.density, area: sw.area, g: sw.g, perMm } : null,
    sweep,
    envelopes,
    straightness: straightness(dense.length ? dense : first),
    working,
    minTransmissionWorking: dense.length ? Math.min(...dense.map((d) => d.transmissionAngleDeg)) : 90,
    minTransmissionDeg: input.minTransmissionDeg,
    straightnessTolerance: input.straightnessTolerance,
    requiredStroke: input.requiredStroke,
  }
  const steps = [...geometrySteps(ctx), ...selfWeightSteps(ctx), ...sweepSteps(ctx)]
  const criteria = criteriaOf(ctx)
  const links = [...cell.links, { name: 'CP', points: ['C', 'P'], stations: [0, r], kind: 'crank' as const }]
  return {
    inversionConstant: cell.k,
    lineOffset: v.lineOffset,
    feasibility: v.feasibility,
    stroke: { ...v.stroke, usable: v.usable },
    line: v.path,
    straightness: ctx.straightness,
    ...(working ? { workingRange: { half: working.half, crankMinDeg: working.crankMinDeg, crankMaxDeg: working.crankMaxDeg } } : {}),
    kinematics,
    criteria,
    loads: input.loads.map((l) => ({ name: l.name, fx: l.fx, fy: l.fy })),
    positions: first,
    loadCases: sweep ? sweep.cases.map((c) => ({ name: c.name, positions: c.samples.map((s) => s.position) })) : [],
    envelope: envelopes,
    links: links.map((l) => ({ name: l.name, joints: l.points, kind: l.kind, length: linkLength(l) })),
    groundJoints: ['O', 'C'],
    toggles: sweep?.toggles ?? [],
    steps,
    tables: sweepTables(ctx),
  }
}

/** What the working range must satisfy besides strength: straightness and transmission angle. */
function criteriaOf(ctx: ReportContext): Criterion[] {
  if (!ctx.working || !ctx.verdict.path) return []
  return [
    {
      id: 'straightness',
      label: 'Straightness of the tracer over the working range',
      required: `δ ≤ ${plain(ctx.straightnessTolerance)} mm`,
      provided: `δ = ${plain(ctx.straightness)} mm`,
      pass: ctx.straightness <= ctx.straightnessTolerance,
      stepId: 'kin.straightness',
    },
    {
      id: 'transmission-angle',
      label: 'Smallest transmission angle over the working range',
      required: `γ ≥ ${plain(ctx.minTransmissionDeg)}°`,
      provided: `γ = ${plain(ctx.minTransmissionWorking)}°`,
      pass: ctx.minTransmissionWorking >= ctx.minTransmissionDeg,
      stepId: 'kin.transmission-angle',
    },
  ]
}

function selfWeightSteps(ctx: ReportContext): Step[] {
  const s = ctx.selfWeight
  if (!s || !ctx.sweep) return []
  return [
    {
      id: 'stat.self-weight',
      section: 'statics',
      title: 'Self-weight of the links per unit length',
      formula: 'w = \\rho\\,A\\,g',
      substituted: `w = ${tex(s.density)} \\cdot ${tex(s.area)} \\cdot 10^{-9} \\cdot ${tex(s.g)} = ${tex(s.perMm)}`,
      value: s.perMm,
      unit: 'N/mm',
      source: 'statics',
    },
  ]
}
