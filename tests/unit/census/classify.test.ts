import { describe, expect, it } from 'vitest'
import { classifyCensusMap } from '../../../shared/census/classify'
import { censusDocument, drawTorusMap } from '../../../shared/census/draw'
import { enumerateCensus } from '../../../shared/census/enumerate'
import { mapShape } from '../../../shared/census/map-code'
import { analyzePattern } from '../../../shared/pattern'
import { parsePatternDocument } from '../../../shared/types/pattern'

const census = [...enumerateCensus({ maxTowers: 3, maxHalfEdges: 14 })]

describe('census drawings', () => {
  it('close every face, cover the torus once and keep the rotation where no edge collapses', () => {
    let drawn = 0
    for (const p of census) {
      const sigma = Int32Array.from(p.sigma)
      const { positions, shifts } = drawTorusMap(sigma)
      const vOf = mapShape(sigma).vertices.of
      const collapsed = Array.from({ length: p.edges }, (_, e) => e).some(e => {
        const a = vOf[2 * e]!, b = vOf[2 * e + 1]!
        return Math.hypot(positions[2 * b]! + shifts[4 * e]! - positions[2 * a]!, positions[2 * b + 1]! + shifts[4 * e + 1]! - positions[2 * a + 1]!) < 1e-9
      })
      if (collapsed) continue
      drawn++
      const r = analyzePattern(parsePatternDocument(censusDocument(sigma, 'drawing')))
      // tree–cotree: every face sums to zero and the cycle shifts generate Z² (D. Eppstein, SODA 2003)
      expect(r.verdicts.faceClosure.ok).toBe(true)
      expect(r.verdicts.faceClosure.latticeIndex).toBe(1)
      // harmonic torus embedding keeps the rotation (S. Gortler, C. Gotsman, D. Thurston, CAGD 23, 2006)
      expect(r.verdicts.cyclicOrder.ok).toBe(true)
      expect(r.topology.predictedGenus).toBe(p.predictedGenus)
    }
    expect(drawn).toBeGreaterThan(census.length / 2)
  })
})

describe('census classification', () => {
  const classified = census.map(p => ({ p, c: classifyCensusMap(Int32Array.from(p.sigma), p.code) }))

  it('finds exactly the two published genus-3 graphs, both balanced and rigid', () => {
    // H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I", arXiv 2103.15676 (2021), Theorem C.1
    // and Examples 7.1 (two towers, four edges) and 7.2 (one tower, three loops): always balanced, rigid.
    const g3 = classified.filter(({ p }) => p.predictedGenus === 3)
    expect(g3.map(({ p }) => `${p.towers}/${p.edges}`).sort()).toEqual(['1/3', '2/4'])
    for (const { c } of g3) { expect(c.balanced).toBe(true); expect(c.rigid).toBe(true) }
    // W. H. Meeks (1990), no genus-2 minimal surfaces in flat 3-tori (from memory)
    expect(classified.some(({ p }) => p.predictedGenus < 3)).toBe(false)
  })

  it('gives phase kernel dimension 0 at trivial phases for every balanced pattern', () => {
    // all cos φ = 1 > 0 ⇒ phase-rigid for every K: H. Chen, M. Traizet (2021), Prop. 6.12
    const balanced = classified.filter(({ c }) => c.balanced)
    expect(balanced.length).toBeGreaterThan(5)
    for (const { c } of balanced) expect(c.phaseKernelDimension).toBe(0)
  })

  it('says why a pattern did not balance', () => {
    const failed = classified.filter(({ c }) => !c.balanced)
    expect(failed.length).toBeGreaterThan(0)
    for (const { c } of failed) { expect(c.reason).toMatch(/\w{4,}/); expect(c.rigid).toBeNull() }
  })

  it('the τ sweep of the two-tower genus-3 pattern reaches every cell of the fundamental domain, all rigid', () => {
    const meeks = census.find(p => p.towers === 2 && p.edges === 4)!
    const c = classifyCensusMap(Int32Array.from(meeks.sigma), 'two towers', { sweep: true, sweepGrid: 3 })
    // Meeks' example is balanced and rigid for every lattice: H. Chen, M. Traizet (2021), Ex. 7.1
    expect(c.sweep).toEqual({ cells: 9, solved: 9, rigid: 9 })
  })
})
