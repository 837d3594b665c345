import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { convert, displayUnit, fromSI, inputToSI, outputFromSI, toSI, UNITS, type Unit } from '@/lib/units'

// Exact definitions: NIST SP 811 (2008), Appendix B.8/B.9 and §B.6:
// 1 in = 25.4 mm exactly; 1 lb = 0.45359237 kg exactly; g_n = 9.80665 m/s² exactly,
// hence 1 lbf = 4.4482216152605 N exactly.
describe('unit table against NIST SP 811 definitions', () => {
  it('length and force are the exact definitions', () => {
    expect(toSI(1, 'in')).toBe(25.4)
    expect(toSI(1, 'ft')).toBeCloseTo(304.8, 12)
    expect(toSI(1, 'lbf')).toBe(4.4482216152605)
    expect(toSI(1, 'kip')).toBeCloseTo(4448.2216152605, 9)
  })
  it('derived units follow from the exact ones', () => {
    // NIST SP 811 B.8: 1 psi = 6.894 757 E+03 Pa; 1 lbf·in = 1.129 848 E-01 N·m;
    // 1 lb/in³ = 2.767 990 E+04 kg/m³ (tabulated to 7 digits there).
    expect(toSI(1, 'psi')).toBeCloseTo(6.894757e-3, 9)
    expect(toSI(1, 'ksi')).toBeCloseTo(6.894757, 6)
    expect(toSI(1, 'lbf·in')).toBeCloseTo(112.9848, 4)
    expect(toSI(1, 'lb/in³')).toBeCloseTo(27679.9, 0)
    expect(toSI(1, 'in²')).toBeCloseTo(645.16, 10)
  })
  it('a common trade figure: 29 000 ksi is about 200 GPa (AISC 360-16 Symbols — common practice)', () => {
    expect(convert(29000, 'ksi', 'GPa')).toBeCloseTo(199.95, 2)
  })
  it('round-trips every unit', () => {
    const units = Object.keys(UNITS) as Unit[]
    fc.assert(
      fc.property(fc.constantFrom(...units), fc.double({ min: -1e9, max: 1e9, noNaN: true }), (u, v) => {
        const back = fromSI(toSI(v, u), u)
        expect(Math.abs(back - v)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(v)))
      }),
    )
  })
  it('refuses to convert between kinds', () => {
    expect(() => convert(1, 'mm', 'N')).toThrow(/cannot convert/)
  })
  it('maps each quantity kind to a display unit per system', () => {
    expect(displayUnit('SI', 'stress')).toBe('MPa')
    expect(displayUnit('US', 'moment')).toBe('lbf·in')
    expect(inputToSI(2, 'US', 'length')).toBe(50.8)
    expect(outputFromSI(4.4482216152605, 'US', 'force')).toBeCloseTo(1, 14)
  })
})
