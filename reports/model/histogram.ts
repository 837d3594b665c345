/**
 * The Monte Carlo histogram of the straightness as built: one bar per bin of the deviation, the
 * straightness limit as a vertical line. Data from the result's `tol.histogram` table (lib/calc/tolerances.ts).
 */
import { scaleLinear } from 'd3-scale'
import type { ReportResult } from '../types'
import { formatNumber } from './format'
import { ACCENT, GRID, INK, MUTED, type Scene, type SceneItem } from './scene'

export function histogramScene(result: ReportResult, width: number): Scene | null {
  const table = (result.tables ?? []).find((t) => t.id === 'tol.histogram')
  const bins = (table?.rows ?? []).map((r) => ({ from: Number(r.from), to: Number(r.to), count: Number(r.count) }))
  if (bins.length === 0) return null
  const limit = Number(table!.rows[0].limit)
  const left = 40
  const right = 16
  const top = 12
  const plotH = 110
  const lo = Math.min(bins[0].from, 0)
  const hi = Math.max(bins[bins.length - 1].to, Number.isFinite(limit) ? limit : 0)
  const x = scaleLinear().domain([lo, hi]).nice(6).range([left, width - right])
  const y = scaleLinear().domain([0, Math.max(...bins.map((b) => b.count))]).nice(4).range([top + plotH, top])
  const items: SceneItem[] = []
  for (const t of y.ticks(4)) {
    items.push({ kind: 'line', x1: left, y1: y(t), x2: width - right, y2: y(t), stroke: t === 0 ? MUTED : GRID, width: t === 0 ? 0.6 : 0.4 })
    items.push({ kind: 'text', x: left - 3, y: y(t) + 2.2, text: formatNumber(t), size: 5.8, anchor: 'end', fill: MUTED })
  }
  for (const b of bins) {
    if (b.count > 0) items.push({ kind: 'rect', x: x(b.from), y: y(b.count), w: Math.max(0.5, x(b.to) - x(b.from) - 0.6), h: y(0) - y(b.count), fill: '#7d858c' })
  }
  for (const t of x.ticks(6)) {
    items.push({ kind: 'line', x1: x(t), y1: top + plotH, x2: x(t), y2: top + plotH + 2.5, stroke: MUTED, width: 0.5 })
    items.push({ kind: 'text', x: x(t), y: top + plotH + 9, text: formatNumber(t), size: 5.8, anchor: 'middle', fill: MUTED })
  }
  if (Number.isFinite(limit)) {
    items.push({ kind: 'line', x1: x(limit), y1: top - 2, x2: x(limit), y2: top + plotH, stroke: ACCENT, width: 0.9, dash: '4 2' })
    items.push({ kind: 'text', x: x(limit) - 2, y: top + 4, text: `limit ${formatNumber(limit)} mm`, size: 6.2, anchor: 'end', fill: ACCENT })
  }
  items.push({ kind: 'text', x: (left + width - right) / 2, y: top + plotH + 19, text: 'straightness deviation δ [mm]', size: 6.4, anchor: 'middle', fill: INK })
  items.push({ kind: 'text', x: left - 3, y: top - 4, text: 'samples', size: 6.2, anchor: 'end', fill: MUTED })
  return { width, height: top + plotH + 24, items }
}
