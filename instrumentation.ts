/** Applies pending migrations once when the server starts (idempotent). */
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return
  const [{ db }, { migrateDb }] = await Promise.all([import('./db'), import('./db/migrate')])
  await migrateDb(db)
}
