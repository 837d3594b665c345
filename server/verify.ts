import { and, desc, eq } from 'drizzle-orm'
import { db } from '@/db'
import { calcs, projects, revisionEvents, revisions } from '@/db/schema'
import { sha256Hex } from '@/lib/calc/hash'
import { AppError } from '@/lib/errors'
import { normaliseCode, verifyStatement } from './signing'

/** Largest PDF the public page takes (a package with appendices stays well under it). */
export const MAX_VERIFY_BYTES = 20 * 1024 * 1024

export interface Verification {
  /** The file or code belongs to a revision this server issued. */
  issued: boolean
  /** The server's Ed25519 signature over the issue statement verifies, and the statement names this revision's content. */
  signatureValid: boolean
  superseded: boolean
  voided: boolean
  project: string | null
  calc: string | null
  revision: string | null
  issuedAt: string | null
  message: string
}

const NOT_FOUND: Verification = {
  issued: false,
  signatureValid: false,
  superseded: false,
  voided: false,
  project: null,
  calc: null,
  revision: null,
  issuedAt: null,
  message: 'Not an issued package of this server. If this is meant to be an issued package, it has been changed (even one byte changes it) or comes from elsewhere: do not rely on it.',
}

async function verdictFor(where: ReturnType<typeof eq>): Promise<Verification> {
  const [row] = await db
    .select({ rev: revisions, calc: calcs.number, title: calcs.title, project: projects.code })
    .from(revisions)
    .innerJoin(calcs, eq(calcs.id, revisions.calcId))
    .innerJoin(projects, eq(projects.id, calcs.projectId))
    .where(where)
  if (!row || !row.rev.issuedAt) return NOT_FOUND
  const [event] = await db
    .select()
    .from(revisionEvents)
    .where(and(eq(revisionEvents.revisionId, row.rev.id), eq(revisionEvents.action, 'issue')))
    .orderBy(desc(revisionEvents.at))
  const statement = event?.statement ? (JSON.parse(event.statement) as { contentHash?: string; revision?: string }) : null
  const signatureValid =
    !!event?.statement && !!event.signature && verifyStatement(event.statement, event.signature) && statement?.contentHash === row.rev.contentHash && statement?.revision === row.rev.id
  const superseded = row.rev.state === 'superseded'
  const voided = row.rev.state === 'voided'
  const name = `${row.project} / ${row.calc} rev ${row.rev.label}`
  return {
    issued: true,
    signatureValid,
    superseded,
    voided,
    project: row.project,
    calc: `${row.calc} — ${row.title}`,
    revision: row.rev.label,
    issuedAt: row.rev.issuedAt.toISOString(),
    message: !signatureValid
      ? `${name} is recorded as issued, but its signature does not verify: do not rely on it and tell the approver.`
      : voided
        ? `${name} was issued and has since been VOIDED: do not use it.`
        : superseded
          ? `${name} was issued and has since been SUPERSEDED by a newer revision: use the current one.`
          : `${name} is issued and current; the signature verifies.`,
  }
}

/** Anyone, signed in or not: is this exact PDF an issued package of this server? */
export async function verifyPdf(bytes: Uint8Array): Promise<Verification> {
  if (bytes.length === 0) throw new AppError('invalid', 'The file is empty.', { file: 'Choose the PDF to verify.' })
  return verdictFor(eq(revisions.pdfHash, sha256Hex(bytes)))
}

export async function verifyCode(code: string): Promise<Verification> {
  const c = normaliseCode(code)
  if (!/^[0-9A-Z]{5}-[0-9A-Z]{5}$/.test(c)) throw new AppError('invalid', 'A verification code has 10 letters and digits, e.g. 7K2QD-M9XWA.', { code: 'Type the 10-character code printed on the package.' })
  return verdictFor(eq(revisions.verificationCode, c))
}
