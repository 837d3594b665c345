import nodemailer from 'nodemailer'

export interface OutgoingMail {
  to: string
  subject: string
  text: string
  html?: string
}

/** A mail server that accepts the connection but never answers must not hold a sender for long. */
export const SMTP_TIMEOUTS = {
  connectionTimeout: Number(process.env.SMTP_CONNECTION_TIMEOUT_MS || 5000),
  greetingTimeout: Number(process.env.SMTP_GREETING_TIMEOUT_MS || 5000),
  socketTimeout: Number(process.env.SMTP_SOCKET_TIMEOUT_MS || 10000),
  dnsTimeout: 5000,
}

/**
 * SMTP settings come from the environment. Development, demo and tests point at the local
 * fake (scripts/mail-fake.ts, port 2525); production points SMTP_HOST at a real relay.
 */
export function smtpSettings() {
  return {
    host: process.env.SMTP_HOST || '127.0.0.1',
    port: Number(process.env.SMTP_PORT || 2525),
    secure: process.env.SMTP_SECURE === 'true',
    auth: process.env.SMTP_USER ? { user: process.env.SMTP_USER, pass: process.env.SMTP_PASSWORD ?? '' } : undefined,
    from: process.env.MAIL_FROM || 'Inverso <no-reply@inverso.local>',
  }
}

export interface MailSender {
  send(mail: OutgoingMail): Promise<void>
  close(): void
}

/**
 * One SMTP connection setup for a batch of mails, with timeouts. Only the outbox sender
 * (server/mail/outbox.ts) calls this: actions enqueue mail and never wait on SMTP.
 */
export function smtpSender(): MailSender {
  const { from, ...settings } = smtpSettings()
  // The fake speaks plain SMTP; a real relay negotiates STARTTLS itself.
  const transport = nodemailer.createTransport({ ...settings, ...SMTP_TIMEOUTS, ignoreTLS: !settings.secure && settings.host === '127.0.0.1' })
  return {
    send: async (mail) => {
      await transport.sendMail({ from, ...mail })
    },
    close: () => transport.close(),
  }
}

/**
 * Sends one mail now. Kept for code that has not moved to the outbox yet; use `enqueueMail`
 * (server/mail/outbox.ts) instead, which survives a mail server that is down.
 */
export async function sendMail(mail: OutgoingMail): Promise<void> {
  const sender = smtpSender()
  try {
    await sender.send(mail)
  } finally {
    sender.close()
  }
}
