/**
 * Census jobs in the web process (no Redis configured): start, progress, cancel, resume, the
 * stored rows (one per canonical code) against the core's own enumeration, the published genus-3
 * classification, filters, and the access rules.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { enumerateCensus } from '../../shared/census/enumerate'
import { startServer, type TestServer } from '../support/server'
import { client, signInAs, type ApiClient } from '../support/http'
import { waitForJob } from './census-support'

let server: TestServer
let owner: ApiClient
beforeAll(async () => {
  server = await startServer()
  owner = await signInAs(server.url, 'owner')
}, 120_000)
afterAll(async () => { await server?.stop() })

describe('census job in process', () => {
  it('refuses the signed-out and bad bounds', async () => {
    expect((await client(server.url).json('POST', '/api/census/jobs', { maxTowers: 2, maxHalfEdges: 8 })).status).toBe(401)
    expect((await client(server.url).json('GET', '/api/census/patterns')).status).toBe(401)
    expect((await owner.json('POST', '/api/census/jobs', { maxTowers: 0, maxHalfEdges: 8 })).status).toBe(400)
    expect((await owner.json('POST', '/api/census/jobs', { maxTowers: 2, maxHalfEdges: 99 })).status).toBe(400)
    expect((await owner.json('GET', '/api/census/jobs/999')).status).toBe(404)
    expect((await owner.json('GET', '/api/census/patterns')).body.total).toBe(0)
  })

  it('runs, cancels, resumes and ends with one row per class of the core enumeration', async () => {
    const bounds = { maxTowers: 3, maxHalfEdges: 14 }
    const expected = new Set([...enumerateCensus(bounds)].map(p => p.code))
    const start = await owner.json('POST', '/api/census/jobs', bounds)
    expect(start.status).toBe(201)
    expect(start.body.queue).toBe('in-process')
    const id = start.body.id as number
    expect((await owner.json('POST', '/api/census/jobs', bounds)).status).toBe(409)
    await waitForJob(owner, id, j => j.classified >= 3)
    expect((await owner.json('POST', `/api/census/jobs/${id}/cancel`)).status).toBe(200)
    const cancelled = await waitForJob(owner, id, j => j.status === 'cancelled')
    const partial = (await owner.json('GET', '/api/census/patterns?limit=500')).body.total as number
    expect(partial).toBeGreaterThanOrEqual(3)
    expect(partial).toBeLessThan(expected.size)
    expect(cancelled.classified).toBe(partial)
    expect((await owner.json('POST', `/api/census/jobs/${id}/cancel`)).status).toBe(409)

    expect((await owner.json('POST', `/api/census/jobs/${id}/resume`)).status).toBe(200)
    const done = await waitForJob(owner, id, j => j.status === 'done')
    // the resumed run classifies only what the cancelled one had not stored
    expect(done.classified).toBe(expected.size - partial)
    expect(done.found).toBe(expected.size)
    const all = (await owner.json('GET', '/api/census/patterns?limit=500')).body
    expect(all.total).toBe(expected.size)
    expect(new Set(all.patterns.map((p: { code: string }) => p.code))).toEqual(expected)
  }, 120_000)

  it('stores exactly the two published genus-3 classes, balanced and rigid, and filters and sorts', async () => {
    // H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I", arXiv 2103.15676 (2021), Theorem C.1
    const g3 = (await owner.json('GET', '/api/census/patterns?genus=3&sort=towers')).body
    expect(g3.patterns.map((p: { towers: number, edges: number }) => [p.towers, p.edges])).toEqual([[1, 3], [2, 4]])
    for (const p of g3.patterns) { expect(p.balanced).toBe(true); expect(p.rigid).toBe(true) }
    // W. H. Meeks (1990): no genus-2 minimal surface in a flat 3-torus (from memory)
    expect((await owner.json('GET', '/api/census/patterns?genus=2')).body.total).toBe(0)
    const byAut = (await owner.json('GET', '/api/census/patterns?sort=automorphisms&order=desc&limit=5')).body.patterns
    expect(byAut[0].automorphisms).toBeGreaterThanOrEqual(byAut[4].automorphisms)
    const unbalanced = (await owner.json('GET', '/api/census/patterns?balanced=false&limit=3')).body.patterns
    for (const p of unbalanced) { expect(p.balanced).toBe(false); expect(p.reason).toMatch(/\w{4,}/) }
    const one = await owner.json('GET', `/api/census/patterns/${g3.patterns[1].id}`)
    expect(one.body.document.format).toBe('wingfold-pattern')
    expect(one.body.document.edges).toHaveLength(4)
    expect((await owner.json('GET', '/api/census/patterns?degrees=x')).status).toBe(400)
  })
})
