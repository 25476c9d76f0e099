/**
 * Applying the committed SQL migrations (drizzle-kit output). Idempotent: drizzle records applied
 * migrations in `__drizzle_migrations` and skips them next time.
 */
import { existsSync } from 'node:fs'
import { resolve } from 'node:path'
import { migrate } from 'drizzle-orm/libsql/migrator'
import type { Database } from './client'

/**
 * Folder of the migrations: the configured one, else `server/migrations` under the working
 * directory (the built `.output` does not contain the SQL files, so the server starts from the
 * project root or is given `NUXT_MIGRATIONS_DIR`).
 */
export function resolveMigrationsDir(configured?: string): string {
  const candidates = [configured, resolve(process.cwd(), 'server/migrations')].filter((c): c is string => !!c)
  const found = candidates.find(dir => existsSync(resolve(dir, 'meta/_journal.json')))
  if (!found) throw new Error(`Wingfold: no migrations folder found (looked in ${candidates.join(', ')}); set NUXT_MIGRATIONS_DIR.`)
  return resolve(found)
}

/** Apply every pending migration from `dir`. */
export async function applyMigrations(db: Database, dir: string): Promise<void> {
  await migrate(db, { migrationsFolder: dir })
}
