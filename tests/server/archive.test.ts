/**
 * Project archives against two built servers: an owner exports a project (runs with points,
 * special points and comments, a map, two pattern versions), a user of a fresh server imports it,
 * and everything reads back equal, with every run and map verified again by the importing server.
 * Tampered archives (a moved point, a removed file, a wrong hash, a zip bomb, a path traversal
 * entry, a newer schema) are refused by name with no row written. No secret leaves the server.
 */
import { createHash } from 'node:crypto'
import { join } from 'node:path'
import { createClient } from '@libsql/client'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { deflateSync, zipSync } from 'fflate'
import { useTestServer } from '../support/fixtures'
import { DEMO_ACCOUNTS, signInAs, signUp, type ApiClient } from '../support/http'
import { startServer, type TestServer } from '../support/server'
import { archiveTexts, exportArchive, fermat, fillProject, importArchive, rezip, rowCounts, shear } from './archive-support'
import { computeBatches, projectIdByName } from './runs-helpers'
import { ARCHIVE_DENIED_TABLES, ARCHIVE_TABLES, isDeniedColumn } from '../../server/utils/archive-tables'

const ctx = useTestServer()
let fresh: TestServer, strict: TestServer
let owner: ApiClient, importer: ApiClient
let torusId: number
let archive: Uint8Array
let texts: Record<string, string>
/** Runs and maps the demo seed put into the project before this file added its own. */
let seeded: { runs: number, maps: number }

beforeAll(async () => {
  fresh = await startServer()
  owner = await signInAs(ctx.server.url, 'owner')
  importer = await signUp(fresh.url, 'Marit Elsholm', 'marit@elsewhere.example')
  torusId = await projectIdByName(owner, 'Genus-three torus gluings')
  seeded = {
    runs: ((await owner.json('GET', `/api/projects/${torusId}/runs`)).body as unknown[]).length,
    maps: ((await owner.json('GET', `/api/projects/${torusId}/maps`)).body as unknown[]).length,
  }
  await fillProject(owner, torusId)
  const r = await exportArchive(owner, torusId)
  expect(r.status).toBe(200)
  archive = r.bytes
  texts = archiveTexts(archive)
})
afterAll(async () => { await Promise.all([fresh?.stop(), strict?.stop()]) })

/** Everything the API shows of a project, without ids, times of the server or authorship. */
async function projectContent(c: ApiClient, projectId: number) {
  const graphs = (await c.json('GET', `/api/projects/${projectId}/graphs`)).body as Array<{ id: number, name: string }>
  const patterns = []
  for (const g of graphs.sort((a, b) => a.name.localeCompare(b.name))) {
    const versions = (await c.json('GET', `/api/projects/${projectId}/graphs/${g.id}/versions`)).body as Array<{ version: number }>
    const docs = []
    for (const v of versions) docs.push((await c.json('GET', `/api/projects/${projectId}/graphs/${g.id}/versions/${v.version}`)).body.document)
    patterns.push({ name: g.name, versions: versions.map(v => v.version), docs })
  }
  const runs = []
  for (const r of ((await c.json('GET', `/api/projects/${projectId}/runs`)).body as Array<{ id: number, name: string }>).sort((a, b) => a.name.localeCompare(b.name))) {
    const detail = (await c.json('GET', `/api/runs/${r.id}`)).body
    runs.push({
      name: detail.name, graphName: detail.graphName, graphVersion: detail.graphVersion, pathKind: detail.pathKind, status: detail.status,
      pointCount: detail.pointCount, specialCount: detail.specialCount, verification: detail.verification,
      points: (await c.json('GET', `/api/runs/${r.id}/points?limit=2000`)).body.points,
      special: (await c.json('GET', `/api/runs/${r.id}/special-points`)).body,
      comments: ((await c.json('GET', `/api/runs/${r.id}/comments`)).body as Array<{ body: string, pointIndex: number | null, parentId: number | null }>)
        .map(m => ({ body: m.body, pointIndex: m.pointIndex, reply: m.parentId !== null })),
    })
  }
  const maps = []
  for (const m of (await c.json('GET', `/api/projects/${projectId}/maps`)).body as Array<{ id: number }>) {
    const d = (await c.json('GET', `/api/maps/${m.id}`)).body
    maps.push({ name: d.name, plane: d.plane, graphName: d.graphName, version: d.version, settings: d.settings, result: d.result, curves: d.curves, verification: d.verification })
  }
  return { patterns, runs, maps }
}

describe('project archive export', () => {
  it('holds a manifest with app and schema version and a SHA-256 per file that matches', () => {
    const manifest = JSON.parse(texts['manifest.json']!)
    expect(manifest.format).toBe('wingfold-project-archive')
    expect(manifest.appVersion).toBe('0.1.0')
    expect(manifest.schema.version).toBeGreaterThanOrEqual(3) // three migrations on this branch: 0000_init, 0001_…, 0002_maps
    expect(Object.keys(texts).sort()).toEqual([...manifest.files.map((f: { path: string }) => f.path), 'manifest.json'].sort())
    for (const f of manifest.files) expect(createHash('sha256').update(texts[f.path]!).digest('hex')).toBe(f.sha256)
    expect(manifest.counts.runs).toBe(seeded.runs + 1)
    expect(manifest.counts.maps).toBe(seeded.maps + 1)
    expect(manifest.counts.graph_versions).toBeGreaterThan(manifest.counts.graphs) // the extra saved version
    const people = JSON.parse(texts['people.json']!)
    expect(people.map((p: { name: string, role: string }) => `${p.name}:${p.role}`).sort()).toEqual(['Neve Ashdown:editor', 'Rafi Okonkwe:viewer', 'Tomas Quillon:owner'])
  })

  it('never writes passwords, token hashes, sessions or mail addresses', () => {
    const all = Object.values(texts).join('\n')
    for (const a of DEMO_ACCOUNTS) expect(all).not.toContain(a.email)
    expect(all).not.toMatch(/\$scrypt|password|token_hash|email|session/i)
    const runRow = JSON.parse(texts['tables/runs.ndjson']!.split('\n')[0]!)
    expect(Object.keys(runRow)).toContain('verification') // columns travel generically (SELECT *)
  })

  it('has an explicit deny list: secret tables are never in the table list, secret columns never leave', () => {
    for (const t of ARCHIVE_TABLES) expect(ARCHIVE_DENIED_TABLES).not.toContain(t.name)
    for (const t of ['users', 'api_tokens', 'password_resets', 'mail_messages', 'invitations', 'sessions']) expect(ARCHIVE_DENIED_TABLES).toContain(t)
    for (const c of ['password_hash', 'token_hash', 'email', 'session_id', 'client_secret', 'to_address_mail', 'refresh_token']) expect(isDeniedColumn(c), c).toBe(true)
    for (const c of ['verification', 'verification_reason', 'document', 'state', 'special_kind', 'analysis_summary']) expect(isDeniedColumn(c), c).toBe(false)
  })

  it('exports a column added later generically, and drops one that holds mail', async () => {
    const db = createClient({ url: `file:${join(ctx.server.dataDir, 'wingfold.db')}` })
    try {
      await db.execute('ALTER TABLE runs ADD COLUMN reviewer_note TEXT')
      await db.execute('ALTER TABLE graphs ADD COLUMN contact_email TEXT')
      await db.execute({ sql: 'UPDATE runs SET reviewer_note = ? WHERE project_id = ?', args: ['looked at twice', torusId] })
      await db.execute({ sql: 'UPDATE graphs SET contact_email = ? WHERE project_id = ?', args: ['secret.person@lanternbay.example', torusId] })
    } finally { db.close() }
    const again = archiveTexts((await exportArchive(owner, torusId)).bytes)
    expect(JSON.parse(again['tables/runs.ndjson']!.split('\n')[0]!).reviewer_note).toBe('looked at twice')
    expect(Object.values(again).join('\n')).not.toContain('secret.person')
  })

  it('is for owners only: an editor gets 403, a stranger 404', async () => {
    const editor = await signInAs(ctx.server.url, 'editor')
    expect((await exportArchive(editor, torusId)).status).toBe(403)
    const stranger = await signUp(ctx.server.url, 'Oda Strand', 'oda@elsewhere.example')
    expect((await exportArchive(stranger, torusId)).status).toBe(404)
  })
})

describe('project archive import', () => {
  it('round trip: a fresh server imports everything equal and verifies every run and map again', async () => {
    const r = await importArchive(importer, archive)
    expect(r.status).toBe(201)
    expect(r.body.runs).toEqual({ verified: seeded.runs + 1, rejected: 0, pending: 0 })
    expect(r.body.maps).toEqual({ verified: seeded.maps + 1, rejected: 0, pending: 0 })
    expect(r.body.members.map((m: { name: string, role: string }) => `${m.name}:${m.role}`).sort()).toEqual(['Neve Ashdown:editor', 'Rafi Okonkwe:viewer', 'Tomas Quillon:owner'])
    const before = await projectContent(owner, torusId)
    const after = await projectContent(importer, r.body.project.id)
    expect(after.patterns).toEqual(before.patterns)
    expect(after.runs).toEqual(before.runs)
    expect(after.maps).toEqual(before.maps)
    const added = after.runs.find(x => x.name === 'shear to the collapse 1')!
    expect(added.points.length).toBeGreaterThan(10)
    expect(added.special.length).toBeGreaterThan(0)
    expect(added.comments).toHaveLength(2)
    const run = (await importer.json('GET', `/api/projects/${r.body.project.id}/runs`)).body[0]
    expect(run.verificationReason).toMatch(/^Re-verified on import/)
    // the importer owns it; nobody else was added (members come back as names to invite)
    const members = (await importer.json('GET', `/api/projects/${r.body.project.id}/members`)).body
    expect(members.map((m: { name: string, role: string }) => `${m.name}:${m.role}`)).toEqual(['Marit Elsholm:owner'])
    const activity = (await importer.json('GET', `/api/projects/${r.body.project.id}/activity/entries`)).body
    expect(JSON.stringify(activity)).toContain('imported')
  })

  async function refused(bytes: Uint8Array, status: number, code: string) {
    const before = await rowCounts(fresh)
    const r = await importArchive(importer, bytes)
    expect(r.status, JSON.stringify(r.body)).toBe(status)
    expect(r.body.data.code).toBe(code)
    expect(await rowCounts(fresh)).toEqual(before)
    return r.body as { message: string, data: { problems: string[] } }
  }

  it('refuses an archive with one moved point (hashes recomputed) and names the run and the point', async () => {
    const runRows = texts['tables/runs.ndjson']!.trim().split('\n').map(l => JSON.parse(l) as { id: number, name: string })
    const runId = runRows.find(x => x.name === 'shear to the collapse 1')!.id
    const lines = texts['tables/run_points.ndjson']!.trim().split('\n')
    const k = lines.findIndex(l => JSON.parse(l).index === 5 && JSON.parse(l).run_id === runId)
    const row = JSON.parse(lines[k]!)
    const state = JSON.parse(row.state)
    state.u[0] += 1e-3
    row.state = JSON.stringify(state)
    lines[k] = JSON.stringify(row)
    const body = await refused(rezip({ ...texts, 'tables/run_points.ndjson': `${lines.join('\n')}\n` }), 422, 'archive_verification_failed')
    expect(body.data.problems.join(' ')).toMatch(/run "shear to the collapse 1": .*point 5:/)
  })

  it('refuses an archive with a file removed, naming it', async () => {
    const { 'tables/comments.ndjson': _removed, ...rest } = texts
    const body = await refused(rezip(rest, false), 422, 'archive_tampered')
    expect(body.data.problems).toContain('tables/comments.ndjson: missing from the archive')
  })

  it('refuses an archive whose manifest hash is wrong, naming the file', async () => {
    const m = JSON.parse(texts['manifest.json']!)
    const f = m.files.find((x: { path: string }) => x.path === 'tables/maps.ndjson')
    f.sha256 = createHash('sha256').update('something else').digest('hex')
    const body = await refused(rezip({ ...texts, 'manifest.json': JSON.stringify(m) }, false), 422, 'archive_tampered')
    expect(body.data.problems).toEqual(['tables/maps.ndjson: SHA-256 does not match the manifest'])
  })

  it('refuses a zip bomb while inflating', async () => {
    // 64 MiB of zeros deflate to about 64 KiB (ratio ≈ 1000:1, common practice for a zip bomb test)
    const bomb = zipSync({ 'tables/graphs.ndjson': new Uint8Array(64 * 1024 * 1024) }, { level: 9 })
    expect(bomb.length).toBeLessThan(1024 * 1024)
    expect(deflateSync(new Uint8Array(1024)).length).toBeLessThan(100)
    await refused(bomb, 413, 'archive_ratio')
  })

  it('refuses a path traversal entry', async () => {
    const body = await refused(zipSync({ ...Object.fromEntries(Object.entries(texts).map(([k, v]) => [k, new TextEncoder().encode(v)])), '../outside.json': new TextEncoder().encode('{}') }), 422, 'archive_unsafe_entry')
    expect(body.message).toContain('../outside.json')
  })

  it('rolls the whole import back when a row breaks a constraint while writing', async () => {
    const lines = texts['tables/run_points.ndjson']!.trim().split('\n')
    const twin = { ...JSON.parse(lines[2]!), id: 999_999 } // a second row with the same (run, index)
    const runs = texts['tables/runs.ndjson']!.trim().split('\n').map(l => JSON.parse(l))
    runs[0].point_count += 1 // so the counts agree and the duplicate reaches the insert
    const m = JSON.parse(texts['manifest.json']!)
    m.counts.run_points += 1
    const body = await refused(rezip({
      ...texts, 'manifest.json': JSON.stringify(m), 'tables/runs.ndjson': `${runs.map(r => JSON.stringify(r)).join('\n')}\n`,
      'tables/run_points.ndjson': `${[...lines, JSON.stringify(twin)].join('\n')}\n`,
    }), 422, 'archive_conflict')
    expect(body.message).toMatch(/UNIQUE constraint failed: run_points\.run_id, run_points\.index/)
  })

  it('refuses an archive of a newer schema with a clear message', async () => {
    const m = JSON.parse(texts['manifest.json']!)
    m.schema = { version: m.schema.version + 1, tag: '9999_from_the_future' }
    const body = await refused(rezip({ ...texts, 'manifest.json': JSON.stringify(m) }, false), 409, 'archive_schema_newer')
    expect(body.message).toMatch(/newer Wingfold .*Upgrade this server/)
  })

  it('imports a run exported while it was still running as cancelled, its points verified', async () => {
    const graphId = (await owner.json('GET', `/api/projects/${torusId}/runs`)).body[0].graphId
    const run = await owner.json('POST', `/api/projects/${torusId}/runs`, { graphId, name: 'still running', settings: shear })
    const [batch] = computeBatches(fermat.document, shear, 5)
    expect((await owner.json('POST', `/api/runs/${run.body.id}/points`, { points: batch!.points, specialPoints: batch!.specialPoints })).status).toBe(200)
    const r = await importArchive(importer, (await exportArchive(owner, torusId)).bytes)
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const imported = ((await importer.json('GET', `/api/projects/${r.body.project.id}/runs`)).body as Array<{ name: string, status: string, verification: string, pointCount: number }>).find(x => x.name === 'still running')!
    expect(imported).toMatchObject({ status: 'cancelled', verification: 'verified', pointCount: batch!.points.length })
  })

  it('refuses an upload that is not a zip, and a signed-out caller', async () => {
    await refused(new TextEncoder().encode('{"not":"a zip"}'), 422, 'archive_empty')
    expect((await importArchive(importer, archive, 'application/json')).status).toBe(415)
    const res = await fetch(`${fresh.url}/api/projects/import`, { method: 'POST', headers: { 'content-type': 'application/zip' }, body: new Uint8Array(archive) })
    expect(res.status).toBe(401)
  })
})

describe('upload limits', () => {
  // small limits on a third server: 200 kB upload, 12 entries, 512 KiB inflated (ratio limit as default)
  const MB = 1024 * 1024
  let user: ApiClient
  beforeAll(async () => {
    strict = await startServer({ env: { NUXT_ARCHIVE_IMPORT_MAX_MB: String(200_000 / MB), NUXT_ARCHIVE_IMPORT_MAX_ENTRIES: '12', NUXT_ARCHIVE_IMPORT_MAX_INFLATED_MB: '0.5' } })
    user = await signUp(strict.url, 'Marit Elsholm', 'marit@elsewhere.example')
  })
  /** Seeded bytes (mulberry32, common practice), each one of `alphabet`. */
  function noise(n: number, alphabet: string, seed = 7): Uint8Array {
    let a = seed >>> 0
    const out = new Uint8Array(n)
    for (let i = 0; i < n; i++) {
      a = (a + 0x6D2B79F5) >>> 0
      let t = Math.imul(a ^ (a >>> 15), 1 | a)
      t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t
      out[i] = alphabet.charCodeAt((((t ^ (t >>> 14)) >>> 0) % alphabet.length))
    }
    return out
  }
  async function limited(bytes: Uint8Array, code: string) {
    const before = await rowCounts(strict)
    const r = await importArchive(user, bytes)
    expect(r.status, JSON.stringify(r.body)).toBe(413)
    expect(r.body.data.code).toBe(code)
    expect(await rowCounts(strict)).toEqual(before)
  }
  it('refuses an upload above the size limit', async () => {
    const zip = zipSync({ 'tables/graphs.ndjson': noise(300_000, 'abcdefghijklmnopqrstuvwxyz0123456789') }, { level: 0 })
    expect(zip.length).toBeGreaterThan(200_000)
    await limited(zip, 'archive_too_large')
  })
  it('refuses more entries than allowed', async () => {
    await limited(zipSync(Object.fromEntries(Array.from({ length: 13 }, (_, k) => [`extra-${k}.json`, new TextEncoder().encode('{}')]))), 'archive_too_many_entries')
  })
  it('refuses an archive that inflates past the total limit at an ordinary ratio', async () => {
    const zip = zipSync({ 'tables/run_points.ndjson': noise(700_000, 'ab') }, { level: 9 })
    expect(zip.length).toBeLessThan(200_000)
    expect(700_000 / zip.length).toBeLessThan(100) // below the zip-bomb ratio: the total limit is what refuses it
    await limited(zip, 'archive_too_large_inflated')
  })
})
