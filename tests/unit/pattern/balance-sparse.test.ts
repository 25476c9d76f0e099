import { describe, expect, it } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import { balanceResidual } from '../../../shared/pattern/balance'
import { solveBalance } from '../../../shared/pattern/balance-solve'
import { compilePattern } from '../../../shared/pattern/model'
import { supercell } from '../../../shared/pattern/supercell'
import type { PatternDocument } from '../../../shared/types/pattern'
import { reportDeviation, seeded } from './helpers'

/** The document with every vertex moved by a seeded uniform offset in [−a, a]². */
function perturbed(doc: PatternDocument, a: number, seed: number): PatternDocument {
  const rnd = seeded(seed)
  return { ...doc, vertices: doc.vertices.map(v => ({ ...v, position: [v.position[0] + a * (2 * rnd() - 1), v.position[1] + a * (2 * rnd() - 1)] as [number, number] })) }
}

const maxDiff = (a: Float64Array, b: Float64Array): number => a.reduce((m, x, i) => Math.max(m, Math.abs(x - b[i]!)), 0)

// Reference: the dense regularised Newton step (ml-matrix 6.15 LU, and its SVD least squares in
// the plane) on the same equations. Both solve the same linear systems, so from the same start
// they must take the same iterates up to rounding, hence the same iteration count and drawing.
describe('balance solve: sparse LDLᵀ steps against the dense steps', () => {
  const cases: [string, PatternDocument][] = [
    ['six-wing 6×6 supercell (torus, rigid)', perturbed(supercell(findPatternExample('six-wing-lattice')!.document, 6, 6), 0.08, 1)],
    ['square grid 5×5 supercell (torus, non-rigid: the lines slide)', perturbed(supercell(findPatternExample('square-grid')!.document, 5, 5), 0.05, 2)],
    ['plane bridge (plane, scale row: least squares)', perturbed(findPatternExample('plane-bridge')!.document, 0.1, 3)],
  ]
  for (const [label, doc] of cases) {
    it(label, () => {
      const m = compilePattern(doc)
      const sparse = solveBalance(m, m.positions, m.lattice)
      const dense = solveBalance(m, m.positions, m.lattice, { linearSolver: 'dense' })
      expect(dense.converged).toBe(true)
      expect(dense.iterations).toBeGreaterThan(0)
      expect(sparse.converged).toBe(true)
      expect(Math.abs(sparse.iterations - dense.iterations)).toBeLessThanOrEqual(1)
      const dev = maxDiff(sparse.positions, dense.positions)
      reportDeviation(`balance ${label}: sparse vs dense final drawing`, 'dense ml-matrix Newton', dev)
      // the balanced drawings of a non-rigid pattern form a family: compare residuals there
      expect(Math.hypot(...balanceResidual(m, sparse.positions, m.lattice))).toBeLessThanOrEqual(1e-12)
      if (!label.includes('non-rigid')) expect(dev).toBeLessThan(1e-9)
    })
  }

  it('the Fermat point of the triangle 0, (2, 0), (1, 2) (classical Fermat–Torricelli)', () => {
    const doc = perturbed(findPatternExample('fermat-pair')!.document, 0.05, 4)
    const m = compilePattern(doc)
    const r = solveBalance(m, m.positions, m.lattice)
    expect(r.converged).toBe(true)
    // derived: the triangle is symmetric about x = 1, and the point sees the base (0,0)–(2,0)
    // under 120°, so it lies at height 1/tan 60° = 1/√3 (relative to the pinned corner)
    const p = r.positions
    expect(p[2]! - p[0]!).toBeCloseTo(1, 10)
    expect(p[3]! - p[1]!).toBeCloseTo(1 / Math.sqrt(3), 10)
  })
})
