/** Test patterns of the map tests (invented geometry; the closed forms are cited in the tests). */
import { parsePatternDocument, type PatternDocument } from '../../../shared/types/pattern'

/**
 * Two phase oscillators on a ring through the torus, every coupling doubled: a → b with shifts
 * (0, 0) and (0, 1), b → a with shifts (1, 0) and (1, 1). With d = ψ_b − ψ_a the state
 * d = α1/2 is balanced for every (α1, α2), and F_u = −2K[cos d + cos(d + α2)]
 * = −4K cos(α2/2) cos((α1 + α2)/2) there (derived here).
 */
export function doubledPhaseRing(alpha: [number, number]): PatternDocument {
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: 'doubled phase ring', space: 'torus',
    lattice: { w1: [2, 0], w2: [0.4, 1.7] },
    vertices: [{ id: 'a', position: [0, 0] }, { id: 'b', position: [1, 0.3] }],
    edges: [
      { id: 'e1', from: 'a', to: 'b' },
      { id: 'e2', from: 'a', to: 'b', shift: [0, 1] },
      { id: 'e3', from: 'b', to: 'a', shift: [1, 0] },
      { id: 'e4', from: 'b', to: 'a', shift: [1, 1] },
    ],
    phases: { alpha, vertexPhases: { b: alpha[0] / 2 } },
  })
}
