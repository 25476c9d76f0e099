/**
 * Vertical balance on cuts, evaluated on the level rows of vertical-levels.ts (H. Chen,
 * M. Traizet, arXiv 2103.15676, 2021, Def. 6.2 and Def. 6.6; H. Chen, Comm. Anal. Geom. 32,
 * 2024, Def. 2). With φ_e = ψ(to) − ψ(from) + k_e·α, a row (X, t) is
 *   F_{X,t} = Σ_{terms} s·K_e sin φ_e,
 *   ∂F/∂ψ_u = Σ s·K_e cos φ_e ([to(e) = u] − [from(e) = u]),   ∂F/∂α_i = Σ s·K_e cos φ_e k_{e,i}.
 * For a single level the rows are the vertex sums G(v) of phases.ts without the smallest vertex.
 */
import { TripletBuilder, type Triplets } from '../linalg/triplets'
import { edgeLengths } from './geometry'
import type { Lattice, PatternModel } from './model'
import { phaseDifferences } from './phases'
import { LEVEL_TOLERANCE, levelStructure, type LevelStructure } from './vertical-levels'

/** The level structure of the drawing (p, lat) of a model (document drawing by default). */
export function modelLevels(m: PatternModel, p: Float64Array = m.positions, lat: Lattice = m.lattice, tol = LEVEL_TOLERANCE): LevelStructure {
  return levelStructure(m, edgeLengths(m, p, lat), tol)
}

/** F (one entry per row) into `out`. */
export function levelResidual(
  m: PatternModel, s: LevelStructure, psi: Float64Array, alpha: readonly [number, number], weights: Float64Array,
  out: Float64Array = new Float64Array(s.rows.length),
): Float64Array {
  const phi = phaseDifferences(m, psi, alpha)
  s.rows.forEach((r, i) => {
    let f = 0
    for (const t of r.terms) f += t.sign * weights[t.edge]! * Math.sin(phi[t.edge]!)
    out[i] = f
  })
  return out
}

/** ∂F/∂ψ as rows × V triplets (duplicates sum). */
export function levelJacobian(
  m: PatternModel, s: LevelStructure, psi: Float64Array, alpha: readonly [number, number], weights: Float64Array,
): Triplets {
  const phi = phaseDifferences(m, psi, alpha)
  const b = new TripletBuilder(s.rows.length, m.nVertices, 2 * s.rows.reduce((n, r) => n + r.terms.length, 0))
  s.rows.forEach((r, i) => {
    for (const t of r.terms) {
      const c = t.sign * weights[t.edge]! * Math.cos(phi[t.edge]!)
      b.add(i, m.edgeTo[t.edge]!, c)
      b.add(i, m.edgeFrom[t.edge]!, -c)
    }
  })
  return b.build()
}

/** ∂F/∂(α1, α2): dense rows × 2, row-major (entry (i, j) at out[2i + j]). */
export function levelAlphaDerivative(
  m: PatternModel, s: LevelStructure, psi: Float64Array, alpha: readonly [number, number], weights: Float64Array,
  out: Float64Array = new Float64Array(2 * s.rows.length),
): Float64Array {
  out.fill(0)
  const phi = phaseDifferences(m, psi, alpha)
  s.rows.forEach((r, i) => {
    for (const t of r.terms) {
      const c = t.sign * weights[t.edge]! * Math.cos(phi[t.edge]!)
      out[2 * i]! += c * m.shift[4 * t.edge]!
      out[2 * i + 1]! += c * m.shift[4 * t.edge + 1]!
    }
  })
  return out
}

/** |sin φ| above this counts as a non-zero term for "depends on K". */
export const K_TERM_TOLERANCE = 1e-9

/**
 * Rows with two or more terms whose sin φ is non-zero: there the verdict depends on the ratios of
 * the K of equal-length edges, which the product takes as given (default 1).
 */
export function rowsDependingOnK(m: PatternModel, s: LevelStructure, psi: Float64Array, alpha: readonly [number, number]): number[] {
  const phi = phaseDifferences(m, psi, alpha)
  return s.rows.flatMap((r, i) => (r.terms.filter(t => Math.abs(Math.sin(phi[t.edge]!)) > K_TERM_TOLERANCE).length >= 2 ? [i] : []))
}
