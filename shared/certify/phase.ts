/**
 * Vertical (phase) balance as an interval system for the certificate, for any row form:
 * every published or earlier form of the phase equations is a list of rows
 *   F_r(ψ) = Σ_{(e, s) ∈ row r} s·K_e sin φ_e,   φ_e = ψ(to e) − ψ(from e) + k_e·α,
 * so the certificate takes the rows as data. Every certificate of Wingfold uses the published
 * rows: the cut-wise level form of vertical balance (H. Chen, M. Traizet, "Gluing Karcher–Scherk
 * saddle towers I", arXiv 2103.15676, 2021, Def. 6.2 and 6.6; H. Chen, Comm. Anal. Geom. 32,
 * 2024, Def. 2) built by shared/pattern/vertical-levels.ts (`modelPhaseRows`). Unknowns: ψ of
 * every vertex but the pinned ones (one per component, the global phase shift); α and K are
 * fixed doubles (or enclosures over a λ interval).
 * ∂F_r/∂ψ_u = Σ s·K_e cos φ_e ([to e = u] − [from e = u]).
 */
import type { Lattice, PatternModel } from '../pattern/model'
import { modelLevels } from '../pattern/vertical-balance'
import type { LevelStructure } from '../pattern/vertical-levels'
import { add, cos, interval, mul, point, sin, sub, type Interval } from './interval'
import { pred, succ } from './round'
import { IntervalTripletBuilder, type IntervalSystem, type IntervalTriplets, type IntervalVector } from './system'

/** One phase equation: closed edges with their signs. */
export type PhaseRow = { edge: number; sign: 1 | -1 }[]

/**
 * The published phase rows of a drawing: the level rows of vertical balance on cuts (one per
 * length level and merged component, signs +1 for edges leaving the component at their `from`
 * end) and one pinned vertex per component (the smallest, as the level structure drops it).
 * The level structure is read from the drawing's float lengths with the equal-length tolerance
 * of shared/pattern/vertical-levels.ts: the certificate proves a zero of THESE equations; which
 * edges share a level is the drawing's numerical verdict, not part of the proof.
 */
export function publishedPhaseRows(s: LevelStructure): { rows: PhaseRow[]; pinned: number[] } {
  return { rows: s.rows.map(r => r.terms.map(t => ({ edge: t.edge, sign: t.sign }))), pinned: [...s.pinned] }
}

/** The published phase rows of the model's drawing (positions p, lattice lat; the document's by default). */
export function modelPhaseRows(m: PatternModel, p: Float64Array = m.positions, lat: Lattice = m.lattice): { rows: PhaseRow[]; pinned: number[] } {
  return publishedPhaseRows(modelLevels(m, p, lat))
}

/** Data of a phase system: rows, pinned vertices and the fixed α, K, ψ of the pinned vertices. */
export interface PhaseSystemData {
  rows: PhaseRow[]
  /** Vertices whose ψ is held (default [0]); the others are the unknowns, in vertex order. */
  pinned?: number[]
  alpha: readonly [number, number]
  weights: Float64Array
  /** Full ψ (V) supplying the pinned values. */
  psi: Float64Array
  /** Enclosures replacing α and K (a phase path over an interval of λ). */
  alphaBox?: [Interval, Interval]
  weightBox?: Interval[]
}

/** The phase system as an interval system; its unknowns are ψ of the free vertices in order. */
export function phaseSystem(m: PatternModel, data: PhaseSystemData): IntervalSystem & { unknownOf: Int32Array; symmetric: boolean } {
  const pinned = new Set(data.pinned ?? [0])
  const unknownOf = new Int32Array(m.nVertices).fill(-1)
  let n = 0
  for (let v = 0; v < m.nVertices; v++) if (!pinned.has(v)) unknownOf[v] = n++
  if (data.rows.length !== n) throw new Error(`certify: ${data.rows.length} phase rows for ${n} unknowns`)
  const alpha = data.alphaBox ?? [point(data.alpha[0]), point(data.alpha[1])]
  const K = data.weightBox ?? Array.from(data.weights, k => point(k))
  const kAlpha: Interval[] = []
  for (let e = 0; e < m.nEdges; e++) kAlpha.push(add(mul(point(m.shift[4 * e]!), alpha[0]), mul(point(m.shift[4 * e + 1]!), alpha[1])))
  const psiOf = (lo: Float64Array, hi: Float64Array, v: number): Interval =>
    unknownOf[v]! < 0 ? point(data.psi[v]!) : interval(lo[unknownOf[v]!]!, hi[unknownOf[v]!]!)
  const phi = (lo: Float64Array, hi: Float64Array, e: number): Interval =>
    add(sub(psiOf(lo, hi, m.edgeTo[e]!), psiOf(lo, hi, m.edgeFrom[e]!)), kAlpha[e]!)
  const weighted = (e: number, f: Interval, s: number): Interval => mul(mul(point(s), K[e]!), f)
  return {
    n,
    unknownOf,
    symmetric: false,
    residualEnclosure(x: Float64Array): IntervalVector {
      const lo = new Float64Array(n), hi = new Float64Array(n)
      data.rows.forEach((row, r) => {
        let acc = point(0)
        for (const { edge, sign } of row) acc = add(acc, weighted(edge, sin(phi(x, x, edge)), sign))
        lo[r] = acc.lo; hi[r] = acc.hi
      })
      return { lo, hi }
    },
    jacobianEnclosure(lo: Float64Array, hi: Float64Array): IntervalTriplets {
      const b = new IntervalTripletBuilder(n, n, 2 * data.rows.reduce((s, row) => s + row.length, 0))
      data.rows.forEach((row, r) => {
        for (const { edge, sign } of row) {
          const c = weighted(edge, cos(phi(lo, hi, edge)), sign)
          const to = unknownOf[m.edgeTo[edge]!]!, from = unknownOf[m.edgeFrom[edge]!]!
          if (to >= 0) b.add(r, to, c.lo, c.hi)
          if (from >= 0) b.add(r, from, pred(-c.hi), succ(-c.lo))
        }
      })
      return b.build()
    },
    maxRadius: () => Math.PI,
    jacobianScale: data.weights.length ? data.weights.reduce((a, k) => a + Math.abs(k), 0) / data.weights.length : 1,
  }
}
