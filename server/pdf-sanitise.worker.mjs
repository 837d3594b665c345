/**
 * Reads an uploaded PDF and writes a clean copy (runs in a worker thread with a time and memory
 * budget: server/attachments.ts). Plain JavaScript so Node runs it as is, outside any bundle.
 *
 * Refuses: anything pdf-lib cannot read (a file that only starts with %PDF-), an encrypted file,
 * a file without pages. Removes: document JavaScript and embedded files (the /Names tree),
 * /OpenAction, /AA (additional actions) everywhere, actions of type JavaScript, Launch,
 * SubmitForm, ImportData, GoToE, RichMediaExecute, Rendition, Sound and Movie (in /A and /Next),
 * file-attachment, rich-media, sound, movie and screen annotations, and the interactive form
 * (/AcroForm, with XFA). The pages are then copied into a fresh document, so nothing that was
 * unlinked is written out.
 */
import { createRequire } from 'node:module'
import { parentPort, workerData } from 'node:worker_threads'

const require = createRequire(import.meta.url)
const { PDFDocument, PDFDict, PDFArray, PDFName, PDFRef, PDFStream, EncryptedPDFError } = require('pdf-lib')

const BAD_ACTIONS = new Set(['JavaScript', 'Launch', 'SubmitForm', 'ImportData', 'GoToE', 'RichMediaExecute', 'Rendition', 'Sound', 'Movie', 'Hide', 'SetOCGState'])
const BAD_ANNOTATIONS = new Set(['FileAttachment', 'RichMedia', 'Sound', 'Movie', 'Screen', '3D'])
const N = (s) => PDFName.of(s)

function nameOf(obj) {
  return obj instanceof PDFName ? obj.decodeText() : undefined
}

function resolve(context, obj) {
  return obj instanceof PDFRef ? context.lookup(obj) : obj
}

function isBadAction(context, obj) {
  const action = resolve(context, obj)
  if (!(action instanceof PDFDict)) return false
  const type = nameOf(action.get(N('S')))
  return type !== undefined && BAD_ACTIONS.has(type)
}

/** Strips what can run or carry files from one dictionary (and its direct children). */
function clean(context, dict, removed, seen) {
  if (seen.has(dict)) return
  seen.add(dict)
  for (const key of ['AA', 'OpenAction', 'JS', 'JavaScript', 'EmbeddedFiles', 'EF', 'XFA']) {
    if (dict.has(N(key))) {
      dict.delete(N(key))
      removed.add(key)
    }
  }
  for (const key of ['A', 'Next', 'PA']) {
    const value = dict.get(N(key))
    if (value === undefined) continue
    if (isBadAction(context, value)) {
      dict.delete(N(key))
      removed.add(`${key} action`)
    } else {
      const arr = resolve(context, value)
      if (arr instanceof PDFArray) {
        for (let i = arr.size() - 1; i >= 0; i--) {
          if (isBadAction(context, arr.get(i))) {
            arr.remove(i)
            removed.add(`${key} action`)
          }
        }
      }
    }
  }
  const annots = resolve(context, dict.get(N('Annots')))
  if (annots instanceof PDFArray) {
    for (let i = annots.size() - 1; i >= 0; i--) {
      const annot = resolve(context, annots.get(i))
      const subtype = annot instanceof PDFDict ? nameOf(annot.get(N('Subtype'))) : undefined
      if (subtype && BAD_ANNOTATIONS.has(subtype)) {
        annots.remove(i)
        removed.add(`${subtype} annotation`)
      }
    }
  }
  for (const [, value] of dict.entries()) {
    if (value instanceof PDFDict) clean(context, value, removed, seen)
    else if (value instanceof PDFArray) for (const item of value.asArray()) if (item instanceof PDFDict) clean(context, item, removed, seen)
  }
}

async function sanitise(bytes) {
  let doc
  try {
    doc = await PDFDocument.load(bytes, { updateMetadata: false })
  } catch (err) {
    // pdf-lib's errors are compiled to ES5 classes, so `instanceof EncryptedPDFError` does not hold.
    if (err instanceof EncryptedPDFError || /is encrypted/.test(String(err && err.message))) return { ok: false, reason: 'encrypted' }
    return { ok: false, reason: 'broken', detail: String(err && err.message).slice(0, 200) }
  }
  if (doc.isEncrypted) return { ok: false, reason: 'encrypted' }
  let pageCount
  try {
    pageCount = doc.getPageCount()
  } catch (err) {
    return { ok: false, reason: 'broken', detail: String(err && err.message).slice(0, 200) }
  }
  if (pageCount === 0) return { ok: false, reason: 'no-pages' }

  const removed = new Set()
  const context = doc.context
  const catalog = doc.catalog
  for (const key of ['Names', 'OpenAction', 'AA', 'AcroForm']) {
    if (catalog.has(N(key))) {
      catalog.delete(N(key))
      removed.add(key)
    }
  }
  const seen = new Set()
  for (const [, obj] of context.enumerateIndirectObjects()) {
    if (obj instanceof PDFDict) clean(context, obj, removed, seen)
    else if (obj instanceof PDFStream) clean(context, obj.dict, removed, seen)
  }

  const out = await PDFDocument.create({ updateMetadata: false })
  const pages = await out.copyPages(doc, doc.getPageIndices())
  for (const page of pages) out.addPage(page)
  const clean_ = await out.save({ useObjectStreams: false })
  return { ok: true, bytes: clean_, pages: pageCount, removed: [...removed].sort() }
}

sanitise(new Uint8Array(workerData.bytes)).then(
  (result) => parentPort.postMessage(result, result.ok ? [result.bytes.buffer] : []),
  (err) => parentPort.postMessage({ ok: false, reason: 'broken', detail: String(err && err.message).slice(0, 200) }),
)
