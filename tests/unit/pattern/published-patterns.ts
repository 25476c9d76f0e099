/**
 * Pattern documents built from the descriptions of published examples, for the tests of the
 * published existence conditions (core and CLI). Sources beside each builder:
 * [CT-I] H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I: triply periodic minimal
 *        surfaces", arXiv 2103.15676 (2021);
 * [C-II] H. Chen, "Gluing Karcher–Scherk saddle towers II: singly periodic minimal surfaces",
 *        Comm. Anal. Geom. 32 (2024) 2583–2615.
 */
import { parsePatternDocument, type PatternDocument } from '../../../shared/types/pattern'

type V2 = [number, number]

/**
 * Meeks' pattern [CT-I Ex. 7.1]: v at (ω1 + ω2)/2, w at 0, four edges v → w with shifts
 * (0,0), (1,0), (1,1), (0,1); ψ = (0, a), α = (−a − b, b − a) gives φ = (a, −b, −a, b).
 */
export function meeks(w1: V2, w2: V2, a: number, b: number, alpha?: V2, psiW?: number): PatternDocument {
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: 'meeks', space: 'torus',
    lattice: { w1, w2 },
    vertices: [{ id: 'v', position: [(w1[0] + w2[0]) / 2, (w1[1] + w2[1]) / 2] }, { id: 'w', position: [0, 0] }],
    edges: ([[0, 0], [1, 0], [1, 1], [0, 1]] as V2[]).map((shift, i) => ({ id: `e${i + 1}`, from: 'v', to: 'w', shift })),
    phases: { alpha: alpha ?? [-a - b, b - a], vertexPhases: { v: 0, w: psiW ?? a } },
  })
}

/** One tower with three loops [CT-I Ex. 7.2] in the hexagonal lattice. */
export function threeLoops(alpha: V2): PatternDocument {
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: 'three loops', space: 'torus',
    lattice: { w1: [1, 0], w2: [0.5, Math.sqrt(3) / 2] },
    vertices: [{ id: 'o', position: [0.2, 0.1] }],
    edges: ([[1, 0], [0, 1], [-1, 1]] as V2[]).map((shift, i) => ({ id: `l${i + 1}`, from: 'o', to: 'o', shift })),
    phases: { alpha },
  })
}

/**
 * Three lines in the torus with ω2/ω1 = e^{iπ/3} [CT-I Ex. 7.9]: the lines through the three
 * pairwise intersection points, each cut into two edges (V = 3, E = 6).
 */
export function threeLines(): PatternDocument {
  const h = Math.sqrt(3) / 2
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: 'three lines', space: 'torus',
    lattice: { w1: [1, 0], w2: [0.5, h] },
    vertices: [{ id: 'a', position: [0, 0] }, { id: 'b', position: [0.5, 0] }, { id: 'c', position: [0.25, h / 2] }],
    edges: [
      { id: 'ab', from: 'a', to: 'b' }, { id: 'ba', from: 'b', to: 'a', shift: [1, 0] },
      { id: 'ac', from: 'a', to: 'c' }, { id: 'ca', from: 'c', to: 'a', shift: [0, 1] },
      { id: 'bc', from: 'b', to: 'c' }, { id: 'cb', from: 'c', to: 'b', shift: [-1, 1] },
    ],
  })
}

/**
 * A triangle in the plane with its sides extended as six wings [C-II Ex. 7]: vertices p0, p1,
 * p2, edges along the sides, and at each vertex the two wings continuing the two sides.
 */
export function planeTriangle(p: [V2, V2, V2], psi: [number, number, number]): PatternDocument {
  const ids = ['p0', 'p1', 'p2']
  const dir = (from: V2, to: V2): V2 => { const d: V2 = [to[0] - from[0], to[1] - from[1]]; const l = Math.hypot(...d); return [d[0] / l, d[1] / l] }
  const wings = [0, 1, 2].flatMap(i => {
    const j = (i + 1) % 3, k = (i + 2) % 3
    // continue side (j → i) beyond i, and side (k → i) beyond i
    return [{ id: `w${i}${j}`, vertex: ids[i]!, direction: dir(p[j]!, p[i]!) }, { id: `w${i}${k}`, vertex: ids[i]!, direction: dir(p[k]!, p[i]!) }]
  })
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: 'triangle', space: 'plane',
    vertices: ids.map((id, i) => ({ id, position: p[i]! })),
    edges: [{ id: 's01', from: 'p0', to: 'p1' }, { id: 's12', from: 'p1', to: 'p2' }, { id: 's20', from: 'p2', to: 'p0' }],
    wings,
    phases: { alpha: [0, 0], vertexPhases: { p0: psi[0], p1: psi[1], p2: psi[2] } },
  })
}

/** The equilateral triangle of side 1 [C-II Ex. 7]. */
export const EQUILATERAL: [V2, V2, V2] = [[0, 0], [1, 0], [0.5, Math.sqrt(3) / 2]]

/**
 * Two towers joined by one edge [C-II Ex. 1]: each tower has the edge and three wings; the
 * wings at each end are the edge's continuation and a line across it (directions ±n).
 */
export function twoTowers(angle = 1.1): PatternDocument {
  const n: V2 = [Math.cos(angle), Math.sin(angle)]
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: 'two towers', space: 'plane',
    vertices: [{ id: 'l', position: [0, 0] }, { id: 'r', position: [1.5, 0] }],
    edges: [{ id: 'bridge', from: 'l', to: 'r' }],
    wings: [
      { id: 'l-out', vertex: 'l', direction: [-1, 0] }, { id: 'l-up', vertex: 'l', direction: n }, { id: 'l-down', vertex: 'l', direction: [-n[0], -n[1]] },
      { id: 'r-out', vertex: 'r', direction: [1, 0] }, { id: 'r-up', vertex: 'r', direction: n }, { id: 'r-down', vertex: 'r', direction: [-n[0], -n[1]] },
    ],
    phases: { alpha: [0, 0], vertexPhases: { l: 0, r: 0.7 } },
  })
}

/** One tower with four wings (Scherk's singly periodic surface) [C-II Ex. 1 discussion]. */
export function oneTower(): PatternDocument {
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: 'one tower', space: 'plane',
    vertices: [{ id: 'o', position: [0, 0] }], edges: [],
    wings: ([[1, 0], [0.3, 1], [-1, 0], [-0.3, -1]] as V2[]).map((direction, i) => ({ id: `w${i}`, vertex: 'o', direction })),
  })
}

/**
 * Four lines bounding a unit square (derived example): corners are the vertices, the sides the
 * edges, each corner carries the two wings continuing its sides outward.
 */
export function squareOfLines(): PatternDocument {
  const c: V2[] = [[0, 0], [1, 0], [1, 1], [0, 1]]
  const wings = c.flatMap((p, i) => {
    const next = c[(i + 1) % 4]!, prev = c[(i + 3) % 4]!
    return [
      { id: `q${i}a`, vertex: `c${i}`, direction: [p[0] - next[0], p[1] - next[1]] as V2 },
      { id: `q${i}b`, vertex: `c${i}`, direction: [p[0] - prev[0], p[1] - prev[1]] as V2 },
    ]
  })
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: 'square of lines', space: 'plane',
    vertices: c.map((position, i) => ({ id: `c${i}`, position })),
    edges: c.map((_, i) => ({ id: `s${i}`, from: `c${i}`, to: `c${(i + 1) % 4}` })),
    wings,
  })
}
