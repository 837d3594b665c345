import type { InversorCell } from './cells/cell'
import { envelopeOf } from './envelope'
import { assessGeometry, type StrokeRange } from './geometry'
import { straightness } from './kinematic-checks'
import { linkLength } from './model'
import type { ReportContext } from './report/context'
import { geometrySteps } from './report/geometry-steps'
import { sweepSteps } from './report/sweep-steps'
import { sweepTables } from './report/tables'
import type { LinkageResult, Step } from '@/lib/contract'
import { runSweep, type LoadInput } from './sweep'
import { tex } from './tex'
import { DEG } from './vec'

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
}

/** The engine's result: the contract's LinkageResult (the calc layer adds the mechanism id and engine version). */
export type AnalyseOutput = LinkageResult

export const DEFAULT_SWEEP_COUNT = 41

/** Crank angles to solve: the user's list, the user's sweep, or the usable stroke. */
function anglesOf(input: AnalyseInput, usable: StrokeRange): number[] {
  if (input.anglesDeg) return input.anglesDeg
  const s = input.sweep ?? { fromDeg: usable.crankMinDeg, toDeg: usable.crankMaxDeg, count: DEFAULT_SWEEP_COUNT }
  if (s.count === 1) return [s.fromDeg]
  return Array.from({ length: s.count }, (_, i) => s.fromDeg + ((s.toDeg - s.fromDeg) * i) / (s.count - 1))
}

/** The whole linkage calculation for one inversor cell: geometry, sweep, statics, checks, steps. */
export function analyse(input: AnalyseInput): AnalyseOutput {
  const { cell, crank: r, offset: e } = input
  const v = assessGeometry(cell, e, r, input.marginDeg)
  const sw = input.selfWeight
  // kg/m³ · mm² · 1e-9 m³/mm³ per mm of length · m/s² = N per mm.
  const perMm = sw ? sw.density * sw.area * 1e-9 * sw.g : 0
  const weightPerMm = sw ? { x: perMm * Math.cos(sw.directionDeg * DEG), y: perMm * Math.sin(sw.directionDeg * DEG) } : null
  const sweep = v.feasibility.ok
    ? runSweep({ cell, crank: r, offset: e, anglesDeg: anglesOf(input, v.usable), loads: input.loads, weightPerMm, amplificationLimit: input.amplificationLimit })
    : null
  const envelopes = sweep ? sweep.cases.map((c) => envelopeOf(sweep.model, c.name, c.samples)) : []
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
    straightness: straightness(first),
  }
  const steps = [...geometrySteps(ctx), ...selfWeightSteps(ctx), ...sweepSteps(ctx)]
  const links = [...cell.links, { name: 'CP', points: ['C', 'P'], stations: [0, r], kind: 'crank' as const }]
  return {
    inversionConstant: cell.k,
    lineOffset: v.lineOffset,
    feasibility: v.feasibility,
    stroke: { ...v.stroke, usable: v.usable },
    line: v.path,
    straightness: ctx.straightness,
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
