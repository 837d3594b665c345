import { describe, expect, it } from 'vitest'
import { aiscFcr, enChi, johnsonEuler } from '@/lib/checks'

describe("Euler / Johnson — Shigley's Mechanical Engineering Design", () => {
  // Shigley, column example (Ex. 4-17 in the 9th/10th editions — number and data from memory):
  // round pin-ended column, Sy = 500 MPa, E = 207 GPa, P = 22 kN, n_d = 4 → P_cr ≥ 88 kN.
  //   (l/k)_1 = √(2π²·207 000/500) = 90.4
  //   (a) l = 1.5 m, d = 40 mm: l/k = 1500/10 = 150 > 90.4 → Euler, σcr = π²·207 000/150² = 90.80 MPa,
  //       P_cr = 90.80·1256.6 = 114.1 kN ≥ 88 kN
  //   (b) l = 350 mm, d = 20 mm: l/k = 350/5 = 70 < 90.4 → Johnson,
  //       σcr = 500 − (500·70/(2π))²/207 000 = 500 − 149.90 = 350.10 MPa, P_cr = 110.0 kN ≥ 88 kN
  it('limiting slenderness', () => {
    expect(johnsonEuler(207000, 500, 100).limit).toBeCloseTo(90.4, 1)
  })
  it('(a) Euler branch', () => {
    const r = johnsonEuler(207000, 500, 150)
    expect(r.regime).toBe('Euler')
    expect((r.stress * Math.PI * 40 ** 2) / 4).toBeCloseTo(114100, -2)
  })
  it('(b) Johnson branch', () => {
    const r = johnsonEuler(207000, 500, 70)
    expect(r.regime).toBe('Johnson')
    expect(r.stress).toBeCloseTo(350.1, 1)
  })
  it('the two branches meet at the limit, at Sy/2 (tangency)', () => {
    const lim = johnsonEuler(207000, 500, 1).limit
    expect(johnsonEuler(207000, 500, lim).stress).toBeCloseTo(250, 9)
    expect(johnsonEuler(207000, 500, lim * (1 + 1e-9)).stress).toBeCloseTo(250, 5)
  })
})

describe('Euler — Mott, Machine Elements in Mechanical Design (column example, checked against a stored copy)', () => {
  // D = 1.25 in, L = 54 in pinned, SAE 1020 CD: Sy = 51 000 psi, E = 30·10⁶ psi.
  //   KL/r = 54/0.3125 = 173 > Cc = √(2π²E/Sy) = 108 → Euler, P_cr = π²EI/L² = 12 169 lb
  it('column constant and critical load', () => {
    const r = johnsonEuler(30e6, 51000, 54 / 0.3125)
    expect(r.limit).toBeCloseTo(108, 0)
    expect(r.regime).toBe('Euler')
    expect((r.stress * Math.PI * 1.25 ** 2) / 4).toBeCloseTo(12169, -1)
  })
})

describe('EN 1993-1-1 §6.3.1.2 reduction factor χ', () => {
  // λ̄ = 1.0, curve c (α = 0.49): Φ = 0.5(1 + 0.49·0.8 + 1) = 1.196, χ = 1/(1.196 + √(1.196² − 1)) = 0.5399
  // curve b (α = 0.34): Φ = 1.136, χ = 0.5970. The tabulated χ of EN 1993-1-1 Fig. 6.4 / ECCS tables give
  // the same to 4 digits (from memory).
  it('curves b and c at λ̄ = 1', () => {
    expect(enChi(1, 'c').chi).toBeCloseTo(0.5399, 4)
    expect(enChi(1, 'b').chi).toBeCloseTo(0.597, 4)
  })
  it('no reduction at λ̄ ≤ 0.2', () => {
    expect(enChi(0.2, 'd').chi).toBe(1)
    expect(enChi(0.05, 'a0').chi).toBe(1)
  })
})

describe('AISC 360-16 §E3', () => {
  // Fy = 50 ksi, E = 29 000 ksi, Lc/r = 100: Fe = π²·29 000/100² = 28.62 ksi; 100 ≤ 4.71√(29 000/50) = 113.4
  //   → Fcr = 0.658^(50/28.62)·50 = 24.07 ksi; φc Fcr = 21.7 ksi (AISC Manual Table 4-14 — from memory)
  // Lc/r = 150 > 113.4 → Fcr = 0.877 Fe = 0.877·12.72 = 11.16 ksi
  it('inelastic and elastic branches', () => {
    const a = aiscFcr(29000, 50, 100)
    expect(a.inelastic).toBe(true)
    expect(a.Fcr).toBeCloseTo(24.07, 2)
    expect(0.9 * a.Fcr).toBeCloseTo(21.7, 1)
    const b = aiscFcr(29000, 50, 150)
    expect(b.inelastic).toBe(false)
    expect(b.Fcr).toBeCloseTo(11.16, 2)
  })
})
