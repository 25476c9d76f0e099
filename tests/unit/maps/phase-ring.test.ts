/**
 * (α1, α2) map of a ring of two phase oscillators with doubled couplings (fixtures.ts). Vertical
 * balance is taken on cuts over the cut's shortest edges (H. Chen, M. Traizet, arXiv 2103.15676,
 * 2021, Def. 6.2): the one cut {a} | {b} has the shortest edges e1 and e3 (both of length
 * |(1, 0.3)|; e2 and e4 are longer), so the one equation is −sin φ1 + sin φ3 with φ1 = d,
 * φ3 = α1 − d, solved by d = α1/2 for every α2. Its Jacobian weight is cos φ1 + cos φ3 = 2 cos d
 * (derived): rigidity is lost where it vanishes, on the line α1 = π, and F_u = −2 cos d is
 * negative exactly where cos d > 0 — the twisted-state criterion "singular where cos φ = 0,
 * stable iff cos φ > 0" of D. A. Wiley, S. H. Strogatz, M. Girvan, "The size of the sync basin",
 * Chaos 16, 015103 (2006), with the parallel couplings summed (derived).
 */
import { describe, expect, it } from 'vitest'
import { runMapSweep, verifyMapCells } from '../../../shared/maps'
import { doubledPhaseRing } from './fixtures'

const settings = { plane: 'alpha', x: { min: -1, max: 4, count: 11 }, y: { min: 0.2, max: 2.6, count: 5 } }
const doc = doubledPhaseRing([0.5, 1])

describe('phase ring in the (α1, α2) plane', () => {
  const map = runMapSweep(doc, settings)

  it('every row loses rigidity on α1 = π, located to 1e-8', () => {
    expect(map.rows).toHaveLength(5)
    for (const r of map.rows) {
      const lost = r.crossings.filter(c => c.kind === 'rigidity loss' || c.kind === 'branch point')
      expect(lost).toHaveLength(1)
      expect(Math.abs(lost[0]!.x - Math.PI)).toBeLessThan(1e-8)
    }
  })

  it('inertia follows the sign of cos d cell by cell', () => {
    for (const c of map.rows.flatMap(r => r.cells)) {
      expect(c.status).toBe('solved')
      const w = Math.cos(c.x / 2)
      expect(c.negativeEigenvalues).toBe(w > 0 ? 1 : 0)
      // the map shows the phase-rigidity verdict's margin (mean weight 1). With two length levels the
      // verdict is σ_min of the pinned square row Jacobian (H. Chen, M. Traizet, arXiv 2103.15676,
      // 2021, Def. 6.6: rank V − c); derived: that 1×1 matrix is −2w, so the margin is 2|w|
      expect(c.sigmaMin!).toBeCloseTo(2 * Math.abs(w), 6)
    }
    expect(verifyMapCells(doc, settings, map.rows.flatMap(r => r.cells)).verified).toBe(true)
  })
})
