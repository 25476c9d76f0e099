/**
 * Walls on a τ map: Meeks' pattern [H. Chen, M. Traizet, arXiv 2103.15676, 2021, Ex. 7.1] with
 * ω1 = (1, 0) has its shortest edges e2, e4 for Re τ > 0 (acute) and e1, e3 for Re τ < 0
 * (obtuse): |ω1 ± ω2|² = 1 ± 2 Re τ + |τ|², so every row of the map crosses the wall Re τ = 0
 * (derived). Phases a = 2π/3, b = π/3 are not trivial, so the wall is recorded.
 */
import { describe, expect, it } from 'vitest'
import { runMapSweep } from '../../../shared/maps'
import { meeks } from '../pattern/published-patterns'

describe('walls on a τ map', () => {
  it('every row of Meeks crosses the wall Re τ = 0, located to 1e-7, and the cells stay solved', () => {
    const doc = meeks([1, 0], [-0.25, 1.3], 2 * Math.PI / 3, Math.PI / 3)
    const map = runMapSweep(doc, { plane: 'tau', x: { min: -0.25, max: 0.25, count: 6 }, y: { min: 1.1, max: 1.5, count: 3 } })
    for (const r of map.rows) {
      const walls = r.crossings.filter(c => c.kind === 'wall')
      expect(walls).toHaveLength(1)
      expect(Math.abs(walls[0]!.x)).toBeLessThan(1e-7)
      expect(r.cells.every(c => c.status === 'solved')).toBe(true)
    }
  })
})
