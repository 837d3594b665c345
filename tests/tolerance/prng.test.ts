import { describe, expect, it } from 'vitest'
import { createRng, xoshiro128ss } from '@/lib/tolerance/prng'

describe('seeded random numbers', () => {
  it('xoshiro128** gives the reference outputs for the state {1, 2, 3, 4}', () => {
    // Reference: Blackman & Vigna's xoshiro128starstar.c (prng.di.unimi.it), typed from memory,
    // compiled with gcc and run from the state {1, 2, 3, 4}: outputs 1–8 and 1001.
    const next = xoshiro128ss(1, 2, 3, 4)
    const first = Array.from({ length: 8 }, () => next())
    expect(first).toEqual([11520, 0, 5927040, 70819200, 2031721883, 1637235492, 1287239034, 3734860849])
    for (let i = 0; i < 992; i++) next()
    expect(next()).toBe(136054147)
  })

  it('the same seed gives the same stream, another seed another stream', () => {
    const a = createRng(42)
    const b = createRng(42)
    const c = createRng(43)
    const xs = Array.from({ length: 100 }, () => a.normal() + a.uniform())
    expect(Array.from({ length: 100 }, () => b.normal() + b.uniform())).toEqual(xs)
    expect(Array.from({ length: 100 }, () => c.normal() + c.uniform())).not.toEqual(xs)
  })

  it('uniform draws have mean 1/2 and variance 1/12 (uniform distribution on [0, 1): statistics textbook)', () => {
    const r = createRng(1)
    const n = 200_000
    let s = 0
    let s2 = 0
    let lo = 1
    let hi = 0
    for (let i = 0; i < n; i++) {
      const u = r.uniform()
      lo = Math.min(lo, u)
      hi = Math.max(hi, u)
      s += u
      s2 += u * u
    }
    expect(lo).toBeGreaterThanOrEqual(0)
    expect(hi).toBeLessThan(1)
    const mean = s / n
    const v = s2 / n - mean * mean
    // Five standard errors: σ/√n = 0.2887/447 ≈ 6.5e-4 for the mean.
    expect(Math.abs(mean - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / n))
    expect(Math.abs(v - 1 / 12)).toBeLessThan(0.002)
  })

  it('normal draws have mean 0, σ 1 and 68.27 % within ±1σ (standard normal table)', () => {
    const r = createRng(7)
    const n = 200_000
    let s = 0
    let s2 = 0
    let inside = 0
    for (let i = 0; i < n; i++) {
      const z = r.normal()
      s += z
      s2 += z * z
      if (Math.abs(z) <= 1) inside++
    }
    const mean = s / n
    expect(Math.abs(mean)).toBeLessThan(5 / Math.sqrt(n))
    expect(Math.abs(Math.sqrt(s2 / n - mean * mean) - 1)).toBeLessThan(0.01)
    // P(|Z| ≤ 1) = 0.6827; binomial standard error √(p(1 − p)/n) ≈ 0.001.
    expect(Math.abs(inside / n - 0.6827)).toBeLessThan(0.005)
  })
})
