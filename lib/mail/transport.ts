import nodemailer from 'nodemailer'

export interface OutgoingMail {
  to: string
  subject: string
  text: string
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

export async function sendMail(mail: OutgoingMail): Promise<void> {
  const { from, ...settings } = smtpSettings()
  // The fake speaks plain SMTP; a real relay negotiates STARTTLS itself.
  const transport = nodemailer.createTransport({ ...settings, ignoreTLS: !settings.secure && settings.host === '127.0.0.1' })
  await transport.sendMail({ from, ...mail })
}
