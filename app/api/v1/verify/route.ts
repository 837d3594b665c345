import { apiRoute, readJson } from '@/app/_lib/api'
import { AppError } from '@/lib/errors'
import { verifyBody } from '@/lib/schemas/api'
import { MAX_VERIFY_BYTES, verifyCode, verifyPdf } from '@/server/verify'

/**
 * Public, no sign-in: is this an issued package of this server? A PDF as multipart field `file`,
 * or `{ code }` as JSON.
 */
export const POST = apiRoute(async ({ req }) => {
  const type = req.headers.get('content-type') ?? ''
  if (/^multipart\/form-data/i.test(type)) {
    if (Number(req.headers.get('content-length') ?? 0) > MAX_VERIFY_BYTES + 64 * 1024) throw new AppError('too_large', `The file is larger than ${MAX_VERIFY_BYTES / 1024 / 1024} MB.`)
    const file = (await req.formData()).get('file')
    if (!(file instanceof File)) throw new AppError('invalid', 'Send the PDF as the form field `file`.', { file: 'Choose the PDF to verify.' })
    if (file.size > MAX_VERIFY_BYTES) throw new AppError('too_large', `The file is larger than ${MAX_VERIFY_BYTES / 1024 / 1024} MB.`)
    return verifyPdf(new Uint8Array(await file.arrayBuffer()))
  }
  const { code } = await readJson(req, verifyBody)
  return verifyCode(code)
})
