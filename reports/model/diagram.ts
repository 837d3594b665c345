/**
 * The mechanism at the start, middle and end of the working range, side by side on one scale, with
 * the traced line, the tracer's path over the full range (thin) and the working range (thick), ground
 * symbols, axes and a scale bar, the link dimensions and the loads at T. Joint labels sit on the side
 * away from the links that meet there, so no link runs through a label.
 */
import { scaleLinear } from 'd3-scale'
import type { Point, PositionResult } from '../../lib/contract'
import type { ReportResult } from '../types'
import { formatNumber } from './format'
import { ACCENT, GRID, INK, MUTED, type Scene, type SceneItem } from './scene'

export type DiagramAt = 'start' | 'middle' | 'end'

/** The symbols the steps use for the link lengths, by mechanism. */
const SYMBOLS: Record<string, Record<string, string>> = {
  peaucellier: { OA: 'l', AP: 's', CP: 'r' },
  hart: { AE: 'a', AD: 'b', CP: 'r' },
}

function groundNames(result: ReportResult): string[] {
  const g = result.groundJoints
  if (!g) return []
  return Array.isArray(g) ? g : Object.keys(g)
}

export function pickPositions(positions: PositionResult[], at: DiagramAt[]): PositionResult[] {
  const idx = { start: 0, middle: Math.floor((positions.length - 1) / 2), end: positions.length - 1 }
  return at.map((a) => positions[idx[a]])
}

const arrowHead = (tip: Point, from: Point, size: number, fill: string): SceneItem => {
  const dx = tip.x - from.x
  const dy = tip.y - from.y
  const len = Math.hypot(dx, dy) || 1
  const ux = dx / len
  const uy = dy / len
  const b = { x: tip.x - ux * size, y: tip.y - uy * size }
  return { kind: 'path', d: `M${tip.x},${tip.y}L${b.x - uy * size * 0.4},${b.y + ux * size * 0.4}L${b.x + uy * size * 0.4},${b.y - ux * size * 0.4}Z`, fill }
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
  const gap = 10
  const panelW = (width - gap * (shown.length - 1)) / shown.length
  const pad = 18
  const k = Math.min((panelW - 2 * pad) / (x1 - x0), 210 / (y1 - y0))
  const panelH = (y1 - y0) * k + 2 * pad + 40
  const items: SceneItem[] = []
  const ground = new Set(groundNames(result))
  const symbols = SYMBOLS[result.mechanism ?? ''] ?? {}
  const load = result.loads?.[0]

  shown.forEach((pos, i) => {
    const left = i * (panelW + gap)
    const cx = left + panelW / 2 - ((x1 - x0) * k) / 2
    const sx = scaleLinear().domain([x0, x1]).range([cx, cx + (x1 - x0) * k])
    const sy = scaleLinear().domain([y0, y1]).range([pad + 16 + (y1 - y0) * k, pad + 16])
    const P = (name: string) => ({ x: sx(pos.joints[name].x), y: sy(pos.joints[name].y) })
    items.push({ kind: 'rect', x: left, y: 0, w: panelW, h: panelH, fill: 'none', stroke: GRID, width: 0.6 })
    const label = at[i] === 'start' ? 'start' : at[i] === 'end' ? 'end' : 'middle'
    items.push({ kind: 'text', x: left + 5, y: 10, text: `${label} of the working range, θ = ${formatNumber(pos.crankDeg)}°`, size: 6.6, bold: true, fill: INK })
    if (result.lineOffset !== undefined && result.line?.kind === 'line') {
      const lx = sx(result.lineOffset)
      items.push({ kind: 'line', x1: lx, y1: sy(y1), x2: lx, y2: sy(y0), stroke: MUTED, width: 0.5, dash: '3 2' })
    }
    const full = (result.kinematics ?? []).filter((p) => p.tracer.y >= y0 && p.tracer.y <= y1)
    if (full.length > 1) items.push({ kind: 'path', d: `M${full.map((p) => `${sx(p.tracer.x).toFixed(2)},${sy(p.tracer.y).toFixed(2)}`).join('L')}`, stroke: ACCENT, width: 0.5 })
    const trace = positions.map((p) => `${sx(p.tracer.x).toFixed(2)},${sy(p.tracer.y).toFixed(2)}`)
    items.push({ kind: 'path', d: `M${trace.join('L')}`, stroke: ACCENT, width: 1.6 })
    // Axes at the pole, in the first panel.
    if (i === 0 && pos.joints.O) {
      const o = P('O')
      items.push({ kind: 'line', x1: o.x, y1: o.y, x2: o.x + 22, y2: o.y, stroke: MUTED, width: 0.5 }, arrowHead({ x: o.x + 24, y: o.y }, o, 3, MUTED))
      items.push({ kind: 'line', x1: o.x, y1: o.y, x2: o.x, y2: o.y - 22, stroke: MUTED, width: 0.5 }, arrowHead({ x: o.x, y: o.y - 24 }, o, 3, MUTED))
      items.push({ kind: 'text', x: o.x + 26, y: o.y + 2, text: 'x', size: 6, fill: MUTED }, { kind: 'text', x: o.x - 2, y: o.y - 27, text: 'y', size: 6, fill: MUTED, anchor: 'end' })
    }
    const drawn = new Set<string>()
    for (const link of links) {
      const pts = link.joints.filter((j) => pos.joints[j]).map(P)
      for (let j = 0; j + 1 < pts.length; j++) {
        items.push({ kind: 'line', x1: pts[j].x, y1: pts[j].y, x2: pts[j + 1].x, y2: pts[j + 1].y, stroke: INK, width: link.kind === 'crank' ? 2.2 : 1.3 })
      }
      // Dimension symbols on the middle panel, beside the first link of each length.
      const sym = symbols[link.name]
      if (sym && i === Math.floor(shown.length / 2) && pts.length >= 2 && !drawn.has(sym)) {
        drawn.add(sym)
        const a = pts[0]
        const b = pts[pts.length - 1]
        const mx = (a.x + b.x) / 2
        const my = (a.y + b.y) / 2
        const len = Math.hypot(b.x - a.x, b.y - a.y) || 1
        const nx = -(b.y - a.y) / len
        const ny = (b.x - a.x) / len
        items.push({ kind: 'text', x: mx + nx * 7, y: my + ny * 7 + 2, text: `${sym} = ${formatNumber(link.length)}`, size: 5.8, fill: MUTED, anchor: 'middle' })
      }
    }
    // Crank pivot offset e, from O to C along x, under the panel's mechanism.
    if (i === Math.floor(shown.length / 2) && pos.joints.O && pos.joints.C) {
      const o = P('O')
      const c = P('C')
      const yy = sy(y0) + 12
      items.push(...dimension(o.x, c.x, yy, `e = ${formatNumber(Math.abs(pos.joints.C.x - pos.joints.O.x))}`))
    }
    for (const name of Object.keys(pos.joints)) {
      const p = P(name)
      if (ground.has(name)) items.push(...groundSymbol(p.x, p.y))
      items.push({ kind: 'circle', cx: p.x, cy: p.y, r: 1.9, fill: '#ffffff', stroke: INK, width: 0.8 })
      // The label goes opposite the mean direction of the links meeting here.
      let ux = 0
      let uy = 0
      for (const link of links) {
        const idx = link.joints.indexOf(name)
        if (idx < 0) continue
        for (const other of [link.joints[idx - 1], link.joints[idx + 1]]) {
          if (!other || !pos.joints[other]) continue
          const q = P(other)
          const d = Math.hypot(q.x - p.x, q.y - p.y) || 1
          ux += (q.x - p.x) / d
          uy += (q.y - p.y) / d
        }
      }
      const n = Math.hypot(ux, uy)
      const dx = n > 0.2 ? -ux / n : 0.7
      const dy = n > 0.2 ? -uy / n : -0.7
      items.push({ kind: 'text', x: p.x + dx * 8, y: p.y + dy * 8 + 2.4, text: name, size: 6.8, bold: true, fill: INK, anchor: dx > 0.35 ? 'start' : dx < -0.35 ? 'end' : 'middle' })
    }
    if (load && pos.joints.T && (load.fx !== 0 || load.fy !== 0)) {
      const t = P('T')
      const m = Math.hypot(load.fx, load.fy)
      const from = { x: t.x - (load.fx / m) * 20, y: t.y + (load.fy / m) * 20 }
      items.push({ kind: 'line', x1: from.x, y1: from.y, x2: t.x - (load.fx / m) * 3, y2: t.y + (load.fy / m) * 3, stroke: ACCENT, width: 1 }, arrowHead({ x: t.x - (load.fx / m) * 2.2, y: t.y + (load.fy / m) * 2.2 }, from, 3.6, ACCENT))
      if (i === 0) items.push({ kind: 'text', x: from.x + 3, y: from.y - 2, text: `F = ${formatNumber(m)} N`, size: 5.8, fill: ACCENT })
    }
    items.push({ kind: 'text', x: left + 5, y: panelH - 6, text: `y_T = ${formatNumber(pos.tracer.y)} mm`, size: 6, fill: MUTED })
  })
  // Scale bar in the last panel's lower right corner.
  const bar = niceLength(40 / k)
  const bx = width - 6 - bar * k
  items.push({ kind: 'line', x1: bx, y1: panelH - 8, x2: bx + bar * k, y2: panelH - 8, stroke: INK, width: 1 })
  items.push({ kind: 'line', x1: bx, y1: panelH - 10.5, x2: bx, y2: panelH - 5.5, stroke: INK, width: 0.6 }, { kind: 'line', x1: bx + bar * k, y1: panelH - 10.5, x2: bx + bar * k, y2: panelH - 5.5, stroke: INK, width: 0.6 })
  items.push({ kind: 'text', x: bx + (bar * k) / 2, y: panelH - 12, text: `${formatNumber(bar)} mm`, size: 5.8, anchor: 'middle', fill: INK })
  return { width, height: panelH, items }
}

function niceLength(x: number): number {
  const e = 10 ** Math.floor(Math.log10(x))
  const m = x / e
  return (m < 2 ? 1 : m < 5 ? 2 : 5) * e
}

function groundSymbol(x: number, y: number): SceneItem[] {
  const out: SceneItem[] = [{ kind: 'path', d: `M${x},${y}L${x - 4.5},${y + 7}L${x + 4.5},${y + 7}Z`, fill: '#ffffff', stroke: MUTED, width: 0.6 }]
  for (let i = 0; i < 4; i++) {
    const hx = x - 5 + i * 3.2
    out.push({ kind: 'line', x1: hx, y1: y + 7, x2: hx - 2.2, y2: y + 9.6, stroke: MUTED, width: 0.45 })
  }
  return out
}

/** A horizontal dimension with end ticks and its text above the line. */
function dimension(xa: number, xb: number, y: number, text: string): SceneItem[] {
  return [
    { kind: 'line', x1: xa, y1: y, x2: xb, y2: y, stroke: MUTED, width: 0.5 },
    { kind: 'line', x1: xa, y1: y - 3, x2: xa, y2: y + 3, stroke: MUTED, width: 0.5 },
    { kind: 'line', x1: xb, y1: y - 3, x2: xb, y2: y + 3, stroke: MUTED, width: 0.5 },
    { kind: 'text', x: (xa + xb) / 2, y: y - 2, text, size: 5.8, anchor: 'middle', fill: MUTED },
  ]
}
