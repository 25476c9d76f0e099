/**
 * Certificates along a family, through the certificate worker's API over a Node MessageChannel
 * (comlink's node adapter): every saved point of a Fermat-pair shear certifies, progress reaches
 * the page after each point, and the certified box of each point contains the Fermat point of the
 * sheared triangle (0, ω1, ω2(λ)) computed from the closed form X(13) (C. Kimberling,
 * Encyclopedia of Triangle Centers). A claim is re-proven by `verifyCertificateClaims`; a claim
 * with the existence radius shrunk far below what can be proven is refused.
 * `drawing`, as the workbench calls it: Meeks' pattern [H. Chen, M. Traizet, arXiv 2103.15676,
 * 2021, Ex. 7.1] on ω1 = (1, 0), ω2 = (0.3, 1.3) — phase Jacobian 2 cos b: a = 2π/3, b = π/3 is
 * phase-rigid (T10, T11 proven), a = π/3, b = π/2 is not (T11 fails).
 */
import { MessageChannel } from 'node:worker_threads'
import { expose, proxy, wrap, type Remote } from 'comlink'
import nodeEndpoint from 'comlink/dist/esm/node-adapter'
import { afterEach, describe, expect, it } from 'vitest'
import { verifyCertificateClaims } from '../../../shared/certify/family'
import { FamilyRunner } from '../../../shared/families/runner'
import { latticePath } from '../../../shared/families/lattice-paths'
import { compilePattern } from '../../../shared/pattern/model'
import { parseFamilySettings } from '../../../shared/types/family'
import { createCertifyWorkerApi, type CertifyWorkerApi } from '../../../workers/certify.worker'
import { fermatPair } from '../families/fixtures'
import { isogonicCentre } from '../pattern/triangle-centres'
import { meeks } from '../pattern/published-patterns'

let channel: MessageChannel | undefined
function connect(): Remote<CertifyWorkerApi> {
  channel = new MessageChannel()
  expose(createCertifyWorkerApi(), nodeEndpoint(channel.port1))
  return wrap<CertifyWorkerApi>(nodeEndpoint(channel.port2))
}
afterEach(() => { channel?.port1.close(); channel?.port2.close() })

type P = [number, number]

describe('certificates of a family through the worker', () => {
  const doc = fermatPair()
  const settings = { path: { kind: 'shear' as const }, to: 0.6 }
  const runner = new FamilyRunner(doc, settings)
  const points: { index: number, lambda: number, u: number[] }[] = []
  for (;;) {
    const b = runner.step({ points: 10, ms: 60_000 })
    points.push(...b.points.map(p => ({ index: p.index, lambda: p.lambda, u: Array.from(p.u) })))
    if (b.done) break
  }

  it('certifies every point with progress, each box containing X(13) of the sheared triangle', async () => {
    expect(points.length).toBeGreaterThan(4)
    const api = connect()
    const seen: number[] = []
    const certs = await api.certify(doc, settings, points, proxy((done: number) => { seen.push(done) }))
    expect(seen).toEqual(points.map((_, k) => k + 1))
    const m = compilePattern(doc)
    const path = latticePath(parseFamilySettings(settings).path, m.lattice)
    for (const [k, c] of certs.entries()) {
      expect(c.certificate.certified, `point ${c.index}`).toBe(true)
      if (!c.certificate.certified) continue
      const lat = path.at(points[k]!.lambda).lattice
      // x_e = p_free + T(k_e) − p_corner with k = 0, −e1, −e2: the free vertex
      // is joined to the corner p0 and its images p0 + ω1, p0 + ω2 (derived)
      const p0: P = [m.positions[0]!, m.positions[1]!]
      const x13 = isogonicCentre(p0, [p0[0] + lat.w1[0], p0[1] + lat.w1[1]], [p0[0] + lat.w2[0], p0[1] + lat.w2[1]])
      const u = points[k]!.u
      expect(Math.max(Math.abs(u[0]! - x13[0]), Math.abs(u[1]! - x13[1]))).toBeLessThanOrEqual(c.certificate.rMin + 1e-13)
    }
    const claims = certs.flatMap(c => c.certificate.certified ? [{ index: c.index, rMin: c.certificate.rMin, rMax: c.certificate.rMax }] : [])
    expect(verifyCertificateClaims(doc, settings, points, claims).accepted).toBe(true)
    const forged = claims.map((c, i) => i === 0 ? { ...c, rMin: c.rMin * 1e-6 } : c)
    const v = verifyCertificateClaims(doc, settings, points, forged)
    expect(v.accepted).toBe(false)
    expect(v.refused.map(r => r.index)).toEqual([claims[0]!.index])
    // a claim that the uniqueness ball is larger than can be proven (beyond the collapse scale) fails too
    expect(verifyCertificateClaims(doc, settings, points, [{ ...claims[1]!, rMax: 10 }]).accepted).toBe(false)
  })
})

const statusOf = (items: { id: string, status: string }[], id: string) => items.find(i => i.id === id)?.status

describe('certificate worker: one drawing with its certified checklist', () => {
  it('Meeks a = 2π/3, b = π/3: both parts certified, T6, T7, T10, T11 proven', async () => {
    const r = await connect().drawing(meeks([1, 0], [0.3, 1.3], 2 * Math.PI / 3, Math.PI / 3))
    expect(r.certificate.phase?.certified).toBe(true)
    expect(r.phase).toMatch(/^certified \(radius/)
    for (const id of ['T6', 'T7', 'T10', 'T11']) expect(statusOf(r.existence.items, id)).toBe('proven-interval')
    expect(r.existence.proven).toEqual({ horizontal: true, phase: true })
  })
  it('Meeks a = π/3, b = π/2: the phase part is not certified (not rigid), T11 fails', async () => {
    const r = await connect().drawing(meeks([1, 0], [0.3, 1.3], Math.PI / 3, Math.PI / 2))
    expect(r.phase).toMatch(/^not certified: not rigid/)
    expect(statusOf(r.existence.items, 'T11')).toBe('fails')
    expect(r.existence.proven).toEqual({ horizontal: true, phase: false })
  })
})
