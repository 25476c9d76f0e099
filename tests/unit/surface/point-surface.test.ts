/**
 * The run page's surface at a point: the phases at a point of an α1 phase path, and the mirror
 * plane rule. A tower keeps horizontal mirror planes (Scherk's sin z = sinh x sinh y is symmetric
 * under z → π − z, H. F. Scherk 1835) and the glued surface keeps them when every phase
 * difference φ is 0 or π (derived: the towers' planes then sit at common heights mod π).
 */
import { describe, expect, it } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { parseFamilySettings } from '../../../shared/types/family'
import { keepsMirrorPlanes, withPhasesAtPoint } from '../../../app/utils/surface/point-surface'

describe('surface at a run point', () => {
  it('agrees with the analysis on which demo patterns keep their mirror planes', () => {
    for (const slug of ['square-pair', 'square-grid', 'plane-bridge', 'six-wing-lattice']) {
      const doc = findPatternExample(slug)!.document
      expect(keepsMirrorPlanes(doc), slug).toBe(analyzePattern(doc).phases.keepsMirrorPlanes)
    }
  })
  it('an α1 point carries α1 = λ and the vertex phases of u (vertex 0 pinned); φ follows', () => {
    const doc = findPatternExample('square-pair')!.document
    const at = withPhasesAtPoint(doc, doc, parseFamilySettings({ path: { kind: 'alpha1' }, to: 2 }), 1.7, [0.3])
    expect(at.phases!.alpha).toEqual([1.7, doc.phases!.alpha[1]])
    expect(at.phases!.vertexPhases).toEqual({ a: 0, b: 0.3 })
    // α = (π, 0), ψ = (0, 0): φ = ψ_b − ψ_a + k·α ∈ {0, −π} on the four diagonals (shifts (0,0), (−1,0), (0,−1), (−1,−1))
    const trivial = withPhasesAtPoint(doc, doc, parseFamilySettings({ path: { kind: 'alpha1' }, to: 4 }), Math.PI, [0])
    expect(keepsMirrorPlanes({ ...trivial, phases: { ...trivial.phases!, alpha: [Math.PI, 0] } })).toBe(true)
    expect(keepsMirrorPlanes(at)).toBe(false)
    expect(doc.phases!.alpha[0]).toBe(1.2) // the document itself is untouched
  })
})
