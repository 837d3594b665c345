'use client'

import { memo, useEffect, useMemo, useRef, useState } from 'react'
import type { CalcResult } from '@/lib/calc/run'
import { forcesAt, frameOf, jointsAt } from './mechanism-geometry'
import { useCrank } from './crank-context'
import { InputsSketch } from './inputs-sketch'
import { MechanismSvg } from './mechanism-svg'

interface MechanismDrawingProps {
  mechanism: string
  geometry: Record<string, number>
  result: CalcResult | null
  loads: { fx: number; fy: number }[]
  marginDeg: number
}

/**
 * The mechanism drawn beside the form and redrawn as you type; a slider turns the crank and Play
 * runs it over the working range. While playing, the angle lives here (the plots and the table
 * follow a few times a second), so only the drawing is redrawn each frame.
 */
export const MechanismDrawing = memo(function MechanismDrawing({ mechanism, geometry, result, loads, marginDeg }: MechanismDrawingProps) {
  const { crankDeg, setCrankDeg: onCrank } = useCrank()
  const frame = useMemo(() => frameOf(mechanism, geometry, marginDeg), [mechanism, geometry, marginDeg])
  const [angle, setAngle] = useState(crankDeg)
  const [playing, setPlaying] = useState(false)
  const [fps, setFps] = useState<number | null>(null)
  const [showForces, setShowForces] = useState(true)
  const pushed = useRef(0)
  const lo = frame?.usable[0] ?? 0
  const hi = frame?.usable[1] ?? 0
  const clamped = Math.min(hi, Math.max(lo, angle))

  useEffect(() => {
    if (!playing) setAngle(crankDeg)
  }, [crankDeg, playing])

  useEffect(() => {
    if (!playing || !frame) return
    let raf = 0
    let frames = 0
    let since = performance.now()
    const start = performance.now()
    const mid = (lo + hi) / 2
    const amp = (hi - lo) / 2
    const tick = (now: number) => {
      const a = mid - amp * Math.cos(((now - start) / 4000) * 2 * Math.PI)
      setAngle(a)
      frames++
      if (now - since >= 1000) {
        setFps(Math.round((frames * 1000) / (now - since)))
        frames = 0
        since = now
      }
      if (now - pushed.current > 250) {
        pushed.current = now
        onCrank(a)
      }
      raf = requestAnimationFrame(tick)
    }
    raf = requestAnimationFrame(tick)
    return () => cancelAnimationFrame(raf)
  }, [playing, frame, lo, hi, onCrank])

  const joints = frame && frame.feasible ? jointsAt(frame, clamped) : frame ? null : null
  const forces = showForces && frame?.feasible ? forcesAt(result, clamped) : null
  const load = loads[0] ? { x: loads[0].fx, y: loads[0].fy } : null

  return (
    <section className="panel flex flex-col gap-2 p-4" aria-labelledby="drawing-heading" data-testid="drawing" data-fps={fps ?? undefined}>
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="drawing-heading" className="h2">
          Mechanism
        </h2>
        <span className="text-xs text-ink/80">computed here as you type, by the calc&apos;s own engine</span>
      </div>
      {!frame ? (
        <p className="text-sm text-ink/80">Enter the geometry to see the mechanism.</p>
      ) : (
        <>
          <MechanismSvg mechanism={mechanism} frame={frame} joints={joints} forces={forces} load={load} showValues />
          {!frame.feasible && (
            <p className="rounded bg-fail-soft px-3 py-2 text-xs text-fail" data-testid="drawing-infeasible">
              {frame.message} The dashed circle is the crank pin&apos;s path; P must stay in the shaded ring.
            </p>
          )}
          {frame.feasible && (
            <div className="flex flex-wrap items-center gap-3">
              <button type="button" className="btn-quiet" onClick={() => setPlaying((p) => !p)} aria-pressed={playing} data-testid="play">
                {playing ? 'Pause' : 'Play'}
              </button>
              <label className="flex flex-1 items-center gap-2 text-xs text-ink/80">
                Crank angle θ
                <input
                  type="range"
                  className="flex-1 accent-[#0f5e63]"
                  min={lo}
                  max={hi}
                  step={0.1}
                  value={clamped}
                  onChange={(e) => {
                    setPlaying(false)
                    setAngle(Number(e.target.value))
                    onCrank(Number(e.target.value))
                  }}
                  aria-valuetext={`${clamped.toFixed(1)}°`}
                  data-testid="crank-slider"
                />
                <span className="w-14 text-right font-mono">{clamped.toFixed(1)}°</span>
              </label>
              <label className="flex items-center gap-1 text-xs text-ink/80">
                <input type="checkbox" checked={showForces} onChange={(e) => setShowForces(e.target.checked)} /> Forces
              </label>
              {playing && fps !== null && (
                <span className="font-mono text-[11px] text-ink/70" data-testid="fps">
                  {fps} fps
                </span>
              )}
            </div>
          )}
          <p className="text-[11px] text-ink/80">
            Thick teal: the tracer&apos;s working range (±{frame.usable[1].toFixed(1)}° of crank); thin dashed: the rest of its reach; grey dashed: the locked positions
            {frame.limitDeg < 180 ? ` at ±${frame.limitDeg.toFixed(1)}°` : ' (none: the crank turns fully)'}. Red: the load at T (first load case); brown: pin forces, to scale.
          </p>
          <InputsSketch mechanism={mechanism} />
        </>
      )}
    </section>
  )
})
