/**
 * Run routes against the built server: saving a family in batches, server verification with the
 * core (a tampered point is refused and named), roles, library filters, exports, import and
 * comparison across projects.
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { client, signInAs, type ApiClient } from '../support/http'
import { findPatternExample } from '../../shared/examples'
import { RESULT_CAUTION } from '../../shared/types/runs'
import { computeBatches, graphIdByName, projectIdByName } from './runs-helpers'
import { waitForMail } from './team-support'

const ctx = useTestServer()
let owner: ApiClient, editor: ApiClient, viewer: ApiClient, admin: ApiClient
let torusId: number, planeId: number, fermatGraph: number, bridgeGraph: number
const fermat = findPatternExample('fermat-pair')!
const bridge = findPatternExample('plane-bridge')!
// shear of fermat-pair towards the collapse at s = −1/2 − 1/√3 (see tests/e2e/family-run.test.ts)
const shear = { path: { kind: 'shear' as const }, to: -2, stop: { maxPoints: 60 } }
const batches = computeBatches(fermat.document, shear, 3)

beforeAll(async () => {
  ;[owner, editor, viewer, admin] = await Promise.all([signInAs(ctx.server.url, 'owner'), signInAs(ctx.server.url, 'editor'), signInAs(ctx.server.url, 'viewer'), signInAs(ctx.server.url, 'admin')])
  torusId = await projectIdByName(owner, 'Genus-three torus gluings')
  planeId = await projectIdByName(owner, 'Open-wing towers in the plane')
  fermatGraph = await graphIdByName(owner, torusId, fermat.title)
  bridgeGraph = await graphIdByName(owner, planeId, bridge.title)
})

async function createRun(c: ApiClient, projectId: number, graphId: number, settings: unknown, name = 'shear to the collapse') {
  return c.json('POST', `/api/projects/${projectId}/runs`, { graphId, name, settings })
}

async function upload(c: ApiClient, runId: number, list = batches) {
  const results = []
  for (const b of list) results.push(await c.json('POST', `/api/runs/${runId}/points`, { points: b.points, specialPoints: b.specialPoints }))
  return results
}

describe('saving and verifying a run', () => {
  it('stores every batch, recomputes the residuals and verifies the finished run', async () => {
    const created = await createRun(editor, torusId, fermatGraph, shear)
    expect(created.status).toBe(201)
    const runId = created.body.id as number
    const res = await upload(editor, runId)
    expect(res.every(r => r.status === 200)).toBe(true)
    const total = batches.reduce((n, b) => n + b.points.length, 0)
    const special = batches.reduce((n, b) => n + b.specialPoints.length, 0)
    expect(special).toBeGreaterThan(0)
    const done = await editor.json('POST', `/api/runs/${runId}/finish`, { status: 'complete' })
    expect(done.body.status).toBe('complete')
    expect(done.body.verification).toBe('verified')
    expect(done.body.pointCount).toBe(total)
    const stored = (await viewer.json('GET', `/api/runs/${runId}/points?limit=2000`)).body
    expect(stored.points).toHaveLength(total)
    // the stored residual is the server's own, at the engine's Newton tolerance (default 1e-10)
    expect(Math.max(...stored.points.map((p: { residual: number }) => p.residual))).toBeLessThan(1e-8)
    const sp = (await viewer.json('GET', `/api/runs/${runId}/special-points`)).body
    expect(sp.map((s: { specialKind: string }) => s.specialKind)).toContain('collapse')
    // the author hears of the verdict by e-mail, through the outbox
    const notice = await waitForMail(admin, m => m.kind === 'run-verdict' && m.toAddress.includes('editor@lanternbay.example'))
    expect(notice.subject).toMatch(/verified/i)
  })

  it('refuses a batch with one tampered point, names the point and rejects the run for good', async () => {
    const runId = (await createRun(editor, torusId, fermatGraph, shear, 'tampered')).body.id as number
    const forged = structuredClone(batches)
    const victim = forged[1]!.points[1]!
    victim.u = victim.u.map((x, k) => (k === 0 ? x + 1e-3 : x))
    const [first, second] = await upload(editor, runId, forged.slice(0, 2))
    expect(first!.status).toBe(200)
    expect(second!.status).toBe(422)
    expect(second!.body.data.offending.map((o: { name: string }) => o.name)).toEqual([`point ${victim.index}`])
    const detail = (await viewer.json('GET', `/api/runs/${runId}`)).body
    expect(detail.verification).toBe('rejected')
    expect(detail.verificationReason).toContain(`point ${victim.index}:`)
    expect(detail.pointCount).toBe(forged[0]!.points.length) // nothing of the bad batch was stored
    expect((await upload(editor, runId, forged.slice(2, 3)))[0]!.status).toBe(409)
    const done = await editor.json('POST', `/api/runs/${runId}/finish`, { status: 'complete' })
    expect(done.body.verification).toBe('rejected')
  })

  it('rejects a point with the wrong number of unknowns', async () => {
    const runId = (await createRun(editor, torusId, fermatGraph, shear, 'short u')).body.id as number
    const bad = structuredClone(batches[0]!)
    bad.points[0]!.u = bad.points[0]!.u.slice(1)
    const r = (await upload(editor, runId, [bad]))[0]!
    expect(r.status).toBe(422)
    expect(r.body.data.offending[0].reason).toMatch(/length/)
  })
})

describe('roles', () => {
  it('lets viewers read but not write, and hides runs from non-members', async () => {
    expect((await createRun(viewer, torusId, fermatGraph, shear)).status).toBe(403)
    expect((await createRun(editor, planeId, bridgeGraph, { path: { kind: 'weight-scale', edges: ['middle'] }, to: 2 })).status).toBe(403)
    const runId = (await createRun(editor, torusId, fermatGraph, shear, 'roles')).body.id as number
    expect((await upload(viewer, runId, batches.slice(0, 1)))[0]!.status).toBe(403)
    expect((await viewer.json('PATCH', `/api/runs/${runId}`, { name: 'x' })).status).toBe(403)
    expect((await viewer.json('DELETE', `/api/runs/${runId}`)).status).toBe(403)
    expect((await viewer.json('GET', `/api/runs/${runId}`)).status).toBe(200)
    const hidden = await admin.json('GET', `/api/runs/${runId}`)
    const missing = await admin.json('GET', '/api/runs/999999')
    expect([hidden.status, missing.status]).toEqual([404, 404])
    expect(hidden.body.message).toBe(missing.body.message)
    expect((await client(ctx.server.url).json('GET', `/api/runs/${runId}`)).status).toBe(401)
    expect((await editor.json('PATCH', `/api/runs/${runId}`, { name: 'renamed' })).body.name).toBe('renamed')
    expect((await owner.json('DELETE', `/api/runs/${runId}`)).status).toBe(204)
    expect((await viewer.json('GET', `/api/runs/${runId}`)).status).toBe(404)
  })
})

describe('library, exports, import and compare', () => {
  let runId: number
  beforeAll(async () => {
    runId = (await createRun(editor, torusId, fermatGraph, shear, 'export me')).body.id
    await upload(editor, runId)
    await editor.json('POST', `/api/runs/${runId}/finish`, { status: 'complete' })
  })

  it('filters and sorts the library', async () => {
    const verified = (await viewer.json('GET', `/api/projects/${torusId}/runs?verification=verified&sort=name&order=asc`)).body as Array<{ name: string, verification: string }>
    expect(verified.length).toBeGreaterThan(0)
    expect(verified.every(r => r.verification === 'verified')).toBe(true)
    expect(verified.map(r => r.name)).toEqual([...verified.map(r => r.name)].sort())
    const rejected = (await viewer.json('GET', `/api/projects/${torusId}/runs?verification=rejected`)).body as unknown[]
    expect(rejected.length).toBeGreaterThan(0)
    // no run of the project (the demo seed's included) follows an angle path
    expect((await viewer.json('GET', `/api/projects/${torusId}/runs?kind=angle`)).body).toEqual([])
    expect((await viewer.json('GET', `/api/projects/${torusId}/runs?kind=nonsense`)).status).toBe(400)
  })

  it('exports CSV and JSON with the version, the settings and the caution, and re-imports the JSON verified', async () => {
    const csv = await (await viewer.fetch(`/api/runs/${runId}/export.csv`)).text()
    const version = (await (await viewer.fetch('/api/health')).json()).version
    expect(csv).toContain(`Wingfold ${version}`)
    expect(csv).toContain(RESULT_CAUTION)
    expect(csv).toContain('"path":{"kind":"shear"}')
    const header = csv.split('\n').find(l => l.startsWith('index,'))!
    expect(header).toMatch(/lambda: shear s .*\[dimensionless\]/)
    const rows = csv.split('\n').filter(l => /^\d/.test(l))
    expect(rows).toHaveLength(batches.reduce((n, b) => n + b.points.length, 0))
    const json = await (await viewer.fetch(`/api/runs/${runId}/export.json`)).json()
    expect(json.caution).toBe(RESULT_CAUTION)
    expect(json.appVersion).toBe(version)
    const imported = await editor.json('POST', `/api/projects/${torusId}/runs/import`, { graphId: fermatGraph, run: json })
    expect(imported.status).toBe(201)
    expect(imported.body.verification).toBe('verified')
    const forged = structuredClone(json)
    forged.points[7].lambda += 1e-4
    const bad = await editor.json('POST', `/api/projects/${torusId}/runs/import`, { graphId: fermatGraph, run: forged })
    expect(bad.body.verification).toBe('rejected')
    expect(bad.body.verificationReason).toContain(`point ${forged.points[7].index}:`)
  })

  it('compares runs from two projects the user can read and leaves out the others', async () => {
    const weight = { path: { kind: 'weight-scale' as const, edges: [bridge.document.edges[0]!.id] }, to: 1.5, stop: { maxPoints: 20 } }
    const planeRun = (await createRun(owner, planeId, bridgeGraph, weight, 'weights')).body.id as number
    const up = await upload(owner, planeRun, computeBatches(bridge.document, weight))
    expect(up.every(r => r.status === 200)).toBe(true)
    await owner.json('POST', `/api/runs/${planeRun}/finish`, { status: 'complete' })
    const cmp = (await editor.json('GET', `/api/compare?runs=${runId},${planeRun}`)).body
    expect(cmp.runs.map((r: { id: number }) => r.id)).toEqual([runId, planeRun])
    expect(cmp.runs[1].points.length).toBeGreaterThan(1)
    const byAdmin = (await admin.json('GET', `/api/compare?runs=${runId},${planeRun}`)).body
    expect(byAdmin).toEqual({ runs: [], hidden: 2 })
  })
})
