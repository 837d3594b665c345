import type { OutgoingMail } from '@/lib/mail/transport'
import { sendMail } from '@/lib/mail/transport'

/**
 * Hands a workflow mail to delivery without waiting for it. Until the outbox lands this sends in
 * the background and logs a failure; the in-app notice is the record either way.
 */
export async function queueMail(mail: OutgoingMail): Promise<void> {
  void sendMail(mail).catch((err: unknown) => console.error('[mail] notice not sent', mail.to, err))
}
