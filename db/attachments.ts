import { randomUUID } from 'node:crypto'
import { and, asc, eq, isNull } from 'drizzle-orm'
import { AppError } from '@/lib/errors'
import type { FileStore } from '@/lib/storage'
import { sha256Hex } from '@/lib/calc/hash'
import { audit } from './audit'
import { db } from './index'
import { attachments, type Calc } from './schema'

export const MAX_ATTACHMENT_BYTES = 10 * 1024 * 1024

/** A PDF to append to the next revision's package (e.g. a bearing data sheet, a test report). */
export async function addAttachment(calc: Calc, file: { name: string; bytes: Uint8Array }, userId: string, store: FileStore) {
  if (file.bytes.length === 0) throw new AppError('invalid', 'The file is empty.', { file: 'Choose a PDF file.' })
  if (file.bytes.length > MAX_ATTACHMENT_BYTES) throw new AppError('invalid', 'The file is too large.', { file: 'At most 10 MB.' })
  if (Buffer.from(file.bytes.subarray(0, 5)).toString('latin1') !== '%PDF-') {
    throw new AppError('invalid', 'Only PDF files can be appended.', { file: `${file.name} is not a PDF.` })
  }
  const sha256 = sha256Hex(file.bytes)
  const storageKey = `attachments/${sha256}.pdf`
  await store.put(storageKey, file.bytes)
  await db.insert(attachments).values({ id: randomUUID(), calcId: calc.id, name: file.name, mime: 'application/pdf', size: file.bytes.length, sha256, storageKey, uploadedBy: userId })
  await audit({ userId, action: 'attachment.added', projectId: calc.projectId, calcId: calc.id, detail: { name: file.name, sha256 } })
}

/** Attachments not yet frozen into a revision: they go with the next one saved. */
export function pendingAttachments(calcId: string) {
  return db.select().from(attachments).where(and(eq(attachments.calcId, calcId), isNull(attachments.revisionId))).orderBy(asc(attachments.createdAt))
}

export async function attachPendingTo(calcId: string, revisionId: string) {
  await db.update(attachments).set({ revisionId }).where(and(eq(attachments.calcId, calcId), isNull(attachments.revisionId)))
}

export async function attachmentBytes(revisionId: string, store: FileStore) {
  const rows = await db.select().from(attachments).where(eq(attachments.revisionId, revisionId)).orderBy(asc(attachments.createdAt))
  return Promise.all(rows.map(async (r) => ({ name: r.name, bytes: await store.get(r.storageKey) })))
}
