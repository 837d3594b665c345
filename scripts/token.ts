/**
 * `npm run token -- create --email <address> --name <label>`: for operators on the server. Makes a
 * personal API token for an active account and prints it once; only its hash is stored.
 */
import { parseArgs } from 'node:util'
import { db } from '@/db'
import { migrateDb } from '@/db/migrate'
import { AppError } from '@/lib/errors'
import { createApiTokenForEmail } from '@/server/auth/api-tokens'

const { positionals, values } = parseArgs({ allowPositionals: true, options: { email: { type: 'string' }, name: { type: 'string' } } })
if (positionals[0] !== 'create' || !values.email || !values.name) {
  process.stderr.write('usage: npm run token -- create --email <address> --name <label>\n')
  process.exit(1)
}
await migrateDb(db)
try {
  const t = await createApiTokenForEmail(values.email, values.name)
  process.stdout.write(`${t.token}\n`)
  process.stderr.write(`token "${t.name}" for ${values.email}: shown once, keep it safe; revoke it on the settings page\n`)
  process.exit(0)
} catch (err) {
  process.stderr.write(`error: ${err instanceof AppError ? err.message : String(err)}\n`)
  process.exit(1)
}
