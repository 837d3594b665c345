/**
 * "Choice of mechanism": approximate straight-line four-bars sized for the same stroke (the caller
 * sizes them, from the registry in lib/mechanisms) and loaded alike, beside rows for the exact cells
 * that the caller supplies, as one table, with a step per four-bar for its straightness error.
 */
import type { Point, Step, Table } from '@/lib/contract'
import { analyseFourBar, type FourBarOptions, type FourBarResult } from './analyse'
import type { SizedFourBar } from './linkages'

/** A row for an exact cell (Peaucellier–Lipkin, Hart), from the caller's own calc. */
export interface ExactCellRow {
  name: string
  /** Bars counting the frame and the crank, as the caller counts them for its cell. */
  links: number
  pins: number
  /** Bounding box of the joints over the working range, mm. */
  footprint: { width: number; height: number }
  /** Straightness error over the stroke, mm: 0 for the ideal cell, or the toleranced figure. */
  straightness: number
  /** What the figure is: `ideal` (exact on paper) or `toleranced` (e.g. a confirmed worst case). */
  straightnessBasis: 'ideal' | 'toleranced'
  /** Largest pin force over the working range, N, and largest |drive torque|, N·mm. */
  peakPinForce: number
  peakTorque: number
  /** Drive angle span, degrees, when known. */
  inputSpanDeg?: number
  /** Step the straightness comes from in the caller's result, if any. */
  stepId?: string
}

export interface ComparisonRow {
  kind: 'four-bar' | 'exact'
  /** Four-bar name (`watt`, …) or the exact cell's name. */
  id: string
  mechanism: string
  links: number
  pins: number
  footprintWidth: number
  footprintHeight: number
  straightness: number
  straightnessBasis: 'approximate' | 'ideal' | 'toleranced'
  peakPinForce: number
  peakTorque: number
  inputSpanDeg: number | null
  /** Smallest transmission angle between coupler and rocker over the stroke (four-bars), degrees. */
  minTransmissionDeg: number | null
  stepId: string | null
}

export interface ComparisonInput {
  stroke: number
  load: { fx: number; fy: number }
  positions?: number
  line?: { point?: Point; angleDeg?: number }
  /** The four-bars, each sized for `stroke`, in table order. */
  fourBars: SizedFourBar[]
  /** Rows of the exact cells, printed after the four-bars. */
  exactCells?: ExactCellRow[]
}

export interface Comparison {
  fourBars: FourBarResult[]
  rows: ComparisonRow[]
  table: Table
  steps: Step[]
}

const SECTION = 'comparison'
const r3 = (x: number) => Number(x.toPrecision(4))
const texNum = (x: number) => String(r3(x))

/** The straightness step of one four-bar. */
export function straightnessStep(r: FourBarResult): Step {
  const L = r.lengths
  const lengths =
    `\\overline{AB} = ${texNum(L.AB)},\\ \\overline{BC} = ${texNum(L.BC)},\\ \\overline{DC} = ${texNum(L.DC)},\\ ` +
    `\\overline{AD} = ${texNum(L.AD)},\\ \\overline{BT} = ${texNum(L.BT)}\\ \\mathrm{mm}`
  return {
    id: `cmp.${r.name}.straightness`,
    section: SECTION,
    title: `Straightness of ${r.label} over the stroke`,
    formula:
      'e = \\max_i \\left| \\hat{\\mathbf{u}} \\times (\\mathbf{T}_i - \\bar{\\mathbf{T}}) \\right|,\\quad ' +
      '\\hat{\\mathbf{u}}:\\ \\text{eigenvector of}\\ \\begin{bmatrix} S_{xx} & S_{xy} \\\\ S_{xy} & S_{yy} \\end{bmatrix}\\ \\text{with the larger eigenvalue}',
    substituted:
      `S = ${texNum(r.stroke)}\\ \\mathrm{mm}:\\ ${lengths};\\ ` +
      `\\theta = ${texNum(r.inputRange.fromDeg)}^\\circ \\ldots ${texNum(r.inputRange.toDeg)}^\\circ,\\ ` +
      `i = 1 \\ldots ${r.straightness.samples}:\\ e = ${texNum(r.straightness.error)}\\ \\mathrm{mm}`,
    value: r.straightness.error,
    unit: 'mm',
    source: `${r.source}; sized by: ${r.rule}; line: total least squares (principal axis of the tracer points)`,
    verdict: 'info',
    note:
      `Tracer points equally spaced along the stroke, each solved by circle–circle intersection on one assembly branch; ` +
      `${r.drive}, smallest transmission angle ${texNum(r.minTransmissionDeg)}°.`,
  }
}

/** An exact cell as a row of the comparison. */
export function exactRow(e: ExactCellRow): ComparisonRow {
  return {
    kind: 'exact',
    id: e.name,
    mechanism: e.name,
    links: e.links,
    pins: e.pins,
    footprintWidth: e.footprint.width,
    footprintHeight: e.footprint.height,
    straightness: e.straightness,
    straightnessBasis: e.straightnessBasis,
    peakPinForce: e.peakPinForce,
    peakTorque: Math.abs(e.peakTorque),
    inputSpanDeg: e.inputSpanDeg ?? null,
    minTransmissionDeg: null,
    stepId: e.stepId ?? null,
  }
}

/** A comparison row as a row of the "Choice of mechanism" table. */
export function tableRow(r: ComparisonRow): Table['rows'][number] {
  return {
    mechanism: r.mechanism,
    links: r.links,
    pins: r.pins,
    width: r.footprintWidth,
    height: r.footprintHeight,
    straightness: r.straightness,
    basis: r.straightnessBasis,
    pinForce: r.peakPinForce,
    torque: r.peakTorque,
    span: r.inputSpanDeg,
    mu: r.minTransmissionDeg,
  }
}

/** Analyses the sized four-bars under the stroke and load and builds the "Choice of mechanism" table. */
export function compareStraightLineMechanisms(input: ComparisonInput): Comparison {
  const opts: FourBarOptions = { stroke: input.stroke, load: input.load, positions: input.positions, line: input.line }
  const fourBars = input.fourBars.map((sized) => analyseFourBar(sized, opts))
  const rows: ComparisonRow[] = fourBars.map((r) => ({
    kind: 'four-bar',
    id: r.name,
    mechanism: r.label,
    links: r.links,
    pins: r.pins,
    footprintWidth: r.footprint.width,
    footprintHeight: r.footprint.height,
    straightness: r.straightness.error,
    straightnessBasis: 'approximate',
    peakPinForce: r.peak.pinForce.value,
    peakTorque: Math.abs(r.peak.torque.value),
    inputSpanDeg: r.inputRange.spanDeg,
    minTransmissionDeg: r.minTransmissionDeg,
    stepId: `cmp.${r.name}.straightness`,
  }))
  rows.push(...(input.exactCells ?? []).map(exactRow))
  const table: Table = {
    id: 'cmp.choice',
    section: SECTION,
    title: 'Choice of mechanism',
    columns: [
      { key: 'mechanism', label: 'Mechanism' },
      { key: 'links', label: 'Links', digits: 0 },
      { key: 'pins', label: 'Pins', digits: 0 },
      { key: 'width', label: 'Footprint width', unit: 'mm', digits: 0 },
      { key: 'height', label: 'Footprint height', unit: 'mm', digits: 0 },
      { key: 'straightness', label: 'Straightness error', unit: 'mm', digits: 3 },
      { key: 'basis', label: 'Straightness basis' },
      { key: 'pinForce', label: 'Peak pin force', unit: 'N', digits: 0 },
      { key: 'torque', label: 'Peak drive torque', unit: 'N·mm', digits: 0 },
      { key: 'span', label: 'Drive angle span', unit: '°', digits: 1 },
      { key: 'mu', label: 'Least transmission angle', unit: '°', digits: 1 },
    ],
    rows: rows.map(tableRow),
  }
  return { fourBars, rows, table, steps: fourBars.map(straightnessStep) }
}
