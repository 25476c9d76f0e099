/**
 * Writing a checked archive (archive-check.ts) as a new project owned by the importer, in ONE
 * write transaction: any error rolls everything back, so a refused or failing import leaves no
 * row behind. Rows are inserted table by table in {@link ARCHIVE_TABLES} order into the columns
 * both the archive and this server's table have (`PRAGMA table_info`); ids are renumbered through
 * the table list's `refs`; user references become null (no account is created: the archive's
 * members come back to the importer as people to invite). The statements run back to back on the
 * transaction's own connection with no other I/O in between, so no other request interleaves.
 */
import type { InValue, Transaction } from '@libsql/client'
import type { ArchiveImportResult } from '#shared/types/archive'

/** Regular rows per INSERT for tables nothing refers to (run points). */
const BATCH_ROWS = 100

/** Runtime-config limits of the import route (README: NUXT_ARCHIVE_IMPORT_*). */
export function archiveLimits() {
  const c = useRuntimeConfig().archiveImport
  const mb = 1024 * 1024
  return { maxUploadBytes: c.maxMb * mb, maxEntries: c.maxEntries, maxTotalBytes: c.maxInflatedMb * mb,
    maxRatio: c.maxRatio }
}

async function tableColumns(tx: Transaction, table: string): Promise<Set<string>> {
  const rs = await tx.execute(`PRAGMA table_info("${table}")`)
  return new Set(rs.rows.map(r => String(r.name)))
}

/** Insert the archive as a new project of `owner`; returns the import answer. */
export async function writeArchive(a: ParsedArchive, v: ArchiveVerdicts,
  owner: { id: number }): Promise<ArchiveImportResult> {
  const tx = await useDb().$client.transaction('write')
  try {
    const now = Date.now()
    const projectRow = await tx.execute({ sql: 'INSERT INTO projects (name, description, created_by, created_at, updated_at) VALUES (?, ?, ?, ?, ?) RETURNING id', args: [a.project.name, a.project.description, owner.id, now, now] })
    const projectId = Number(projectRow.rows[0]!.id)
    await tx.execute({ sql: 'INSERT INTO memberships (project_id, user_id, role, created_at, updated_at) VALUES (?, ?, ?, ?, ?)', args: [projectId, owner.id, 'owner', now, now] })
    const idMaps = new Map<string, Map<number, number>>(ARCHIVE_TABLES.map(t => [t.name, new Map()]))
    const referenced = new Set(ARCHIVE_TABLES.flatMap(t => Object.values(t.refs).flatMap(r => typeof r === 'string' ? [r] : Object.values(r.map))))
    const counts: Record<string, number> = {}
    for (const t of ARCHIVE_TABLES) {
      const targetColumns = await tableColumns(tx, t.name)
      const rows = a.tables.get(t.name)!
      const deferred: Array<{ newId: number, col: string, old: number }> = []
      const values = (row: ArchiveRow): Record<string, unknown> => {
        const out: Record<string, unknown> = {}
        for (const [col, val] of Object.entries(row)) {
          if (!targetColumns.has(col)) continue
          const ref = t.refs[col]
          if (ref === 'pk') continue
          if (ref === undefined || val === null || val === undefined) out[col] = val ?? null
          else if (ref === 'project') out[col] = projectId
          else if (ref === 'user') out[col] = null
          else {
            const target = typeof ref === 'string' ? ref : ref.map[String(row[ref.byColumn])]
            out[col] = target === 'project' ? projectId : target ? idMaps.get(target)?.get(val as number) ?? null : null
            if (target === t.name && out[col] === null) out.__defer = { col, old: val as number }
          }
        }
        if (t.name === 'runs' && v.runs.has(row.id as number)) { const r = v.runs.get(row.id as number)!; out.verification = r.verification; out.verification_reason = r.reason }
        if (t.name === 'runs' && out.status === 'running') out.status = 'cancelled' // exported mid-computation: nobody computes it here
        if (t.name === 'maps' && v.maps.has(row.id as number)) { const m = v.maps.get(row.id as number)!; out.verification = m.verification; out.verification_reason = m.reason }
        if (t.name === 'run_points' && v.residuals.has(row.id as number)) out.residual = v.residuals.get(row.id as number)
        return out
      }
      if (referenced.has(t.name)) {
        for (const row of rows) {
          const { __defer,
            ...vals } = values(row) as Record<string, unknown> & { __defer?: { col: string, old: number } }
          const cols = Object.keys(vals)
          const rs = await tx.execute({ sql: `INSERT INTO "${t.name}" (${cols.map(c => `"${c}"`).join(', ')}) VALUES (${cols.map(() => '?').join(', ')}) RETURNING id`, args: Object.values(vals) as InValue[] })
          const newId = Number(rs.rows[0]!.id)
          idMaps.get(t.name)!.set(row.id as number, newId)
          if (__defer) deferred.push({ newId, ...__defer })
        }
      } else {
        for (let i = 0; i < rows.length; i += BATCH_ROWS) {
          const batch = rows.slice(i, i + BATCH_ROWS).map(values)
          const cols = Object.keys(batch[0]!)
          if (batch.some(b => Object.keys(b).join() !== cols.join())) throw archiveRefusal(422, 'archive_tampered',
            `${t.file}: rows do not share one set of columns.`, [t.file])
          await tx.execute({
            sql: `INSERT INTO "${t.name}" (${cols.map(c => `"${c}"`).join(', ')}) VALUES ${batch.map(() => `(${cols.map(() => '?').join(', ')})`).join(', ')}`,
            args: batch.flatMap(b => cols.map(c => b[c])) as InValue[],
          })
        }
      }
      for (const d of deferred) {
        await tx.execute({ sql: `UPDATE "${t.name}" SET "${d.col}" = ? WHERE id = ?`,
          args: [idMaps.get(t.name)!.get(d.old) ?? null, d.newId] })
      }
      counts[t.name] = rows.length
    }
    await tx.execute({
      sql: 'INSERT INTO activity (project_id, actor_id, verb, object_type, object_id, data, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)',
      args: [projectId, owner.id, 'imported', 'project', projectId,
        JSON.stringify({ name: a.project.name, appVersion: a.manifest.appVersion,
        exportedAt: a.manifest.createdAt }), now, now],
    })
    await tx.commit()
    const tally = <T extends { verification: string }>(list: Iterable<T>) => {
      const out = { verified: 0, rejected: 0, pending: 0 }
      for (const x of list) out[x.verification as keyof typeof out]++
      return out
    }
    return {
      project: { id: projectId, name: a.project.name }, counts,
      runs: tally(v.runs.values()), maps: tally(v.maps.values()),
      members: a.people.filter(p => p.role).map(p => ({ name: p.name, role: p.role! })),
    }
  } catch (e) {
    // a row the checks let through but the schema refuses (a duplicate, a broken constraint): nothing was committed
    if (/SQLITE_CONSTRAINT/.test(String((e as { code?: string }).code ?? (e as Error).message))) {
      throw archiveRefusal(422, 'archive_conflict',
        `The archive's rows conflict with each other, so nothing was imported: ${(e as Error).message}`, [(e as Error).message])
    }
    throw e
  } finally {
    tx.close()
  }
}
