/**
 * The server re-proves phase certificates on the published vertical system — the level rows of
 * vertical balance on cuts (H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I", arXiv
 * 2103.15676, 2021, Def. 6.2) — and the JSON export carries the certified checklist.
 * Meeks' pattern [CT-I Ex. 7.1] on ω1 = (1, 0), ω2 = (0.3, 1.3), a = 2π/3, b = π/3: the level row
 * holds e2, e4 only, with Jacobian 2 cos b = 1 (phase-rigid); the earlier vertex sum over all four
 * edges has Jacobian 2(cos a + cos b) = 0 at the start point (derived), so a server still
 * re-proving vertex sums would refuse the honest claim of point 0.
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { signInAs, type ApiClient } from '../support/http'
import { certifyFamilyPoints } from '../../shared/certify/family'
import { meeks } from '../unit/pattern/published-patterns'
import { computeBatches, projectIdByName } from './runs-helpers'

const ctx = useTestServer()
let editor: ApiClient, viewer: ApiClient
let runId: number
const a = 2 * Math.PI / 3, b = Math.PI / 3
const doc = meeks([1, 0], [0.3, 1.3], a, b)
const settings = { path: { kind: 'alpha1' as const }, to: -a - b + 0.4, step: { max: 0.1 } }
const points = computeBatches(doc, settings, 4).flatMap(x => x.points)
const statusOf = (items: { id: string, status: string }[], id: string) => items.find(i => i.id === id)?.status

beforeAll(async () => {
  ;[editor, viewer] = await Promise.all([signInAs(ctx.server.url, 'editor'), signInAs(ctx.server.url, 'viewer')])
  const projectId = await projectIdByName(editor, 'Genus-three torus gluings')
  const graph = await editor.json('POST', `/api/projects/${projectId}/graphs`, { name: 'Meeks acute', document: doc, message: 'CT-I Ex. 7.1' })
  expect(graph.status).toBe(201)
  const created = await editor.json('POST', `/api/projects/${projectId}/runs`, { graphId: graph.body.id, name: 'Meeks along α1', settings })
  expect(created.status).toBe(201)
  runId = created.body.id
  for (const batch of computeBatches(doc, settings, 4)) {
    expect((await editor.json('POST', `/api/runs/${runId}/points`, { points: batch.points, specialPoints: batch.specialPoints })).status).toBe(200)
  }
})

describe('phase certificates on the level rows (Meeks [CT-I Ex. 7.1])', () => {
  const local = certifyFamilyPoints(doc, settings, points.map(p => ({ index: p.index, lambda: p.lambda, u: p.u })))
  const claims = local.flatMap(c => c.certificate.certified ? [{ index: c.index, rMin: c.certificate.rMin, rMax: c.certificate.rMax }] : [])

  it('before any certificate the export lists T1–T11, with T10, T11 numerical evidence', async () => {
    expect(points.length).toBeGreaterThan(3)
    expect(claims).toHaveLength(points.length)
    const ex = (await viewer.json('GET', `/api/runs/${runId}/export.json`)).body.certificates.existence
    expect(ex.items.map((i: { id: string }) => i.id)).toEqual(['T1', 'T2', 'T3', 'T4', 'T5', 'T6', 'T7', 'T8', 'T9', 'T10', 'T11'])
    expect(statusOf(ex.items, 'T10')).toBe('numerical')
    expect(statusOf(ex.items, 'T11')).toBe('numerical')
    expect(statusOf(ex.items, 'T4')).toBe('exact')
  })
  it('a forged claim (uniqueness radius beyond the next zero at distance π) is refused, nothing stored', async () => {
    // derived: along α1 the row is −(sin(ψ_w + α1) + sin(ψ_w + b − a)); zeros repeat every π in ψ_w
    const forged = claims.map((c, i) => i === 0 ? { ...c, rMax: 3.5 } : c)
    const r = await editor.json('POST', `/api/runs/${runId}/certificates`, { claims: forged })
    expect(r.status).toBe(422)
    expect(r.body.data.refused.map((x: { index: number }) => x.index)).toEqual([claims[0]!.index])
    expect((await viewer.json('GET', `/api/runs/${runId}/certificates`)).body.certificates).toEqual([])
  })
  it('honest claims (point 0 included) are re-proven and stored; the export then shows T10, T11 proven by interval arithmetic', async () => {
    const r = await editor.json('POST', `/api/runs/${runId}/certificates`, { claims, segments: claims.slice(0, -1).map(c => ({ from: c.index })) })
    expect(r.status).toBe(200)
    expect(r.body.certificates.map((c: { index: number }) => c.index)).toContain(0)
    expect(r.body.segments).toHaveLength(claims.length - 1)
    const ex = (await viewer.json('GET', `/api/runs/${runId}/export.json`)).body.certificates.existence
    expect(statusOf(ex.items, 'T10')).toBe('proven-interval')
    expect(statusOf(ex.items, 'T11')).toBe('proven-interval')
    expect(statusOf(ex.items, 'T7')).toBe('numerical')
    expect(ex.line).toMatch(/proven by interval arithmetic: T10, T11/)
  })
})
