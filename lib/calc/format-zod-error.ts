import type { z } from 'zod'

/** `loads[0].fx` style path, as a person would write it. */
export function issuePath(path: readonly PropertyKey[]): string {
  let out = ''
  for (const p of path) out += typeof p === 'number' ? `[${p}]` : out ? `.${String(p)}` : String(p)
  return out || '(input)'
}

/**
 * One line for a CLI or a log: the first issue, naming the field, e.g.
 * `error: geometry.side: must be positive`. The first issue is enough to act
 * on; the rest usually follow from it.
 */
export function formatZodError(err: z.ZodError): string {
  const first = err.issues[0]
  if (!first) return 'error: invalid input'
  return `error: ${issuePath(first.path)}: ${first.message}`
}
