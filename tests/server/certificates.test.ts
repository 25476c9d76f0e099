/**
 * Certificate routes against the built server: a client certifies the saved points of a run
 * with the core (as the run page's worker does) and claims the radii; the server re-proves each
 * claim (shared/certify) before storing it, refuses a tampered claim (a radius smaller than can
 * be proven, a point that does not exist) with nothing written, and keeps viewers out. Segment
 * claims name only the pair of points; the server computes and stores its own segment radii.
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { signInAs, type ApiClient } from '../support/http'
import { findPatternExample } from '../../shared/examples'
import { certifyFamilyPoints } from '../../shared/certify/family'
import { claimsPerRequest } from '../../shared/types/certificates'
import { computeBatches, graphIdByName, projectIdByName } from './runs-helpers'

const ctx = useTestServer()
let editor: ApiClient, viewer: ApiClient
let runId: number
const fermat = findPatternExample('fermat-pair')!
const shear = { path: { kind: 'shear' as const }, to: -0.5, stop: { maxPoints: 8 } }
const batches = computeBatches(fermat.document, shear, 4)
const points = batches.flatMap(b => b.points)

beforeAll(async () => {
  ;[editor, viewer] = await Promise.all([signInAs(ctx.server.url, 'editor'), signInAs(ctx.server.url, 'viewer')])
  const torusId = await projectIdByName(editor, 'Genus-three torus gluings')
  const graphId = await graphIdByName(editor, torusId, fermat.title)
  const created = await editor.json('POST', `/api/projects/${torusId}/runs`, { graphId, name: 'certified shear', settings: shear })
  runId = created.body.id
  for (const b of batches) expect((await editor.json('POST', `/api/runs/${runId}/points`, { points: b.points, specialPoints: b.specialPoints })).status).toBe(200)
})

describe('certificates of run points', () => {
  const local = certifyFamilyPoints(fermat.document, shear, points.map(p => ({ index: p.index, lambda: p.lambda, u: p.u })))
  const claims = local.flatMap(c => c.certificate.certified ? [{ index: c.index, rMin: c.certificate.rMin, rMax: c.certificate.rMax }] : [])

  it('every saved point of the shear certifies in the core', () => {
    expect(points.length).toBeGreaterThan(3)
    expect(claims).toHaveLength(points.length)
  })
  it('a viewer may not claim (403); an empty claim list is a 400', async () => {
    expect((await viewer.json('POST', `/api/runs/${runId}/certificates`, { claims })).status).toBe(403)
    expect((await editor.json('POST', `/api/runs/${runId}/certificates`, { claims: [] })).status).toBe(400)
    expect((await editor.json('POST', `/api/runs/${runId}/certificates`, {})).status).toBe(400)
  })
  it('a tampered claim (existence radius shrunk a millionfold) is refused and nothing is stored', async () => {
    const forged = claims.map((c, i) => i === 1 ? { ...c, rMin: c.rMin * 1e-6 } : c)
    const r = await editor.json('POST', `/api/runs/${runId}/certificates`, { claims: forged })
    expect(r.status).toBe(422)
    expect(r.body.data.code).toBe('certificate_refused')
    expect(r.body.data.refused.map((x: { index: number }) => x.index)).toEqual([claims[1]!.index])
    expect((await viewer.json('GET', `/api/runs/${runId}/certificates`)).body.certificates).toEqual([])
  })
  it('a claim for a point that does not exist is refused', async () => {
    const r = await editor.json('POST', `/api/runs/${runId}/certificates`, { claims: [{ index: 999, rMin: 1e-12, rMax: 1e-3 }] })
    expect(r.status).toBe(422)
  })
  it('a segment claim whose end is not a saved point is refused', async () => {
    const last = Math.max(...claims.map(c => c.index))
    const r = await editor.json('POST', `/api/runs/${runId}/certificates`, { claims, segments: [{ from: last }] })
    expect(r.status).toBe(422)
    expect(r.body.data.refused.map((x: { index: number }) => x.index)).toEqual([last])
  })
  it('a request asking more work than one request may is refused with 413 (nothing stored)', async () => {
    // the Fermat shear has n = 2 unknowns, so claimsPerRequest(2) = MAX_CERTIFICATE_CLAIMS claims fit; one more does not
    const many = Array.from({ length: claimsPerRequest(2) }, () => ({ from: claims[0]!.index }))
    const r = await editor.json('POST', `/api/runs/${runId}/certificates`, { claims: [claims[0]], segments: many })
    expect(r.status).toBe(413)
    expect((await viewer.json('GET', `/api/runs/${runId}/certificates`)).body.certificates).toEqual([])
  })
  it('honest claims are re-proven, stored, listed and exported; the server computes the segments itself', async () => {
    const segments = claims.slice(0, -1).map(c => ({ from: c.index }))
    const r = await editor.json('POST', `/api/runs/${runId}/certificates`, { claims, segments })
    expect(r.status).toBe(200)
    expect(r.body.certificates).toHaveLength(claims.length)
    expect(r.body.segments).toHaveLength(segments.length)
    for (const s of r.body.segments) expect(s.to).toBe(s.from + 1)
    const listed = (await viewer.json('GET', `/api/runs/${runId}/certificates`)).body.certificates
    expect(listed.map((c: { index: number }) => c.index)).toEqual(claims.map(c => c.index))
    expect(listed[0].rMin).toBe(claims[0]!.rMin)
    const exp = (await viewer.json('GET', `/api/runs/${runId}/export.json`)).body
    expect(exp.certificates.proven).toHaveLength(claims.length)
    expect(exp.certificates.segments).toHaveLength(segments.length)
  })
})
