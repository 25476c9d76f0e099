/**
 * Rigidity of a drawing (docs/theory.md §4). The trivial kernel of J = ∂B/∂p is removed by
 * restricting J to the orthogonal complement of
 *   torus: the two translations;
 *   plane: the two translations and the dilation p ↦ p (B only sees directions).
 * The reduced matrix is symmetric; its eigenvalues times the mean edge length ℓ̄ are
 * dimensionless (J scales like 1/length). σ_min·ℓ̄ and the inertia decide rigidity; the kernel
 * mode (a parallel redrawing: every edge keeps its direction) is the eigenvector of min |λ|.
 */
import type { Lattice, PatternModel } from './model'
import { balanceJacobian } from './balance'
import { meanEdgeLength } from './geometry'
import type { Inertia } from '../linalg/ldlt'
import { inertiaOf, reducedSpectrum } from './spectrum'
import { pinnedCoordinates, sparseRigidity } from './rigidity-sparse'

/** [dx, dy] per vertex from an interleaved vector. */
function pairs(x: ArrayLike<number>): [number, number][] {
  const out: [number, number][] = []
  for (let v = 0; v < x.length / 2; v++) out.push([x[2 * v]!, x[2 * v + 1]!])
  return out
}

/** Options; defaults in `DEFAULT_RIGIDITY_OPTIONS`. */
export interface RigidityOptions {
  /** Dimensionless threshold: rigid iff σ_min·ℓ̄ > tolerance; also the inertia's zero band. */
  tolerance?: number
  /** 'auto' (default): dense up to `maxDenseVertices`, sparse above; or force one. */
  method?: 'auto' | 'dense' | 'sparse'
  /** Above this vertex count 'auto' uses the sparse method (rigidity-sparse.ts); default 32 (faster from ~30, `npm run bench`). */
  maxDenseVertices?: number
}

export const DEFAULT_RIGIDITY_OPTIONS: Required<RigidityOptions> = {
  tolerance: 1e-7,
  method: 'auto',
  maxDenseVertices: 32,
}

/**
 * Rigidity result. `method: 'sparse'` reports σ_min, inertia and the weakest mode but not the
 * whole spectrum (`eigenvalues` is empty); `reason` notes a Lanczos iteration that did not settle.
 */
export interface RigidityResult {
  method: 'dense' | 'sparse'
  reason?: string
  /** Number of trivial directions removed (2 torus, 3 plane; fewer if degenerate). */
  trivialDimension: number
  /** Size of the reduced matrix. */
  dimension: number
  /** Dimensionless smallest singular value σ_min·ℓ̄ of the reduced Jacobian. */
  sigmaMin: number | null
  /** The length scale ℓ̄ used. */
  lengthScale: number
  /** Counts of negative / zero / positive eigenvalues (zero: |λ|·ℓ̄ ≤ tolerance). */
  inertia: Inertia | null
  /** Reduced eigenvalues × ℓ̄, ascending. */
  eigenvalues: number[]
  rigid: boolean | null
  /** Unit displacement per vertex [dx, dy] of the weakest mode (the kernel mode when not rigid). */
  weakestMode: [number, number][]
  tolerance: number
}

/** Fills defaults and rejects nonsense. */
export function resolveRigidityOptions(o: RigidityOptions = {}): Required<RigidityOptions> {
  const r = { ...DEFAULT_RIGIDITY_OPTIONS, ...o }
  if (!(r.tolerance > 0)) throw new Error('rigidity tolerance must be positive')
  if (!['auto', 'dense', 'sparse'].includes(r.method)) throw new Error(`unknown rigidity method '${r.method}'`)
  if (!(Number.isInteger(r.maxDenseVertices) && r.maxDenseVertices >= 1)) {
    throw new Error('maxDenseVertices must be a positive integer')
  }
  return r
}

/** Trivial kernel vectors of J (2V): translations, and the dilation in the plane. */
export function trivialMotions(m: PatternModel, p: Float64Array): Float64Array[] {
  const n = 2 * m.nVertices
  const tx = new Float64Array(n), ty = new Float64Array(n)
  for (let v = 0; v < m.nVertices; v++) { tx[2 * v] = 1; ty[2 * v + 1] = 1 }
  return m.space === 'plane' ? [tx, ty, Float64Array.from(p)] : [tx, ty]
}

/** Rigidity of the drawing p in lattice `lat` (any drawing; meaningful when balanced). */
export function analyzeRigidity(
  m: PatternModel, p: Float64Array, lat: Lattice, options?: RigidityOptions,
): RigidityResult {
  const o = resolveRigidityOptions(options)
  const lengthScale = meanEdgeLength(m, p, lat)
  const trivial = trivialMotions(m, p)
  if (o.method === 'sparse' || (o.method === 'auto' && m.nVertices > o.maxDenseVertices)) {
    const s = sparseRigidity(balanceJacobian(m, p, lat), trivial,
      pinnedCoordinates(p, m.space === 'plane'), o.tolerance / lengthScale)
    const sigmaMin = s.sigmaMin * lengthScale
    return {
      method: 'sparse',
      ...(s.converged ? {} : { reason: `Lanczos on the inverse did not settle in ${s.iterations} solves` }),
      trivialDimension: 2 * m.nVertices - s.dimension,
      dimension: s.dimension,
      sigmaMin,
      lengthScale,
      inertia: s.inertia,
      eigenvalues: [],
      rigid: sigmaMin > o.tolerance,
      weakestMode: pairs(s.mode),
      tolerance: o.tolerance,
    }
  }
  const s = reducedSpectrum(balanceJacobian(m, p, lat), trivial)
  const eigenvalues = s.eigenvalues.map(l => l * lengthScale)
  const sigmaMin = s.dimension === 0 ? null : s.sigmaMin * lengthScale
  const weakestMode = pairs(s.weakestMode)
  return {
    method: 'dense',
    trivialDimension: 2 * m.nVertices - s.dimension,
    dimension: s.dimension,
    sigmaMin,
    lengthScale,
    inertia: inertiaOf(eigenvalues, o.tolerance),
    eigenvalues,
    rigid: sigmaMin === null ? true : sigmaMin > o.tolerance,
    weakestMode,
    tolerance: o.tolerance,
  }
}
