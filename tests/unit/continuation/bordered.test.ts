import { describe, expect, it } from 'vitest'
import { LuDecomposition, Matrix, SingularValueDecomposition } from 'ml-matrix'
import { BorderedSolver } from '../../../shared/continuation/bordered'
import { estimateSigmaMin } from '../../../shared/continuation/sigma-min'
import { SparseSolver, tripletsToDense, TripletBuilder } from '../../../shared/linalg'
import { randomSparse, seeded } from '../linalg/random'

// Reference: dense ml-matrix 6.15 (LU determinant and solve, SVD) on the same matrices.
function denseBordered(Fu: Matrix, Fl: Float64Array, c: Float64Array): Matrix {
  const n = Fu.rows
  const M = Matrix.zeros(n + 1, n + 1)
  M.setSubMatrix(Fu, 0, 0)
  for (let i = 0; i < n; i++) M.set(i, n, Fl[i]!)
  for (let j = 0; j <= n; j++) M.set(n, j, c[j]!)
  return M
}

describe('bordered solves against ml-matrix', () => {
  for (const [seed, symmetric, singularFu] of [[11, true, false], [12, false, false], [13, true, true], [14, false, true]] as const) {
    it(`seed ${seed}: ${symmetric ? 'symmetric' : 'general'} F_u${singularFu ? ', exactly singular (full-matrix route)' : ''}`, () => {
      const rnd = seeded(seed)
      const n = 40
      let Fu = randomSparse(n, 3, rnd, symmetric)
      if (singularFu) {
        // zero the last row and column: F_u singular, the bordered matrix generically not
        const b = new TripletBuilder(n, n)
        for (let k = 0; k < Fu.count; k++) if (Fu.rows[k] !== n - 1 && Fu.cols[k] !== n - 1) b.add(Fu.rows[k]!, Fu.cols[k]!, Fu.values[k]!)
        Fu = b.build()
      }
      const Fl = Float64Array.from({ length: n }, () => rnd() - 0.5)
      const c = Float64Array.from({ length: n + 1 }, () => rnd() - 0.5)
      const f = Float64Array.from({ length: n }, () => rnd() - 0.5)
      const g = rnd() - 0.5
      const solver = new BorderedSolver(n, symmetric, {}, 1e-9)
      const M = solver.prepare({ Fu, Flambda: Fl }, c)
      const x = M.solve(f, g)
      expect(x.ok).toBe(true)
      if (!x.ok) return
      const D = denseBordered(tripletsToDense(Fu), Fl, c)
      const lu = new LuDecomposition(D)
      const ref = lu.solve(Matrix.columnVector([...f, g])).getColumn(0)
      let dev = 0, scale = 0
      for (let i = 0; i <= n; i++) { dev = Math.max(dev, Math.abs(x.x[i]! - ref[i]!)); scale = Math.max(scale, Math.abs(ref[i]!)) }
      expect(dev / scale).toBeLessThan(1e-8)
      expect(M.det()!.sign).toBe(Math.sign(lu.determinant))
      expect(Math.abs(M.det()!.logAbs - Math.log(Math.abs(lu.determinant)))).toBeLessThan(1e-7)
      expect(M.usedFullMatrix).toBe(singularFu)
    })
  }
})

describe('σ_min estimate against the ml-matrix SVD', () => {
  for (const [seed, symmetric] of [[21, true], [22, false]] as const) {
    it(`seed ${seed}, ${symmetric ? 'symmetric' : 'general'}: an upper bound at every step, converging to the SVD value`, () => {
      const rnd = seeded(seed)
      const t = randomSparse(60, 3, rnd, symmetric)
      const f = new SparseSolver().factor(t, symmetric)
      expect(f.ok).toBe(true)
      if (!f.ok) return
      const exact = Math.min(...new SingularValueDecomposition(tripletsToDense(t)).diagonal)
      for (const k of [1, 3, 6]) {
        // 1/|A⁻¹x| ≥ σ_min for every unit x (Golub & Van Loan 2013, §2.4): an upper bound at each step
        expect(estimateSigmaMin(f.factor, symmetric, k).sigma).toBeGreaterThanOrEqual(exact * (1 - 1e-12))
      }
      const est3 = estimateSigmaMin(f.factor, symmetric, 3).sigma
      const est5 = estimateSigmaMin(f.factor, symmetric, 5).sigma
      const est40 = estimateSigmaMin(f.factor, symmetric, 40).sigma
      console.log(`σ_min seed ${seed}: SVD ${exact}; 3 steps ${est3} (relative ${(est3 / exact - 1).toExponential(2)}); 5 steps relative ${(est5 / exact - 1).toExponential(2)}; 40 steps relative ${(est40 / exact - 1).toExponential(2)}`)
      expect(est40 / exact - 1).toBeLessThan(1e-6)
    })
  }
})

describe('solver fallbacks', () => {
  it('symmetric indefinite [[0, 1], [1, 0]]: LDLᵀ meets a zero pivot, LU takes over', () => {
    const b = new TripletBuilder(2, 2); b.add(0, 1, 1); b.add(1, 0, 1)
    const r = new SparseSolver({ ordering: 'natural' }).factor(b.build(), true)
    expect(r.ok).toBe(true)
    if (!r.ok) return
    expect(r.factor.kind).toBe('lu')
    expect(Array.from(r.factor.solve([2, 3]))).toEqual([3, 2])
    expect(r.factor.detSign).toBe(-1) // det = −1 (by hand)
  })
})
