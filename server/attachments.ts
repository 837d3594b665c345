import { randomUUID } from 'node:crypto'
import path from 'node:path'
import { pathToFileURL } from 'node:url'
import { Worker } from 'node:worker_threads'
import { and, asc, eq, isNull } from 'drizzle-orm'
import { AppError } from '@/lib/errors'
import type { FileStore } from '@/lib/storage'
import { sha256Hex } from '@/lib/calc/hash'
import { stripControl } from '@/lib/schemas/clean-text'
import { authoriseCalc, type Caller } from './access'
import { audit } from '@/db/audit'
import { db } from '@/db'
import { attachments } from '@/db/schema'

export const MAX_ATTACHMENT_BYTES = 10 * 1024 * 1024
/** Reading and cleaning one upload may take this long and this much memory, in its own thread. */
export const SANITISE_TIME_MS = 15_000
const SANITISE_MEMORY_MB = 256

/**
 * An upload as a form gives it (a `File`: size known before reading) or as bytes already read
 * (tests, the CLI). The size is checked before anything is read.
 */
export type Upload = { name: string; bytes: Uint8Array } | { name: string; size: number; arrayBuffer(): Promise<ArrayBuffer> }

type Sanitised = { ok: true; bytes: Uint8Array; pages: number; removed: string[] } | { ok: false; reason: 'encrypted' | 'broken' | 'no-pages' | 'timeout'; detail?: string }

const REFUSAL: Record<Exclude<Sanitised, { ok: true }>['reason'], string> = {
  encrypted: 'is encrypted or password-protected. Save an unprotected copy and upload that.',
  broken: 'is not a readable PDF (damaged, or another kind of file named .pdf).',
  'no-pages': 'has no pages.',
  timeout: 'could not be read in time; it may be damaged. Save it again from its source and retry.',
}

/** Where the worker script lives: beside this file in the source tree (Next runs from the project root). */
function workerUrl(): URL {
  return pathToFileURL(path.join(/*turbopackIgnore: true*/ process.cwd(), 'server', 'pdf-sanitise.worker.mjs'))
}

/**
 * Parses the PDF with pdf-lib and writes a clean copy without scripts, embedded files and
 * actions (see server/pdf-sanitise.worker.mjs). In a worker thread with a time and memory budget:
 * a crafted file can take pdf-lib tens of seconds, which must not stall other requests.
 */
export function sanitisePdf(bytes: Uint8Array, timeoutMs = SANITISE_TIME_MS): Promise<Sanitised> {
  return new Promise((resolve) => {
    const copy = bytes.slice()
    const worker = new Worker(workerUrl(), { workerData: { bytes: copy.buffer }, transferList: [copy.buffer], resourceLimits: { maxOldGenerationSizeMb: SANITISE_MEMORY_MB } })
    let settled = false
    const finish = (r: Sanitised) => {
      if (settled) return
      settled = true
      clearTimeout(timer)
      void worker.terminate()
      resolve(r)
    }
    const timer = setTimeout(() => finish({ ok: false, reason: 'timeout' }), timeoutMs)
    worker.once('message', (r: Sanitised) => finish(r.ok ? { ...r, bytes: new Uint8Array(r.bytes) } : r))
    worker.once('error', (err) => finish({ ok: false, reason: 'broken', detail: err.message }))
    worker.once('exit', () => finish({ ok: false, reason: 'broken', detail: 'the reader stopped' }))
  })
}

/** Cheap structure checks before the parser: a PDF starts with %PDF-1.x/2.x and ends with startxref … %%EOF. */
function looksLikePdf(bytes: Uint8Array): boolean {
  const head = Buffer.from(bytes.subarray(0, 16)).toString('latin1')
  if (!/^%PDF-[12]\.\d/.test(head)) return false
  const tail = Buffer.from(bytes.subarray(Math.max(0, bytes.length - 2048))).toString('latin1')
  const m = tail.match(/startxref\s+(\d+)\s+%%EOF\s*$/)
  return Boolean(m && Number(m[1]) < bytes.length)
}

function fileName(raw: string): string {
  const name = stripControl(path.basename(raw.replace(/\\/g, '/'))).trim().slice(0, 200)
  return name || 'appendix.pdf'
}

/**
 * A PDF to append to the next revision's package (e.g. a bearing data sheet, a test report).
 * Nothing is stored until the file has been read and cleaned; what is stored is the clean copy.
 */
export async function addAttachment(caller: Caller | null, projectId: string, calcId: string, file: Upload, store: FileStore) {
  const { calc, caller: who } = await authoriseCalc(caller, projectId, calcId, 'calc.edit')
  const name = fileName(file.name)
  const size = 'bytes' in file ? file.bytes.length : file.size
  if (size === 0) throw new AppError('invalid', 'The file is empty.', { file: 'Choose a PDF file.' })
  if (size > MAX_ATTACHMENT_BYTES) throw new AppError('too_large', 'The file is too large.', { file: `${name} is ${(size / 1048576).toFixed(1)} MB; at most ${MAX_ATTACHMENT_BYTES / 1048576} MB.` })
  const original = 'bytes' in file ? file.bytes : new Uint8Array(await file.arrayBuffer())
  if (original.length > MAX_ATTACHMENT_BYTES) throw new AppError('too_large', 'The file is too large.', { file: `At most ${MAX_ATTACHMENT_BYTES / 1048576} MB.` })
  if (!looksLikePdf(original)) {
    throw new AppError('invalid', 'Only PDF files can be appended.', { file: `${name} ${REFUSAL.broken}` })
  }
  const clean = await sanitisePdf(original)
  if (!clean.ok) throw new AppError('invalid', `${name} ${REFUSAL[clean.reason]}`, { file: `${name} ${REFUSAL[clean.reason]}` })

  const sha256 = sha256Hex(clean.bytes)
  const storageKey = `attachments/${sha256}.pdf`
  await store.put(storageKey, clean.bytes)
  await db.insert(attachments).values({ id: randomUUID(), calcId: calc.id, name, mime: 'application/pdf', size: clean.bytes.length, sha256, storageKey, uploadedBy: who.id })
  await audit({
    userId: who.id,
    action: 'attachment.added',
    projectId: calc.projectId,
    calcId: calc.id,
    detail: { name, sha256, originalSha256: sha256Hex(original), pages: clean.pages, removed: clean.removed },
  })
  return { name, pages: clean.pages, removed: clean.removed }
}

/** Attachments not yet frozen into a revision: they go with the next one saved. */
export async function pendingAttachments(caller: Caller | null, projectId: string, calcId: string) {
  await authoriseCalc(caller, projectId, calcId, 'project.view')
  return db.select().from(attachments).where(and(eq(attachments.calcId, calcId), isNull(attachments.revisionId))).orderBy(asc(attachments.createdAt))
}

/** The appendices that will go with the next revision saved. */
export async function pendingAttachmentRows(calcId: string) {
  return db.select({ id: attachments.id }).from(attachments).where(and(eq(attachments.calcId, calcId), isNull(attachments.revisionId))).orderBy(asc(attachments.createdAt))
}

export async function attachmentBytes(revisionId: string, store: FileStore) {
  const rows = await db.select().from(attachments).where(eq(attachments.revisionId, revisionId)).orderBy(asc(attachments.createdAt))
  return Promise.all(rows.map(async (r) => ({ name: r.name, bytes: await store.get(r.storageKey) })))
}
