/**
 * A straight-line torus drawing of a census map, as a pattern document.
 *
 * 1. Shifts from a tree–cotree decomposition (D. Eppstein, "Dynamic generators of topologically
 *    embedded graphs", SODA 2003): a spanning tree T, a spanning tree C of the dual on the edges
 *    not in T, and the 2g = 2 leftover edges, whose fundamental cycles in T form a basis of the
 *    torus' first homology. Tree edges get k = 0, the leftovers k = (1, 0) and (0, 1), and the
 *    cotree edges are solved leaf by leaf of C so that every face sums to zero. The cycle shifts
 *    then generate Z² (index 1: the drawing covers the torus once).
 * 2. Positions from the harmonic (genus-one Tutte) embedding (S. Gortler, C. Gotsman, D. Thurston,
 *    "Discrete one-forms on meshes and applications to 3D mesh parameterization", CAGD 23, 2006):
 *    each vertex at the mean of its neighbours' lifts, Σ_{h at v} (p(v(ιh)) + T(k_h) − p(v)) = 0,
 *    with vertex 0 pinned at the origin; a dense solve (census patterns have a few towers).
 * 3. Orientation: faces of a counter-clockwise rotation system are walked clockwise (φ = σ∘ι turns
 *    right), so the signed face areas must add up to −det(ω1, ω2); if they add up to +det, the
 *    homology basis was reversed and k = (k1, k2) becomes (k2, k1).
 */
import { Matrix, solve } from 'ml-matrix'
import { halfEdgeRefs, PATTERN_FORMAT, PATTERN_VERSION, type PatternDocument } from '../types/pattern'
import { mapShape } from './map-code'

/** A lattice {w1, w2} with det > 0. */
export interface CensusLattice { w1: [number, number], w2: [number, number] }

export const SQUARE_LATTICE: CensusLattice = { w1: [1, 0], w2: [0, 1] }

/** Integer shifts k_h per dart (interleaved k1, k2) from the tree–cotree decomposition. */
export function treeCotreeShifts(sigma: Int32Array): Int32Array {
  const n = sigma.length, E = n / 2
  const sh = mapShape(sigma)
  if (sh.genus !== 1) throw new Error('tree–cotree shifts are defined here for torus maps only')
  const vOf = sh.vertices.of, fOf = sh.faces.of
  const inTree = new Uint8Array(E), inCotree = new Uint8Array(E)
  // spanning tree by BFS over vertices
  const seenV = new Uint8Array(sh.vertices.count); seenV[0] = 1
  const queue = [0]
  const dartsAt: number[][] = Array.from({ length: sh.vertices.count }, () => [])
  for (let d = 0; d < n; d++) dartsAt[vOf[d]!]!.push(d)
  while (queue.length) {
    const v = queue.shift()!
    for (const d of dartsAt[v]!) {
      const w = vOf[d ^ 1]!
      if (!seenV[w]) { seenV[w] = 1; inTree[d >> 1] = 1; queue.push(w) }
    }
  }
  // dual spanning tree on the other edges, BFS from face 0; parentDart[f] = dart of f on its parent edge
  const dartsIn: number[][] = Array.from({ length: sh.faces.count }, () => [])
  for (let d = 0; d < n; d++) dartsIn[fOf[d]!]!.push(d)
  const seenF = new Uint8Array(sh.faces.count); seenF[0] = 1
  const parentDart = new Int32Array(sh.faces.count).fill(-1)
  const orderF = [0]
  for (let i = 0; i < orderF.length; i++) {
    for (const d of dartsIn[orderF[i]!]!) {
      if (inTree[d >> 1]) continue
      const g = fOf[d ^ 1]!
      if (!seenF[g]) { seenF[g] = 1; inCotree[d >> 1] = 1; parentDart[g] = d ^ 1; orderF.push(g) }
    }
  }
  const k = new Int32Array(2 * n)
  const known = new Uint8Array(E)
  let basis = 0
  for (let e = 0; e < E; e++) {
    if (inTree[e]) { known[e] = 1; continue }
    if (inCotree[e]) continue
    k[4 * e + basis] = 1; k[4 * e + 2 + basis] = -1; known[e] = 1; basis++
  }
  if (basis !== 2) throw new Error(`expected 2 leftover edges on the torus, found ${basis}`)
  for (let i = orderF.length - 1; i > 0; i--) {
    const f = orderF[i]!, pd = parentDart[f]!
    let s1 = 0, s2 = 0
    for (const d of dartsIn[f]!) if (d !== pd) { s1 += k[2 * d]!; s2 += k[2 * d + 1]! }
    k[2 * pd] = -s1; k[2 * pd + 1] = -s2
    k[2 * (pd ^ 1)] = s1; k[2 * (pd ^ 1) + 1] = s2
    known[pd >> 1] = 1
  }
  return k
}

/** Harmonic positions (2V, interleaved) for shifts k on lattice lat; vertex 0 at the origin. */
export function harmonicPositions(sigma: Int32Array, k: Int32Array, lat: CensusLattice): Float64Array {
  const sh = mapShape(sigma)
  const V = sh.vertices.count, vOf = sh.vertices.of
  const p = new Float64Array(2 * V)
  if (V === 1) return p
  const L = Matrix.zeros(V - 1, V - 1), b = Matrix.zeros(V - 1, 2)
  for (let d = 0; d < sigma.length; d++) {
    const v = vOf[d]!, w = vOf[d ^ 1]!
    if (v === 0) continue
    const tx = k[2 * d]! * lat.w1[0] + k[2 * d + 1]! * lat.w2[0]
    const ty = k[2 * d]! * lat.w1[1] + k[2 * d + 1]! * lat.w2[1]
    L.set(v - 1, v - 1, L.get(v - 1, v - 1) + 1)
    if (w !== 0) L.set(v - 1, w - 1, L.get(v - 1, w - 1) - 1)
    b.set(v - 1, 0, b.get(v - 1, 0) + tx)
    b.set(v - 1, 1, b.get(v - 1, 1) + ty)
  }
  const x = solve(L, b)
  for (let v = 1; v < V; v++) { p[2 * v] = x.get(v - 1, 0); p[2 * v + 1] = x.get(v - 1, 1) }
  return p
}

/** Σ over faces of the signed area of each face polygon walked in the cover. */
export function signedFaceArea(sigma: Int32Array, k: Int32Array, p: Float64Array, lat: CensusLattice): number {
  const sh = mapShape(sigma), vOf = sh.vertices.of
  const n = sigma.length
  const done = new Uint8Array(n)
  let total = 0
  for (let start = 0; start < n; start++) {
    if (done[start]) continue
    let h = start, x = p[2 * vOf[h]!]!, y = p[2 * vOf[h]! + 1]!, area = 0
    while (!done[h]) {
      done[h] = 1
      const w = vOf[h ^ 1]!
      const tx = k[2 * h]! * lat.w1[0] + k[2 * h + 1]! * lat.w2[0]
      const ty = k[2 * h]! * lat.w1[1] + k[2 * h + 1]! * lat.w2[1]
      const dx = p[2 * w]! + tx - p[2 * vOf[h]!]!, dy = p[2 * w + 1]! + ty - p[2 * vOf[h]! + 1]!
      area += (x * (y + dy) - (x + dx) * y) / 2
      x += dx; y += dy
      h = sigma[h ^ 1]!
    }
    total += area
  }
  return total
}

/** Shifts and positions of the straight-line drawing, orientation matched to σ. */
export function drawTorusMap(sigma: Int32Array, lat: CensusLattice = SQUARE_LATTICE): { shifts: Int32Array, positions: Float64Array } {
  let k = treeCotreeShifts(sigma)
  let p = harmonicPositions(sigma, k, lat)
  if (signedFaceArea(sigma, k, p, lat) > 0) {
    const swapped = new Int32Array(k.length)
    for (let d = 0; d < sigma.length; d++) { swapped[2 * d] = k[2 * d + 1]!; swapped[2 * d + 1] = k[2 * d]! }
    k = swapped
    p = harmonicPositions(sigma, k, lat)
  }
  return { shifts: k, positions: p }
}

/** The census map as a pattern document (explicit rotation, K = 1, trivial phases). */
export function censusDocument(sigma: Int32Array, name: string, lat: CensusLattice = SQUARE_LATTICE): PatternDocument {
  const { shifts, positions } = drawTorusMap(sigma, lat)
  const vOf = mapShape(sigma).vertices.of
  const V = positions.length / 2, E = sigma.length / 2
  const vid = (v: number) => `t${v + 1}`
  const ref = (d: number) => halfEdgeRefs(`e${(d >> 1) + 1}`)[d & 1]!
  const rotation: Record<string, string[]> = {}
  const seen = new Uint8Array(sigma.length)
  for (let d = 0; d < sigma.length; d++) {
    if (seen[d]) continue
    const cycle: string[] = []
    for (let x = d; !seen[x]; x = sigma[x]!) { seen[x] = 1; cycle.push(ref(x)) }
    rotation[vid(vOf[d]!)] = cycle
  }
  return {
    format: PATTERN_FORMAT, version: PATTERN_VERSION, name, space: 'torus',
    lattice: { w1: [...lat.w1], w2: [...lat.w2] },
    vertices: Array.from({ length: V }, (_, v) => ({ id: vid(v), position: [positions[2 * v]!, positions[2 * v + 1]!] as [number, number] })),
    edges: Array.from({ length: E }, (_, e) => ({
      id: `e${e + 1}`, from: vid(vOf[2 * e]!), to: vid(vOf[2 * e + 1]!),
      shift: [shifts[4 * e]!, shifts[4 * e + 1]!] as [number, number],
    })),
    rotation,
  }
}
