/**
 * The compiled numeric model of a pattern document: the rotation system (σ, ι) on half-edges
 * plus the geometric data in typed arrays, built once and shared by every numeric function
 * (balance, rigidity, phases, the continuation engine).
 *
 * Half-edge numbering: closed edge i owns half-edges 2i (at its `from` vertex) and 2i+1 (at its
 * `to` vertex); open wing j is half-edge 2E + j. ι swaps 2i ↔ 2i+1 and fixes wings.
 * The shift of half-edge 2i is the edge's shift k, of 2i+1 it is −k; wings have shift 0.
 */
import type { PatternDocument } from '../types/pattern'
import { halfEdgeRefs } from '../types/pattern'

/** A lattice as two plain vectors (the continuation parameter for lattice paths). */
export interface Lattice {
  w1: [number, number]
  w2: [number, number]
}

/** The compiled model; every array is indexed as documented on each field. */
export interface PatternModel {
  space: 'torus' | 'plane'
  nVertices: number
  /** Closed edges E. */
  nEdges: number
  /** Open wings W. */
  nWings: number
  /** Half-edges 2E + W. */
  nHalf: number
  /** Vertex of each half-edge. */
  vertexOf: Int32Array
  /** ι: the other end of a closed edge, or itself for a wing. */
  iota: Int32Array
  /** σ: the next half-edge counter-clockwise at the same vertex (wings included). */
  sigma: Int32Array
  /** Lattice shift of each half-edge, interleaved (k1, k2); length 2·nHalf. */
  shift: Int32Array
  /** Half-edges at each vertex in σ order: star(v) = starHalf[starStart[v] .. starStart[v+1]). */
  starStart: Int32Array
  starHalf: Int32Array
  edgeFrom: Int32Array
  edgeTo: Int32Array
  /** Phase weight K_e per closed edge. */
  weight: Float64Array
  /** Unit direction of each wing, interleaved (x, y); length 2·nWings. */
  wingDir: Float64Array
  vertexIds: string[]
  edgeIds: string[]
  wingIds: string[]
  /** Readable half-edge ids: `<edge>:from`, `<edge>:to`, or the wing id. */
  halfEdgeIds: string[]
  /** True when σ came from the document's `rotation`, false when read from the drawing. */
  rotationExplicit: boolean
  /** Positions of the document (2V, interleaved). */
  positions: Float64Array
  /** Lattice of the document (unit square placeholder in the plane; unused there). */
  lattice: Lattice
  /** Period phases α of the document (0, 0 when absent). */
  alpha: [number, number]
  /** Vertex phases ψ of the document (0 when absent). */
  psi: Float64Array
}

/** Edge vector x_h = p(v(ιh)) + T(k_h) − p(v(h)) of a closed half-edge, into out[0..1]. */
export function halfEdgeVector(
  m: PatternModel, p: Float64Array, lat: Lattice, h: number, out: Float64Array,
): void {
  const v = m.vertexOf[h]!, w = m.vertexOf[m.iota[h]!]!
  const k1 = m.shift[2 * h]!, k2 = m.shift[2 * h + 1]!
  out[0] = p[2 * w]! - p[2 * v]! + k1 * lat.w1[0] + k2 * lat.w2[0]
  out[1] = p[2 * w + 1]! - p[2 * v + 1]! + k1 * lat.w1[1] + k2 * lat.w2[1]
}

/** Direction of half-edge h (edge vector, or the wing's unit direction), into out[0..1]. */
export function halfEdgeDirection(
  m: PatternModel, p: Float64Array, lat: Lattice, h: number, out: Float64Array,
): void {
  if (h >= 2 * m.nEdges) {
    const j = h - 2 * m.nEdges
    out[0] = m.wingDir[2 * j]!
    out[1] = m.wingDir[2 * j + 1]!
  } else halfEdgeVector(m, p, lat, h, out)
}

/** Builds σ at each vertex by sorting directions by angle (ties: by half-edge number). */
function sigmaFromDrawing(m: PatternModel, stars: number[][]): void {
  const d = new Float64Array(2)
  for (const star of stars) {
    const angle = new Map<number, number>()
    for (const h of star) {
      halfEdgeDirection(m, m.positions, m.lattice, h, d)
      angle.set(h, Math.atan2(d[1]!, d[0]!))
    }
    star.sort((a, b) => angle.get(a)! - angle.get(b)! || a - b)
  }
}

/**
 * Compiles a parsed document (see `parsePatternDocument`) into the numeric model.
 * The document must already be valid; ids are trusted.
 */
export function compilePattern(doc: PatternDocument): PatternModel {
  const V = doc.vertices.length
  const E = doc.edges.length
  const wings = doc.wings ?? []
  const W = wings.length
  const nHalf = 2 * E + W
  const vIndex = new Map(doc.vertices.map((v, i) => [v.id, i]))
  const m: PatternModel = {
    space: doc.space,
    nVertices: V, nEdges: E, nWings: W, nHalf,
    vertexOf: new Int32Array(nHalf),
    iota: new Int32Array(nHalf),
    sigma: new Int32Array(nHalf),
    shift: new Int32Array(2 * nHalf),
    starStart: new Int32Array(V + 1),
    starHalf: new Int32Array(nHalf),
    edgeFrom: new Int32Array(E),
    edgeTo: new Int32Array(E),
    weight: new Float64Array(E),
    wingDir: new Float64Array(2 * W),
    vertexIds: doc.vertices.map(v => v.id),
    edgeIds: doc.edges.map(e => e.id),
    wingIds: wings.map(w => w.id),
    halfEdgeIds: [],
    rotationExplicit: doc.rotation !== undefined,
    positions: new Float64Array(doc.vertices.flatMap(v => v.position)),
    lattice: doc.lattice
      ? { w1: [...doc.lattice.w1], w2: [...doc.lattice.w2] }
      : { w1: [1, 0], w2: [0, 1] },
    alpha: doc.phases ? [...doc.phases.alpha] : [0, 0],
    psi: new Float64Array(doc.vertices.map(v => doc.phases?.vertexPhases?.[v.id] ?? 0)),
  }
  doc.edges.forEach((e, i) => {
    const f = vIndex.get(e.from)!, t = vIndex.get(e.to)!
    const [k1, k2] = e.shift ?? [0, 0]
    m.edgeFrom[i] = f; m.edgeTo[i] = t
    m.weight[i] = e.weight ?? 1
    m.vertexOf[2 * i] = f; m.vertexOf[2 * i + 1] = t
    m.iota[2 * i] = 2 * i + 1; m.iota[2 * i + 1] = 2 * i
    m.shift[4 * i] = k1; m.shift[4 * i + 1] = k2
    m.shift[4 * i + 2] = -k1; m.shift[4 * i + 3] = -k2
    m.halfEdgeIds.push(...halfEdgeRefs(e.id))
  })
  wings.forEach((w, j) => {
    const h = 2 * E + j
    const n = Math.hypot(w.direction[0], w.direction[1])
    m.vertexOf[h] = vIndex.get(w.vertex)!
    m.iota[h] = h
    m.wingDir[2 * j] = w.direction[0] / n
    m.wingDir[2 * j + 1] = w.direction[1] / n
    m.halfEdgeIds.push(w.id)
  })
  const stars: number[][] = Array.from({ length: V }, () => [])
  if (doc.rotation) {
    const hIndex = new Map(m.halfEdgeIds.map((id, h) => [id, h]))
    doc.vertices.forEach((v, i) => { stars[i] = doc.rotation![v.id]!.map(ref => hIndex.get(ref)!) })
  } else {
    for (let h = 0; h < nHalf; h++) stars[m.vertexOf[h]!]!.push(h)
    sigmaFromDrawing(m, stars)
  }
  let pos = 0
  stars.forEach((star, v) => {
    m.starStart[v] = pos
    star.forEach((h, j) => {
      m.starHalf[pos + j] = h
      m.sigma[h] = star[(j + 1) % star.length]!
    })
    pos += star.length
  })
  m.starStart[V] = pos
  return m
}

/** Degree of vertex v (wings included). */
export function degree(m: PatternModel, v: number): number {
  return m.starStart[v + 1]! - m.starStart[v]!
}
