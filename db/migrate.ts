import path from 'node:path'
import { migrate } from 'drizzle-orm/libsql/migrator'
import type { Db } from './index'

/** Applies the SQL migrations in drizzle/ (idempotent). */
export async function migrateDb(target: Db, root = process.cwd()): Promise<void> {
  await migrate(target, { migrationsFolder: path.join(root, 'drizzle') })
}
