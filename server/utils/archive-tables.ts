/**
 * What a project archive holds, table by table, in ONE place. Export and import both walk
 * {@link ARCHIVE_TABLES} in order (parents before children), so a new table is one more entry
 * and a new column travels without any change: rows are exported with `SELECT *` and inserted
 * column by column into the columns the importing server has.
 *
 * `refs` says which columns hold ids that must be renumbered on import:
 * - `'pk'`: this row's own id (new ids on import; the old → new map serves the children),
 * - `'project'`: the project's id (the new project),
 * - `'user'`: a user of the exporting instance; exported as an opaque reference listed with the
 *   person's name in `people.json`, and imported as null (accounts are never created),
 * - a table name: a row of that archived table (its new id; null when it was not archived),
 * - `{ byColumn, map }`: the referenced table depends on another column (activity objects).
 *
 * Secrets never leave: {@link ARCHIVE_DENIED_TABLES} are never archived and
 * {@link isDeniedColumn} drops password hashes, token hashes, session data and mail addresses
 * from every row, also from columns added later.
 */

/** Where an id column points. */
export type ArchiveRef = 'pk' | 'project' | 'user' | string | { byColumn: string, map: Record<string, string> }

/** One archived table. */
export interface ArchiveTable {
  /** SQL table name. */
  name: string
  /** Archive entry holding its rows, one JSON object per line. */
  file: string
  /** SQL condition selecting the project's rows; `?` is the project id. */
  scope: string
  /** Id columns renumbered on import. */
  refs: Record<string, ArchiveRef>
}

export const ARCHIVE_TABLES: readonly ArchiveTable[] = [
  { name: 'graphs', file: 'tables/graphs.ndjson', scope: 'project_id = ?',
    refs: { id: 'pk', project_id: 'project', created_by: 'user' } },
  {
    name: 'graph_versions', file: 'tables/graph_versions.ndjson', scope: 'graph_id IN (SELECT id FROM graphs WHERE project_id = ?)',
    refs: { id: 'pk', graph_id: 'graphs', author_id: 'user' },
  },
  {
    name: 'runs', file: 'tables/runs.ndjson', scope: 'project_id = ?',
    refs: { id: 'pk', project_id: 'project', graph_version_id: 'graph_versions', author_id: 'user',
      parent_run_id: 'runs' },
  },
  { name: 'run_points', file: 'tables/run_points.ndjson',
    scope: 'run_id IN (SELECT id FROM runs WHERE project_id = ?)', refs: { id: 'pk', run_id: 'runs' } },
  {
    name: 'comments', file: 'tables/comments.ndjson', scope: 'run_id IN (SELECT id FROM runs WHERE project_id = ?)',
    refs: { id: 'pk', run_id: 'runs', parent_id: 'comments', author_id: 'user' },
  },
  {
    name: 'maps', file: 'tables/maps.ndjson', scope: 'project_id = ?',
    refs: { id: 'pk', project_id: 'project', graph_version_id: 'graph_versions', author_id: 'user' },
  },
  {
    name: 'activity', file: 'tables/activity.ndjson', scope: 'project_id = ?',
    refs: {
      id: 'pk', project_id: 'project', actor_id: 'user',
      object_id: { byColumn: 'object_type',
        map: { project: 'project', graph: 'graphs', run: 'runs', map: 'maps', comment: 'comments' } },
    },
  },
]

/** Tables that are never archived, whatever the table list says. */
export const ARCHIVE_DENIED_TABLES: readonly string[] = [
  'users', 'api_tokens', 'password_resets', 'mail_messages', 'invitations', 'sign_in_failures', 'sessions', 'app_settings', 'memberships',
]

/** Columns never written to an archive: secrets and personal mail data. */
const DENIED_COLUMN = /(^|_)(password|passwd|token|tokens|secret|session|sessions|email|e_mail|mail)($|_)/

/** True for a column name that must never be archived (password/token hashes, sessions, mail). */
export function isDeniedColumn(column: string): boolean {
  return DENIED_COLUMN.test(column)
}

for (const t of ARCHIVE_TABLES) {
  if (ARCHIVE_DENIED_TABLES.includes(t.name)) throw new Error(`archive table list names the denied table ${t.name}`)
}

/** Archive entries besides the tables. */
export const ARCHIVE_FILES = { manifest: 'manifest.json', project: 'project.json', people: 'people.json' } as const

/** Identifier check for column names taken from an archive or PRAGMA table_info. */
export const SQL_IDENTIFIER = /^[a-z_][a-z0-9_]*$/
