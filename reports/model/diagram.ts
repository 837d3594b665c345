/**
 * The mechanism at the start, middle and end of the stroke, side by side on
 * one scale, with the traced line, ground symbols and key dimensions.
 */
import { scaleLinear } from 'd3-scale'
import type { Point, PositionResult } from '../../lib/contract'
import type { ReportResult } from '../types'
import { formatNumber } from './format'
import { ACCENT, GRID, INK, MUTED, type Scene, type SceneItem } from './scene'

export type DiagramAt = 'start' | 'middle' | 'end'

function groundNames(result: ReportResult): string[] {
  const g = result.groundJoints
  if (!g) return []
  return Array.isArray(g) ? g : Object.keys(g)
}

export function pickPositions(positions: PositionResult[], at: DiagramAt[]): PositionResult[] {
  const idx = { start: 0, middle: Math.floor((positions.length - 1) / 2), end: positions.length - 1 }
  return at.map((a) => positions[idx[a]])
}

export function mechanismScene(result: ReportResult, at: DiagramAt[], width: number): Scene | null {
  const positions = result.positions ?? []
  const links = result.links ?? []
  if (positions.length === 0 || links.length === 0) return null
  const shown = pickPositions(positions, at)
  const all: Point[] = positions.flatMap((p) => Object.values(p.joints))
  const xs = all.map((p) => p.x)
  const ys = all.map((p) => p.y)
  const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)]
  const gap = 14
  const panelW = (width - gap * (shown.length - 1)) / shown.length
  const pad = 16
  const k = Math.min((panelW - 2 * pad) / (x1 - x0), 200 / (y1 - y0))
  const panelH = (y1 - y0) * k + 2 * pad + 34
  const items: SceneItem[] = []
  const ground = new Set(groundNames(result))

  shown.forEach((pos, i) => {
    const left = i * (panelW + gap)
    const cx = left + panelW / 2 - ((x1 - x0) * k) / 2
    const sx = scaleLinear().domain([x0, x1]).range([cx, cx + (x1 - x0) * k])
    const sy = scaleLinear().domain([y0, y1]).range([pad + 14 + (y1 - y0) * k, pad + 14])
    const P = (name: string) => ({ x: sx(pos.joints[name].x), y: sy(pos.joints[name].y) })
    items.push({ kind: 'rect', x: left, y: 0, w: panelW, h: panelH, fill: '#f7f9fa', stroke: GRID, width: 0.6 })
    const label = at[i] === 'start' ? 'Start' : at[i] === 'end' ? 'End' : 'Middle'
    items.push({ kind: 'text', x: left + 6, y: 11, text: `${label} · θ = ${formatNumber(pos.crankDeg, 0)}°`, size: 7.5, bold: true, fill: INK })
    if (result.lineOffset !== undefined) {
      const lx = sx(result.lineOffset)
      items.push({ kind: 'line', x1: lx, y1: sy(y1), x2: lx, y2: sy(y0), stroke: ACCENT, width: 0.6, dash: '3 2' })
    }
    const trace = positions.map((p) => `${sx(p.tracer.x).toFixed(2)},${sy(p.tracer.y).toFixed(2)}`)
    items.push({ kind: 'path', d: `M${trace.join('L')}`, stroke: ACCENT, width: 1.4 })
    for (const link of links) {
      const pts = link.joints.filter((j) => pos.joints[j]).map(P)
      for (let j = 0; j + 1 < pts.length; j++) {
        items.push({ kind: 'line', x1: pts[j].x, y1: pts[j].y, x2: pts[j + 1].x, y2: pts[j + 1].y, stroke: link.kind === 'crank' ? '#c0643f' : INK, width: link.kind === 'crank' ? 2.2 : 1.5 })
      }
    }
    for (const name of Object.keys(pos.joints)) {
      const p = P(name)
      if (ground.has(name)) items.push(...groundSymbol(p.x, p.y))
      items.push({ kind: 'circle', cx: p.x, cy: p.y, r: 2.2, fill: '#ffffff', stroke: INK, width: 0.9 })
      items.push({ kind: 'text', x: p.x + 4, y: p.y - 4, text: name, size: 7, bold: true, fill: INK })
    }
    const ty = formatNumber(pos.tracer.y, 1)
    items.push({ kind: 'text', x: left + 6, y: panelH - 8, text: `tracer y = ${ty} mm`, size: 6.5, fill: MUTED })
    if (result.lineOffset !== undefined && pos.joints.O) {
      items.push(...dimension(sx(pos.joints.O.x), sx(result.lineOffset), sy(y0) + 10, `x_T ${formatNumber(result.lineOffset, 1)}`))
    }
  })
  return { width, height: panelH, items }
}

function groundSymbol(x: number, y: number): SceneItem[] {
  const out: SceneItem[] = [
    { kind: 'path', d: `M${x},${y}L${x - 5},${y + 8}L${x + 5},${y + 8}Z`, fill: '#e9edf0', stroke: MUTED, width: 0.6 },
  ]
  for (let i = 0; i < 4; i++) {
    const hx = x - 6 + i * 3.5
    out.push({ kind: 'line', x1: hx, y1: y + 8, x2: hx - 2.5, y2: y + 11, stroke: MUTED, width: 0.5 })
  }
  return out
}

/** A horizontal dimension with end ticks and its text above the line. */
function dimension(xa: number, xb: number, y: number, text: string): SceneItem[] {
  return [
    { kind: 'line', x1: xa, y1: y, x2: xb, y2: y, stroke: MUTED, width: 0.5 },
    { kind: 'line', x1: xa, y1: y - 3, x2: xa, y2: y + 3, stroke: MUTED, width: 0.5 },
    { kind: 'line', x1: xb, y1: y - 3, x2: xb, y2: y + 3, stroke: MUTED, width: 0.5 },
    { kind: 'text', x: (xa + xb) / 2, y: y - 2, text, size: 6, anchor: 'middle', fill: MUTED },
  ]
}
