/**
 * Plane balance as an interval system for the certificate, with the wing directions as unknowns
 * as in the published plane rigidity (H. Chen, "Gluing Karcher–Scherk saddle towers II: singly
 * periodic minimal surfaces", Comm. Anal. Geom. 32, 2024, Def. 1): rigid ⇔ M = [ℓ̄·J | R] has
 * rank 2V, and then the balanced drawings near the given one form, modulo translation, a manifold
 * D of dimension |R| − 2 (it contains rotation and scaling).
 *
 * Square reduction (our own, derived): J p = 0 (B is homogeneous of degree 0 in p, so scaling is
 * in ker J) and J annihilates translations, so the position columns of M have rank ≤ 2V − 3 and
 * rank 2V needs wing columns. We pin vertex 0 (translations) and add one linear scale equation
 * S(p) = Σ_{v ≥ 1} ⟨p̃_v − p̃_0, p_v⟩ − c = 0 (transverse to scaling, Σ|p̃_v − p̃_0|² ≠ 0), up to a
 * positive factor. Then QR with column pivoting on the float columns of [B-rows; S-row] (position
 * coordinates of vertices 1..V−1 and wing angles) picks 2V + 1 columns with independent
 * directions: these are the unknowns; every other position coordinate
 * and wing angle is held at its document value (a parameter). Equations:
 *   B(v) = Σ_{closed h at v} u_h + Σ_{wings r at v} (cos θ_r, sin θ_r) = 0 for every v (2V), S = 0.
 * A certificate proves exactly one zero of this square system in the box and an invertible
 * Jacobian there. Its 2V balance rows restricted to the free columns then have rank 2V at the
 * zero; they are columns of M (up to the factor ℓ̄ on J), so rank M = 2V: the drawing at the zero
 * is balanced (P5) and rigid (P6) in the published sense, and by the implicit function theorem
 * the balanced drawings near it form a manifold of dimension (2V − 2 + |R|) − (2V + 1) + 1 =
 * |R| − 2 modulo translation, parametrised by the held coordinates, the held angles and c. The
 * proof is at the held values exactly (one member of the family), not over a range of them. The wing angles of the
 * document are θ_r = atan2 of its stored directions (doubles), so every wing direction of the
 * proven drawing is an exact unit vector (cos θ_r, sin θ_r).
 * One tower (V = 1): no positions and no scale (a dilation is a translation there), two wing
 * angles solved for, |R| − 2 held.
 * Norm: max-norm of x, positions in the drawing's length units and angles in radians.
 */
import type { PatternModel } from '../pattern/model'
import { add, cos, interval, mul, neg, point, sin, sub, unitVector, type Interval } from './interval'
import { edgeLengthStats, projectorOverLength } from './horizontal'
import { IntervalTripletBuilder, type IntervalSystem, type IntervalTriplets, type IntervalVector } from './system'

/** The coordinates and wing angles solved for, and the reduced problem around the document drawing. */
export interface PlaneReduction {
  /** Indices j ≥ 2 into the 2V positions that are unknowns (the others are held at `p`). */
  freeCoords: number[]
  /** Wing indices whose angles are unknowns. */
  free: number[]
  /** The drawing (held coordinates and the pinned vertex 0). */
  p: Float64Array
  /** All wing angles (document values; the free ones are the starting point). */
  theta: Float64Array
  /** x̃: the free coordinates then the free angles. */
  x: Float64Array
  /** Position of the pinned vertex 0. */
  pin: [number, number]
}

/** Wing angles θ_r = atan2(dir_y, dir_x) of the document. */
export function wingAngles(m: PatternModel): Float64Array {
  return Float64Array.from({ length: m.nWings }, (_, r) => Math.atan2(m.wingDir[2 * r + 1]!, m.wingDir[2 * r]!))
}

/**
 * Chooses the unknowns by QR with column pivoting (G. H. Golub, C. F. Van Loan, Matrix
 * Computations, 4th ed., 2013, §5.4.2) on the float columns of M with the scale row,
 * [ℓ̄·J_o | R; ℓ̄·s | 0] (J_o: J without vertex 0's columns, s the scale row, ℓ̄ the mean closed-
 * edge length as in M): each step takes the column with the largest component outside the span
 * so far, until the 2V + 1 (one tower: 2) directions are spanned. Null when the largest remaining
 * component falls below `tol` relative to the largest column: then M has rank below 2V in
 * floating point (not rigid). The choice only conditions the proof; rigour never depends on it.
 */
export function choosePlaneReduction(m: PatternModel, p: Float64Array, J: (i: number, j: number) => number, tol = 1e-8): PlaneReduction | null {
  const V = m.nVertices, scaled = V > 1, rows = 2 * V + (scaled ? 1 : 0)
  const theta = wingAngles(m)
  const p0x = p[0]!, p0y = p[1]!
  let total = 0, count = 0
  for (let e = 0; e < m.nEdges; e++) {
    const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
    if (v !== w) { total += Math.hypot(p[2 * w]! - p[2 * v]!, p[2 * w + 1]! - p[2 * v + 1]!); count++ }
  }
  const lbar = count ? total / count : 1
  // candidate columns: position coordinates j = 2..2V−1, then wings
  const cols: Float64Array[] = []
  for (let j = 2; j < 2 * V; j++) {
    const c = new Float64Array(rows)
    for (let i = 0; i < 2 * V; i++) c[i] = lbar * J(i, j)
    if (scaled) c[2 * V] = p[j]! - (j % 2 ? p0y : p0x)
    cols.push(c)
  }
  for (let r = 0; r < m.nWings; r++) {
    const c = new Float64Array(rows), v = m.vertexOf[2 * m.nEdges + r]!
    c[2 * v] = -Math.sin(theta[r]!); c[2 * v + 1] = Math.cos(theta[r]!)
    cols.push(c)
  }
  const norm2 = (c: Float64Array) => { let t = 0; for (let i = 0; i < rows; i++) t += c[i]! * c[i]!; return t }
  // squared residual norms, downdated by each projection and recomputed when cancellation looms
  const n2 = cols.map(norm2), first = n2.slice()
  const top = Math.max(0, ...n2)
  const taken = new Uint8Array(cols.length)
  const chosen: number[] = []
  while (chosen.length < rows) {
    let best = -1
    for (let k = 0; k < cols.length; k++) if (!taken[k] && (best < 0 || n2[k]! > n2[best]!)) best = k
    if (best < 0) return null
    n2[best] = norm2(cols[best]!)
    if (!(n2[best]! > tol * tol * top)) return null
    taken[best] = 1; chosen.push(best)
    const q = cols[best]!, nq = Math.sqrt(n2[best]!)
    for (let i = 0; i < rows; i++) q[i]! /= nq
    for (let k = 0; k < cols.length; k++) {
      if (taken[k]) continue
      const c = cols[k]!
      let d = 0
      for (let i = 0; i < rows; i++) d += q[i]! * c[i]!
      if (d === 0) continue
      for (let i = 0; i < rows; i++) c[i]! -= d * q[i]!
      n2[k] = n2[k]! - d * d
      if (n2[k]! < 1e-6 * first[k]!) n2[k] = norm2(c)
    }
  }
  const nPos = 2 * V - 2
  const freeCoords = chosen.filter(k => k < nPos).map(k => k + 2).sort((a, b) => a - b)
  const free = chosen.filter(k => k >= nPos).map(k => k - nPos).sort((a, b) => a - b)
  const x = Float64Array.from([...freeCoords.map(j => p[j]!), ...free.map(r => theta[r]!)])
  return { freeCoords, free, p: Float64Array.from(p), theta, x, pin: [p0x, p0y] }
}

/** The square plane system of `red` (vertex 0 pinned at `red.pin`). */
export function planeSystem(m: PatternModel, red: PlaneReduction): IntervalSystem {
  if (m.space !== 'plane') throw new Error('certify: the plane certificate covers plane patterns')
  const V = m.nVertices, nc = red.freeCoords.length, n = nc + red.free.length, W = m.nWings, scaled = V > 1
  const pin = red.pin
  /** Unknown index of position coordinate j (2v + k), −1 when held. */
  const coordIndex = new Int32Array(2 * V).fill(-1)
  red.freeCoords.forEach((j, i) => { coordIndex[j] = i })
  const freeIndex = new Int32Array(W).fill(-1)
  red.free.forEach((r, k) => { freeIndex[r] = nc + k })
  const coord = (lo: Float64Array, hi: Float64Array, v: number, k: number): Interval => {
    const i = coordIndex[2 * v + k]!
    return i < 0 ? point(red.p[2 * v + k]!) : interval(lo[i]!, hi[i]!)
  }
  const edge = (lo: Float64Array, hi: Float64Array, e: number): [Interval, Interval] => {
    const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
    return [sub(coord(lo, hi, w, 0), coord(lo, hi, v, 0)), sub(coord(lo, hi, w, 1), coord(lo, hi, v, 1))]
  }
  const angle = (lo: Float64Array, hi: Float64Array, r: number): Interval =>
    freeIndex[r]! < 0 ? point(red.theta[r]!) : interval(lo[freeIndex[r]!]!, hi[freeIndex[r]!]!)
  const wingVertex = (r: number) => m.vertexOf[2 * m.nEdges + r]!
  // scale row over all coordinates of vertices 1..V−1: s_j = p̃_j − p̃_0; c = Σ s_j p̃_j is a fixed
  // double, so S = Σ s_j p_j − c is the scale equation whatever its rounding
  const stats = edgeLengthStats(m, e => edge(red.x, red.x, e))
  const s = Float64Array.from({ length: 2 * V }, (_, j) => (j < 2 ? 0 : red.p[j]! - pin[j % 2]!))
  // any multiple of the row is the same equation; this one has entries of J's size (1/mean length)
  // so that the condition estimate of the certificate measures the balance equations, not units
  const sMax = s.reduce((a, x) => Math.max(a, Math.abs(x)), 0)
  if (sMax > 0) for (let j = 2; j < 2 * V; j++) s[j] = (s[j]! / sMax) * stats.scale
  const c = s.reduce((acc, sj, j) => acc + sj * red.p[j]!, 0)
  return {
    n,
    jacobianScale: stats.scale,
    residualEnclosure(x: Float64Array): IntervalVector {
      const acc: Interval[] = Array.from({ length: n }, () => point(0))
      for (let e = 0; e < m.nEdges; e++) {
        const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
        if (v === w) continue
        const u = unitVector(...edge(x, x, e))
        for (const k of [0, 1]) { acc[2 * v + k] = add(acc[2 * v + k]!, u[k]!); acc[2 * w + k] = sub(acc[2 * w + k]!, u[k]!) }
      }
      for (let r = 0; r < W; r++) {
        const v = wingVertex(r), t = angle(x, x, r)
        acc[2 * v] = add(acc[2 * v]!, cos(t)); acc[2 * v + 1] = add(acc[2 * v + 1]!, sin(t))
      }
      if (scaled) {
        let scale = point(-c)
        for (let j = 2; j < 2 * V; j++) scale = add(scale, mul(point(s[j]!), coord(x, x, j >> 1, j & 1)))
        acc[2 * V] = scale
      }
      return { lo: Float64Array.from(acc, a => a.lo), hi: Float64Array.from(acc, a => a.hi) }
    },
    jacobianEnclosure(lo: Float64Array, hi: Float64Array): IntervalTriplets {
      const b = new IntervalTripletBuilder(n, n, 16 * m.nEdges + 2 * W + 2 * V)
      const put = (row: number, col: number, q: Interval) => b.add(row, col, q.lo, q.hi)
      const block = (i: number, j: number, sign: 1 | -1, P: Interval[]) => {
        const [a, bb, cc] = sign > 0 ? P : P.map(neg)
        const cx = coordIndex[2 * j]!, cy = coordIndex[2 * j + 1]!
        if (cx >= 0) { put(2 * i, cx, a!); put(2 * i + 1, cx, bb!) }
        if (cy >= 0) { put(2 * i, cy, bb!); put(2 * i + 1, cy, cc!) }
      }
      for (let e = 0; e < m.nEdges; e++) {
        const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
        if (v === w) continue
        const P = projectorOverLength(...edge(lo, hi, e))
        block(v, w, 1, P); block(w, v, 1, P); block(v, v, -1, P); block(w, w, -1, P)
      }
      for (let r = 0; r < W; r++) {
        const col = freeIndex[r]!
        if (col < 0) continue
        const v = wingVertex(r), t = angle(lo, hi, r)
        put(2 * v, col, neg(sin(t))); put(2 * v + 1, col, cos(t))
      }
      if (scaled) red.freeCoords.forEach((j, i) => b.add(2 * V, i, s[j]!, s[j]!))
      return b.build()
    },
    maxRadius: (x: Float64Array): number => Math.min(edgeLengthStats(m, e => edge(x, x, e)).shortest / 2, Math.PI / 2),
  }
}
