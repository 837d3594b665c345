import { mkdirSync } from 'node:fs'
import path from 'node:path'
import { createClient, type Client } from '@libsql/client'
import { drizzle, type LibSQLDatabase } from 'drizzle-orm/libsql'
import * as schema from './schema'

export const DEFAULT_DATABASE_URL = 'file:./data/inverso.db'

export type Db = LibSQLDatabase<typeof schema>

export function databaseUrl(): string {
  return process.env.DATABASE_URL || DEFAULT_DATABASE_URL
}

/** Opens a database; a `file:` URL gets its folder created first (libSQL fails with error 14 otherwise). */
export function openDb(url = databaseUrl()): { db: Db; client: Client } {
  if (url.startsWith('file:')) mkdirSync(path.dirname(url.slice('file:'.length)), { recursive: true })
  const client = createClient({ url, authToken: process.env.DATABASE_AUTH_TOKEN })
  return { db: drizzle(client, { schema }), client }
}

// One client per process: Next's dev server reloads modules, so keep it on globalThis.
const holder = globalThis as unknown as { __inversoDb?: { db: Db; client: Client } }

function shared() {
  holder.__inversoDb ??= openDb()
  return holder.__inversoDb
}

/** The process-wide database, opened on first use so that `next build` never touches it. */
export const db: Db = new Proxy({} as Db, {
  get(_target, prop) {
    const real = shared().db
    const value = Reflect.get(real, prop, real)
    return typeof value === 'function' ? value.bind(real) : value
  },
})

export { schema }
