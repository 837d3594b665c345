/**
 * Runs once when the server starts: applies pending migrations (idempotent), then starts the mail
 * outbox sender in this process (each instance runs one; a mail is claimed by one instance only).
 * OUTBOX_SENDER=off leaves sending to another instance.
 */
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return
  // Before the first request: stamp each request with its socket address (per-source sign-in limits).
  const { installClientAddressHeader } = await import('./server/auth/client-address')
  installClientAddressHeader()
  const [{ db }, { migrateDb }] = await Promise.all([import('./db'), import('./db/migrate')])
  await migrateDb(db)
  if (process.env.OUTBOX_SENDER !== 'off') {
    const { startOutboxSender } = await import('./server/mail/outbox')
    startOutboxSender()
  }
}
