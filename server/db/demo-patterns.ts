/**
 * Pattern documents drafted for the demo group on top of the core's examples (shared/examples):
 * each one is where a kind of special point genuinely occurs in a Wingfold family (see
 * demo-runs.ts). Invented scenario; the mathematics is cited where a closed form is used.
 */
import { findPatternExample } from '../../shared/examples'
import { parsePatternDocument, type PatternDocument } from '../../shared/types/pattern'

const SQRT3 = Math.sqrt(3)

/**
 * The square pair with ω2 leaning back by a quarter of ω1: tower b stays at the cell centre
 * (ω1 + ω2)/2, so it is balanced; the diagonals ne, sw are shorter than nw, se until a shear
 * of s = 1/4 makes the cell a square again (Re τ = 0, all four lengths tie: a wall).
 */
export function leaningSquarePair(): PatternDocument {
  const doc = structuredClone(findPatternExample('square-pair')!.document)
  doc.name = 'Leaning square pair'
  doc.notes = 'The square pair in a cell leaning back by a quarter period, phases as in the square pair. Drafted to see what happens to vertical balance when a shear makes the cell square again.'
  doc.lattice = { w1: [1, 0], w2: [-0.25, 1] }
  doc.vertices[1]!.position = [0.375, 0.5]
  return parsePatternDocument(doc)
}

/**
 * Four towers on a ring along ω1 = (4, 0), each joined to the next twice: by a short edge (e_i,
 * length 1) and by a long one with shift (0, 1) (l_i, length √(0.5² + 1.6²)). Every cut's shortest
 * edges are two short ones, so vertical balance is the weighted ring K_i sin φ_i = c of the short
 * edges; edge e0 has weight K = 3/5, the others 1. Degree 4 everywhere, orientable (the ring has
 * even length), balanced, rigid.
 */
export function weightedRingOfFour(): PatternDocument {
  const n = 4
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: 'Weighted ring of four', space: 'torus',
    notes: 'Four towers on a ring, each joined to the next by a short and a long edge; the short edge e0 carries phase weight 3/5. Drafted to find how far the period phase α1 can be pushed before the phases give out.',
    lattice: { w1: [n, 0], w2: [0.5, 1.6] },
    vertices: Array.from({ length: n }, (_, i) => ({ id: `v${i}`, position: [i, 0] })),
    edges: [
      ...Array.from({ length: n }, (_, i) => ({ id: `e${i}`, from: `v${i}`, to: `v${(i + 1) % n}`, ...(i === 0 ? { weight: 0.6 } : {}), ...(i === n - 1 ? { shift: [1, 0] } : {}) })),
      ...Array.from({ length: n }, (_, i) => ({ id: `l${i}`, from: `v${i}`, to: `v${(i + 1) % n}`, shift: i === n - 1 ? [1, 1] : [0, 1] })),
    ],
    phases: { alpha: [0, 0] },
    display: { tiles: [1, 3], showLattice: true },
  })
}

/**
 * The same ring of four with every weight 1, period phase α1 = 4π/3 and the twisted state
 * φ_i = π/3 on the short edges (all cos φ > 0: phase-rigid, H. Chen, M. Traizet, Gluing
 * Karcher–Scherk saddle towers I, arXiv 2103.15676, 2021, Prop. 6.12).
 */
export function evenRingOfFour(): PatternDocument {
  const doc = weightedRingOfFour()
  doc.name = 'Even ring of four'
  doc.notes = 'The ring of four with equal phase weights, twisted by a third of a turn per tower. Drafted to see which phase states survive when two opposite edges are made lighter.'
  for (const e of doc.edges) delete e.weight
  doc.phases = { alpha: [4 * Math.PI / 3, 0], vertexPhases: { v0: 0, v1: Math.PI / 3, v2: 2 * Math.PI / 3, v3: Math.PI } }
  return parsePatternDocument(doc)
}

/**
 * Five phase oscillators on a ring along ω1 = (5, 0), one edge between neighbours: degree 2, so
 * NOT a gluing pattern. Kept because its twisted states are the classical example of a phase
 * state losing rigidity (D. A. Wiley, S. H. Strogatz, M. Girvan, "The size of the sync basin",
 * Chaos 16, 015103, 2006).
 */
export function twistedRingOfFive(): PatternDocument {
  const n = 5
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: 'Twisted ring of five', space: 'torus',
    notes: 'Five phase oscillators on a ring (degree 2: not a gluing pattern). A phase-only test bed: the twisted state loses phase rigidity when every edge phase reaches a quarter turn.',
    lattice: { w1: [n, 0], w2: [0, 1] },
    vertices: Array.from({ length: n }, (_, i) => ({ id: `v${i}`, position: [i, 0] })),
    edges: Array.from({ length: n }, (_, i) => ({ id: `e${i}`, from: `v${i}`, to: `v${(i + 1) % n}`, ...(i === n - 1 ? { shift: [1, 0] } : {}) })),
    phases: { alpha: [0, 0] },
  })
}

/**
 * Three lines in the plane crossing in an equilateral triangle: three degree-4 towers, three
 * closed edges, six open wings, phases ψ = (0, 2π/3, −2π/3) (H. Chen, Gluing Karcher–Scherk saddle
 * towers II, Comm. Anal. Geom. 32 (2024), Ex. 7: balanced and phase-rigid).
 */
export function threeLineTriangle(): PatternDocument {
  const h = SQRT3 / 2
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: 'Three-line triangle', space: 'plane',
    notes: 'Three straight lines meeting in an equilateral triangle, each tower turned a third of a period from the last. Drafted as the smallest plane pattern with phases away from 0 and π.',
    vertices: [{ id: 'p', position: [0, 0] }, { id: 'q', position: [1, 0] }, { id: 'r', position: [0.5, h] }],
    edges: [{ id: 'pq', from: 'p', to: 'q' }, { id: 'qr', from: 'q', to: 'r' }, { id: 'rp', from: 'r', to: 'p' }],
    wings: [
      { id: 'p-west', vertex: 'p', direction: [-1, 0] }, { id: 'p-down', vertex: 'p', direction: [-0.5, -h] },
      { id: 'q-east', vertex: 'q', direction: [1, 0] }, { id: 'q-down', vertex: 'q', direction: [0.5, -h] },
      { id: 'r-right', vertex: 'r', direction: [0.5, h] }, { id: 'r-left', vertex: 'r', direction: [-0.5, h] },
    ],
    phases: { alpha: [0, 0], vertexPhases: { p: 0, q: 2 * Math.PI / 3, r: -2 * Math.PI / 3 } },
    display: { showLabels: true },
  })
}
