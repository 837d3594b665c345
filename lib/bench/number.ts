/**
 * Reading a number as a person types it. A decimal comma is read as the decimal separator
 * ("80,5" is 80.5); anything that is not one plain number is refused with a reason, never
 * silently changed (no dropped separators, no thousands guessing).
 */
export type ParsedNumber = { ok: true; value: number | undefined } | { ok: false; message: string }

const PLAIN = /^[+-]?(\d+(\.\d*)?|\.\d+)(e[+-]?\d+)?$/i

export function parseDecimal(text: string): ParsedNumber {
  const t = text.trim().replace(/\u2212/g, '-')
  if (t === '') return { ok: true, value: undefined }
  const commas = (t.match(/,/g) ?? []).length
  if (commas > 1 || (commas === 1 && t.includes('.'))) {
    return { ok: false, message: 'write one number with one decimal separator, e.g. 80.5 or 80,5 (no thousands separators)' }
  }
  const normal = t.replace(',', '.')
  if (!PLAIN.test(normal)) return { ok: false, message: 'must be a number, e.g. 80.5' }
  const value = Number(normal)
  if (!Number.isFinite(value)) return { ok: false, message: 'is too large to be a number here' }
  return { ok: true, value }
}

/** The digits a value is shown with: as stored, without float noise beyond 12 significant digits. */
export function formatEntered(value: number): string {
  if (!Number.isFinite(value)) return ''
  const short = Number(value.toPrecision(12))
  return String(short)
}
