/**
 * The phase certificate proves a zero of the PUBLISHED vertical system: the level rows of
 * vertical balance on cuts (H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I",
 * arXiv 2103.15676, 2021, Def. 6.2, 6.6), not the earlier vertex sums over all edges.
 *
 * Meeks' pattern [CT-I Ex. 7.1] on ω1 = (1, 0), ω2 = (0.3, 1.3) (acute: e2, e4 with shifts (1,0),
 * (0,1) are the shortest edges, one level row on them). With ψ_v = 0 pinned, x = ψ_w − a and
 * α = (−a − b, b − a): φ2 = x − b, φ4 = x + b, and the one row is (derived)
 *   F(x) = −(sin φ2 + sin φ4) = −2 sin x cos b,   F′(0) = −2 cos b   [CT-I Ex. 7.1: det 2 cos b],
 * while the earlier vertex sum over all four edges is −2 sin x (cos a + cos b) (derived).
 * - a = 2π/3, b = π/3: F′ = −1, phase-rigid → certified; the vertex sum is identically 0 there.
 * - a = π/3, b = π/2: F ≡ 0 for every x (a whole circle of zeros), so no unique zero exists and
 *   no certificate may ever succeed; the vertex sum (F′ = −1) would have certified it.
 * Twisted rings (D. A. Wiley, S. H. Strogatz, M. Girvan, "The size of the sync basin", Chaos 16,
 * 015103, 2006) have all edges of one length: there the level rows are the vertex sums without the
 * pinned vertex (derived: one level, the parts are the single vertices, vertex 0's part dropped).
 */
import { describe, expect, it } from 'vitest'
import { certifyFamilyPoints, certifyFamilySegments } from '../../../shared/certify/family'
import { certifyZero } from '../../../shared/certify/krawczyk'
import { certifyDrawing, certifyPhases } from '../../../shared/certify/pattern'
import { modelPhaseRows, phaseSystem, type PhaseRow } from '../../../shared/certify/phase'
import { FamilyRunner } from '../../../shared/families/runner'
import { compilePattern, type PatternModel } from '../../../shared/pattern/model'
import { meeks } from '../pattern/published-patterns'
import { ringModel } from '../pattern/helpers'

const PI = Math.PI
const W1: [number, number] = [1, 0], W2: [number, number] = [0.3, 1.3]

/** The earlier vertex-sum rows G(v), v ≠ 0, built here only to show where they disagree. */
function vertexSumRows(m: PatternModel): PhaseRow[] {
  const rows: PhaseRow[] = Array.from({ length: m.nVertices }, () => [])
  for (let e = 0; e < m.nEdges; e++) {
    if (m.edgeFrom[e] === m.edgeTo[e]) continue
    rows[m.edgeFrom[e]!]!.push({ edge: e, sign: 1 })
    rows[m.edgeTo[e]!]!.push({ edge: e, sign: -1 })
  }
  return rows.slice(1)
}

function certifyVertexSums(m: PatternModel, psi: Float64Array) {
  const sys = phaseSystem(m, { rows: vertexSumRows(m), alpha: m.alpha, weights: m.weight, psi })
  return certifyZero(sys, psi.slice(1))
}

describe('Meeks [CT-I Ex. 7.1], ω2 = (0.3, 1.3): the certificate uses the level rows', () => {
  it('the published system has one row on e2, e4 (the two shortest edges)', () => {
    const m = compilePattern(meeks(W1, W2, 2 * PI / 3, PI / 3))
    const { rows, pinned } = modelPhaseRows(m)
    expect(pinned).toEqual([0])
    expect(rows).toHaveLength(1)
    expect(rows[0]!.map(t => m.edgeIds[t.edge]).sort()).toEqual(['e2', 'e4'])
  })

  it('a = 2π/3, b = π/3 (phase-rigid, det 2 cos b = 1): certified, the box holds ψ_w = a; the vertex sums cannot certify it', () => {
    const a = 2 * PI / 3, b = PI / 3
    const m = compilePattern(meeks(W1, W2, a, b))
    for (const dx of [0, 1e-9, 1e-4]) {
      const psi = Float64Array.from([0, a + dx])
      const c = certifyPhases(m, psi, m.alpha, m.weight)
      expect(c.certified, `dx = ${dx}`).toBe(true)
      if (!c.certified) continue
      // the true zero is x = 0, i.e. ψ_w = a (derived above)
      expect(Math.abs(psi[1]! - a)).toBeLessThanOrEqual(c.rMin)
      // the uniqueness radius cannot exceed π: the next zero of −sin x is at x = π (derived)
      expect(c.rMax).toBeLessThan(PI)
      const old = certifyVertexSums(m, psi)
      expect(old.certified).toBe(false)
    }
  })

  it('a = π/3, b = π/2 (not phase-rigid: F ≡ 0): never certified, from any ψ; the vertex sums would certify', () => {
    const a = PI / 3, b = PI / 2
    const m = compilePattern(meeks(W1, W2, a, b))
    for (const dx of [0, 1e-12, 1e-6, 1e-3, 0.3, -1]) {
      const psi = Float64Array.from([0, a + dx])
      const c = certifyPhases(m, psi, m.alpha, m.weight)
      expect(c.certified, `dx = ${dx}`).toBe(false)
      if (!c.certified) expect(c.reason).toBe('not-rigid')
    }
    expect(certifyDrawing(m, true).phase!.certified).toBe(false)
    expect(certifyVertexSums(m, Float64Array.from([0, a])).certified).toBe(true)
  })

  it('a phase family along α1 (a = 2π/3, b = π/3): points and segments certified, boxes hold ψ_w = (a − b − α1)/2', () => {
    // derived: F = −(sin(ψ_w + α1) + sin(ψ_w + b − a)) = 0 on the branch ψ_w + α1 = −(ψ_w + b − a)
    const a = 2 * PI / 3, b = PI / 3
    const doc = meeks(W1, W2, a, b)
    const settings = { path: { kind: 'alpha1' as const }, to: -a - b + 0.6, step: { max: 0.1 } }
    const runner = new FamilyRunner(doc, settings)
    const points: { index: number, lambda: number, u: number[] }[] = []
    for (;;) {
      const batch = runner.step({ points: 50, ms: 60_000 })
      points.push(...batch.points.map(p => ({ index: p.index, lambda: p.lambda, u: Array.from(p.u) })))
      if (batch.done) break
    }
    expect(points.length).toBeGreaterThan(4)
    const pc = certifyFamilyPoints(doc, settings, points)
    for (const [k, c] of pc.entries()) {
      expect(c.certificate.certified, `point ${c.index}`).toBe(true)
      if (!c.certificate.certified) continue
      const exact = (a - b - points[k]!.lambda) / 2
      expect(Math.abs(points[k]!.u[0]! - exact)).toBeLessThanOrEqual(c.certificate.rMin + 1e-15)
    }
    const segs = certifyFamilySegments(doc, settings, points, pc)
    expect(segs).toHaveLength(points.length - 1)
    for (const s of segs) expect(s.certificate.certified, `segment ${s.from}`).toBe(true)
  })
})

describe('equal lengths: the level rows are the vertex sums (derived)', () => {
  it('twisted rings (Wiley–Strogatz–Girvan 2006): one level, rows = G(v) for v ≠ 0, same signs', () => {
    for (const n of [5, 8, 13]) {
      const m = ringModel(n)
      const key = (rows: PhaseRow[]) => rows.map(r => r.map(t => `${t.sign}:${t.edge}`).sort().join(' ')).sort()
      const { rows, pinned } = modelPhaseRows(m)
      expect(pinned).toEqual([0])
      expect(key(rows)).toEqual(key(vertexSumRows(m)))
    }
  })
})
