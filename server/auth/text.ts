import { AppError } from '@/lib/errors'
import { stripControl } from '@/lib/schemas/clean-text'

/** A person's name as stored: control characters stripped, one line, 2–120 characters. */
export function cleanText(raw: string, field: string): string {
  const text = stripControl(raw).trim()
  if (text.length < 2 || text.length > 120) throw new AppError('invalid', 'Check the marked field.', { [field]: 'Enter your name as it should appear on signed calcs (2–120 characters).' })
  return text
}
