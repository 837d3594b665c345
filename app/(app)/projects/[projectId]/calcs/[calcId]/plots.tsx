'use client'

import { memo, useMemo, useState } from 'react'
import type { CalcResult } from '@/lib/calc/run'
import { plotScene, PLOT_TITLE, type PlotKind } from '@/reports/model/plots'
import { columnUnit } from '@/reports/model/format'
import type { UnitSystem } from '@/lib/units'
import type { Scene } from '@/reports/model/scene'
import { utilisationScene } from '@/reports/model/utilisation'
import { useCrank } from './crank-context'

/*
 * The package's own plots (reports/model/plots.ts and utilisation.ts draw the same scenes into the
 * PDF), drawn here as SVG with a cursor linked to the drawing: click or drag on a plot to move the
 * crank. Against tracer travel the same scene is built with the travel as its x values.
 */

type Axis = 'crank' | 'travel'

/** The result with each position's x value replaced by the tracer's travel along the line. */
function byTravel(result: CalcResult, toUnit: (mm: number) => number): CalcResult {
  const swap = <T extends { crankDeg: number; tracer: { y: number } }>(p: T): T => ({ ...p, crankDeg: toUnit(p.tracer.y) })
  return { ...result, positions: result.positions.map(swap), loadCases: result.loadCases.map((lc) => ({ ...lc, positions: lc.positions.map(swap) })) }
}

/** The plot frames (one per load case panel) in scene coordinates: the rectangles drawn without fill. */
function panelsOf(scene: Scene) {
  return scene.items.flatMap((it) => (it.kind === 'rect' && it.fill === 'none' ? [{ x: it.x, y: it.y, w: it.w, h: it.h }] : []))
}

function SceneView({ scene, label, cursor, onPick, testId }: { scene: Scene; label: string; cursor?: { x: number } | null; onPick?(x: number, panel: { x: number; w: number }): void; testId?: string }) {
  const panels = panelsOf(scene)
  const pick = (e: React.PointerEvent<SVGSVGElement>) => {
    if (!onPick || (e.type === 'pointermove' && e.buttons !== 1)) return
    const svg = e.currentTarget
    const pt = svg.createSVGPoint()
    pt.x = e.clientX
    pt.y = e.clientY
    const p = pt.matrixTransform(svg.getScreenCTM()?.inverse())
    const panel = panels.find((q) => p.x >= q.x && p.x <= q.x + q.w)
    if (panel) onPick(p.x, panel)
  }
  return (
    <svg viewBox={`0 0 ${scene.width} ${scene.height}`} className="h-auto w-full touch-none select-none" role="img" aria-label={label} onPointerDown={pick} onPointerMove={pick} data-testid={testId}>
      {scene.items.map((it, i) => {
        switch (it.kind) {
          case 'line':
            return <line key={i} x1={it.x1} y1={it.y1} x2={it.x2} y2={it.y2} stroke={it.stroke} strokeWidth={it.width} strokeDasharray={it.dash} />
          case 'circle':
            return <circle key={i} cx={it.cx} cy={it.cy} r={it.r} fill={it.fill ?? 'none'} stroke={it.stroke ?? 'none'} strokeWidth={it.width ?? 0} />
          case 'rect':
            return <rect key={i} x={it.x} y={it.y} width={it.w} height={it.h} fill={it.fill} stroke={it.stroke ?? 'none'} strokeWidth={it.width ?? 0} />
          case 'path':
            return <path key={i} d={it.d} fill={it.fill ?? 'none'} stroke={it.stroke ?? 'none'} strokeWidth={it.width ?? 0} strokeDasharray={it.dash} />
          case 'text':
            return (
              <text key={i} x={it.x} y={it.y} textAnchor={it.anchor ?? 'start'} fill={it.fill === '#6b7780' ? '#4f5a63' : (it.fill ?? '#000')} fontSize={it.size} fontWeight={it.bold ? 700 : 400}>
                {it.text}
              </text>
            )
        }
      })}
      {cursor &&
        panels.map((p, i) => <line key={`c${i}`} x1={p.x + cursor.x * p.w} y1={p.y} x2={p.x + cursor.x * p.w} y2={p.y + p.h} stroke="#a1262b" strokeWidth={0.8} data-testid="plot-cursor" />)}
    </svg>
  )
}

const WIDTH = 520

export const Plots = memo(function Plots({ result, system = 'SI' }: { result: CalcResult; system?: UnitSystem }) {
  const { crankDeg, setCrankDeg: onCrank } = useCrank()
  const [kind, setKind] = useState<PlotKind>('links')
  const [axis, setAxis] = useState<Axis>('crank')
  const len = useMemo(() => columnUnit('mm', system), [system])
  const source = useMemo(() => (axis === 'travel' ? byTravel(result, len.show) : result), [axis, result, len])
  const scene = useMemo(() => {
    const s = plotScene(source, kind, WIDTH, system)
    if (!s || axis === 'crank') return s
    // The shared scene labels its x axis in degrees; against travel it reads in the length unit.
    return { ...s, items: s.items.map((it) => (it.kind === 'text' && it.text === 'crank angle θ [°]' ? { ...it, text: `tracer travel y [${len.unit}]` } : it.kind === 'text' && /°$/.test(it.text) ? { ...it, text: it.text.slice(0, -1) } : it)) }
  }, [source, kind, axis, system, len])
  const util = useMemo(() => {
    const s = utilisationScene(result.checks, WIDTH, new Map())
    return s && { ...s, items: s.items.map((it) => (it.kind === 'text' && it.text.startsWith('—  ') ? { ...it, text: it.text.slice(3) } : it)) }
  }, [result.checks])
  const xs = source.loadCases.flatMap((lc) => lc.positions.map((p) => p.crankDeg))
  const x0 = Math.min(...xs)
  const x1 = Math.max(...xs)
  // The cursor sits at the position nearest the crank angle (travel is read from the solved positions).
  const ps = result.positions
  const near = ps.reduce((best, p) => (Math.abs(p.crankDeg - crankDeg) < Math.abs(best.crankDeg - crankDeg) ? p : best), ps[0])
  const at = axis === 'crank' ? crankDeg : (near?.tracer.y ?? 0)
  const cursor = x1 > x0 ? { x: (at - x0) / (x1 - x0) } : null
  const pick = (x: number, panel: { x: number; w: number }) => {
    const v = x0 + ((x - panel.x) / panel.w) * (x1 - x0)
    if (axis === 'crank') onCrank(v)
    else onCrank(ps.reduce((best, p) => (Math.abs(p.tracer.y - v) < Math.abs(best.tracer.y - v) ? p : best), ps[0]).crankDeg)
  }
  return (
    <section className="panel flex flex-col gap-2 p-4" aria-labelledby="plots-heading" data-testid="plots">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="plots-heading" className="h2">
          Forces over the stroke
        </h2>
        <div role="group" aria-label="What to plot" className="flex gap-1">
          {(['links', 'pins', 'torque'] as const).map((k) => (
            <button key={k} type="button" className={`rounded px-2 py-0.5 text-xs ${kind === k ? 'bg-accent text-white' : 'border border-rule'}`} aria-pressed={kind === k} onClick={() => setKind(k)}>
              {k === 'links' ? 'Link forces' : k === 'pins' ? 'Pin forces' : 'Drive torque'}
            </button>
          ))}
        </div>
        <label className="ml-auto flex items-center gap-1 text-xs text-ink/80">
          Against
          <select className="field w-auto py-0.5" value={axis} onChange={(e) => setAxis(e.target.value as Axis)}>
            <option value="crank">crank angle θ</option>
            <option value="travel">tracer travel y</option>
          </select>
        </label>
      </div>
      <p className="text-xs text-ink/80">{PLOT_TITLE[kind]}. Click or drag on the plot to move the crank; the red line is where the drawing is.</p>
      {scene && <SceneView scene={scene} label={PLOT_TITLE[kind]} cursor={cursor} onPick={pick} testId="force-plot" />}
      {util && (
        <details className="border-t border-rule pt-2" open>
          <summary className="cursor-pointer text-xs font-semibold text-ink/80">Utilisation per check ({result.checks.length})</summary>
          <SceneView scene={util} label="Utilisation per component check; the dashed line is the limit u = 1" testId="utilisation-chart" />
        </details>
      )}
    </section>
  )
})
