import { describe, expect, it } from 'vitest'
import { MATERIALS, strengthFor } from '@/lib/checks'

describe('material library', () => {
  it('has the grades the issue asks for, each value with a source', () => {
    for (const id of ['S235', 'S355', 'C45+QT', '42CrMo4+QT', '6061-T6', '6082-T6']) {
      const m = MATERIALS[id]
      expect(m, id).toBeDefined()
      expect(m.sources.strength.length).toBeGreaterThan(10)
      expect(m.sources.E.length).toBeGreaterThan(10)
      expect(m.sources.density.length).toBeGreaterThan(10)
      for (const b of m.bands) expect(b.fu).toBeGreaterThanOrEqual(b.fy)
    }
  })
  // EN 10025-2 Table 7, S355 (from memory): ReH 355 for t ≤ 16, 345 for 16 < t ≤ 40, 335 for 40 < t ≤ 63.
  it('reads the thickness band, band edges inclusive', () => {
    expect(strengthFor(MATERIALS.S355, 16).fy).toBe(355)
    expect(strengthFor(MATERIALS.S355, 16.01).fy).toBe(345)
    expect(strengthFor(MATERIALS.S355, 50).band).toBe('40 < t ≤ 63 mm')
  })
  // EN ISO 683-2, 42CrMo4 +QT (from memory): Re 900 for d ≤ 16, 750 for 16 < d ≤ 40.
  it('reads the diameter band for bar steels and flags sizes beyond the standard', () => {
    expect(strengthFor(MATERIALS['42CrMo4+QT'], 30).fy).toBe(750)
    expect(strengthFor(MATERIALS['C45+QT'], 120).beyond).toBe(true)
  })
})
