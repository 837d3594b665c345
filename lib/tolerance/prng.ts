/**
 * Seeded random numbers for the Monte Carlo run: xoshiro128** (Blackman & Vigna, "Scrambled linear
 * pseudorandom number generators", 2018/2021) seeded through splitmix32, so one 32-bit seed gives
 * one reproducible stream; normal deviates by the Box–Muller transform (Box & Muller, 1958).
 * Plain closures over 32-bit integers: no allocation per draw.
 */

export interface Rng {
  /** Uniform on [0, 1), 32 random bits. */
  uniform(): number
  /** Standard normal (mean 0, σ 1). */
  normal(): number
}

/** splitmix32: spreads a small seed over the four words of xoshiro's state. */
function splitmix32(seed: number): () => number {
  let a = seed | 0
  return () => {
    a = (a + 0x9e3779b9) | 0
    let t = a ^ (a >>> 16)
    t = Math.imul(t, 0x21f0aaad)
    t ^= t >>> 15
    t = Math.imul(t, 0x735a2d97)
    return (t ^ (t >>> 15)) >>> 0
  }
}

/** xoshiro128** from a state of four 32-bit words (not all zero): returns the next unsigned 32-bit output. */
export function xoshiro128ss(s0: number, s1: number, s2: number, s3: number): () => number {
  let a = s0 | 0
  let b = s1 | 0
  let c = s2 | 0
  let d = s3 | 0
  if ((a | b | c | d) === 0) throw new Error('xoshiro128** state must not be all zero')
  return () => {
    const x = Math.imul(b, 5)
    const r = Math.imul((x << 7) | (x >>> 25), 9)
    const t = b << 9
    c ^= a
    d ^= b
    b ^= c
    a ^= d
    c ^= t
    d = (d << 11) | (d >>> 21)
    return r >>> 0
  }
}

const TWO_32 = 4294967296

/** A reproducible stream from a seed (any integer; the same seed gives the same numbers). */
export function createRng(seed: number): Rng {
  const sm = splitmix32(seed)
  const next = xoshiro128ss(sm(), sm(), sm(), sm() | 1)
  let spare = 0
  let hasSpare = false
  return {
    uniform: () => next() / TWO_32,
    normal() {
      if (hasSpare) {
        hasSpare = false
        return spare
      }
      // Box–Muller: u1 in (0, 1] so the logarithm is finite.
      const u1 = 1 - next() / TWO_32
      const u2 = next() / TWO_32
      const m = Math.sqrt(-2 * Math.log(u1))
      spare = m * Math.sin(2 * Math.PI * u2)
      hasSpare = true
      return m * Math.cos(2 * Math.PI * u2)
    },
  }
}
