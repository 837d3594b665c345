import { AppError } from '@/lib/errors'
import { listCaughtMail, mailInboxEnabled } from '@/lib/mail/inbox'
import { authoriseSite, type Caller } from './access'

/** What the local fake mail server caught (demo and development only), newest first. */
export function caughtMail(caller: Caller | null, limit = 100) {
  authoriseSite(caller, 'mail.view')
  if (!mailInboxEnabled()) throw new AppError('not_found', 'The mail inbox is off on this server.')
  return listCaughtMail().slice(0, limit)
}
