/**
 * Opening the SQLite database (libsql) with Drizzle. No Nitro here: the seed CLI uses it too.
 */
import { mkdirSync } from 'node:fs'
import { dirname, resolve } from 'node:path'
import { createClient } from '@libsql/client'
import { drizzle } from 'drizzle-orm/libsql'
import * as schema from './schema'

export type Database = ReturnType<typeof drizzle<typeof schema>>

/** Absolute file path of a `file:` URL (relative paths resolve from the working directory), or null. */
export function databaseFilePath(url: string): string | null {
  if (!url.startsWith('file:')) return null
  const path = url.slice('file:'.length).replace(/^\/\/(?=\/)/, '')
  return resolve(path)
}

/**
 * Open the database at `url`, creating the data folder for file URLs, and switch on WAL journaling
 * and foreign keys (libsql enables foreign keys by default; the pragma states the intent).
 *
 * Write several statements together with `db.batch([...])`, not `db.transaction(async tx => …)`:
 * libsql runs SQLite synchronously on a pool of connections, so an interactive transaction that
 * stays open across an await lets another request's write wait for the lock inside the event
 * loop, the transaction can never finish, and both fail with SQLITE_BUSY after the busy timeout
 * (seen as 500s under concurrent saves). A batch runs from BEGIN to COMMIT without yielding.
 */
export async function openDatabase(url: string): Promise<{ db: Database, close: () => void }> {
  const file = databaseFilePath(url)
  if (file) mkdirSync(dirname(file), { recursive: true })
  // `timeout`: the busy timeout of every pooled connection (the PRAGMA below reaches only the
  // first one; without it concurrent writers on other connections fail with SQLITE_BUSY).
  const client = createClient({ url: file ? `file:${file}` : url, timeout: 5000 })
  await client.execute('PRAGMA journal_mode = WAL')
  await client.execute('PRAGMA foreign_keys = ON')
  await client.execute('PRAGMA busy_timeout = 5000')
  return { db: drizzle(client, { schema }), close: () => client.close() }
}
