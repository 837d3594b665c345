/** The mechanism as SVG: one picture for the live drawing and for the sketch of the inputs. */
import { createContext, memo, useContext, useId } from 'react'
import { fromSI, type UnitSystem } from '@/lib/units'
import type { Point } from '@/lib/contract'
import { jointsAt, type MechanismFrame } from './mechanism-geometry'

const INK = '#1c2430'
const MUTED = '#5d6873'
const ACCENT = '#0f5e63'
const LOAD = '#a1262b'
const PIN = '#7a4a00'

/** Letters of each link's dimension as the inputs name them. */
export const DIMENSION_OF: Record<string, Record<string, string>> = {
  peaucellier: { OA: 'l', OB: 'l', AP: 's', BP: 's', AT: 's', BT: 's', CP: 'r' },
  hart: { AD: 'b', BE: 'b', AE: 'a', BD: 'a', CP: 'r' },
}

const fmt = (x: number) => (Math.abs(x) >= 100 ? x.toFixed(0) : Math.abs(x) >= 10 ? x.toFixed(1) : x.toFixed(2))

/** Lengths on the drawing in the person's unit system: bare numbers in mm, or inches marked as such. */
export const DrawingUnits = createContext<UnitSystem>('SI')
function useLength() {
  const system = useContext(DrawingUnits)
  return (mm: number) => (system === 'US' ? `${fromSI(mm, 'in').toFixed(3)} in` : fmt(mm))
}

function Arrow({ from, to, colour, width, head }: { from: Point; to: Point; colour: string; width: number; head: number }) {
  const dx = to.x - from.x
  const dy = to.y - from.y
  const len = Math.hypot(dx, dy)
  if (len < 1e-9) return null
  const ux = dx / len
  const uy = dy / len
  const h = Math.min(head, len * 0.5)
  const b = { x: to.x - ux * h, y: to.y - uy * h }
  const px = -uy * h * 0.45
  const py = ux * h * 0.45
  return (
    <g stroke={colour} fill={colour}>
      <line x1={from.x} y1={-from.y} x2={b.x} y2={-b.y} strokeWidth={width} />
      <path d={`M${to.x},${-to.y} L${b.x + px},${-(b.y + py)} L${b.x - px},${-(b.y - py)} Z`} strokeWidth={0} />
    </g>
  )
}

/** What does not move with the crank: crank circle, reach ring, locked positions, tracer path, e and d. Drawn once per geometry. */
const StaticLayer = memo(function StaticLayer({ frame, showValues }: { frame: MechanismFrame; showValues: boolean }) {
  const len = useLength()
  const { y0, x1, x0, y1 } = frame.box
  const span = Math.max(x1 - x0, y1 - y0)
  const fs = span * 0.032
  const sw = span * 0.006
  const locked = frame.limitDeg < 180 ? [jointsAt(frame, frame.limitDeg - 0.05), jointsAt(frame, -frame.limitDeg + 0.05)] : []
  const pathD = (pts: Point[]) => pts.map((p, i) => `${i ? 'L' : 'M'}${p.x.toFixed(2)},${(-p.y).toFixed(2)}`).join('')
  return (
    <>
      {/* The crank circle and the ring P must stay in (|OP| from ρmin to ρmax). */}
      <circle cx={frame.e} cy={0} r={frame.r} fill="none" stroke={MUTED} strokeWidth={sw * 0.5} strokeDasharray={`${sw * 3} ${sw * 2}`} />
      {!frame.feasible && frame.cell.rhoMax > 0 && (
        <path
          d={`M${frame.cell.rhoMax},0 A${frame.cell.rhoMax},${frame.cell.rhoMax} 0 1 0 ${-frame.cell.rhoMax},0 A${frame.cell.rhoMax},${frame.cell.rhoMax} 0 1 0 ${frame.cell.rhoMax},0 M${Math.max(0, frame.cell.rhoMin)},0 A${frame.cell.rhoMin},${frame.cell.rhoMin} 0 1 1 ${-frame.cell.rhoMin},0 A${frame.cell.rhoMin},${frame.cell.rhoMin} 0 1 1 ${frame.cell.rhoMin},0 Z`}
          fill="#d9d6cc"
          fillOpacity={0.5}
          fillRule="evenodd"
          data-testid="reach-ring"
        />
      )}
      {/* Locked (toggle) positions, faint. */}
      {locked.map((j, i) =>
        j ? (
          <g key={i} stroke={MUTED} strokeWidth={sw * 0.6} strokeDasharray={`${sw * 2} ${sw * 2}`} opacity={0.7} data-testid="locked-position">
            {frame.links.map((l) => (
              <line key={l.name} x1={j[l.points[0]].x} y1={-j[l.points[0]].y} x2={j[l.points[l.points.length - 1]].x} y2={-j[l.points[l.points.length - 1]].y} />
            ))}
          </g>
        ) : null,
      )}
      {/* The tracer's path: thin over the reachable stroke, thick over the working range. */}
      {frame.path.length > 1 && <path d={pathD(frame.path)} fill="none" stroke={ACCENT} strokeWidth={sw * 0.6} strokeDasharray={`${sw} ${sw}`} />}
      {frame.usablePath.length > 1 && <path d={pathD(frame.usablePath)} fill="none" stroke={ACCENT} strokeWidth={sw * 1.6} opacity={0.45} data-testid="tracer-path" />}
      {/* Ground: pole O and crank pivot C, with e and the line offset d dimensioned. */}
      <line x1={0} y1={span * 0.05} x2={frame.e} y2={span * 0.05} stroke={MUTED} strokeWidth={sw * 0.4} />
      <text x={frame.e / 2} y={span * 0.05 + fs} fontSize={fs * 0.8} textAnchor="middle" fill={MUTED}>
        e{showValues ? ` = ${len(frame.e)}` : ''}
      </text>
      {frame.path.length > 1 && frame.feasible && (
        <>
          <line x1={0} y1={-y0 - span * 0.06} x2={frame.cell.k / (2 * frame.r)} y2={-y0 - span * 0.06} stroke={MUTED} strokeWidth={sw * 0.4} />
          <text x={frame.cell.k / (4 * frame.r)} y={-y0 - span * 0.075} fontSize={fs * 0.8} textAnchor="middle" fill={MUTED}>
            d = k/(2r){showValues ? ` = ${len(frame.cell.k / (2 * frame.r))}` : ''}
          </text>
        </>
      )}
    </>
  )
})

interface DrawProps {
  mechanism: string
  frame: MechanismFrame
  joints: Record<string, Point> | null
  forces: { pins: Record<string, Point> } | null
  load: Point | null
  showValues: boolean
}

/** One picture of the mechanism: links, pivots, the tracer's path, locked positions, dimensions and force arrows. */
export function MechanismSvg({ mechanism, frame, joints, forces, load, showValues }: DrawProps) {
  const len = useLength()
  const titleId = useId()
  const { x0, y0, x1, y1 } = frame.box
  const span = Math.max(x1 - x0, y1 - y0)
  const fs = span * 0.032
  const sw = span * 0.006
  const dims = DIMENSION_OF[mechanism] ?? {}
  const fMax = forces ? Math.max(1e-9, ...Object.values(forces.pins).map((f) => Math.hypot(f.x, f.y)), load ? Math.hypot(load.x, load.y) : 0) : 1
  const arrowLen = (f: Point) => (Math.hypot(f.x, f.y) / fMax) * span * 0.16
  return (
    <svg viewBox={`${x0} ${-y1} ${x1 - x0} ${y1 - y0}`} className="h-auto max-h-[26rem] w-full" role="img" aria-labelledby={titleId} data-testid={showValues ? 'mechanism-svg' : 'sketch-svg'}>
      <title id={titleId}>{showValues ? 'Mechanism drawing' : 'Sketch: what the inputs mean'}</title>
      <StaticLayer frame={frame} showValues={showValues} />
      {joints && (
        <g data-testid="links">
          {frame.links.map((l) => {
            const a = joints[l.points[0]]
            const b = joints[l.points[l.points.length - 1]]
            const m = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 }
            // Each dimension is labelled once, on the first link that has it.
            const d = frame.links.find((x) => dims[x.name] === dims[l.name])?.name === l.name ? dims[l.name] : undefined
            return (
              <g key={l.name}>
                <line x1={a.x} y1={-a.y} x2={b.x} y2={-b.y} stroke={l.kind === 'crank' ? ACCENT : INK} strokeWidth={sw * (l.kind === 'crank' ? 1.8 : 1.3)} strokeLinecap="round" />
                {d && (
                  <text x={m.x} y={-m.y - fs * 0.3} fontSize={fs * 0.85} fill={l.kind === 'crank' ? ACCENT : MUTED} textAnchor="middle" fontStyle="italic">
                    {d}
                    {showValues ? ` = ${len(l.length)}` : ''}
                  </text>
                )}
              </g>
            )
          })}
          {forces &&
            Object.entries(forces.pins).map(([j, f]) =>
              joints[j] && Math.hypot(f.x, f.y) > 1e-9 ? (
                <Arrow key={j} from={joints[j]} to={{ x: joints[j].x + (f.x / Math.hypot(f.x, f.y)) * arrowLen(f), y: joints[j].y + (f.y / Math.hypot(f.x, f.y)) * arrowLen(f) }} colour={PIN} width={sw * 0.8} head={fs * 0.7} />
              ) : null,
            )}
          {load && joints.T && Math.hypot(load.x, load.y) > 0 && (
            <g data-testid="load-arrow">
              <Arrow from={{ x: joints.T.x - (load.x / Math.hypot(load.x, load.y)) * arrowLen(load), y: joints.T.y - (load.y / Math.hypot(load.x, load.y)) * arrowLen(load) }} to={joints.T} colour={LOAD} width={sw * 1.2} head={fs * 0.9} />
            </g>
          )}
          {Object.entries(joints).map(([name, p]) => (
            <g key={name}>
              <circle cx={p.x} cy={-p.y} r={sw * (name === 'O' || name === 'C' ? 2.4 : 1.6)} fill={name === 'O' || name === 'C' ? INK : '#fff'} stroke={INK} strokeWidth={sw * 0.6} />
              <text x={p.x + fs * 0.45} y={-p.y - fs * 0.45} fontSize={fs} fontWeight={700} fill={name === 'T' ? ACCENT : INK} data-testid={name === 'T' && showValues ? 'tracer' : undefined} data-x={name === 'T' ? p.x.toFixed(4) : undefined} data-y={name === 'T' ? p.y.toFixed(4) : undefined}>
                {name}
              </text>
            </g>
          ))}
        </g>
      )}
    </svg>
  )
}

