import { describe, expect, it } from 'vitest'
import { convert, DISPLAY_UNITS, isUnit, kindOf, kindOfSILabel, toSI, UNITS, type Unit } from '@/lib/units'

// Every unit's kind and factor against its definition: SI prefixes (BIPM SI Brochure, 9th ed., Table 7)
// and NIST SP 811 (2008) Appendix B: 1 in = 25.4 mm, 1 ft = 12 in, 1 lbf = 4.4482216152605 N,
// 1 kip = 1000 lbf, 1 psi = 1 lbf/in², 1 ksi = 1000 psi, 1 lb = 0.45359237 kg (all exact).
const LBF = 4.4482216152605
const TABLE: [Unit, string, number][] = [
  ['mm', 'length', 1],
  ['m', 'length', 1000],
  ['in', 'length', 25.4],
  ['ft', 'length', 304.8],
  ['mm²', 'area', 1],
  ['in²', 'area', 645.16],
  ['N', 'force', 1],
  ['kN', 'force', 1000],
  ['lbf', 'force', LBF],
  ['kip', 'force', 1000 * LBF],
  ['N·mm', 'moment', 1],
  ['N·m', 'moment', 1000],
  ['lbf·in', 'moment', LBF * 25.4],
  ['kip·in', 'moment', 1000 * LBF * 25.4],
  ['MPa', 'stress', 1],
  ['GPa', 'stress', 1000],
  ['psi', 'stress', LBF / 645.16],
  ['ksi', 'stress', (1000 * LBF) / 645.16],
  ['kg/m³', 'density', 1],
  ['lb/in³', 'density', 0.45359237 / 0.0254 ** 3],
  ['—', 'dimensionless', 1],
]

describe('the unit table, unit by unit', () => {
  it('has exactly these units', () => {
    expect(Object.keys(UNITS).sort()).toEqual(TABLE.map((x) => x[0]).sort())
  })
  it.each(TABLE)('%s is a %s, 1 %s = %d in SI-inside units', (u, kind, factor) => {
    expect(kindOf(u)).toBe(kind)
    expect(Math.abs(toSI(1, u) - factor)).toBeLessThanOrEqual(1e-15 * factor)
    expect(isUnit(u)).toBe(true)
  })
  it('knows only its own units (no inherited names)', () => {
    expect(isUnit('furlong')).toBe(false)
    expect(isUnit('toString')).toBe(false)
    expect(isUnit('')).toBe(false)
  })
  it('converts within a kind, refuses across kinds with both kinds named', () => {
    expect(convert(2, 'kip·in', 'N·m')).toBeCloseTo((2000 * LBF * 25.4) / 1000, 9)
    expect(convert(1, 'm', 'in')).toBeCloseTo(1000 / 25.4, 12)
    expect(() => convert(1, 'kN', 'MPa')).toThrow('cannot convert kN (force) to MPa (stress)')
  })
})

describe('display units per system', () => {
  it('SI and US customary, every kind', () => {
    expect(DISPLAY_UNITS).toEqual({
      SI: { length: 'mm', area: 'mm²', force: 'N', moment: 'N·mm', stress: 'MPa', density: 'kg/m³' },
      US: { length: 'in', area: 'in²', force: 'lbf', moment: 'lbf·in', stress: 'ksi', density: 'lb/in³' },
    })
  })
  it('reads the kind of every SI label the results print, and nothing else', () => {
    expect(['mm', 'mm²', 'N', 'N·mm', 'MPa', 'kg/m³'].map(kindOfSILabel)).toEqual(['length', 'area', 'force', 'moment', 'stress', 'density'])
    expect(kindOfSILabel('—')).toBeNull()
    expect(kindOfSILabel('in')).toBeNull()
  })
})
