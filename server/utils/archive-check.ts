/**
 * Checking an archive before anything is written: the manifest (format, schema version against
 * the migration journal, SHA-256 and size of every entry, no missing or extra entries), the rows
 * (JSON objects, plain column names, references that resolve inside the archive), and the
 * mathematics: every pattern version parses, every run is re-verified with the same core as on
 * finish (`checkPoints` and the sample rule of runs-verify.ts, shared/families/verify.ts) and
 * every map with `checkPostedMap` (shared/maps/verify.ts). A run or map that the archive calls
 * verified (or pending) and that fails is a refusal naming it; one archived as rejected stays
 * rejected.
 */
import { createHash } from 'node:crypto'
import { formatNumber } from '#shared/format'
import { ARCHIVE_FORMAT_VERSION, archiveManifestSchema, archivePersonSchema, type ArchiveManifest,
  type ArchivePerson } from '#shared/types/archive'
import { parseFamilySettings } from '#shared/types/family'
import { parseMapSettings, type MapResult } from '#shared/types/maps'
import { parsePatternDocument, type PatternDocument } from '#shared/types/pattern'
import { readJournal, schemaVersionOf, type SchemaVersion } from '../db/journal'
import { resolveMigrationsDir } from '../db/migrate'

export type ArchiveRow = Record<string, unknown>

/** An archive whose files passed the manifest checks. */
export interface ParsedArchive {
  manifest: ArchiveManifest
  project: { name: string, description: string }
  people: ArchivePerson[]
  tables: Map<string, ArchiveRow[]>
}

/** The verdict to store for an archived run or map (by archived id), and recomputed residuals. */
export interface ArchiveVerdicts {
  runs: Map<number, { verification: 'verified' | 'rejected' | 'pending', reason: string | null }>
  maps: Map<number, { verification: 'verified' | 'rejected', reason: string }>
  /** Archived run_points id → residual recomputed by this server. */
  residuals: Map<number, number>
}

/** The schema version of this server's migrations. */
export function serverSchemaVersion(): SchemaVersion {
  return schemaVersionOf(resolveMigrationsDir(useRuntimeConfig().migrationsDir || undefined))
}

const sha256 = (b: Uint8Array) => createHash('sha256').update(b).digest('hex')
const tampered = (problems: string[]) => archiveRefusal(422, 'archive_tampered',
  `The archive does not match its manifest or is damaged: ${problems.slice(0, 8).join('; ')}${problems.length > 8 ? `; and ${problems.length - 8} more` : ''}.`, problems)

/** Manifest, schema version and per-file hashes; then the parsed rows. Throws a 4xx refusal. */
export function parseArchive(entries: Map<string, Uint8Array>): ParsedArchive {
  const raw = entries.get(ARCHIVE_FILES.manifest)
  if (!raw) throw archiveRefusal(422, 'archive_no_manifest',
    'This is not a Wingfold project archive: manifest.json is missing.', [ARCHIVE_FILES.manifest])
  let manifest: ArchiveManifest
  try { manifest = archiveManifestSchema.parse(JSON.parse(new TextDecoder().decode(raw))) }
  catch { throw archiveRefusal(422, 'archive_bad_manifest',
    'manifest.json is not a Wingfold project archive manifest.', [ARCHIVE_FILES.manifest]) }
  const ours = serverSchemaVersion()
  if (manifest.formatVersion > ARCHIVE_FORMAT_VERSION || manifest.schema.version > ours.version) {
    throw archiveRefusal(409, 'archive_schema_newer',
      `This archive was made by a newer Wingfold (app ${manifest.appVersion}, database schema ${manifest.schema.version} "${manifest.schema.tag}") than this server (schema ${ours.version} "${ours.tag}"). Upgrade this server, then import again.`)
  }
  const journal = readJournal(resolveMigrationsDir(useRuntimeConfig().migrationsDir || undefined))
  if (manifest.schema.version > 0 && journal[manifest.schema.version - 1]?.tag !== manifest.schema.tag) {
    throw archiveRefusal(409, 'archive_schema_unknown',
      `This archive's database schema ${manifest.schema.version} "${manifest.schema.tag}" is not one of this server's migrations; it comes from another line of Wingfold.`)
  }
  const problems: string[] = []
  const listed = new Map(manifest.files.map(f => [f.path, f]))
  const required = [ARCHIVE_FILES.project, ARCHIVE_FILES.people, ...ARCHIVE_TABLES.map(t => t.file)]
  for (const path of required) if (!listed.has(path)) problems.push(`${path}: not listed in the manifest`)
  for (const [path, f] of listed) {
    const bytes = entries.get(path)
    if (!bytes) problems.push(`${path}: missing from the archive`)
    else if (bytes.length !== f.bytes || sha256(bytes) !== f.sha256) problems.push(`${path}: SHA-256 does not match the manifest`)
  }
  for (const path of entries.keys()) if (path !== ARCHIVE_FILES.manifest && !listed.has(path)) problems.push(`${path}: not listed in the manifest`)
  if (problems.length) throw tampered(problems)
  const text = (path: string) => new TextDecoder().decode(entries.get(path)!)
  const tables = new Map<string, ArchiveRow[]>()
  let project: ParsedArchive['project'] = { name: '', description: '' }
  let people: ArchivePerson[] = []
  try {
    const p = JSON.parse(text(ARCHIVE_FILES.project)) as { name?: unknown, description?: unknown }
    project = { name: String(p.name ?? '').slice(0, 120) || 'Imported project',
      description: String(p.description ?? '').slice(0, 2000) }
    people = archivePersonSchema.array().parse(JSON.parse(text(ARCHIVE_FILES.people)))
  } catch { problems.push(`${ARCHIVE_FILES.project} or ${ARCHIVE_FILES.people}: not valid`) }
  for (const t of ARCHIVE_TABLES) {
    const rows: ArchiveRow[] = []
    text(t.file).split('\n').forEach((line, k) => {
      if (!line.trim()) return
      try {
        const row = JSON.parse(line) as unknown
        if (!row || typeof row !== 'object' || Array.isArray(row)) throw new Error('not an object')
        const bad = Object.entries(row).find(([c,
          v]) => !SQL_IDENTIFIER.test(c) || isDeniedColumn(c) || (v !== null && typeof v === 'object'))
        if (bad) throw new Error(`column ${bad[0]}`)
        if (!Number.isInteger((row as ArchiveRow).id)) throw new Error('no integer id')
        rows.push(row as ArchiveRow)
      } catch (e) { problems.push(`${t.file} line ${k + 1}: ${(e as Error).message}`) }
    })
    if (manifest.counts[t.name] !== undefined && manifest.counts[t.name] !== rows.length) problems.push(`${t.file}: ${rows.length} rows, the manifest says ${manifest.counts[t.name]}`)
    tables.set(t.name, rows)
  }
  if (problems.length) throw tampered(problems)
  return { manifest, project, people, tables }
}

/** References between archived rows must resolve inside the archive (or be null). */
function checkReferences(a: ParsedArchive, problems: string[]): void {
  const ids = new Map([...a.tables].map(([name, rows]) => [name, new Set(rows.map(r => r.id as number))]))
  for (const t of ARCHIVE_TABLES) {
    for (const row of a.tables.get(t.name)!) {
      for (const [col, ref] of Object.entries(t.refs)) {
        if (typeof ref !== 'string' || ref === 'pk' || ref === 'project' || ref === 'user' || ref === t.name) continue // a self reference outside the project (a run restarted from another project's run) is imported as null
        const v = row[col]
        if (v !== null && v !== undefined && !ids.get(ref)!.has(v as number)) problems.push(`${t.name} ${row.id}: ${col} ${String(v)} is not in the archive`)
      }
    }
  }
}

/** Parse the pattern documents; re-verify runs and maps. Throws a 422 naming what failed. */
export function verifyArchive(a: ParsedArchive): ArchiveVerdicts {
  const problems: string[] = []
  checkReferences(a, problems)
  if (problems.length) throw tampered(problems)
  const graphs = new Map(a.tables.get('graphs')!.map(g => [g.id as number, g]))
  const docs = new Map<number, { doc: PatternDocument, label: string }>()
  for (const v of a.tables.get('graph_versions')!) {
    const label = `pattern "${String(graphs.get(v.graph_id as number)?.name)}" version ${String(v.version)}`
    try { docs.set(v.id as number, { doc: parsePatternDocument(JSON.parse(String(v.document))), label }) }
    catch { problems.push(`${label}: not a valid pattern document`) }
  }
  const verdicts: ArchiveVerdicts = { runs: new Map(), maps: new Map(), residuals: new Map() }
  const pointsByRun = new Map<number, ArchiveRow[]>()
  for (const p of a.tables.get('run_points')!) {
    const list = pointsByRun.get(p.run_id as number) ?? []
    list.push(p)
    pointsByRun.set(p.run_id as number, list)
  }
  for (const run of a.tables.get('runs')!) {
    const label = `run "${String(run.name)}"`
    const source = docs.get(run.graph_version_id as number)
    if (!source) continue
    try {
      const rows = pointsByRun.get(run.id as number) ?? []
      const regularRows = rows.filter(r => (r.index as number) >= 0)
      if (regularRows.length !== run.point_count || rows.length - regularRows.length !== run.special_count) {
        problems.push(`${label}: holds ${regularRows.length} points and ${rows.length - regularRows.length} special points, the run says ${String(run.point_count)} and ${String(run.special_count)}`)
        continue
      }
      if (!rows.length) { verdicts.runs.set(run.id as number,
        { verification: run.verification as 'pending',
        reason: (run.verification_reason ?? null) as string | null }); continue }
      const settings = parseFamilySettings(JSON.parse(String(run.settings)))
      const picks = new Set(verificationSample(regularRows.length))
      const toCheck = (r: ArchiveRow) => ({ index: (r.index as number) < 0 ? -1 - (r.index as number) : r.index as number, lambda: r.lambda as number, u: (JSON.parse(String(r.state)) as { u: number[] }).u, id: r.id as number, ...(r.special_kind ? { kind: String(r.special_kind) } : {}) })
      const regular = regularRows.filter(r => picks.has(r.index as number)).map(toCheck)
      const special = rows.filter(r => (r.index as number) < 0).map(toCheck)
      const check = checkPoints(source.doc, settings, regular, special)
      for (const p of regular) verdicts.residuals.set(p.id, check.residuals.points.get(p.index)!)
      for (const p of special) verdicts.residuals.set(p.id, check.residuals.special.get(p.index)!)
      if (run.verification === 'rejected') verdicts.runs.set(run.id as number,
        { verification: 'rejected', reason: String(run.verification_reason ?? 'Rejected before export.') })
      else if (!check.ok) problems.push(`${label}: ${rejectionReason(check)}`)
      else {
        const sampled = regularRows.length > FULL_CHECK_MAX_POINTS ? ` (sample of ${regular.length} of ${regularRows.length} points plus every special point)` : ''
        verdicts.runs.set(run.id as number,
          { verification: 'verified',
          reason: `Re-verified on import: every checked point has max|F| ≤ ${RUN_RESIDUAL_TOLERANCE} (largest ${formatNumber(check.maxResidual)})${sampled}.` })
      }
    } catch (e) { problems.push(`${label}: cannot be read (${(e as Error).message})`) }
  }
  for (const map of a.tables.get('maps')!) {
    const label = `map "${String(map.name)}"`
    const source = docs.get(map.graph_version_id as number)
    if (!source) continue
    try {
      const stored = JSON.parse(String(map.result)) as { result: MapResult }
      const check = checkPostedMap(source.doc, parseMapSettings(JSON.parse(String(map.settings))), stored.result)
      if (map.verification === 'rejected') verdicts.maps.set(map.id as number,
        { verification: 'rejected', reason: String(map.verification_reason ?? check.reason) })
      else if (check.verification !== 'verified') problems.push(`${label}: ${check.reason}`)
      else verdicts.maps.set(map.id as number,
        { verification: 'verified', reason: `Re-verified on import: ${check.reason}` })
    } catch (e) { problems.push(`${label}: cannot be read (${(e as Error).message})`) }
  }
  if (problems.length) throw archiveRefusal(422, 'archive_verification_failed',
    `The archive was refused: ${problems.slice(0, 5).join('; ')}${problems.length > 5 ? `; and ${problems.length - 5} more` : ''}`, problems)
  return verdicts
}
