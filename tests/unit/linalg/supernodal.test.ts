import { describe, expect, it } from 'vitest'
import { EigenvalueDecomposition } from 'ml-matrix'
import {
  CscPattern, LdltSymbolic, SupernodalSymbolic, cscMultiply, inertiaFromEigenvalues, ldltFactor, nestedDissection,
  supernodalFactor, symmetricAdjacency, tripletsToDense,
} from '../../../shared/linalg'
import { gridLaplacian, randomSparse, seeded } from './random'

const setup = (t: ReturnType<typeof gridLaplacian>) => {
  const pattern = new CscPattern(t.nRows, t.nCols, t)
  const { ptr, adj } = symmetricAdjacency(pattern)
  return { A: pattern.fill(t), pattern, perm: nestedDissection(ptr, adj, { leafSize: 8 }) }
}

const maxResidual = (A: ReturnType<CscPattern['fill']>, x: Float64Array, b: Float64Array): number => {
  const r = cscMultiply(A, x, new Float64Array(b.length))
  let m = 0, s = 0
  for (let i = 0; i < b.length; i++) { m = Math.max(m, Math.abs(r[i]! - b[i]!)); s = Math.max(s, Math.abs(b[i]!)) }
  return m / s
}

// Reference: ml-matrix 6.15 symmetric eigen-decomposition (general-purpose library) for the
// inertia, and the up-looking LDLᵀ (T. A. Davis, ACM TOMS 31(4), 2005) for the pivots: without
// pivoting, LDLᵀ is unique, so both codes must give the same D up to rounding.
describe('supernodal multifrontal LDLᵀ', () => {
  for (const [seed, n] of [[11, 60], [12, 150], [13, 400]] as const) {
    it(`indefinite random matrix, seed ${seed}, n = ${n}: same inertia as the eigenvalues, same pivots as up-looking`, () => {
      const rnd = seeded(seed)
      const t = randomSparse(n, 4, rnd, true)
      const { A, pattern, perm } = setup(t)
      const sn = new SupernodalSymbolic(pattern, perm)
      const r = supernodalFactor(A, sn)
      expect(r.ok).toBe(true)
      if (!r.ok) return
      const ref = inertiaFromEigenvalues(new EigenvalueDecomposition(tripletsToDense(t), { assumeSymmetric: true }).realEigenvalues)
      expect(r.factor.inertia).toEqual(ref)
      expect(ref.negative).toBeGreaterThan(0) // genuinely indefinite
      // the same ordering (with the postorder) through the up-looking code gives the same D
      const up = ldltFactor(A, new LdltSymbolic(pattern, sn.perm))
      expect(up.ok).toBe(true)
      if (!up.ok) return
      let d = 0
      for (let k = 0; k < n; k++) d = Math.max(d, Math.abs(up.factor.D[k]! - r.factor.D[k]!) / Math.max(1, Math.abs(up.factor.D[k]!)))
      expect(d).toBeLessThan(1e-8)
      const b = Float64Array.from({ length: n }, () => rnd() - 0.5)
      expect(maxResidual(A, r.factor.solve(b), b)).toBeLessThan(1e-9)
      expect(Math.abs(r.factor.logAbsDet - up.factor.logAbsDet)).toBeLessThan(1e-8 * n)
    })
  }

  it('a 60×60 grid Laplacian: positive definite, supernodes wider than one column, solve to rounding', () => {
    const t = gridLaplacian(60)
    const { A, pattern, perm } = setup(t)
    const sn = new SupernodalSymbolic(pattern, perm)
    // a nested-dissection separator is a chain in the elimination tree: fundamental supernodes (common practice)
    expect(sn.nSuper).toBeLessThan(3600 / 3)
    const r = supernodalFactor(A, sn)
    expect(r.ok).toBe(true)
    if (!r.ok) return
    // The grid Laplacian is positive definite (common practice): all pivots positive.
    expect(r.factor.inertia).toEqual({ negative: 0, zero: 0, positive: 3600 })
    const b = Float64Array.from({ length: 3600 }, (_, i) => Math.sin(i))
    expect(maxResidual(A, r.factor.solve(b), b)).toBeLessThan(1e-12)
    // the symbolic analysis is reused: a second matrix with the same pattern (scaled values)
    const A2 = { ...A, values: A.values.map(v => 2 * v) }
    const r2 = supernodalFactor(A2, sn)
    expect(r2.ok).toBe(true)
    if (r2.ok) expect(maxResidual(A2, r2.factor.solve(b), b)).toBeLessThan(1e-12)
  })

  it('reports the zero pivot of a singular matrix instead of dividing by it', () => {
    // Rank-one 3×3 matrix [1 2 3; 2 4 6; 3 6 9]: singular by construction (common practice).
    const t = { nRows: 3, nCols: 3, count: 9, rows: new Int32Array([0, 0, 0, 1, 1, 1, 2, 2, 2]), cols: new Int32Array([0, 1, 2, 0, 1, 2, 0, 1, 2]), values: new Float64Array([1, 2, 3, 2, 4, 6, 3, 6, 9]) }
    const pattern = new CscPattern(3, 3, t)
    const r = supernodalFactor(pattern.fill(t), new SupernodalSymbolic(pattern, new Int32Array([0, 1, 2])))
    expect(r.ok).toBe(false)
  })
})
