/**
 * Streaming export of one project as a zip (fflate's `Zip` + `ZipDeflate`: pure JS, push based).
 * The rows are read inside one read transaction (a consistent snapshot while others keep writing),
 * page by page ({@link ARCHIVE_PAGE_ROWS} rows a query), deflated and handed on as they come, so
 * memory holds one page and the zip's small bookkeeping, never the whole project. Each entry's
 * SHA-256 is computed while it is written; the manifest comes last and lists them all.
 */
import { createHash } from 'node:crypto'
import type { Client, InValue, Transaction } from '@libsql/client'
import { Zip, ZipDeflate } from 'fflate'
import { ARCHIVE_FORMAT, ARCHIVE_FORMAT_VERSION, type ArchiveManifest, type ArchivePerson } from '#shared/types/archive'

/** Rows read per query while exporting. */
export const ARCHIVE_PAGE_ROWS = 500

type RowObject = Record<string, unknown>

/** The rows of a result set as plain objects, without denied columns. */
function rowObjects(rs: { columns: string[], rows: ArrayLike<unknown>[] }): RowObject[] {
  const keep = rs.columns.map((c, i) => [c, i] as const).filter(([c]) => !isDeniedColumn(c))
  return rs.rows.map(r => Object.fromEntries(keep.map(([c, i]) => [c, r[i]])))
}

/** Pages of a table's project rows, ordered by id. */
async function* tableRows(tx: Transaction, table: ArchiveTable, projectId: number): AsyncGenerator<RowObject[]> {
  let after = 0 // ids are positive
  for (;;) {
    const rs = await tx.execute({ sql: `SELECT * FROM "${table.name}" WHERE (${table.scope}) AND id > ? ORDER BY id LIMIT ${ARCHIVE_PAGE_ROWS}`, args: [projectId, after] as InValue[] })
    const rows = rowObjects(rs as never)
    if (rows.length) yield rows
    if (rows.length < ARCHIVE_PAGE_ROWS) return
    after = Number(rows[rows.length - 1]!.id)
  }
}

/** People referenced by the project's rows: members with their role, other authors with none. */
async function archivePeople(tx: Transaction, projectId: number): Promise<ArchivePerson[]> {
  const userColumns = ARCHIVE_TABLES.flatMap(t => Object.entries(t.refs).filter(([,
    r]) => r === 'user').map(([c]) => `SELECT ${c} AS uid FROM "${t.name}" WHERE ${t.scope}`))
  const args = userColumns.map(() => projectId)
  const rs = await tx.execute({
    sql: `SELECT u.id AS ref, u.name AS name, m.role AS role FROM users u LEFT JOIN memberships m ON m.user_id = u.id AND m.project_id = ?
          WHERE m.project_id IS NOT NULL OR u.id IN (${userColumns.join(' UNION ')}) ORDER BY u.id`,
    args: [projectId, ...args],
  })
  return rs.rows.map(r => ({ ref: Number(r.ref), name: String(r.name),
    role: (r.role ?? null) as ArchivePerson['role'] }))
}

/** Inputs of {@link projectArchiveChunks}. */
export interface ArchiveExportInput {
  client: Client
  projectId: number
  appVersion: string
  schema: { version: number, tag: string }
}

/** The zip of one project, chunk by chunk (pull: the next page is read when the consumer asks). */
export async function* projectArchiveChunks(input: ArchiveExportInput): AsyncGenerator<Uint8Array> {
  const out: Uint8Array[] = []
  let failure: Error | null = null
  const zip = new Zip((err, chunk) => { if (err) failure = err; else out.push(chunk) })
  const drain = function* () {
    if (failure) throw failure
    while (out.length) yield out.shift()!
  }
  const files: ArchiveManifest['files'] = []
  const counts: Record<string, number> = {}
  const enc = new TextEncoder()
  const entry = (path: string) => {
    const f = new ZipDeflate(path, { level: 6 })
    zip.add(f)
    const hash = createHash('sha256')
    let bytes = 0
    return {
      push(text: string) { const b = enc.encode(text); hash.update(b); bytes += b.length; f.push(b) },
      end() { f.push(new Uint8Array(0), true); files.push({ path, bytes, sha256: hash.digest('hex') }) },
    }
  }
  const tx = await input.client.transaction('read')
  try {
    const project = (await tx.execute({ sql: 'SELECT name, description FROM projects WHERE id = ?',
      args: [input.projectId] })).rows[0]!
    const info = { name: String(project.name), description: String(project.description) }
    const p = entry(ARCHIVE_FILES.project)
    p.push(JSON.stringify(info, null, 2))
    p.end()
    yield* drain()
    const people = entry(ARCHIVE_FILES.people)
    const list = await archivePeople(tx, input.projectId)
    people.push(JSON.stringify(list, null, 2))
    people.end()
    counts.people = list.length
    yield* drain()
    for (const table of ARCHIVE_TABLES) {
      const e = entry(table.file)
      counts[table.name] = 0
      for await (const page of tableRows(tx, table, input.projectId)) {
        e.push(page.map(r => `${JSON.stringify(r)}\n`).join(''))
        counts[table.name]! += page.length
        yield* drain()
      }
      e.end()
      yield* drain()
    }
    const manifest: ArchiveManifest = {
      format: ARCHIVE_FORMAT, formatVersion: ARCHIVE_FORMAT_VERSION, appVersion: input.appVersion, schema: input.schema,
      createdAt: new Date().toISOString(), project: info, counts, files,
    }
    const m = new ZipDeflate(ARCHIVE_FILES.manifest, { level: 6 })
    zip.add(m)
    m.push(enc.encode(JSON.stringify(manifest, null, 2)), true)
    zip.end()
    yield* drain()
  } finally {
    tx.close()
  }
}

/** A file name for the archive of a project. */
export function archiveFileName(projectId: number, name: string): string {
  return `wingfold-project-${projectId}-${name.replace(/[^\w.-]+/g, '-').slice(0, 60)}.zip`
}
