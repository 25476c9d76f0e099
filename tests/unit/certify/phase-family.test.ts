/**
 * Certificates along a phase family: a ring of n vertices whose closing edge carries the shift
 * e1, followed along α1. With every phase difference equal, φ = α1/n and ψ_j = j·α1/n balance the
 * ring (derived: each vertex sum is sin φ − sin φ = 0); the reduced Jacobian is cos(α1/n) times a
 * ring Laplacian (D. A. Wiley, S. H. Strogatz, M. Girvan, "The size of the sync basin", Chaos 16,
 * 015103, 2006), so the certified points and segments must contain the closed-form state, and the
 * uniqueness radius must shrink as α1/n approaches π/2.
 */
import { describe, expect, it } from 'vitest'
import { certifyFamilyPoints, certifyFamilySegments } from '../../../shared/certify/family'
import { FamilyRunner } from '../../../shared/families/runner'
import { torusDoc } from '../pattern/helpers'

const n = 6
function ringDoc() {
  const positions: Record<string, [number, number]> = {}
  const edges: [string, string, [number, number]][] = []
  for (let i = 0; i < n; i++) {
    positions[`r${i}`] = [i / n, 0]
    edges.push([`r${i}`, `r${(i + 1) % n}`, [i === n - 1 ? 1 : 0, 0]])
  }
  return torusDoc([1, 0], [0, 1], positions, edges, { phases: { alpha: [0, 0], vertexPhases: {} } })
}

describe('certified phase family on a ring (Wiley–Strogatz–Girvan 2006)', () => {
  it('points and segments certified, containing ψ_j = j·α1/n; uniqueness radius shrinks towards α1/n = π/2', () => {
    const doc = ringDoc()
    const target = 0.8 * n * Math.PI / 2
    const settings = { path: { kind: 'alpha1' as const }, to: target, step: { max: 0.3 } }
    const runner = new FamilyRunner(doc, settings)
    const points: { index: number, lambda: number, u: number[] }[] = []
    for (;;) {
      const b = runner.step({ points: 20, ms: 60_000 })
      points.push(...b.points.map(p => ({ index: p.index, lambda: p.lambda, u: Array.from(p.u) })))
      if (b.done) break
    }
    expect(points.length).toBeGreaterThan(5)
    const pc = certifyFamilyPoints(doc, settings, points)
    let previous = Infinity
    for (const [k, c] of pc.entries()) {
      expect(c.certificate.certified, `point ${c.index}`).toBe(true)
      if (!c.certificate.certified) continue
      const a = points[k]!.lambda
      const dist = Math.max(...points[k]!.u.map((x, i) => Math.abs(x - (i + 1) * a / n)))
      expect(dist).toBeLessThanOrEqual(c.certificate.rMin + 1e-15)
      if (a > 1) {
        expect(c.certificate.rMax).toBeLessThanOrEqual(previous * 1.0001)
        previous = c.certificate.rMax
      }
    }
    const segs = certifyFamilySegments(doc, settings, points, pc)
    for (const s of segs) expect(s.certificate.certified, `segment ${s.from}: λ ${s.lambdaFrom}..${s.lambdaTo} ${JSON.stringify(s.certificate)}`).toBe(true)
  })
})
