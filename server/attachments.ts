import { randomUUID } from 'node:crypto'
import { and, asc, eq, isNull } from 'drizzle-orm'
import { AppError } from '@/lib/errors'
import type { FileStore } from '@/lib/storage'
import { sha256Hex } from '@/lib/calc/hash'
import { authoriseCalc, type Caller } from './access'
import { audit } from '@/db/audit'
import { db } from '@/db'
import { attachments } from '@/db/schema'

export const MAX_ATTACHMENT_BYTES = 10 * 1024 * 1024

/** A PDF to append to the next revision's package (e.g. a bearing data sheet, a test report). */
export async function addAttachment(caller: Caller | null, projectId: string, calcId: string, file: { name: string; bytes: Uint8Array }, store: FileStore) {
  const { calc, caller: who } = await authoriseCalc(caller, projectId, calcId, 'calc.edit')
  if (file.bytes.length === 0) throw new AppError('invalid', 'The file is empty.', { file: 'Choose a PDF file.' })
  if (file.bytes.length > MAX_ATTACHMENT_BYTES) throw new AppError('invalid', 'The file is too large.', { file: 'At most 10 MB.' })
  if (Buffer.from(file.bytes.subarray(0, 5)).toString('latin1') !== '%PDF-') {
    throw new AppError('invalid', 'Only PDF files can be appended.', { file: `${file.name} is not a PDF.` })
  }
  const sha256 = sha256Hex(file.bytes)
  const storageKey = `attachments/${sha256}.pdf`
  await store.put(storageKey, file.bytes)
  await db.insert(attachments).values({ id: randomUUID(), calcId: calc.id, name: file.name, mime: 'application/pdf', size: file.bytes.length, sha256, storageKey, uploadedBy: who.id })
  await audit({ userId: who.id, action: 'attachment.added', projectId: calc.projectId, calcId: calc.id, detail: { name: file.name, sha256 } })
}

/** Attachments not yet frozen into a revision: they go with the next one saved. */
export async function pendingAttachments(caller: Caller | null, projectId: string, calcId: string) {
  await authoriseCalc(caller, projectId, calcId, 'project.view')
  return db.select().from(attachments).where(and(eq(attachments.calcId, calcId), isNull(attachments.revisionId))).orderBy(asc(attachments.createdAt))
}

/** The appendices that will go with the next revision saved, for rendering it before it is written. */
export async function pendingAttachmentFiles(calcId: string, store: FileStore) {
  const rows = await db.select().from(attachments).where(and(eq(attachments.calcId, calcId), isNull(attachments.revisionId))).orderBy(asc(attachments.createdAt))
  return Promise.all(rows.map(async (r) => ({ id: r.id, name: r.name, bytes: await store.get(r.storageKey) })))
}

export async function attachmentBytes(revisionId: string, store: FileStore) {
  const rows = await db.select().from(attachments).where(eq(attachments.revisionId, revisionId)).orderBy(asc(attachments.createdAt))
  return Promise.all(rows.map(async (r) => ({ name: r.name, bytes: await store.get(r.storageKey) })))
}
