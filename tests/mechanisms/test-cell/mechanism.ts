/**
 * A test-only third mechanism, declared the way a real one is (lib/mechanisms/<id>/) but living
 * in tests/: an inversor cell given by its inversion constant k and rhombus side s instead of the
 * arm, with its own joint and link names (L and R for the rhombus vertices). Its closed form is
 * written here from the geometry of inversion: L and R are √(k + s²) from the pole and s from both
 * P and T, so with d the distance from O to the midpoint of LR,
 *   d = (k + |OP|²)/(2|OP|),  half-width w = √(k + s² − d²),  |OT| = k/|OP|.
 * Nothing in lib/, reports/ or app/ names it: it plugs in through `registerMechanism` and
 * `registerReportParts` only.
 */
import { z } from 'zod'
import type { InversorCell } from '@/lib/linkage'
import { CRANK_FIELDS, defineMechanism, positive, withCrank } from '@/lib/mechanisms'

const vec = (x: number, y: number) => ({ x, y })

export function testCell(k: number, s: number): InversorCell {
  const l = Math.sqrt(k + s * s)
  const rhoMin = l - s
  const rhoMax = Math.sqrt(k)
  return {
    mechanism: 'test-cell',
    invalid: null,
    k,
    rhoMin,
    rhoMax,
    links: [
      { name: 'OL', points: ['O', 'L'], stations: [0, l], kind: 'bar' },
      { name: 'OR', points: ['O', 'R'], stations: [0, l], kind: 'bar' },
      { name: 'LP', points: ['L', 'P'], stations: [0, s], kind: 'bar' },
      { name: 'RP', points: ['R', 'P'], stations: [0, s], kind: 'bar' },
      { name: 'LT', points: ['L', 'T'], stations: [0, s], kind: 'bar' },
      { name: 'RT', points: ['R', 'T'], stations: [0, s], kind: 'bar' },
    ],
    place(p) {
      const rho = Math.hypot(p.x, p.y)
      if (rho < rhoMin * (1 - 1e-12) || rho > rhoMax * (1 + 1e-12)) return null
      const u = vec(p.x / rho, p.y / rho)
      const d = (k + rho * rho) / (2 * rho)
      const w = Math.sqrt(Math.max(0, l * l - d * d))
      return {
        O: vec(0, 0),
        P: { ...p },
        L: vec(u.x * d - u.y * w, u.y * d + u.x * w),
        R: vec(u.x * d + u.y * w, u.y * d - u.x * w),
        T: vec((u.x * k) / rho, (u.y * k) / rho),
      }
    },
    transmission: [
      ['L', 'O', 'P'],
      ['R', 'O', 'P'],
      ['T', 'L', 'R'],
    ],
    tex: {
      k: { formula: 'k', substituted: `k = ${k}` },
      rhoMin: { formula: '\\rho_{\\min} = \\sqrt{k + s^2} - s', substituted: `\\rho_{\\min} = ${rhoMin.toFixed(3)}` },
      rhoMax: { formula: '\\rho_{\\max} = \\sqrt{k}', substituted: `\\rho_{\\max} = ${rhoMax.toFixed(3)}` },
    },
    rhoMinName: '√(k + s²) − s',
    rhoMaxName: '√k',
    splitReason: 'its middle is only reachable through a fold of the rhombus',
    source: 'geometry of inversion (test cell)',
  }
}

export const TEST_CELL = defineMechanism({
  id: 'test-cell',
  label: 'Test cell (k and s given)',
  geometry: withCrank({ k: positive(), side: positive() }),
  fields: [
    { key: 'k', label: 'Inversion constant k', description: 'Inversion constant k = |OP|·|OT|', unit: 'mm²' },
    { key: 'side', label: 'Rhombus side s', description: 'Rhombus side s', unit: 'mm' },
    ...CRANK_FIELDS,
  ],
  defaultGeometry: { k: 52500, side: 100, crank: 100, crankPivotOffset: 100 },
  model: (g) => ({ cell: testCell(g.k, g.side), crank: g.crank, offset: g.crankPivotOffset }),
  // Its own numbering order: statics before the verification.
  stepSections: ['geometry', 'kinematics', 'statics', 'verification', 'checks', 'comparison'],
})

/** The schema is an ordinary zod schema: the registry needs nothing else. */
export type TestCellGeometry = z.output<typeof TEST_CELL.geometry>
