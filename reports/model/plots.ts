/**
 * Line plots over the crank angle: link forces and pin forces (one panel per load case, shared y
 * scale), the drive torque τ (all load cases in one panel) and the kinematics over the full range to
 * the locked positions (tracer y_T and the smallest transmission angle γ). The working range is shaded,
 * the positions where a value governs are ticked on the top edge, and series differ by dash pattern and
 * grey as well as by a label at their right end, so they read in black and white.
 */
import { scaleLinear } from 'd3-scale'
import { line } from 'd3-shape'
import type { ReportResult, LoadCasePositions } from '../types'
import type { PositionResult } from '../../lib/contract'
import { columnUnit, formatNumber } from './format'
import type { UnitSystem } from '../../lib/units/system'
import { ACCENT, GRID, INK, MUTED, type Scene, type SceneItem, textWidth } from './scene'

export type PlotKind = 'links' | 'pins' | 'torque' | 'kinematics'

interface Series {
  name: string
  points: [number, number][]
}

function cases(result: ReportResult): LoadCasePositions[] {
  if (result.loadCases && result.loadCases.length) return result.loadCases
  return result.positions?.length ? [{ name: 'Load case', positions: result.positions }] : []
}

const pick: Record<'links' | 'pins', (p: PositionResult) => Record<string, number>> = {
  links: (p) => p.linkForces,
  pins: (p) => Object.fromEntries(Object.entries(p.pinForces).map(([k, f]) => [k, f.magnitude])),
}

export const PLOT_TITLE: Record<PlotKind, string> = {
  links: 'Axial link forces N over the working range (tension positive); ticks on the top edge mark where a value governs.',
  pins: 'Resultant pin forces F over the working range; ticks on the top edge mark where a value governs.',
  torque: 'Drive torque τ over the working range, one line per load case.',
  kinematics: 'Kinematics over the full range to the locked positions: tracer position y_T and the smallest transmission angle γ. Shaded: the working range; dashed: the locked positions and the smallest angle allowed.',
}

/** Dash patterns and greys that stay apart in print. */
const DASH = [undefined, '5 2', '1.2 1.6', '6 2 1.2 2', '3 3', '8 2 2 2 2 2']
const TONE = [INK, '#4d555c', '#7d858c']
const style = (i: number) => ({ dash: DASH[i % DASH.length], stroke: TONE[Math.floor(i / DASH.length) % TONE.length] })

interface Panel {
  title: string
  series: Series[]
  yLabel: string
  /** Horizontal reference lines (value, label). */
  hLines?: [number, string][]
}

interface Frame {
  xLabel: string
  working?: [number, number]
  locked?: number[]
  governing?: number[]
}

/** The scene of a plot, its values in `system` (the engine's are SI; angles stay degrees). */
export function plotScene(result: ReportResult, kind: PlotKind, width: number, system: UnitSystem = 'SI'): Scene | null {
  const len = columnUnit('mm', system)
  const force = columnUnit('N', system)
  const moment = columnUnit('N·mm', system)
  const w = result.workingRange
  if (kind === 'kinematics') {
    const k = result.kinematics ?? []
    if (k.length < 2) return null
    const gmin = (result.criteria ?? []).find((c) => c.id === 'transmission-angle')
    const req = gmin ? Number(/([\d.]+)/.exec(gmin.required)?.[1]) : undefined
    return panels(
      [
        { title: 'tracer y_T', yLabel: `y_T [${len.unit}]`, series: [{ name: 'y_T', points: k.map((p) => [p.crankDeg, len.show(p.tracer.y)]) }] },
        {
          title: 'smallest transmission angle γ',
          yLabel: 'γ [°]',
          series: [{ name: 'γ', points: k.map((p) => [p.crankDeg, p.transmissionAngleDeg]) }],
          hLines: req !== undefined && Number.isFinite(req) ? [[req, `γ_req ${formatNumber(req)}°`]] : [],
        },
      ],
      { xLabel: 'crank angle θ [°]', working: w ? [w.crankMinDeg, w.crankMaxDeg] : undefined, locked: result.stroke ? [result.stroke.crankMinDeg, result.stroke.crankMaxDeg] : undefined },
      width,
      false,
    )
  }
  const lcs = cases(result)
  if (lcs.length === 0) return null
  const governing = [...new Set((result.checks ?? []).filter((c) => c.governing && c.crankDeg !== undefined).map((c) => c.crankDeg!))]
  const frame: Frame = { xLabel: 'crank angle θ [°]', working: w ? [w.crankMinDeg, w.crankMaxDeg] : undefined, governing }
  if (kind === 'torque') {
    const series = lcs.map((lc) => ({ name: lc.name, points: lc.positions.map((p) => [p.crankDeg, moment.show(p.driveTorque)] as [number, number]) }))
    return panels([{ title: '', series, yLabel: `τ [${moment.unit}]` }], frame, width, true)
  }
  const names = Object.keys(pick[kind](lcs[0].positions[0]))
  const groups = lcs.map((lc) => ({
    title: lc.name,
    yLabel: kind === 'links' ? `N [${force.unit}]` : `F [${force.unit}]`,
    series: names.map((n) => ({ name: kind === 'links' ? n : `F_${n}`, points: lc.positions.map((p) => [p.crankDeg, force.show(pick[kind](p)[n] ?? 0)] as [number, number]) })),
  }))
  return panels(groups, frame, width, true)
}

function panels(groups: Panel[], frame: Frame, width: number, sharedY: boolean): Scene {
  const gap = 26
  const left = 40
  const plotH = 104
  const top = 14
  const endRoom = 26
  const panelW = (width - left - (gap + (sharedY ? 0 : left - gap + 14)) * (groups.length - 1) - endRoom) / groups.length
  const items: SceneItem[] = []
  const domainOf = (pts: [number, number][]) => scaleLinear().domain([Math.min(0, ...pts.map((p) => p[1])), Math.max(0, ...pts.map((p) => p[1]), ...(groups.flatMap((g) => g.hLines ?? []).map((h) => h[0])))]).nice(5).domain()
  const allX = groups.flatMap((g) => g.series.flatMap((s) => s.points.map((p) => p[0])))
  const xDom = [Math.min(...allX), Math.max(...allX)]
  const shared = domainOf(groups.flatMap((g) => g.series.flatMap((s) => s.points)))
  groups.forEach((g, gi) => {
    const x0 = left + gi * (panelW + gap + (sharedY ? 0 : left - gap + 14))
    const x = scaleLinear().domain(xDom).range([x0, x0 + panelW])
    const y = scaleLinear().domain(sharedY ? shared : domainOf(g.series.flatMap((s) => s.points))).range([top + plotH, top])
    if (frame.working) {
      const [a, b] = frame.working
      items.push({ kind: 'rect', x: x(Math.max(a, xDom[0])), y: top, w: x(Math.min(b, xDom[1])) - x(Math.max(a, xDom[0])), h: plotH, fill: '#eceef0' })
    }
    for (const t of y.ticks(5)) {
      items.push({ kind: 'line', x1: x0, y1: y(t), x2: x0 + panelW, y2: y(t), stroke: t === 0 ? MUTED : GRID, width: t === 0 ? 0.6 : 0.4 })
      if (gi === 0 || !sharedY) items.push({ kind: 'text', x: x0 - 3, y: y(t) + 2.2, text: formatNumber(t), size: 5.8, anchor: 'end', fill: MUTED })
    }
    for (const t of x.ticks(6)) {
      items.push({ kind: 'line', x1: x(t), y1: top + plotH, x2: x(t), y2: top + plotH + 2.5, stroke: MUTED, width: 0.5 })
      items.push({ kind: 'text', x: x(t), y: top + plotH + 10, text: formatNumber(t), size: 5.8, anchor: 'middle', fill: MUTED })
    }
    for (const l of frame.locked ?? []) {
      items.push({ kind: 'line', x1: x(l), y1: top, x2: x(l), y2: top + plotH, stroke: INK, width: 0.6, dash: '3 2' })
    }
    for (const gx of frame.governing ?? []) {
      if (gx < xDom[0] || gx > xDom[1]) continue
      items.push({ kind: 'path', d: `M${x(gx) - 2.4},${top - 4}L${x(gx) + 2.4},${top - 4}L${x(gx)},${top}Z`, fill: ACCENT })
    }
    for (const [v, label] of g.hLines ?? []) {
      items.push({ kind: 'line', x1: x0, y1: y(v), x2: x0 + panelW, y2: y(v), stroke: ACCENT, width: 0.7, dash: '4 2' })
      items.push({ kind: 'text', x: x0 + 3, y: y(v) - 2, text: label, size: 5.8, fill: ACCENT })
    }
    items.push({ kind: 'rect', x: x0, y: top, w: panelW, h: plotH, fill: 'none', stroke: MUTED, width: 0.5 })
    const path = line<[number, number]>().x((p) => x(p[0])).y((p) => y(p[1]))
    const ends: number[] = []
    g.series.forEach((s, si) => {
      const d = path(s.points)
      const st = style(si)
      if (d) items.push({ kind: 'path', d: roundPath(d), stroke: st.stroke, width: 1, dash: st.dash })
      // Label at the right end unless it would sit on another label.
      const last = s.points[s.points.length - 1]
      if (last && g.series.length > 1 && g.series.every((x) => x.name.length <= 5)) {
        const ly = y(last[1])
        if (ends.every((e) => Math.abs(e - ly) > 6)) {
          items.push({ kind: 'text', x: x0 + panelW + 2, y: ly + 2, text: s.name, size: 5.6, fill: INK })
          ends.push(ly)
        }
      }
    })
    if (g.title) items.push({ kind: 'text', x: x0 + 2, y: top - 5, text: g.title, size: 6.6, bold: true, fill: INK })
    if (gi === 0 || !sharedY) items.push({ kind: 'text', x: x0 - 3, y: top - 5, text: g.yLabel, size: 6, fill: MUTED, anchor: 'end' })
  })
  items.push({ kind: 'text', x: width - endRoom, y: top + plotH + 19, text: frame.xLabel, size: 6.2, anchor: 'end', fill: MUTED })
  // Legend: line style and name of every series of the first panel.
  let lx = left
  let ly = top + plotH + 29
  const legend = groups[0].series.length > 1 ? groups[0].series : []
  legend.forEach((s, i) => {
    const wd = 24 + textWidth(s.name, 6.2)
    if (lx + wd > width) {
      lx = left
      ly += 10
    }
    const st = style(i)
    items.push({ kind: 'line', x1: lx, y1: ly - 2.2, x2: lx + 16, y2: ly - 2.2, stroke: st.stroke, width: 1.1, dash: st.dash })
    items.push({ kind: 'text', x: lx + 19, y: ly, text: s.name, size: 6.2, fill: INK })
    lx += wd + 8
  })
  if (frame.working) {
    const wd = 24 + textWidth('working range', 6.2)
    if (lx + wd > width) {
      lx = left
      ly += 10
    }
    items.push({ kind: 'rect', x: lx, y: ly - 5.5, w: 16, h: 6, fill: '#eceef0' })
    items.push({ kind: 'text', x: lx + 19, y: ly, text: 'working range', size: 6.2, fill: INK })
  }
  return { width, height: ly + 5, items }
}

/** Two decimals are plenty at print scale and keep output small and stable. */
function roundPath(d: string): string {
  return d.replace(/-?\d+\.\d+/g, (m) => String(Math.round(Number(m) * 100) / 100))
}
