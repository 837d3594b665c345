import type { z } from 'zod'

/** First message per field path (`geometry.arm`, `loads.0.fx`), ready to show beside the field. */
export function fieldErrorsOf(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {}
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.') || '_form'
    out[key] ??= issue.message
  }
  return out
}
