import { readdirSync, readFileSync } from 'node:fs'
import path from 'node:path'
import type { CaughtMail } from './fake-server'

export function mailDir(): string {
  return process.env.MAIL_FAKE_DIR || path.join(process.cwd(), 'data', 'mail')
}

/** Messages the fake caught, newest first. */
export function listCaughtMail(dir = mailDir()): CaughtMail[] {
  let files: string[]
  try {
    files = readdirSync(/*turbopackIgnore: true*/ dir).filter((f) => f.endsWith('.json'))
  } catch {
    return []
  }
  return files
    .sort()
    .reverse()
    .map((f) => JSON.parse(readFileSync(path.join(/*turbopackIgnore: true*/ dir, f), 'utf8')) as CaughtMail)
}

/** The first link in a caught message, e.g. an invitation or reset link. */
export function firstLink(mail: CaughtMail): string | null {
  return mail.text.match(/https?:\/\/\S+/)?.[0] ?? null
}

/** The caught-mail page exists only where the fake is in use (development, demo, tests). */
export function mailInboxEnabled(): boolean {
  return process.env.NODE_ENV !== 'production' || process.env.INVERSO_MAIL_INBOX === 'on'
}
