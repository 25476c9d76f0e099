/**
 * Helpers for the archive tests and bench: fill a project with a verified run (with comments)
 * and a map computed with the core in node, read and rewrite archives (fflate), and count rows
 * straight from a test server's SQLite file.
 */
import { createHash } from 'node:crypto'
import { join } from 'node:path'
import { createClient } from '@libsql/client'
import { unzipSync, zipSync } from 'fflate'
import { findPatternExample } from '../../shared/examples'
import { runMapSweep } from '../../shared/maps'
import { parseMapSettings } from '../../shared/types/maps'
import type { ApiClient } from '../support/http'
import type { TestServer } from '../support/server'
import { computeBatches, graphIdByName } from './runs-helpers'

export const fermat = findPatternExample('fermat-pair')!
// shear of fermat-pair towards the collapse at s = −1/2 − 1/√3 (as in tests/server/runs.test.ts)
export const shear = { path: { kind: 'shear' as const }, to: -2, stop: { maxPoints: 60 } }
export const mapSettings = parseMapSettings({ plane: 'tau', x: { min: -0.5, max: 0.5, count: 6 }, y: { min: 0.8, max: 1.6, count: 4 } })

/** Save a second version of the Fermat pattern, a verified run with two comments, and a map. */
export async function fillProject(c: ApiClient, projectId: number, runs = 1): Promise<{ runIds: number[], mapId: number }> {
  const graphId = await graphIdByName(c, projectId, fermat.title)
  const saved = await c.json('POST', `/api/projects/${projectId}/graphs/${graphId}/versions`, { document: fermat.document, message: 'saved again for the archive' })
  if (saved.status !== 201) throw new Error(`save failed: ${JSON.stringify(saved.body)}`)
  const batches = computeBatches(fermat.document, shear, 20)
  const runIds: number[] = []
  for (let k = 0; k < runs; k++) {
    const run = await c.json('POST', `/api/projects/${projectId}/runs`, { graphId, name: `shear to the collapse ${k + 1}`, settings: shear })
    for (const b of batches) await c.json('POST', `/api/runs/${run.body.id}/points`, { points: b.points, specialPoints: b.specialPoints })
    const done = await c.json('POST', `/api/runs/${run.body.id}/finish`, { status: 'complete' })
    if (done.body.verification !== 'verified') throw new Error(`run not verified: ${JSON.stringify(done.body)}`)
    const first = await c.json('POST', `/api/runs/${run.body.id}/comments`, { body: 'The **collapse** comes early here.', pointIndex: 3 })
    await c.json('POST', `/api/runs/${run.body.id}/comments`, { body: 'Agreed, see the last point.', parentId: first.body.id })
    runIds.push(run.body.id)
  }
  const map = await c.json('POST', `/api/projects/${projectId}/maps`, { graphId, name: 'τ window', settings: mapSettings, result: runMapSweep(fermat.document, mapSettings), wallMs: 10, workers: 1 })
  if (map.body.verification !== 'verified') throw new Error(`map not verified: ${JSON.stringify(map.body)}`)
  return { runIds, mapId: map.body.id }
}

/** Download a project's archive. */
export async function exportArchive(c: ApiClient, projectId: number): Promise<{ status: number, bytes: Uint8Array }> {
  const res = await c.fetch(`/api/projects/${projectId}/archive`)
  return { status: res.status, bytes: new Uint8Array(await res.arrayBuffer()) }
}

/** Upload an archive for import. */
export async function importArchive(c: ApiClient, bytes: Uint8Array, type = 'application/zip') {
  const res = await c.fetch('/api/projects/import', { method: 'POST', headers: { 'content-type': type }, body: new Uint8Array(bytes) })
  const text = await res.text()
  return { status: res.status, body: text ? JSON.parse(text) : null }
}

/** Entries of a zip as text. */
export function archiveTexts(bytes: Uint8Array): Record<string, string> {
  return Object.fromEntries(Object.entries(unzipSync(bytes)).map(([k, v]) => [k, new TextDecoder().decode(v)]))
}

/** Re-zip texts; with `rehash` the manifest's sizes and SHA-256 are recomputed (a careful forger). */
export function rezip(texts: Record<string, string>, rehash = true): Uint8Array {
  const out = { ...texts }
  if (rehash && out['manifest.json']) {
    const m = JSON.parse(out['manifest.json'])
    m.files = m.files.filter((f: { path: string }) => f.path in out).map((f: { path: string }) => {
      const b = new TextEncoder().encode(out[f.path]!)
      return { path: f.path, bytes: b.length, sha256: createHash('sha256').update(b).digest('hex') }
    })
    out['manifest.json'] = JSON.stringify(m)
  }
  return zipSync(Object.fromEntries(Object.entries(out).map(([k, v]) => [k, new TextEncoder().encode(v)])))
}

/** Row counts of the project tables in a test server's database. */
export async function rowCounts(server: TestServer): Promise<Record<string, number>> {
  const db = createClient({ url: `file:${join(server.dataDir, 'wingfold.db')}` })
  try {
    const out: Record<string, number> = {}
    for (const t of ['projects', 'memberships', 'graphs', 'graph_versions', 'runs', 'run_points', 'comments', 'maps', 'activity', 'invitations', 'users']) {
      out[t] = Number((await db.execute(`SELECT count(*) AS n FROM ${t}`)).rows[0]!.n)
    }
    return out
  } finally {
    db.close()
  }
}
