import { describe, expect, it } from 'vitest'
import { compareStraightLineMechanisms } from '@/lib/fourbar'
import { sized } from '../helpers/fourbar'

describe('comparison "Choice of mechanism"', () => {
  const cmp = compareStraightLineMechanisms({
    stroke: 150,
    load: { fx: 0, fy: -140 },
    positions: 61,
    fourBars: ['watt', 'chebyshev', 'roberts', 'hoeken'].map((id) => sized(id, 150)),
    exactCells: [
      { name: 'Peaucellier–Lipkin cell', links: 8, pins: 6, footprint: { width: 300, height: 200 }, straightness: 0, straightnessBasis: 'ideal', peakPinForce: 400, peakTorque: -9000 },
    ],
  })

  it('one row per four-bar, then the exact cells as given', () => {
    expect(cmp.rows.map((r) => r.id)).toEqual(['watt', 'chebyshev', 'roberts', 'hoeken', 'Peaucellier–Lipkin cell'])
    expect(cmp.rows[4]).toMatchObject({ kind: 'exact', links: 8, pins: 6, straightness: 0, straightnessBasis: 'ideal', peakTorque: 9000 })
    for (const r of cmp.rows.slice(0, 4)) expect(r).toMatchObject({ kind: 'four-bar', links: 4, pins: 4, straightnessBasis: 'approximate' })
  })

  it('a Table in the contract shape: every row has every column key', () => {
    expect(cmp.table).toMatchObject({ id: 'cmp.choice', title: 'Choice of mechanism' })
    const keys = cmp.table.columns.map((c) => c.key).sort()
    for (const row of cmp.table.rows) expect(Object.keys(row).sort()).toEqual(keys)
  })

  it('a straightness step per four-bar, id cmp.<name>.straightness, value in mm equal to the row', () => {
    expect(cmp.steps.map((s) => s.id)).toEqual(['cmp.watt.straightness', 'cmp.chebyshev.straightness', 'cmp.roberts.straightness', 'cmp.hoeken.straightness'])
    for (const [i, s] of cmp.steps.entries()) {
      expect(s.unit).toBe('mm')
      expect(s.value).toBe(cmp.rows[i].straightness)
      expect(s.formula).toContain('\\max')
      expect(s.substituted).toContain('150')
      expect(s.source).toMatch(/linkage/)
    }
  })
})
