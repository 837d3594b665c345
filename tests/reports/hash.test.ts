import { describe, expect, it } from 'vitest'
import { canonicalJson, sha256Hex } from '@/reports/hash'

describe('canonicalJson / sha256Hex', () => {
  it('sorts keys at every depth and drops undefined members', () => {
    const a = canonicalJson({ b: 1, a: { d: [1, { y: 2, x: 1 }], c: undefined } })
    expect(a).toBe('{"a":{"d":[1,{"x":1,"y":2}]},"b":1}')
    expect(canonicalJson({ a: { d: [1, { x: 1, y: 2 }] }, b: 1 })).toBe(a)
  })

  it('refuses non-finite numbers rather than writing null', () => {
    expect(() => canonicalJson({ a: Number.NaN })).toThrow(/non-finite/)
  })

  it('hashes bytes and strings as hex SHA-256', () => {
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad')
    expect(sha256Hex(new TextEncoder().encode('abc'))).toBe(sha256Hex('abc'))
  })
})
