/**
 * The report on the demo examples: expected verdicts (reasoned in each example's notes), a
 * JSON-serialisable object, explanations on failures, and the option check.
 */
import { describe, expect, it } from 'vitest'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { balancePattern } from '../../../shared/pattern/balance-solve'
import { PATTERN_EXAMPLES } from '../../../shared/examples'
import { parsePatternDocument } from '../../../shared/types/pattern'

const expectedFailing: Record<string, string[]> = {
  'square-pair': [],
  'three-line-weave': ['rigidity'],
  'two-line-knot': ['orientable'],
  'square-grid': ['rigidity'],
  'plane-bridge': [],
  'fermat-pair': ['degrees', 'orientable', 'balance'],
  // one vertex, three loops: each loop meets the tower from both sides (u and −u), so B = 0 for
  // every lattice; opposite half-edges sit three places apart in the rotation, so the alternating
  // signs give them opposite signs (orientable); E − V + 1 = 3 (derived here)
  'six-wing-lattice': [],
}

describe('analyzePattern on the examples', () => {
  for (const ex of PATTERN_EXAMPLES) {
    it(`${ex.slug}: failing verdicts, explanations, JSON round trip`, () => {
      const r = analyzePattern(ex.document)
      expect(r.summary.failing).toEqual(expectedFailing[ex.slug])
      for (const name of r.summary.failing) expect(r.verdicts[name].explanation).toMatch(/\.$/)
      for (const v of Object.values(r.verdicts)) if (v.ok) expect(v.explanation).toBeUndefined()
      expect(JSON.parse(JSON.stringify(r))).toEqual(r)
    })
  }

  it('square-pair: predicted genus 3, phases away from the mirror values, balanced vertically', () => {
    const r = analyzePattern(PATTERN_EXAMPLES[0]!.document)
    expect(r.summary.predictedGenus).toBe(3)
    expect(r.phases.keepsMirrorPlanes).toBe(false)
    expect(r.verdicts.phaseBalance.ok).toBe(true)
    expect(r.verdicts.phaseRigidity.ok).toBe(true)
  })

  it('six-wing-lattice: balanced, rigid and orientable in seeded random lattices (derived above)', () => {
    const ex = PATTERN_EXAMPLES.find(e => e.slug === 'six-wing-lattice')!
    let seed = 7
    const rnd = () => { seed = (seed * 16807) % 2147483647; return seed / 2147483647 }
    for (let k = 0; k < 20; k++) {
      const w2: [number, number] = [2 * rnd() - 1, 0.3 + rnd()]
      const r = analyzePattern({ ...ex.document, lattice: { w1: [1, 0], w2 } })
      expect(r.verdicts.balance.ok).toBe(true)
      expect(r.verdicts.orientable.ok).toBe(true)
      expect(r.summary.predictedGenus).toBe(3)
    }
  })

  it('the balanced Fermat pair passes balance and keeps its non-gluing verdicts', () => {
    const ex = PATTERN_EXAMPLES.find(e => e.slug === 'fermat-pair')!
    const b = balancePattern(ex.document)
    expect(b.converged).toBe(true)
    expect(analyzePattern(b.document).summary.failing).toEqual(['degrees', 'orientable'])
  })

  it('a single tower with four open wings: genus 0, four ends, every verdict holds, JSON-safe', () => {
    // Scherk's singly periodic surface: its quotient by the period is a sphere with four ends
    // (H. F. Scherk 1835; from memory)
    const doc = parsePatternDocument({
      format: 'wingfold-pattern', version: 1, name: 'one tower', space: 'plane',
      vertices: [{ id: 'a', position: [0, 0] }], edges: [],
      wings: [[1, 0], [0, 1], [-1, 0], [0, -1]].map((direction, i) => ({ id: `w${i}`, vertex: 'a', direction })),
    })
    const r = analyzePattern(doc)
    expect(r.summary.ok).toBe(true)
    expect([r.summary.predictedGenus, r.summary.openEnds]).toEqual([0, 4])
    expect(r.verdicts.edgeLengths.minLength).toBeNull()
    expect(JSON.parse(JSON.stringify(r))).toEqual(r)
  })

  it('rejects nonsense options with a clear message', () => {
    expect(() => analyzePattern(PATTERN_EXAMPLES[0]!.document, { balanceTolerance: -1 })).toThrow(/balanceTolerance/)
    expect(() => analyzePattern(PATTERN_EXAMPLES[0]!.document, { maxDenseVertices: 2.5 })).toThrow(/maxDenseVertices/)
  })
})
