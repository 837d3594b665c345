import { describe, expect, it } from 'vitest'
import { generalTolerance, ISO2768_SOURCE } from '@/lib/tolerance/iso2768'

// ISO 2768-1:1989 Table 1, permissible deviations for linear dimensions — values from memory
// (two secondary web copies of the table agree, except coarse 0.5–3 mm); the source string says so.
describe('ISO 2768-1 general tolerances (from memory)', () => {
  it('says the values are recalled, not copied from the standard', () => {
    expect(ISO2768_SOURCE).toMatch(/from memory/)
  })

  it.each([
    ['m', 250, 0.5], // over 120 to 400 mm, medium: ±0.5 (from memory)
    ['m', 100, 0.3], // over 30 to 120 mm, medium: ±0.3 (from memory)
    ['m', 30, 0.2], // over 6 to 30 mm includes 30: ±0.2 (from memory)
    ['m', 30.5, 0.3],
    ['f', 100, 0.15], // fine, over 30 to 120 mm: ±0.15 (from memory)
    ['c', 240, 1.2], // coarse, over 120 to 400 mm: ±1.2 (from memory)
    ['v', 500, 4], // very coarse, over 400 to 1000 mm: ±4 (from memory)
    ['m', 3000, 2], // medium, over 2000 to 4000 mm: ±2 (from memory)
  ] as const)('class %s, %d mm: ±%d mm', (cls, size, t) => {
    expect(generalTolerance(cls, size)).toMatchObject({ ok: true, plusMinus: t })
  })

  it('has no value where the table has a dash or no band', () => {
    expect(generalTolerance('v', 2).ok).toBe(false) // very coarse, 0.5–3 mm: no value (from memory)
    expect(generalTolerance('f', 2500).ok).toBe(false) // fine, over 2000 mm: no value (from memory)
    expect(generalTolerance('m', 0.3).ok).toBe(false) // below 0.5 mm: tolerance stated at the dimension
    expect(generalTolerance('m', 5000).ok).toBe(false)
  })
})
