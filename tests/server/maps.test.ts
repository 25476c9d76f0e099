/**
 * Map routes against the built server: saving a map computed with the core in node, the server's
 * verification of a sample of cells (a moved state is named and the map rejected), roles, list,
 * CSV / JSON export and delete.
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { client, signInAs, type ApiClient } from '../support/http'
import { findPatternExample } from '../../shared/examples'
import { runMapSweep } from '../../shared/maps'
import { parseMapSettings } from '../../shared/types/maps'
import { graphIdByName, projectIdByName } from './runs-helpers'

const ctx = useTestServer()
let owner: ApiClient, viewer: ApiClient
let torusId: number, fermatGraph: number
const fermat = findPatternExample('fermat-pair')!
const settings = parseMapSettings({ plane: 'tau', x: { min: -0.5, max: 0.5, count: 6 }, y: { min: 0.8, max: 1.6, count: 4 } })
const map = runMapSweep(fermat.document, settings)

beforeAll(async () => {
  owner = await signInAs(ctx.server.url, 'owner')
  viewer = await signInAs(ctx.server.url, 'viewer')
  torusId = await projectIdByName(owner, 'Genus-three torus gluings')
  fermatGraph = await graphIdByName(owner, torusId, fermat.title)
})

const post = (c: ApiClient, result: unknown, name = 'τ window') => c.json('POST', `/api/projects/${torusId}/maps`, { graphId: fermatGraph, name, settings, result, wallMs: 12.5, workers: 2 })

describe('saved maps', () => {
  it('stores a map verified by the server, lists it, exports it and deletes it', async () => {
    const r = await post(owner, map)
    expect(r.status).toBe(201)
    expect(r.body.verification).toBe('verified')
    // below 40 solved cells the server checks all of them; (−0.5, 0.8) is beyond 120° at 0 (arg τ ≈ 122°, Fermat–Torricelli)
    expect(r.body.solvedCount).toBe(23)
    expect(r.body.verificationReason).toMatch(/23 sampled cells re-evaluated/)
    expect(r.body.cellCount).toBe(24)
    const list = await viewer.json('GET', `/api/projects/${torusId}/maps`)
    expect(list.body.map((m: { id: number }) => m.id)).toContain(r.body.id)
    const detail = await viewer.json('GET', `/api/maps/${r.body.id}`)
    expect(detail.body.result.rows).toHaveLength(4)
    const csv = await (await viewer.fetch(`/api/maps/${r.body.id}/export.csv`)).text()
    expect(csv.split('\n').filter(l => /^\d/.test(l))).toHaveLength(24)
    const json = await viewer.json('GET', `/api/maps/${r.body.id}/export.json`)
    expect(json.body.format).toBe('wingfold-map')
    expect((await viewer.json('DELETE', `/api/maps/${r.body.id}`)).status).toBe(403)
    expect((await owner.json('DELETE', `/api/maps/${r.body.id}`)).status).toBe(204)
    expect((await owner.json('GET', `/api/maps/${r.body.id}`)).status).toBe(404)
  })

  it('rejects a map whose cell state was moved, naming the cell', async () => {
    const tampered = structuredClone(map)
    const cell = tampered.rows[1]!.cells.find(c => c.status === 'solved')!
    cell.u = cell.u!.map(v => v + 0.05)
    const r = await post(owner, tampered, 'tampered')
    expect(r.status).toBe(201)
    expect(r.body.verification).toBe('rejected')
    expect(r.body.verificationReason).toContain(`(${cell.i}, ${cell.j})`)
  })

  it('refuses viewers, strangers and malformed results', async () => {
    expect((await post(viewer, map)).status).toBe(403)
    expect((await post(client(ctx.server.url), map)).status).toBe(401)
    expect((await post(owner, { ...map, rows: 'nope' })).status).toBe(400)
  })
})
