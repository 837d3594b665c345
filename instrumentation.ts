/**
 * Runs once when the server starts: applies pending migrations (idempotent), then starts the
 * package render runner and the mail outbox sender in this process (each instance runs one of each;
 * a job or a mail is claimed by one instance only). RENDER_RUNNER=off / OUTBOX_SENDER=off leave the
 * work to another instance.
 */
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return
  // Before the first request: stamp each request with its socket address (per-source sign-in limits).
  const { installClientAddressHeader } = await import('./server/auth/client-address')
  installClientAddressHeader()
  const [{ db }, { migrateDb }] = await Promise.all([import('./db'), import('./db/migrate')])
  await migrateDb(db)
  if (process.env.RENDER_RUNNER !== 'off') {
    // Packages of saved revisions are rendered here, in the worker pool, off every request.
    const [{ startRenderRunner }, { pooledRenderer }, { localFileStore }] = await Promise.all([
      import('./server/render-jobs'),
      import('./server/render-pool'),
      import('./lib/storage'),
    ])
    startRenderRunner({ renderer: pooledRenderer, store: localFileStore() })
  }
  if (process.env.OUTBOX_SENDER !== 'off') {
    const { startOutboxSender } = await import('./server/mail/outbox')
    startOutboxSender()
  }
}
