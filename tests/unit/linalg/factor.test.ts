import { describe, expect, it } from 'vitest'
import { EigenvalueDecomposition, LuDecomposition, Matrix } from 'ml-matrix'
import { lusolve, slu, sparse } from 'mathjs'
import { SparseSolver, tripletsToDense, inertiaFromEigenvalues, cscMultiply, tripletsToCsc, LdltSymbolic, ldltFactor, nestedDissection, naturalOrdering, symmetricAdjacency } from '../../../shared/linalg'
import { gridLaplacian, randomSparse, seeded } from './random'

const rel = (a: ArrayLike<number>, b: ArrayLike<number>): number => {
  let d = 0, s = 0
  for (let i = 0; i < a.length; i++) { d = Math.max(d, Math.abs(a[i]! - b[i]!)); s = Math.max(s, Math.abs(b[i]!)) }
  return d / s
}

// Reference: ml-matrix 6.15 dense LU / eigen decomposition (general-purpose library) and
// mathjs 15.2 sparse LU `slu` + `lusolve` (general-purpose library).
describe('sparse factorisations against ml-matrix and mathjs on seeded random matrices', () => {
  for (const [seed, n, symmetric] of [[1, 40, false], [2, 75, false], [3, 40, true], [4, 90, true], [5, 120, true]] as const) {
    it(`seed ${seed}, n = ${n}, ${symmetric ? 'symmetric (LDLᵀ)' : 'general (LU)'}`, () => {
      const rnd = seeded(seed)
      const t = randomSparse(n, 3, rnd, symmetric)
      const b = Array.from({ length: n }, () => rnd() - 0.5)
      const res = new SparseSolver().factor(t, symmetric)
      expect(res.ok).toBe(true)
      if (!res.ok) return
      expect(res.factor.kind).toBe(symmetric ? 'ldlt' : 'lu')
      const x = res.factor.solve(b)
      const M = tripletsToDense(t)
      const dense = new LuDecomposition(M)
      const xRef = dense.solve(Matrix.columnVector(b)).getColumn(0)
      expect(rel(x, xRef)).toBeLessThan(1e-9)
      // transpose solve against ml-matrix on Mᵀ
      const xt = res.factor.solveTranspose(b)
      const xtRef = new LuDecomposition(M.transpose()).solve(Matrix.columnVector(b)).getColumn(0)
      expect(rel(xt, xtRef)).toBeLessThan(1e-9)
      // determinant sign and magnitude
      const det = dense.determinant
      expect(res.factor.detSign).toBe(Math.sign(det))
      expect(Math.abs(res.factor.logAbsDet - Math.log(Math.abs(det)))).toBeLessThan(1e-8 * n)
      if (symmetric) {
        const ref = inertiaFromEigenvalues(new EigenvalueDecomposition(M, { assumeSymmetric: true }).realEigenvalues)
        expect(res.inertia).toEqual(ref)
      }
      // mathjs sparse LU as a second, independent sparse reference
      const mj = lusolve(slu(sparse(M.to2DArray()), 1, 0.001), b) as unknown as { toArray(): number[][] } | number[][]
      const xm = (Array.isArray(mj) ? mj : mj.toArray()).map((r) => r[0]!)
      expect(rel(x, xm)).toBeLessThan(1e-8)
    })
  }

  it('reuses pattern analysis for a second matrix with the same pattern', () => {
    const rnd = seeded(7)
    const t1 = randomSparse(50, 3, rnd, true)
    const t2 = { ...t1, values: t1.values.map((v) => v * (1 + 0.1 * rnd())) }
    const s = new SparseSolver()
    s.factor(t1, false)
    const r2 = s.factor(t2, false)
    expect(s.analyses).toBe(1)
    expect(r2.ok).toBe(true)
    if (!r2.ok) return
    const b = new Float64Array(50).fill(1)
    const x = r2.factor.solve(b)
    const Ax = cscMultiply(tripletsToCsc(t2), x, new Float64Array(50))
    expect(rel(Ax, b)).toBeLessThan(1e-10)
  })

  it('reports a singular matrix as a failed factorisation, not a crash', () => {
    // Rank-one 3×3 matrix [1 2 3; 2 4 6; 3 6 9]: singular by construction (common practice).
    const rows = new Int32Array([0, 0, 0, 1, 1, 1, 2, 2, 2]), cols = new Int32Array([0, 1, 2, 0, 1, 2, 0, 1, 2])
    const values = new Float64Array([1, 2, 3, 2, 4, 6, 3, 6, 9])
    const t = { nRows: 3, nCols: 3, count: 9, rows, cols, values }
    expect(new SparseSolver().factor(t, true).ok).toBe(false)
    expect(new SparseSolver({ method: 'lu' }).factor(t, false).ok).toBe(false)
  })

  it('rejects malformed input with a clear error', () => {
    const t = { nRows: 2, nCols: 2, count: 1, rows: new Int32Array([2]), cols: new Int32Array([0]), values: new Float64Array([1]) }
    expect(() => new SparseSolver().factor(t, false)).toThrow(/outside 2×2/)
    expect(() => new SparseSolver({ leafSize: 0 })).toThrow(/leafSize/)
  })
})

describe('nested dissection ordering', () => {
  it('gives less fill than the natural ordering on a 40×40 grid Laplacian (common practice: George 1973)', () => {
    const A = tripletsToCsc(gridLaplacian(40))
    const { ptr, adj } = symmetricAdjacency(A)
    const nd = new LdltSymbolic(A, nestedDissection(ptr, adj))
    const nat = new LdltSymbolic(A, naturalOrdering(1600))
    // Natural (banded) order on an m×m grid fills the band: about m per row, here 40·1600 (common practice).
    expect(nat.nnzL).toBeGreaterThan(50000)
    expect(nd.nnzL).toBeLessThan(0.6 * nat.nnzL)
    const r = ldltFactor(A, nd)
    expect(r.ok).toBe(true)
    if (!r.ok) return
    // The grid Laplacian is positive definite (common practice): all pivots positive.
    expect(r.factor.inertia).toEqual({ negative: 0, zero: 0, positive: 1600 })
  })
})
