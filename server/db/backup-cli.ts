/**
 * `npm run db:backup -- OUT`: a consistent copy of the database (NUXT_DATABASE_URL, default
 * file:./data/wingfold.db) while the server runs. See server/db/backup.ts and docs/backups.md.
 */
import { backupDatabase, cliArguments } from './backup'

const { arg: out, dbFile } = cliArguments('db:backup')
try {
  const { file, bytes } = await backupDatabase(dbFile, out)
  console.log(`Backup of ${dbFile} written to ${file} (${bytes} bytes).`)
} catch (e) {
  console.error(`Backup failed: ${(e as Error).message}`)
  process.exit(1)
}
