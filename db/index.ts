import { mkdirSync } from 'node:fs'
import path from 'node:path'
import { createClient, type Client, type InStatement, type Transaction, type TransactionMode } from '@libsql/client'
import { drizzle, type LibSQLDatabase } from 'drizzle-orm/libsql'
import * as schema from './schema'

export const DEFAULT_DATABASE_URL = 'file:./data/inverso.db'

export type Db = LibSQLDatabase<typeof schema>
/** The `tx` a `db.transaction(async (tx) => …)` callback gets. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]

export function databaseUrl(): string {
  return process.env.DATABASE_URL || DEFAULT_DATABASE_URL
}

/**
 * How long a connection waits for another *process* (a second app instance, `npm run db:setup`)
 * that holds SQLite's write lock. Inside one process writes never wait on SQLite at all: see
 * `gateWrites` below.
 */
export const BUSY_TIMEOUT_MS = Number(process.env.DATABASE_BUSY_TIMEOUT_MS || 5000)
/** How long a write waits for this process's open write transaction before it gives up. */
export const WRITE_GATE_TIMEOUT_MS = Number(process.env.DATABASE_WRITE_WAIT_MS || 15000)

/**
 * Opens a database; a `file:` URL gets its folder created first (libSQL fails with error 14
 * otherwise). A file database is switched to WAL (readers never wait for the writer, and several
 * processes can share the file), every pooled connection gets a busy timeout for other processes,
 * and foreign keys are on for every connection.
 */
export function openDb(url = databaseUrl()): { db: Db; client: Client } {
  const isFile = url.startsWith('file:')
  if (isFile) mkdirSync(path.dirname(url.slice('file:'.length)), { recursive: true })
  const raw = createClient({ url, authToken: process.env.DATABASE_AUTH_TOKEN, ...(isFile ? { timeout: BUSY_TIMEOUT_MS } : {}) })
  const client = isFile ? gateWrites(raw) : raw
  // libSQL opens each pooled connection with foreign keys on (tests/security/db-pragmas.test.ts
  // checks several at once); saying so here keeps it true if that default ever changes for the
  // first connection. journal_mode=WAL is stored in the file, so once is enough.
  const ready = (async () => {
    await client.execute('PRAGMA foreign_keys = ON')
    if (isFile && !url.includes(':memory:')) await client.execute('PRAGMA journal_mode = WAL')
  })()
  ready.catch((err) => console.error('[db] could not set the connection pragmas', err))
  return { db: drizzle(client, { schema }), client }
}

const READ_ONLY = /^\s*(select|explain)\b/i

function isRead(stmt: InStatement): boolean {
  const text = typeof stmt === 'string' ? stmt : Array.isArray(stmt) ? String(stmt[0]) : stmt.sql
  return READ_ONLY.test(text)
}

/**
 * One writer at a time per process. libSQL's local driver is synchronous: when a second pooled
 * connection meets SQLite's write lock, its busy handler sleeps on the event loop, so the
 * transaction holding the lock can never finish and both fail after the timeout (seen here:
 * 2 s stall, then SQLITE_BUSY). So writes, batches and write transactions of this process queue
 * here first, and SQLite's busy timeout only ever waits for another process. Reads go straight
 * through (WAL lets them run beside the writer).
 *
 * A write through `db` from inside a `db.transaction(...)` callback would wait for the very
 * transaction it is part of: use the callback's `tx`. Such a write fails after
 * WRITE_GATE_TIMEOUT_MS with a message saying so instead of hanging.
 */
export function gateWrites(inner: Client): Client {
  let tail: Promise<void> = Promise.resolve()
  const acquire = async (): Promise<() => void> => {
    let release!: () => void
    const mine = new Promise<void>((r) => (release = r))
    const before = tail
    tail = before.then(() => mine)
    let timer: NodeJS.Timeout | undefined
    const timedOut = new Promise<never>((_, reject) => {
      timer = setTimeout(
        () => reject(new Error(`database write waited ${WRITE_GATE_TIMEOUT_MS} ms for another write of this process (a write through \`db\` inside a transaction callback? use \`tx\`)`)),
        WRITE_GATE_TIMEOUT_MS,
      )
    })
    try {
      await Promise.race([before, timedOut])
    } catch (err) {
      // Give our place up without blocking those behind us once our turn comes.
      before.then(release, release)
      throw err
    } finally {
      clearTimeout(timer)
    }
    let done = false
    return () => {
      if (!done) (done = true), release()
    }
  }
  const gated = async <T>(fn: () => Promise<T>): Promise<T> => {
    const release = await acquire()
    try {
      return await fn()
    } finally {
      release()
    }
  }

  const wrapped: Partial<Client> = {
    execute: ((stmt: InStatement, args?: unknown) => {
      const run = () => (args === undefined ? inner.execute(stmt) : inner.execute(stmt as string, args as never))
      return isRead(stmt) ? run() : gated(run)
    }) as Client['execute'],
    batch: ((stmts: InStatement[], mode?: TransactionMode) =>
      mode === 'read' ? inner.batch(stmts, mode) : gated(() => inner.batch(stmts, mode))) as Client['batch'],
    migrate: ((stmts: InStatement[]) => gated(() => inner.migrate(stmts))) as Client['migrate'],
    executeMultiple: ((sql: string) => gated(() => inner.executeMultiple(sql))) as Client['executeMultiple'],
    transaction: (async (mode: TransactionMode = 'write') => {
      if (mode === 'read') return inner.transaction(mode)
      const release = await acquire()
      let tx: Transaction
      try {
        tx = await inner.transaction(mode)
      } catch (err) {
        release()
        throw err
      }
      const settle = (name: 'commit' | 'rollback') => async () => {
        try {
          return await tx[name]()
        } finally {
          release()
        }
      }
      return new Proxy(tx, {
        get(target, prop, receiver) {
          if (prop === 'commit' || prop === 'rollback') return settle(prop)
          if (prop === 'close')
            return () => {
              try {
                target.close()
              } finally {
                release()
              }
            }
          const value = Reflect.get(target, prop, receiver)
          return typeof value === 'function' ? value.bind(target) : value
        },
      })
    }) as Client['transaction'],
  }
  return new Proxy(inner, {
    get(target, prop, receiver) {
      if (prop in wrapped) return wrapped[prop as keyof Client]
      const value = Reflect.get(target, prop, receiver)
      return typeof value === 'function' ? value.bind(target) : value
    },
  })
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

/** The process-wide libSQL client (for pragmas and raw statements in tests and scripts). */
export function dbClient(): Client {
  return shared().client
}

export { schema }
