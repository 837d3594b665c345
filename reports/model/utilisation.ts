/** Horizontal bars, one per check, in document order, with the limit u = 1 marked. */
import { scaleLinear } from 'd3-scale'
import type { CheckItem } from '../../lib/contract'
import { formatUtilisation } from './format'
import { FAIL, GRID, INK, MUTED, PASS, WARN, type Scene, type SceneItem, textWidth } from './scene'

/** Beyond this many checks only the governing check of each component is charted (the table lists all). */
export const CHART_ALL_UP_TO = 30

export function utilisationScene(all: CheckItem[], width: number, numberOf: Map<string, number>): Scene | null {
  const checks = all.length > CHART_ALL_UP_TO ? all.filter((c) => c.governing) : all
  if (checks.length === 0) return null
  const full = checks.map((c) => `${numberOf.get(c.stepId) ?? '—'}  ${c.component} · ${c.check}`)
  const labelW = Math.min(width * 0.45, Math.max(...full.map((l) => textWidth(l, 6.8))) + 8)
  const fits = Math.floor((labelW - 8) / (6.8 * 0.55))
  const labels = full.map((l) => (l.length > fits ? `${l.slice(0, fits - 1)}…` : l))
  // Rows tighten for long lists so the chart stays within one page.
  const rowH = checks.length > 40 ? 9 : checks.length > 25 ? 11 : 13
  const top = 14
  const maxU = Math.max(1.1, ...checks.map((c) => c.utilisation))
  const x = scaleLinear().domain([0, maxU]).range([labelW, width - 30])
  const items: SceneItem[] = []
  const bottom = top + rowH * checks.length
  for (const t of x.ticks(6)) {
    items.push({ kind: 'line', x1: x(t), y1: top - 2, x2: x(t), y2: bottom, stroke: GRID, width: 0.5 })
    items.push({ kind: 'text', x: x(t), y: bottom + 9, text: t.toFixed(1), size: 6, anchor: 'middle', fill: MUTED })
  }
  checks.forEach((c, i) => {
    const yy = top + i * rowH
    const colour = !c.pass ? FAIL : c.utilisation > 0.9 ? WARN : PASS
    items.push({ kind: 'text', x: 0, y: yy + rowH * 0.66, text: labels[i], size: 6.8, fill: INK, bold: c.governing })
    items.push({ kind: 'rect', x: x(0), y: yy + 2, w: Math.max(0.5, x(c.utilisation) - x(0)), h: rowH - 4, fill: colour })
    items.push({ kind: 'text', x: x(c.utilisation) + 3, y: yy + rowH * 0.66, text: formatUtilisation(c.utilisation), size: 6.5, fill: INK })
  })
  items.push({ kind: 'line', x1: x(1), y1: top - 4, x2: x(1), y2: bottom + 2, stroke: FAIL, width: 1, dash: '3 2' })
  items.push({ kind: 'text', x: x(1) + 3, y: 8, text: 'limit u = 1.0', size: 6.2, fill: FAIL })
  items.push({ kind: 'text', x: labelW, y: bottom + 18, text: 'utilisation u = demand / capacity (bold: governing per component)', size: 6.2, fill: MUTED })
  return { width, height: bottom + 22, items }
}
