import { describe, expect, it } from 'vitest'
import { formatNumber, formatUtilisation, MINUS, roundShown, shownPair, SIGNIFICANT, texNumber, texNumberP, utilisationShown } from '@/lib/units'

/*
 * The one number formatter, against the rules it states (lib/units/format.ts) and the
 * typesetting conventions they follow: digits in groups of three separated by a thin
 * space, a four-digit number not grouped (ISO 80000-1:2009 §7.3.1 — from memory); the
 * minus sign U+2212 in text (ISO 80000-2, Unicode "MINUS SIGN" — common practice);
 * four significant figures, whole numbers from 1000 up (common practice in calc packages).
 * Every expected string is written out by hand.
 */
const THIN = '\u2009'

describe('formatNumber (text)', () => {
  it('four significant figures, whole numbers from 1000 up', () => {
    expect(SIGNIFICANT).toBe(4)
    expect(formatNumber(7.30164)).toBe('7.302')
    expect(formatNumber(0.0567891)).toBe('0.05679')
    expect(formatNumber(123.456)).toBe('123.5')
    expect(formatNumber(1234.4)).toBe('1234')
    expect(formatNumber(1000)).toBe('1000')
    expect(formatNumber(999.4)).toBe('999.4')
    expect(formatNumber(2.5)).toBe('2.5') // no trailing zeros
    expect(formatNumber(40)).toBe('40')
  })
  it('rounding that carries into the next decade keeps four figures', () => {
    expect(formatNumber(999.96)).toBe('1000')
    expect(formatNumber(9.99961)).toBe('10')
    expect(formatNumber(0.0999951)).toBe('0.1')
  })
  it('thin-space groups from five integer digits on', () => {
    expect(formatNumber(52500)).toBe(`52${THIN}500`)
    expect(formatNumber(1234567.8)).toBe(`1${THIN}234${THIN}568`)
    expect(formatNumber(9999)).toBe('9999')
    expect(formatNumber(-52500)).toBe(`${MINUS}52${THIN}500`)
  })
  it('a true minus sign', () => {
    expect(MINUS).toBe('\u2212')
    expect(formatNumber(-180)).toBe('\u2212180')
    expect(formatNumber(-0.5)).toBe('\u22120.5')
  })
  it('a power of ten below 10⁻³, three figures', () => {
    expect(formatNumber(2.1e-13)).toBe('2.1×10⁻¹³')
    expect(formatNumber(-1.2345e-5)).toBe('\u22121.23×10⁻⁵')
    expect(formatNumber(0.001)).toBe('0.001')
    expect(formatNumber(0.00099999)).toBe('0.001') // rounds up into the plain range
    expect(formatNumber(0.00098765)).toBe('9.88×10⁻⁴')
  })
  it('zero, and no number', () => {
    expect(formatNumber(0)).toBe('0')
    expect(formatNumber(Number.NaN)).toBe('n/a')
    expect(formatNumber(Number.POSITIVE_INFINITY)).toBe('n/a')
    expect(formatNumber(1e-20 * 0)).toBe('0')
  })
  it('rounds toward or away from a limit when asked', () => {
    expect(formatNumber(1.0001, 'up')).toBe('1.001')
    expect(formatNumber(1.0009, 'down')).toBe('1')
    expect(formatNumber(1.0004)).toBe('1')
    expect(formatNumber(1.0006)).toBe('1.001')
    // binary noise (0.56 · 1000 = 560.0000000000001) must not move a figure either way
    expect(formatNumber(0.56, 'up')).toBe('0.56')
    expect(formatNumber(0.57, 'down')).toBe('0.57')
    expect(formatNumber(12345.2, 'up')).toBe(`12${THIN}346`)
    // up and down are toward +∞ and −∞ (demands and capacities are magnitudes)
    expect(formatNumber(-2.0004, 'up')).toBe(`${MINUS}2`)
    expect(formatNumber(-2.0004, 'down')).toBe(`${MINUS}2.001`)
  })
})

describe('roundShown: the value as printed', () => {
  it('is the number the text shows', () => {
    expect(roundShown(7.30164)).toBe(7.302)
    expect(roundShown(52499.6)).toBe(52500)
    expect(roundShown(999.96)).toBe(1000)
    expect(roundShown(1.2345e-5)).toBe(0.0000123)
    expect(roundShown(9.9951e-4)).toBe(0.001)
    expect(roundShown(0)).toBe(0)
    expect(roundShown(Number.NaN)).toBeNaN()
    expect(roundShown(1.2341e-5, 'up')).toBe(0.0000124)
    expect(roundShown(1.2349e-5, 'down')).toBe(0.0000123)
  })
})

describe('texNumber', () => {
  it('the same figures as the text, in TeX', () => {
    expect(texNumber(52500)).toBe('52500') // no groups in TeX
    expect(texNumber(-180)).toBe('-180') // TeX's own minus
    expect(texNumber(7.30164)).toBe('7.302')
    expect(texNumber(2.1e-13)).toBe('2.1 \\times 10^{-13}')
    expect(texNumber(-4.56e-7)).toBe('-4.56 \\times 10^{-7}')
    expect(texNumber(0)).toBe('0')
    expect(texNumber(Number.NaN)).toBe('\\text{n/a}')
    expect(texNumber(1.0001, 'up')).toBe('1.001')
  })
  it('bracketed when negative, for a value put into an expression', () => {
    expect(texNumberP(-3)).toBe('\\left(-3\\right)')
    expect(texNumberP(3)).toBe('3')
    expect(texNumberP(-0.00001234)).toBe('\\left(-1.23 \\times 10^{-5}\\right)')
    expect(texNumberP(0)).toBe('0')
  })
})

describe('utilisation', () => {
  it('three decimals, rounded up, never below 0', () => {
    expect(utilisationShown(0.9994)).toBe(1)
    expect(utilisationShown(1.0003)).toBe(1.001) // exactly the number shown, not 1.0010000000000001
    expect(utilisationShown(0.5)).toBe(0.5)
    expect(utilisationShown(0.56)).toBe(0.56)
    expect(utilisationShown(-0.2)).toBe(0)
    expect(utilisationShown(Number.POSITIVE_INFINITY)).toBe(Number.POSITIVE_INFINITY)
    expect(formatUtilisation(1.0003)).toBe('1.001')
    expect(formatUtilisation(0.5)).toBe('0.500')
    expect(formatUtilisation(Number.NaN)).toBe('n/a')
  })
  it('a failing comparison never reads as met: demand up, capacity down', () => {
    expect(shownPair(100.04, 100.06, true)).toEqual([100.1, 100])
    expect(shownPair(100.04, 100.06, false)).toEqual([100, 100.1])
  })
})
