/**
 * Column strength formulas, one per basis, kept side by side because they
 * answer the same question and must agree at the extremes (stocky → squash
 * load, slender → Euler).
 */

/** Euler critical stress π²E/λ², MPa. */
export function eulerStress(E: number, slenderness: number): number {
  return (Math.PI * Math.PI * E) / (slenderness * slenderness)
}

/**
 * Shigley's Mechanical Engineering Design, §4-12 to §4-13 (section numbers from
 * memory): (l/k)_1 = sqrt(2π²CE/Sy); below it the Johnson parabola
 * Pcr/A = Sy − (Sy·l/(2πk))²/(CE), above it Euler Pcr/A = Cπ²E/(l/k)².
 * Written here with the effective slenderness λ = K·l/k, i.e. C = 1/K².
 */
export function johnsonEuler(E: number, Sy: number, slenderness: number): { stress: number; limit: number; regime: 'Johnson' | 'Euler' } {
  const limit = Math.sqrt((2 * Math.PI * Math.PI * E) / Sy)
  if (slenderness <= limit) {
    const stress = Sy - ((Sy * slenderness) / (2 * Math.PI)) ** 2 / E
    return { stress, limit, regime: 'Johnson' }
  }
  return { stress: eulerStress(E, slenderness), limit, regime: 'Euler' }
}

export const IMPERFECTION = { a0: 0.13, a: 0.21, b: 0.34, c: 0.49, d: 0.76 } as const
export type BucklingCurve = keyof typeof IMPERFECTION

/** EN 1993-1-1 §6.3.1.2: reduction factor χ for flexural buckling. */
export function enChi(lambdaBar: number, curve: BucklingCurve): { chi: number; phi: number; alpha: number } {
  const alpha = IMPERFECTION[curve]
  const phi = 0.5 * (1 + alpha * (lambdaBar - 0.2) + lambdaBar * lambdaBar)
  // §6.3.1.2(4): no buckling reduction at or below λ̄ = 0.2.
  if (lambdaBar <= 0.2) return { chi: 1, phi, alpha }
  const chi = 1 / (phi + Math.sqrt(phi * phi - lambdaBar * lambdaBar))
  return { chi: Math.min(chi, 1), phi, alpha }
}

/** AISC 360-16 E3: critical stress Fcr from Fy, E and Lc/r. */
export function aiscFcr(E: number, Fy: number, slenderness: number): { Fcr: number; Fe: number; inelastic: boolean } {
  const Fe = eulerStress(E, slenderness)
  const inelastic = slenderness <= 4.71 * Math.sqrt(E / Fy)
  const Fcr = inelastic ? Math.pow(0.658, Fy / Fe) * Fy : 0.877 * Fe
  return { Fcr, Fe, inelastic }
}
