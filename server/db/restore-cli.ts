/**
 * `npm run db:restore -- FILE`: check FILE (integrity_check, schema version against the migration
 * journal), refuse while a server holds the database, keep the current database beside it, then
 * put FILE in its place. See server/db/backup.ts and docs/backups.md.
 */
import { cliArguments, restoreDatabase } from './backup'
import { resolveMigrationsDir } from './migrate'

const { arg: source, dbFile } = cliArguments('db:restore')
try {
  const { kept, check } = await restoreDatabase(source, dbFile,
    resolveMigrationsDir(process.env.NUXT_MIGRATIONS_DIR || undefined))
  console.log(`Restored ${source} into ${dbFile} (integrity ok; ${check.applied} migrations applied, ${check.pending} to apply at the next start).`)
  if (kept) console.log(`The previous database is kept as ${kept}.`)
} catch (e) {
  console.error((e as Error).message)
  process.exit(1)
}
