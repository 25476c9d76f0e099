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
 */
export async function openDatabase(url: string): Promise<{ db: Database, close: () => void }> {
  const file = databaseFilePath(url)
  if (file) mkdirSync(dirname(file), { recursive: true })
  const client = createClient({ url: file ? `file:${file}` : url })
  await client.execute('PRAGMA journal_mode = WAL')
  await client.execute('PRAGMA foreign_keys = ON')
  await client.execute('PRAGMA busy_timeout = 5000')
  return { db: drizzle(client, { schema }), close: () => client.close() }
}
