/**
 * The crank every inversor cell here is driven by: length r, pivot C at (e, 0). Mechanisms spread
 * these into their geometry; `withCrank` fills e = r (the straight line) when e is not given.
 */
import { z } from 'zod'
import type { GeometryField } from './types'
import { nonNegative, positive } from './numbers'
import { LINK_RANGE, OFFSET_RANGE } from '@/lib/bench/ranges'

export const crankShape = { crank: positive(), crankPivotOffset: nonNegative().optional() }

export const CRANK_FIELDS: readonly GeometryField[] = [
  { key: 'crank', label: 'Crank r', description: 'Crank length r', unit: 'mm', range: LINK_RANGE },
  { key: 'crankPivotOffset', label: 'Crank pivot offset e', description: 'Crank pivot offset e from the pole', unit: 'mm', hint: 'e = r gives the straight line', range: OFFSET_RANGE },
]

export type CrankGeometry = { crank: number; crankPivotOffset: number }

/** A geometry object with the crank keys; the output always carries crankPivotOffset. */
export function withCrank<K extends string>(
  shape: Record<K, z.ZodNumber>,
): z.ZodType<Record<K, number> & CrankGeometry, Record<K, number> & { crank: number; crankPivotOffset?: number }> {
  // zod cannot follow a generic shape through .object(); the schema is exactly the declared type.
  return z
    .object({ ...shape, ...crankShape })
    .transform((g) => {
      const v = g as Record<string, number | undefined>
      return { ...v, crankPivotOffset: v.crankPivotOffset ?? v.crank } as Record<K, number> & CrankGeometry
    }) as unknown as z.ZodType<Record<K, number> & CrankGeometry, Record<K, number> & { crank: number; crankPivotOffset?: number }>
}
