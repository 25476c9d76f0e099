/**
 * Database backups and restores for the SQLite file (libsql). No Nitro here: the npm scripts
 * (backup-cli.ts, restore-cli.ts) and the scheduled backup plugin use it alike.
 *
 * - A backup is `VACUUM INTO <file>` on its own connection: SQLite writes a compacted copy of one
 *   read snapshot (in WAL mode writers go on meanwhile), so the copy holds exactly the
 *   transactions committed before it began (https://sqlite.org/lang_vacuum.html#vacuuminto).
 * - A restore first checks the file (`PRAGMA integrity_check`, and its applied migrations against
 *   the migration journal: a backup from a newer Wingfold is refused), refuses while a server
 *   holds the database (the holder file written by server/plugins/database-holder.ts names a
 *   live process), keeps the current database as `<db>.before-restore-<time>`, then moves the
 *   copy into place and removes the old WAL and shared-memory files.
 */
import { copyFileSync, existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'
import { createClient } from '@libsql/client'
import { databaseFilePath } from './client'
import { compareApplied, readJournal } from './journal'

/** Write a consistent copy of the database `dbFile` to `out` (which must not exist yet). */
export async function backupDatabase(dbFile: string, out: string): Promise<{ file: string, bytes: number }> {
  const target = resolve(out)
  if (existsSync(target)) throw new Error(`${target} already exists; choose a new file name.`)
  if (!existsSync(dbFile)) throw new Error(`No database at ${dbFile}.`)
  mkdirSync(dirname(target), { recursive: true })
  const client = createClient({ url: `file:${dbFile}` })
  try {
    await client.execute('PRAGMA busy_timeout = 10000')
    await client.execute({ sql: 'VACUUM INTO ?', args: [target] })
  } finally {
    client.close()
  }
  return { file: target, bytes: statSync(target).size }
}

/** Result of {@link checkDatabaseFile}. */
export interface DatabaseCheck {
  ok: boolean
  problems: string[]
  /** Migrations applied in the file, and how many of the journal's are still to apply. */
  applied: number
  pending: number
}

/** integrity_check and schema version of a database file against the journal in `migrationsDir`. */
export async function checkDatabaseFile(file: string, migrationsDir: string): Promise<DatabaseCheck> {
  if (!existsSync(file)) return { ok: false, problems: [`${file} does not exist`], applied: 0, pending: 0 }
  const head = readFileSync(file).subarray(0, 16).toString('latin1')
  if (head !== 'SQLite format 3\0') return { ok: false, problems: [`${file} is not an SQLite database`], applied: 0,
    pending: 0 }
  const client = createClient({ url: `file:${resolve(file)}` })
  const problems: string[] = []
  try {
    let integrity: string[]
    try { integrity = (await client.execute('PRAGMA integrity_check')).rows.map(r => String(r[0])) }
    catch (e) { return { ok: false, problems: [`integrity_check could not run: ${(e as Error).message}`], applied: 0,
      pending: 0 } }
    if (integrity.join() !== 'ok') problems.push(`integrity_check: ${integrity.slice(0, 5).join('; ')}`)
    let whens: number[] = []
    try { whens = (await client.execute('SELECT created_at FROM __drizzle_migrations ORDER BY id')).rows.map(r => Number(r[0])) }
    catch { problems.push('no migration table: not a Wingfold database') }
    const { newer, pending } = compareApplied(whens, readJournal(migrationsDir))
    if (newer.length) problems.push(`the file has ${newer.length} migration(s) this Wingfold does not know (made by a newer version); upgrade first`)
    return { ok: problems.length === 0, problems, applied: whens.length, pending }
  } finally {
    client.close()
  }
}

/** Path of the file a running server writes beside its database. */
export const holderFile = (dbFile: string) => `${dbFile}.server.json`

/** The live process holding `dbFile` (from its holder file), or null. */
export function databaseHolder(dbFile: string): { pid: number, startedAt: string } | null {
  try {
    const h = JSON.parse(readFileSync(holderFile(dbFile), 'utf8')) as { pid: number, startedAt: string }
    process.kill(h.pid, 0) // throws when no such process
    return h
  } catch {
    return null
  }
}

/** Replace `dbFile` with the checked copy `file`; returns where the previous database was kept. */
export async function restoreDatabase(file: string, dbFile: string,
  migrationsDir: string): Promise<{ kept: string | null, check: DatabaseCheck }> {
  const check = await checkDatabaseFile(file, migrationsDir)
  if (!check.ok) throw new Error(`Refused: ${check.problems.join('; ')}. Nothing was replaced.`)
  const holder = databaseHolder(dbFile)
  if (holder) throw new Error(`Refused: a Wingfold server (process ${holder.pid}, started ${holder.startedAt}) holds ${dbFile}. Stop it, restore, start it again. Nothing was replaced.`)
  mkdirSync(dirname(dbFile), { recursive: true })
  let kept: string | null = null
  if (existsSync(dbFile)) {
    kept = `${dbFile}.before-restore-${new Date().toISOString().replace(/[:.]/g, '-')}`
    await backupDatabase(dbFile, kept)
  }
  const staging = `${dbFile}.restoring`
  copyFileSync(file, staging)
  for (const suffix of ['-wal', '-shm']) rmSync(`${dbFile}${suffix}`, { force: true })
  renameSync(staging, dbFile)
  return { kept, check }
}

/** Name of a scheduled backup taken at `date`. */
export const scheduledBackupName = (date: Date) => `wingfold-${date.toISOString().replace(/[:.]/g, '-')}.db`

/** Take a scheduled backup into `dir` and keep only the newest `keep` scheduled backups there. */
export async function scheduledBackup(dbFile: string, dir: string, keep: number): Promise<{ file: string,
  removed: string[] }> {
  const { file } = await backupDatabase(dbFile, join(dir, scheduledBackupName(new Date())))
  const ours = readdirSync(dir).filter(f => /^wingfold-.*\.db$/.test(f)).sort()
  const removed = ours.slice(0, Math.max(0, ours.length - Math.max(1, keep)))
  for (const f of removed) rmSync(join(dir, f), { force: true })
  return { file, removed }
}

/**
 * For the npm scripts: the argument (or a usage line and exit 2) and the database file of
 * NUXT_DATABASE_URL (default file:./data/wingfold.db, as in nuxt.config.ts).
 */
export function cliArguments(script: string): { arg: string, dbFile: string } {
  const arg = process.argv[2]
  const dbFile = databaseFilePath(process.env.NUXT_DATABASE_URL || 'file:./data/wingfold.db')
  if (!arg || !dbFile) {
    console.error(arg ? `${script} works on a file: database URL only.` : `Usage: npm run ${script} -- FILE.db`)
    process.exit(2)
  }
  return { arg, dbFile }
}
