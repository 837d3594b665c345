/**
 * Line plots over the stroke: link forces and pin forces (one panel per load
 * case, shared y scale) and the drive torque (all load cases in one panel).
 */
import { scaleLinear } from 'd3-scale'
import { line } from 'd3-shape'
import type { ReportResult, LoadCasePositions } from '../types'
import type { PositionResult } from '../../lib/contract'
import { formatNumber } from './format'
import { GRID, INK, MUTED, SERIES, type Scene, type SceneItem, textWidth } from './scene'

export type PlotKind = 'links' | 'pins' | 'torque'

interface Series {
  name: string
  points: [number, number][]
  dash?: string
}

function cases(result: ReportResult): LoadCasePositions[] {
  if (result.loadCases && result.loadCases.length) return result.loadCases
  return result.positions?.length ? [{ name: 'Load case', positions: result.positions }] : []
}

const pick: Record<Exclude<PlotKind, 'torque'>, (p: PositionResult) => Record<string, number>> = {
  links: (p) => p.linkForces,
  pins: (p) => Object.fromEntries(Object.entries(p.pinForces).map(([k, f]) => [k, f.magnitude])),
}

export const PLOT_TITLE: Record<PlotKind, string> = {
  links: 'Axial link forces over the stroke (tension positive)',
  pins: 'Resultant pin forces over the stroke',
  torque: 'Drive torque over the stroke',
}

export function plotScene(result: ReportResult, kind: PlotKind, width: number): Scene | null {
  const lcs = cases(result)
  if (lcs.length === 0) return null
  if (kind === 'torque') {
    const series = lcs.map((lc, i) => ({
      name: lc.name,
      points: lc.positions.map((p) => [p.crankDeg, p.driveTorque] as [number, number]),
      dash: i === 0 ? undefined : '4 2',
    }))
    return panels([{ title: '', series }], 'M [N·mm]', width, false)
  }
  const names = Object.keys(pick[kind](lcs[0].positions[0]))
  const groups = lcs.map((lc) => ({
    title: lc.name,
    series: names.map((n) => ({ name: n, points: lc.positions.map((p) => [p.crankDeg, pick[kind](p)[n] ?? 0] as [number, number]) })),
  }))
  return panels(groups, kind === 'links' ? 'N [N]' : 'F [N]', width, true)
}

function panels(groups: { title: string; series: Series[] }[], yLabel: string, width: number, colourByName: boolean): Scene {
  const all = groups.flatMap((g) => g.series.flatMap((s) => s.points))
  const xDom = [Math.min(...all.map((p) => p[0])), Math.max(...all.map((p) => p[0]))]
  const yDom = scaleLinear().domain([Math.min(0, ...all.map((p) => p[1])), Math.max(0, ...all.map((p) => p[1]))]).nice(5).domain()
  const legendNames = colourByName ? groups[0].series.map((s) => s.name) : groups[0].series.map((s) => s.name)
  const gap = 18
  const left = 44
  const plotH = 120
  const top = 16
  const panelW = (width - left - gap * (groups.length - 1) - 6) / groups.length
  const items: SceneItem[] = []
  const y = scaleLinear().domain(yDom).range([top + plotH, top])
  groups.forEach((g, gi) => {
    const x0 = left + gi * (panelW + gap)
    const x = scaleLinear().domain(xDom).range([x0, x0 + panelW])
    if (g.title) items.push({ kind: 'text', x: x0, y: top - 5, text: g.title, size: 7, bold: true, fill: INK })
    for (const t of y.ticks(5)) {
      items.push({ kind: 'line', x1: x0, y1: y(t), x2: x0 + panelW, y2: y(t), stroke: t === 0 ? MUTED : GRID, width: t === 0 ? 0.7 : 0.5 })
      if (gi === 0) items.push({ kind: 'text', x: x0 - 4, y: y(t) + 2.3, text: formatNumber(t, 0), size: 6, anchor: 'end', fill: MUTED })
    }
    for (const t of x.ticks(6)) {
      items.push({ kind: 'line', x1: x(t), y1: top + plotH, x2: x(t), y2: top + plotH + 3, stroke: MUTED, width: 0.5 })
      items.push({ kind: 'text', x: x(t), y: top + plotH + 11, text: `${formatNumber(t, 0)}°`, size: 6, anchor: 'middle', fill: MUTED })
    }
    items.push({ kind: 'rect', x: x0, y: top, w: panelW, h: plotH, fill: 'none', stroke: GRID, width: 0.6 })
    const path = line<[number, number]>().x((p) => x(p[0])).y((p) => y(p[1]))
    g.series.forEach((s, si) => {
      const d = path(s.points)
      if (d) items.push({ kind: 'path', d: roundPath(d), stroke: SERIES[si % SERIES.length], width: 1.2, dash: s.dash })
    })
  })
  items.push({ kind: 'text', x: 4, y: top - 5, text: yLabel, size: 6.5, fill: MUTED })
  items.push({ kind: 'text', x: width - 6, y: top + plotH + 22, text: 'crank angle θ', size: 6.5, anchor: 'end', fill: MUTED })
  // Legend on one row below the axes; its entries wrap only if a cell has many links.
  let lx = left
  let ly = top + plotH + 32
  legendNames.forEach((name, i) => {
    const w = 22 + textWidth(name, 6.5)
    if (lx + w > width) {
      lx = left
      ly += 11
    }
    const dash = groups[0].series[i].dash
    items.push({ kind: 'line', x1: lx, y1: ly - 2.2, x2: lx + 14, y2: ly - 2.2, stroke: SERIES[i % SERIES.length], width: 1.6, dash })
    items.push({ kind: 'text', x: lx + 17, y: ly, text: name, size: 6.5, fill: INK })
    lx += w + 8
  })
  return { width, height: ly + 5, items }
}

/** Two decimals are plenty at print scale and keep output small and stable. */
function roundPath(d: string): string {
  return d.replace(/-?\d+\.\d+/g, (m) => String(Math.round(Number(m) * 100) / 100))
}
