/**
 * Schema version from the drizzle migration journal (`server/migrations/meta/_journal.json`):
 * the number of committed migrations and the tag of the last one. Archives and backups record it,
 * so an archive or a backup made by a newer Wingfold is refused by an older one.
 */
import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'

/** One journal entry as drizzle-kit writes it. */
export interface JournalEntry { idx: number, when: number, tag: string }

/** Schema version: how many migrations, and the last one's tag and timestamp. */
export interface SchemaVersion { version: number, tag: string, when: number }

/** The entries of the journal in `migrationsDir`. */
export function readJournal(migrationsDir: string): JournalEntry[] {
  const raw = JSON.parse(readFileSync(resolve(migrationsDir, 'meta/_journal.json'),
    'utf8')) as { entries: JournalEntry[] }
  return raw.entries
}

/** The schema version the code in `migrationsDir` expects. */
export function schemaVersionOf(migrationsDir: string): SchemaVersion {
  const entries = readJournal(migrationsDir)
  const last = entries[entries.length - 1]
  return { version: entries.length, tag: last?.tag ?? '', when: last?.when ?? 0 }
}

/**
 * Compares the migrations applied to a database (drizzle's `__drizzle_migrations.created_at`,
 * which is the journal's `when`) with the journal. `newer` lists applied migrations this code
 * does not know; `pending` counts journal entries not applied yet (they apply at the next start).
 */
export function compareApplied(appliedWhens: number[], journal: JournalEntry[]): { newer: number[], pending: number } {
  const known = new Set(journal.map(e => e.when))
  const applied = new Set(appliedWhens)
  return { newer: appliedWhens.filter(w => !known.has(w)), pending: journal.filter(e => !applied.has(e.when)).length }
}
