/**
 * (α1, α2) map of a ring of two phase oscillators with doubled couplings (fixtures.ts). On the
 * state d = α1/2 the Jacobian weight is Σ cos φ_e = 2[cos d + cos(d + α2)]: rigidity is lost
 * where it vanishes, i.e. on the line α1 + α2 = π (and α2 = π), and F_u = −(that weight) has one
 * negative eigenvalue exactly where the weight is positive. This is the twisted-state criterion
 * "singular where cos φ = 0, stable iff cos φ > 0" of D. A. Wiley, S. H. Strogatz, M. Girvan,
 * "The size of the sync basin", Chaos 16, 015103 (2006), with parallel couplings summed (derived).
 */
import { describe, expect, it } from 'vitest'
import { runMapSweep, verifyMapCells } from '../../../shared/maps'
import { doubledPhaseRing } from './fixtures'

const settings = { plane: 'alpha', x: { min: -1, max: 3, count: 9 }, y: { min: 0.2, max: 2.6, count: 5 } }
const doc = doubledPhaseRing([0.5, 1])

describe('phase ring in the (α1, α2) plane', () => {
  const map = runMapSweep(doc, settings)

  it('every row loses rigidity on α1 + α2 = π, located to 1e-8', () => {
    expect(map.rows).toHaveLength(5)
    for (const r of map.rows) {
      const lost = r.crossings.filter(c => c.kind === 'rigidity loss' || c.kind === 'branch point')
      expect(lost).toHaveLength(1)
      expect(Math.abs(lost[0]!.x - (Math.PI - r.y))).toBeLessThan(1e-8)
    }
  })

  it('inertia follows the sign of cos d + cos(d + α2) cell by cell', () => {
    for (const c of map.rows.flatMap(r => r.cells)) {
      expect(c.status).toBe('solved')
      const w = Math.cos(c.x / 2) + Math.cos(c.x / 2 + c.y)
      expect(c.negativeEigenvalues).toBe(w > 0 ? 1 : 0)
      // the map shows the phase-rigidity margin (σ_min on non-constant ψ, mean weight 1). Derived:
      // the 1×1 F_u is −2w, so the full Jacobian is −2w·[[1, −1], [−1, 1]], whose eigenvalue on
      // (1, −1)/√2 is −4w
      expect(c.sigmaMin!).toBeCloseTo(4 * Math.abs(w), 6)
    }
    expect(verifyMapCells(doc, settings, map.rows.flatMap(r => r.cells)).verified).toBe(true)
  })
})
