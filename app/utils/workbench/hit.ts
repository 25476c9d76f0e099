/**
 * Hit testing on the canvas: which vertex copy lies under a point. In the torus every vertex is
 * drawn in the fundamental domain and in its neighbouring copies; the copy hit carries the lattice
 * shift that a new edge to it receives. Pure functions.
 */
import type { PatternDocument } from '#shared/types/pattern'
import { latticePoint } from './lattice'
import type { Vec } from './view'

/** A vertex copy: vertex index, lattice shift of the copy, distance to the query point. */
export interface VertexHit {
  index: number
  shift: [number, number]
  distance: number
}

/**
 * The nearest vertex copy within `radius` (world units) of `p`, or null.
 * @param range copies with shifts in [−range, range]² are considered in the torus (default 1)
 */
export function hitVertex(doc: PatternDocument, p: Vec, radius: number, range = 1): VertexHit | null {
  let best: VertexHit | null = null
  const torus = doc.space === 'torus' && doc.lattice
  const r = torus ? range : 0
  for (let k1 = -r; k1 <= r; k1++) {
    for (let k2 = -r; k2 <= r; k2++) {
      const [ox, oy] = torus ? latticePoint(doc.lattice!, [k1, k2]) : [0, 0]
      doc.vertices.forEach((v, index) => {
        const d = Math.hypot(v.position[0] + ox - p[0], v.position[1] + oy - p[1])
        if (d <= radius && (!best || d < best.distance)) best = { index, shift: [k1, k2], distance: d }
      })
    }
  }
  return best
}

/** The end point of an edge: p(to) + k1 ω1 + k2 ω2. */
export function edgeEnd(doc: PatternDocument, to: number, shift: readonly [number, number] | undefined): Vec {
  const p = doc.vertices[to]!.position
  if (!shift || !doc.lattice) return [p[0], p[1]]
  const o = latticePoint(doc.lattice, shift)
  return [p[0] + o[0], p[1] + o[1]]
}

/** Indices of the vertices inside the axis-aligned box spanned by two world points. */
export function verticesInBox(doc: PatternDocument, a: Vec, b: Vec): number[] {
  const [x0, x1] = [Math.min(a[0], b[0]), Math.max(a[0], b[0])]
  const [y0, y1] = [Math.min(a[1], b[1]), Math.max(a[1], b[1])]
  return doc.vertices.flatMap((v, i) => (v.position[0] >= x0 && v.position[0] <= x1 && v.position[1] >= y0 && v.position[1] <= y1 ? [i] : []))
}

/** An id not yet used among `taken`: prefix + the smallest free positive integer. */
export function freshId(prefix: string, taken: Iterable<string>): string {
  const used = new Set(taken)
  let n = 1
  while (used.has(`${prefix}${n}`)) n++
  return `${prefix}${n}`
}
