/**
 * Issue 13: an input outside its bounds is refused at its field through the service that stores the
 * working inputs, and what was saved before is left exactly as it was (row, result and time).
 */
import { describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { db } from '@/db'
import { calcs } from '@/db/schema'
import { saveInputs } from '@/server/calcs'
import { useSeededDemo } from '../helpers/demo'

const demo = useSeededDemo()

type Tree = Record<string, unknown>
const many = <T>(n: number, f: (i: number) => T) => Array.from({ length: n }, (_, i) => f(i))

describe('saveInputs refuses out-of-bounds inputs and changes nothing', () => {
  const cases: [string, (i: Tree) => Tree][] = [
    ['geometry.arm', (i) => ({ ...i, geometry: { ...(i.geometry as Tree), arm: 1e308 } })],
    ['loads.0.fy', (i) => ({ ...i, loads: [{ name: 'Huge', fx: 0, fy: -1e12 }] })],
    ['loads', (i) => ({ ...i, loads: many(50, (k) => ({ name: `L${k}`, fx: 0, fy: -1 })) })],
    ['sweep.count', (i) => ({ ...i, workingRange: undefined, sweep: { fromDeg: -10, toDeg: 10, count: 10_000 } })],
    ['factors.load', (i) => ({ ...i, factors: { load: 1e308, dynamic: 1 } })],
    ['loads.0.name', (i) => ({ ...i, loads: [{ name: 'x'.repeat(1_000_000), fx: 0, fy: -1 }] })],
    ['defaults.joint.pinDiameter', (i) => ({ ...i, defaults: { ...(i.defaults as Tree), joint: { ...((i.defaults as Tree).joint as Tree), pinDiameter: 1e300 } } })],
  ]
  it.each(cases)('%s', async (path, change) => {
    const id = await demo.calcId('LC-001')
    const [before] = await db.select().from(calcs).where(eq(calcs.id, id))
    const out = await saveInputs(demo.people.engineer, demo.projectId, id, change(structuredClone(before.draftInputs) as Tree))
    expect(out.ok).toBe(false)
    if (!out.ok) expect(out.fieldErrors[path]).toMatch(/^must (be|hold)/)
    const [after] = await db.select().from(calcs).where(eq(calcs.id, id))
    expect(JSON.stringify(after.draftInputs)).toBe(JSON.stringify(before.draftInputs))
    expect(JSON.stringify(after.draftResult)).toBe(JSON.stringify(before.draftResult))
    expect(after.updatedAt?.getTime()).toBe(before.updatedAt?.getTime())
  })
})
