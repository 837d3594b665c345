/**
 * Issue 13, item 8: an upload is size-checked before it is read, parsed with pdf-lib, refused
 * when it is encrypted, broken or not a PDF at all, and stored only as a clean copy without
 * JavaScript, embedded files or actions.
 */
import { mkdtempSync, readdirSync, existsSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { eq } from 'drizzle-orm'
import { PDFDocument, PDFName, PDFString } from 'pdf-lib'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { attachments } from '@/db/schema'
import { addAttachment, MAX_ATTACHMENT_BYTES, sanitisePdf } from '@/server/attachments'
import type { Caller } from '@/server/access'
import { AppError } from '@/lib/errors'
import { localFileStore } from '@/lib/storage'
import { seededDemo, type DemoRole } from '../helpers/demo'
import { useTempEnvironment } from '../helpers/temp-env'

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let who: Record<DemoRole, Caller>
let projectId = ''
let calcId = ''
const filesDir = mkdtempSync(path.join(tmpdir(), 'inverso-files-'))
const store = localFileStore(filesDir)
beforeAll(async () => {
  env = await useTempEnvironment()
  const demo = await seededDemo()
  ;({ people: who, projectId } = demo)
  calcId = await demo.calcId('LC-002')
})
afterAll(() => env.close())

const storedFiles = () => (existsSync(path.join(filesDir, 'attachments')) ? readdirSync(path.join(filesDir, 'attachments')) : [])
const rowCount = async () => (await db.select().from(attachments).where(eq(attachments.calcId, calcId))).length

async function upload(name: string, bytes: Uint8Array) {
  return addAttachment(who.engineer, projectId, calcId, { name, bytes }, store)
}

async function refused(p: Promise<unknown>, pattern: RegExp, code = 'invalid') {
  const before = { rows: await rowCount(), files: storedFiles().length }
  const err = await p.then(() => null, (e: unknown) => e)
  expect(err).toBeInstanceOf(AppError)
  expect((err as AppError).code).toBe(code)
  expect((err as AppError).fieldErrors?.file).toMatch(pattern)
  // Nothing was stored.
  expect(await rowCount()).toBe(before.rows)
  expect(storedFiles()).toHaveLength(before.files)
}

async function simplePdf(text = 'Bearing data sheet'): Promise<PDFDocument> {
  const doc = await PDFDocument.create()
  const page = doc.addPage([300, 200])
  page.drawText(text, { x: 20, y: 100, size: 12 })
  return doc
}

/** A PDF with document JavaScript, an OpenAction, page and link actions and an embedded file. */
async function scriptedPdf(): Promise<Uint8Array> {
  const doc = await simplePdf('With scripts')
  const ctx = doc.context
  const js = ctx.obj({ Type: 'Action', S: 'JavaScript', JS: PDFString.of('app.alert("hi")') })
  const jsRef = ctx.register(js)
  doc.catalog.set(PDFName.of('OpenAction'), jsRef)
  doc.catalog.set(PDFName.of('AA'), ctx.obj({ WC: jsRef }))
  doc.catalog.set(PDFName.of('Names'), ctx.obj({ JavaScript: ctx.obj({ Names: [PDFString.of('x'), jsRef] }) }))
  const page = doc.getPage(0)
  page.node.set(PDFName.of('AA'), ctx.obj({ O: jsRef }))
  const launch = ctx.obj({ S: 'Launch', F: PDFString.of('calc.exe') })
  const link = ctx.register(ctx.obj({ Type: 'Annot', Subtype: 'Link', Rect: [0, 0, 100, 20], A: launch }))
  const uri = ctx.register(ctx.obj({ Type: 'Annot', Subtype: 'Link', Rect: [0, 30, 100, 50], A: ctx.obj({ S: 'URI', URI: PDFString.of('https://example.com'), Next: jsRef }) }))
  page.node.set(PDFName.of('Annots'), ctx.obj([link, uri]))
  await doc.attach(new TextEncoder().encode('MZ payload'), 'payload.exe', { mimeType: 'application/octet-stream' })
  return doc.save({ useObjectStreams: false })
}

/** pdf-lib cannot encrypt, so: a small PDF with an /Encrypt dictionary in its trailer, written by hand. */
function encryptedPdf(): Uint8Array {
  const objects = [
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    '<< /Type /Page /Parent 2 0 R /MediaBox [0 0 200 200] >>',
    '<< /Filter /Standard /V 1 /R 2 /O (0123456789abcdef0123456789abcdef) /U (0123456789abcdef0123456789abcdef) /P -4 >>',
  ]
  let out = '%PDF-1.4\n'
  const offsets: number[] = []
  objects.forEach((body, i) => {
    offsets.push(out.length)
    out += `${i + 1} 0 obj\n${body}\nendobj\n`
  })
  const xref = out.length
  out += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n` + offsets.map((o) => `${String(o).padStart(10, '0')} 00000 n \n`).join('')
  out += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R /Encrypt 4 0 R /ID [<0123456789abcdef0123456789abcdef> <0123456789abcdef0123456789abcdef>] >>\nstartxref\n${xref}\n%%EOF\n`
  return new TextEncoder().encode(out)
}

describe('uploads', () => {
  it('a plain PDF is accepted and stored as a clean copy that still reads', async () => {
    const bytes = await (await simplePdf()).save()
    const out = await upload('data-sheet.pdf', bytes)
    expect(out.pages).toBe(1)
    const [row] = await db.select().from(attachments).where(eq(attachments.calcId, calcId))
    const stored = await store.get(row.storageKey)
    expect((await PDFDocument.load(stored)).getPageCount()).toBe(1)
  })

  it('JavaScript, the OpenAction, additional actions, a Launch link and an embedded file are stripped', async () => {
    const bytes = await scriptedPdf()
    expect(Buffer.from(bytes).toString('latin1')).toMatch(/\/JavaScript/)
    const out = await upload('scripted.pdf', bytes)
    expect(out.removed).toEqual(expect.arrayContaining(['Names', 'OpenAction', 'AA', 'A action', 'Next action']))
    const rows = await db.select().from(attachments).where(eq(attachments.name, 'scripted.pdf'))
    const stored = Buffer.from(await store.get(rows[0].storageKey)).toString('latin1')
    for (const word of ['/JavaScript', '/JS', '/OpenAction', '/AA', '/Launch', '/EmbeddedFile', 'payload.exe', 'app.alert']) expect(stored).not.toContain(word)
    // The harmless URI link stays.
    expect(stored).toContain('https://example.com')
    expect((await PDFDocument.load(await store.get(rows[0].storageKey))).getPageCount()).toBe(1)
  })

  it('an encrypted PDF is refused at the file field', async () => {
    await refused(upload('locked.pdf', encryptedPdf()), /encrypted/)
  })

  it('a polyglot — starts with %PDF- and ends like one, but is HTML inside — is refused', async () => {
    const body = '%PDF-1.7\n<html><body><script>alert(document.cookie)</script></body></html>\n'
    const poly = new TextEncoder().encode(`${body}startxref\n9\n%%EOF\n`)
    await refused(upload('poly.pdf', poly), /not a readable PDF/)
  })

  it('a file with only the %PDF- prefix, and 9.5 MB of junk, are refused quickly', async () => {
    await refused(upload('prefix.pdf', new TextEncoder().encode('%PDF-')), /not a readable PDF/)
    const junk = new Uint8Array(9.5 * 1024 * 1024)
    junk.set(new TextEncoder().encode('%PDF-1.7\n'))
    for (let i = 9; i < junk.length; i++) junk[i] = (i * 7919) % 251
    const t0 = Date.now()
    await refused(upload('junk.pdf', junk), /not a readable PDF/)
    expect(Date.now() - t0).toBeLessThan(2000)
  })

  it('a file that would take the reader too long is given up in its worker, not on the event loop', async () => {
    const junk = new Uint8Array(2 * 1024 * 1024)
    junk.set(new TextEncoder().encode('%PDF-1.7\n'))
    for (let i = 9; i < junk.length; i++) junk[i] = (i * 7919) % 251
    const tail = new TextEncoder().encode('\nstartxref\n9\n%%EOF\n')
    junk.set(tail, junk.length - tail.length)
    let ticks = 0
    const ticker = setInterval(() => ticks++, 20)
    const result = await sanitisePdf(junk, 400)
    clearInterval(ticker)
    expect(result.ok).toBe(false)
    // The event loop kept running while the worker read the file.
    expect(ticks).toBeGreaterThan(5)
  })

  it('the size is checked before the file is read: a 50 MB upload is refused without reading it', async () => {
    let read = false
    const big = { name: 'huge.pdf', size: 50 * 1024 * 1024, arrayBuffer: async () => ((read = true), new ArrayBuffer(0)) }
    await refused(addAttachment(who.engineer, projectId, calcId, big, store), new RegExp(`at most ${MAX_ATTACHMENT_BYTES / 1048576} MB`), 'too_large')
    expect(read).toBe(false)
  })
})
