/**
 * Horizontal balance as an interval system for the certificate. Torus only: unknowns are the
 * positions of vertices 1..V−1 (vertex 0 pinned: the translations, as in the rigidity verdict
 * and the lattice families), equations the balance B(v) = Σ_{h at v} u_h of those vertices; the
 * pinned vertex's equations follow because Σ_v B(v) = 0 identically without open wings. The
 * lattice is fixed, exactly the doubles given.
 * Enclosures: x_e = p_w + T(k_e) − p_v, u_e by the tight unit-vector range of ./interval.ts,
 * and J's blocks P_e/ℓ_e = [[u_y², −u_x u_y], [−u_x u_y, u_x²]]/ℓ_e (the projector of the
 * horizontal balance Jacobian; H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I",
 * arXiv 2103.15676, 2021, §4).
 */
import type { Lattice, PatternModel } from '../pattern/model'
import { add, div, hypot, interval, mul, neg, point, sqr, sub, unitVector, type Interval } from './interval'
import { pred, succ } from './round'
import { IntervalTripletBuilder, type IntervalSystem, type IntervalTriplets, type IntervalVector } from './system'

/** A lattice whose four components are intervals (a lattice path over an interval of λ). */
export interface LatticeBox { w1: [Interval, Interval]; w2: [Interval, Interval] }

/** The point lattice as a box. */
export function latticeBox(lat: Lattice): LatticeBox {
  return { w1: [point(lat.w1[0]), point(lat.w1[1])], w2: [point(lat.w2[0]), point(lat.w2[1])] }
}

/** Enclosure of the lattice translation T(k) = k1 ω1 + k2 ω2 (component c). */
function translation(k1: number, k2: number, lat: LatticeBox, c: 0 | 1): Interval {
  return add(mul(point(k1), lat.w1[c]), mul(point(k2), lat.w2[c]))
}

/** The block P_e/ℓ_e = [[u_y², −u_x u_y], [−u_x u_y, u_x²]]/ℓ_e over an edge-vector box: [a, b, c]. */
export function projectorOverLength(x: Interval, y: Interval): Interval[] {
  const l = hypot(x, y)
  const [ux, uy] = unitVector(x, y)
  return [div(sqr(uy), l), neg(div(mul(ux, uy), l)), div(sqr(ux), l)]
}

/**
 * Over the closed non-loop edges, with `edgeAt(e)` the edge vector at a point: the shortest length
 * (half of it bounds the radius: beyond, a box can hold a collapsed edge and J's enclosure is
 * unbounded) and 1/mean length (the natural scale of J).
 */
export function edgeLengthStats(m: PatternModel, edgeAt: (e: number) => [Interval, Interval]): { shortest: number; scale: number } {
  let shortest = Infinity, total = 0, count = 0
  for (let e = 0; e < m.nEdges; e++) {
    if (m.edgeFrom[e] === m.edgeTo[e]) continue
    const [ex, ey] = edgeAt(e)
    const l = Math.hypot(ex.lo, ey.lo)
    shortest = Math.min(shortest, l); total += l; count++
  }
  return { shortest, scale: count && total > 0 ? count / total : 1 }
}

/**
 * The reduced horizontal system of a torus model in lattice `lat` (a point lattice, or a box:
 * then the enclosures hold for every lattice in it), vertex 0 pinned at `pin`.
 */
export function horizontalSystem(m: PatternModel, lattice: Lattice | LatticeBox, pin: readonly [number, number]): IntervalSystem & { symmetric: true } {
  const lat = typeof lattice.w1[0] === 'number' ? latticeBox(lattice as Lattice) : lattice as LatticeBox
  if (m.space !== 'torus') throw new Error('certify: the horizontal certificate covers torus patterns')
  const V = m.nVertices, n = 2 * V - 2
  const T: [Interval, Interval][] = []
  for (let e = 0; e < m.nEdges; e++) {
    const k1 = m.shift[4 * e]!, k2 = m.shift[4 * e + 1]!
    T.push([translation(k1, k2, lat, 0), translation(k1, k2, lat, 1)])
  }
  /** Coordinate c of vertex v in the box (pinned vertex: a point). */
  const coord = (lo: Float64Array, hi: Float64Array, v: number, c: 0 | 1): Interval =>
    v === 0 ? point(pin[c]) : interval(lo[2 * v - 2 + c]!, hi[2 * v - 2 + c]!)
  /** Edge vector enclosure over the box. */
  const edge = (lo: Float64Array, hi: Float64Array, e: number): [Interval, Interval] => {
    const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
    return [0, 1].map(c => add(sub(coord(lo, hi, w, c as 0 | 1), coord(lo, hi, v, c as 0 | 1)), T[e]![c]!)) as [Interval, Interval]
  }
  const here = m.positions.subarray(2)
  return {
    n,
    symmetric: true,
    jacobianScale: edgeLengthStats(m, e => edge(here, here, e)).scale,
    residualEnclosure(x: Float64Array): IntervalVector {
      const lo = new Float64Array(n), hi = new Float64Array(n)
      const addTo = (v: number, c: number, s: number, u: Interval) => {
        if (v === 0) return
        const i = 2 * v - 2 + c
        lo[i] = pred(lo[i]! + (s > 0 ? u.lo : -u.hi))
        hi[i] = succ(hi[i]! + (s > 0 ? u.hi : -u.lo))
      }
      for (let e = 0; e < m.nEdges; e++) {
        const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
        if (v === w) continue
        const u = unitVector(...edge(x, x, e))
        for (const c of [0, 1]) { addTo(v, c, 1, u[c]!); addTo(w, c, -1, u[c]!) }
      }
      return { lo, hi }
    },
    jacobianEnclosure(lo: Float64Array, hi: Float64Array): IntervalTriplets {
      const b = new IntervalTripletBuilder(n, n, 16 * m.nEdges)
      const block = (i: number, j: number, s: 1 | -1, [a, bb, c]: Interval[]) => {
        if (i === 0 || j === 0) return
        const put = (r: number, k: number, q: Interval) => { const z = s > 0 ? q : neg(q); b.add(r, k, z.lo, z.hi) }
        put(2 * i - 2, 2 * j - 2, a!); put(2 * i - 2, 2 * j - 1, bb!)
        put(2 * i - 1, 2 * j - 2, bb!); put(2 * i - 1, 2 * j - 1, c!)
      }
      for (let e = 0; e < m.nEdges; e++) {
        const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
        if (v === w) continue
        const P = projectorOverLength(...edge(lo, hi, e))
        block(v, w, 1, P); block(w, v, 1, P); block(v, v, -1, P); block(w, w, -1, P)
      }
      return b.build()
    },
    maxRadius: (x: Float64Array): number => edgeLengthStats(m, e => edge(x, x, e)).shortest / 2,
  }
}
