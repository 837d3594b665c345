/**
 * An infeasible geometry said at the fields that make it so, in the engineer's terms
 * ("the crank cannot reach the cell: make 2r ≥ l − s"), instead of a saved result that fails.
 * The limits come from the mechanism's own cell (ring ends and their names), so a new
 * mechanism gets the same messages.
 */
import { getMechanism } from '@/lib/mechanisms'
import type { MechanismResult } from '@/lib/contract'

const mm = (x: number) => `${Number(x.toPrecision(4))} mm`

/** The geometry keys that set the cell's ring (everything but the crank keys). */
function cellKeys(mechanism: string): string[] {
  return getMechanism(mechanism)
    .fields.map((f) => f.key)
    .filter((k) => k !== 'crank' && k !== 'crankPivotOffset')
}

/**
 * Field errors (dotted paths) for a result whose geometry is infeasible; empty when it is feasible.
 * `geometry` is the raw geometry of the input (e defaults to r).
 */
export function feasibilityErrors(mechanism: string, geometry: Record<string, number>, result: Pick<MechanismResult, 'feasibility'>): Record<string, string> {
  const f = result.feasibility
  if (f.ok) return {}
  const def = getMechanism(mechanism)
  const parsed = def.geometry.safeParse(geometry)
  if (!parsed.success) return {}
  const g = parsed.data
  const { cell, crank: r, offset: e } = def.model(g)
  const keys = cellKeys(mechanism)
  const at = (paths: string[], message: string) => Object.fromEntries(paths.map((k) => [`geometry.${k}`, message]))
  const straight = Math.abs(e - r) <= 1e-9 * Math.max(e, r)
  const far = straight ? '2r' : 'e + r'
  const crankKeys = straight ? ['crank'] : ['crank', 'crankPivotOffset']
  switch (f.kind) {
    case 'arm-not-longer-than-side':
    case 'long-not-longer-than-short': {
      const [longer, shorter] = keys
      const names = def.fields.filter((x) => keys.includes(x.key)).map((x) => x.label.split(' ').pop())
      return at([longer, shorter], `the cell cannot invert: make ${names[0]} longer than ${names[1]}`)
    }
    case 'crank-cannot-reach':
      if (e + r < cell.rhoMin) {
        return at([...keys, ...crankKeys], `the crank cannot reach the cell: make ${far} ≥ ${cell.rhoMinName} (now ${far} = ${mm(e + r)} < ${cell.rhoMinName} = ${mm(cell.rhoMin)})`)
      }
      return at([...keys, 'crank', 'crankPivotOffset'], `the crank keeps P beyond the cell's reach: make |e − r| ≤ ${cell.rhoMaxName} (now ${mm(Math.abs(e - r))} > ${mm(cell.rhoMax)})`)
    case 'split-segment':
      return at([...keys, ...crankKeys], `the crank reaches past the cell's fold and splits the path: make ${far} < ${cell.rhoMaxName} (now ${far} = ${mm(e + r)} ≥ ${cell.rhoMaxName} = ${mm(cell.rhoMax)})`)
    case 'no-usable-stroke':
      return { toggleMarginDeg: `leaves no usable stroke: make the margin smaller than the crank limit. ${f.message}` }
    default:
      return at(keys, f.message)
  }
}
