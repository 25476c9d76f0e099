/**
 * The server's database handle. `ensureDatabase()` opens the database from runtime config,
 * applies migrations and seeds the demo data on first start (when no user exists and
 * `seedDemo` is on); it runs once, started by server/plugins/database.ts and awaited by
 * server/middleware/00.database.ts before any request is handled.
 */
import { openDatabase, type Database } from '../db/client'
import { applyMigrations, resolveMigrationsDir } from '../db/migrate'
import { isEmpty, seedDemo } from '../db/seed'

let handle: Database | undefined
let ready: Promise<Database> | undefined

async function initialise(): Promise<Database> {
  const config = useRuntimeConfig()
  const { db } = await openDatabase(config.databaseUrl)
  await applyMigrations(db, resolveMigrationsDir(config.migrationsDir || undefined))
  if (config.seedDemo && await isEmpty(db)) {
    const result = await seedDemo(db, { hash: hashPassword, appVersion: config.public.appVersion })
    console.info(`[wingfold] first start: seeded ${result.users} demo accounts, ${result.projects} projects, ${result.runs} runs and ${result.maps} maps`)
  }
  handle = db
  return db
}

/** Open, migrate and (first start) seed the database; the same promise for every caller. */
export function ensureDatabase(): Promise<Database> {
  ready ??= initialise()
  return ready
}

/** The Drizzle handle. Only valid after `ensureDatabase()` resolved (guaranteed inside handlers). */
export function useDb(): Database {
  if (!handle) throw createError({ statusCode: 503, message: 'The database is not ready yet.' })
  return handle
}

export * as tables from '../db/schema'
