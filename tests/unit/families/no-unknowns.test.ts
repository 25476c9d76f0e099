/**
 * A one-tower pattern has no free unknowns: families and maps walk the path and say so, instead
 * of failing in the engine. The six-wing lattice: one vertex, three loops along ω1, ω2, ω2 − ω1.
 * Every lattice balances it, B = Σ u_h over both ends of each loop = 0, and every α balances its
 * phases, sin(k·α) + sin(−k·α) = 0 (derived), so each point of any path is a solution.
 */
import { describe, expect, it } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import { FamilyRunner, NO_UNKNOWNS_NOTE, verifyFamilyPoints } from '../../../shared/families'
import { runMapSweep } from '../../../shared/maps'

const doc = findPatternExample('six-wing-lattice')!.document

function runToEnd(settings: ConstructorParameters<typeof FamilyRunner>[1]) {
  const r = new FamilyRunner(doc, settings)
  while (!r.done) r.step({ points: 1000, ms: 60_000 })
  return r.result()
}

describe('six-wing lattice (no free unknowns)', () => {
  it('a shear walks the path to its target and says why there is nothing to solve', () => {
    const r = runToEnd({ path: { kind: 'shear' }, to: 1 })
    expect(r.status).toBe('finished')
    expect(r.startNote).toBe(NO_UNKNOWNS_NOTE)
    expect(r.startNote).toMatch(/no free unknowns/)
    expect(r.branch.specialPoints.map(s => s.kind)).toEqual(['bound'])
    expect(r.branch.points.at(-1)!.lambda).toBe(1)
    // the numbers along the path: ω2 = ω2⁰ + s·ω1, so Re τ = 0.5 + s (ω1 = (1, 0))
    for (const p of r.branch.points) expect(p.diagnostics!.tauRe).toBeCloseTo(0.5 + p.lambda, 12)
    // and every point passes the server's re-check
    expect(verifyFamilyPoints(doc, r.settings, r.branch.points).verified).toBe(true)
  })

  it('an α1 path reaches its target with α1 = λ at every point', () => {
    const r = runToEnd({ path: { kind: 'alpha1' }, to: 2 })
    expect(r.status).toBe('finished')
    expect(r.branch.points.at(-1)!.lambda).toBe(2)
    for (const p of r.branch.points) expect(p.diagnostics!.alpha1).toBeCloseTo(p.lambda, 12)
  })

  it('a τ map solves every cell of a window of valid lattices', () => {
    const map = runMapSweep(doc, { plane: 'tau', x: { min: -0.5, max: 1, count: 4 }, y: { min: 0.4, max: 1.2, count: 3 } })
    const cells = map.rows.flatMap(r => r.cells)
    expect(cells).toHaveLength(12)
    expect(cells.every(c => c.status === 'solved' && c.residualNorm === 0)).toBe(true)
  })
})
