import { createHash } from 'node:crypto'

/** Hex SHA-256 of raw bytes (the rendered PDF, or canonical JSON encoded as UTF-8). */
export function sha256Hex(bytes: Uint8Array | string): string {
  return createHash('sha256').update(bytes).digest('hex')
}

/**
 * JSON with object keys sorted at every depth, so equal values hash equally no
 * matter how they were built. Typed arrays become plain number arrays;
 * `undefined` members are dropped like JSON.stringify does; non-finite numbers
 * are refused because JSON would silently turn them into null.
 */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(normalise(value, '$'))
}

type Json = null | boolean | number | string | Json[] | { [key: string]: Json }

function normalise(value: unknown, path: string): Json | undefined {
  if (value === null) return null
  switch (typeof value) {
    case 'boolean':
    case 'string':
      return value
    case 'number':
      if (!Number.isFinite(value)) throw new Error(`canonicalJson: non-finite number at ${path}`)
      return Object.is(value, -0) ? 0 : value
    case 'undefined':
    case 'function':
    case 'symbol':
      return undefined
    case 'bigint':
      return value.toString()
    default:
      break
  }
  if (value instanceof Date) return value.toISOString()
  if (ArrayBuffer.isView(value)) {
    return Array.from(new Uint8Array(value.buffer, value.byteOffset, value.byteLength))
  }
  if (Array.isArray(value)) {
    return value.map((item, i) => normalise(item, `${path}[${i}]`) ?? null)
  }
  const out: { [key: string]: Json } = {}
  const record = value as Record<string, unknown>
  for (const key of Object.keys(record).sort()) {
    const item = normalise(record[key], `${path}.${key}`)
    if (item !== undefined) out[key] = item
  }
  return out
}
