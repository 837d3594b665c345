import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { openDb } from '@/db'

const dir = mkdtempSync(path.join(tmpdir(), 'inverso-db-'))
const { client } = openDb(`file:${path.join(dir, 'pragmas.db')}`)
afterAll(() => client.close())

describe('every connection of a file database', () => {
  it('has foreign keys on, WAL and a busy timeout — checked on several pooled connections at once', async () => {
    await client.execute('SELECT 1')
    // Three read transactions at once borrow three different pooled connections.
    const txs = await Promise.all([1, 2, 3].map(() => client.transaction('read')))
    for (const tx of txs) {
      expect((await tx.execute('PRAGMA foreign_keys')).rows[0].foreign_keys).toBe(1)
      expect((await tx.execute('PRAGMA journal_mode')).rows[0].journal_mode).toBe('wal')
      expect(Number((await tx.execute('PRAGMA busy_timeout')).rows[0].timeout)).toBeGreaterThan(0)
    }
    await Promise.all(txs.map((tx) => tx.rollback()))
  })

  it('a plain write while a write transaction of the same process is open waits for it instead of failing with SQLITE_BUSY', async () => {
    await client.execute('CREATE TABLE t (x INTEGER)')
    const slowTx = (async () => {
      const tx = await client.transaction('write')
      await tx.execute('INSERT INTO t VALUES (1)')
      await new Promise((r) => setTimeout(r, 100))
      await tx.commit()
    })()
    await new Promise((r) => setTimeout(r, 10))
    const t0 = Date.now()
    const plain = client.execute('INSERT INTO t VALUES (2)')
    // A read is not held up by the writer (WAL).
    const read = await client.execute('SELECT count(*) AS n FROM t')
    expect(Date.now() - t0).toBeLessThan(80)
    expect(read.rows[0].n).toBe(0)
    await Promise.all([slowTx, plain])
    expect((await client.execute('SELECT count(*) AS n FROM t')).rows[0].n).toBe(2)
  })

  it('a foreign key violation is refused', async () => {
    await client.execute('CREATE TABLE parent (id INTEGER PRIMARY KEY)')
    await client.execute('CREATE TABLE child (pid INTEGER REFERENCES parent(id))')
    await expect(client.execute('INSERT INTO child VALUES (42)')).rejects.toThrow(/FOREIGN KEY/)
  })
})
