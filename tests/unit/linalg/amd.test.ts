import { describe, expect, it } from 'vitest'
import { EigenvalueDecomposition } from 'ml-matrix'
import {
  CscPattern, LdltSymbolic, SparseSolver, TripletBuilder, approximateMinimumDegree, chooseOrdering, cscMultiply,
  inertiaFromEigenvalues, invertPermutation, ldltFactor, nestedDissection, predictedFill, symmetricAdjacency,
  tripletsToDense, type Triplets,
} from '../../../shared/linalg'
import { findPatternExample } from '../../../shared/examples'
import { balanceJacobian } from '../../../shared/pattern/balance'
import { compilePattern } from '../../../shared/pattern/model'
import { supercell } from '../../../shared/pattern/supercell'
import { gridLaplacian, randomSparse, seeded } from './random'

/** Shifted 5-point Laplacian of the m×m torus (periodic grid), L − σ I. */
function torusLaplacian(m: number, sigma: number): Triplets {
  const b = new TripletBuilder(m * m, m * m, 5 * m * m)
  for (let r = 0; r < m; r++) {
    for (let c = 0; c < m; c++) {
      const i = r * m + c
      b.add(i, i, 4 - sigma)
      b.add(i, r * m + ((c + 1) % m), -1); b.add(i, r * m + ((c + m - 1) % m), -1)
      b.add(i, ((r + 1) % m) * m + c, -1); b.add(i, ((r + m - 1) % m) * m + c, -1)
    }
  }
  return b.build()
}

/** Balance Jacobian of an m×m supercell of a demo net (full pattern, both triangles). */
const supercellJacobian = (slug: string, m: number): Triplets => {
  const model = compilePattern(supercell(findPatternExample(slug)!.document, m, m))
  return balanceJacobian(model, model.positions, model.lattice)
}

const graphOf = (t: Triplets) => {
  const pattern = new CscPattern(t.nRows, t.nCols, t)
  return { pattern, ...symmetricAdjacency(pattern) }
}

const expectPermutation = (perm: Int32Array, n: number) => {
  expect(perm.length).toBe(n)
  expect(() => invertPermutation(perm)).not.toThrow()
}

describe('approximate minimum degree ordering', () => {
  it('returns a permutation on random graphs, with isolated vertices and with dense rows', () => {
    const rnd = seeded(7)
    for (const n of [1, 2, 3, 17, 200, 1500]) {
      const t = randomSparse(n, 3, rnd, true)
      const { ptr, adj } = graphOf(t)
      expectPermutation(approximateMinimumDegree(ptr, adj), n)
    }
    // an arrow matrix bordered by two full rows/columns (as a bordered continuation system), plus isolated vertices
    const n = 400
    const b = new TripletBuilder(n, n)
    for (let i = 0; i < n; i++) b.add(i, i, 1)
    for (let i = 0; i < n - 40; i++) { b.add(i, n - 1, 1); b.add(n - 1, i, 1); b.add(i, n - 2, 1); b.add(n - 2, i, 1) }
    const { ptr, adj } = graphOf(b.build())
    const perm = approximateMinimumDegree(ptr, adj)
    expectPermutation(perm, n)
    // dense rows go last (Amestoy, Davis, Duff 1996, §6)
    expect(new Set([perm[n - 1], perm[n - 2]])).toEqual(new Set([n - 1, n - 2]))
  })

  it('a tree and a star are eliminated without fill', () => {
    // derived: eliminating a leaf of a tree creates no fill, and a leaf always has the minimum
    // degree 1, so nnz(L) = number of edges = n − 1; the natural order of a star with its hub
    // first fills L completely (n(n−1)/2 entries).
    const n = 300
    const star = new TripletBuilder(n, n)
    for (let i = 0; i < n; i++) star.add(i, i, 1)
    for (let i = 1; i < n; i++) { star.add(0, i, 1); star.add(i, 0, 1) }
    const s = graphOf(star.build())
    expect(predictedFill(s.pattern, approximateMinimumDegree(s.ptr, s.adj))).toBe(n - 1)
    expect(predictedFill(s.pattern, Int32Array.from({ length: n }, (_, i) => i))).toBe((n * (n - 1)) / 2)
    const rnd = seeded(3)
    const tree = new TripletBuilder(n, n)
    for (let i = 0; i < n; i++) tree.add(i, i, 1)
    for (let i = 1; i < n; i++) { const p = Math.floor(rnd() * i); tree.add(i, p, 1); tree.add(p, i, 1) }
    const tr = graphOf(tree.build())
    expect(predictedFill(tr.pattern, approximateMinimumDegree(tr.ptr, tr.adj))).toBe(n - 1)
  })

  it('beats the banded (natural) order on a grid Laplacian', () => {
    // derived: the natural order of an m×m 5-point grid has envelope width m, so column j of L
    // holds every row j+1..j+m that is still in the matrix: nnz(L) = m(m−1)·m … ≈ m³;
    // a minimum-degree order is O(m² log m) (A. George, J. W. H. Liu, Computer Solution of Large
    // Sparse Positive Definite Systems, 1981, ch. 5 and 8).
    const m = 60
    const { pattern, ptr, adj } = graphOf(gridLaplacian(m))
    const natural = predictedFill(pattern, Int32Array.from({ length: m * m }, (_, i) => i))
    const amd = predictedFill(pattern, approximateMinimumDegree(ptr, adj))
    expect(natural).toBeGreaterThan(m ** 3 * 0.9)
    expect(amd).toBeLessThan(natural / 3)
  })

  const matrices: [string, () => Triplets][] = [
    ['grid Laplacian 70×70', () => gridLaplacian(70)],
    ['torus Laplacian 64×64', () => torusLaplacian(64, 0)],
    ['six-wing supercell 40×40 Jacobian', () => supercellJacobian('six-wing-lattice', 40)],
    ['square-grid supercell 25×25 Jacobian', () => supercellJacobian('square-grid', 25)],
    ['three-line weave supercell 25×25 Jacobian', () => supercellJacobian('three-line-weave', 25)],
    ['fermat-pair supercell 30×30 Jacobian', () => supercellJacobian('fermat-pair', 30)],
  ]
  for (const [name, make] of matrices) {
    it(`${name}: the chosen ordering fills no more than the better of AMD and nested dissection`, () => {
      const t = make()
      const { pattern, ptr, adj } = graphOf(t)
      const c = chooseOrdering(pattern)
      expectPermutation(c.perm, t.nRows)
      // independent recomputation of both candidates' fill with the up-looking symbolic analysis
      const amd = new LdltSymbolic(pattern, approximateMinimumDegree(ptr, adj)).nnzL
      const nd = new LdltSymbolic(pattern, nestedDissection(ptr, adj)).nnzL
      expect(c.nnzL).toEqual({ amd, 'nested-dissection': nd })
      expect(new LdltSymbolic(pattern, c.perm).nnzL).toBe(Math.min(amd, nd))
      // and the SparseSolver default uses it (the unpinned Jacobians are singular: only the ordering is checked)
      const solver = new SparseSolver()
      solver.factor(t, true)
      expect(solver.orderingUsed).toBe(c.chosen)
    })
  }

  it('shifted torus Laplacian: exact inertia with the AMD order (closed-form eigenvalues)', () => {
    // Eigenvalues of the periodic 5-point Laplacian on an m×m torus: 4 − 2cos(2πj/m) − 2cos(2πk/m),
    // j, k = 0..m−1 (common practice, Fourier modes); L − σI has one negative pivot per eigenvalue < σ.
    const m = 40, sigma = 1.3
    let below = 0
    for (let j = 0; j < m; j++) for (let k = 0; k < m; k++) if (4 - 2 * Math.cos(2 * Math.PI * j / m) - 2 * Math.cos(2 * Math.PI * k / m) < sigma) below++
    expect(below).toBeGreaterThan(10)
    for (const ordering of ['amd', 'auto'] as const) {
      const r = new SparseSolver({ ordering, method: 'ldlt' }).factor(torusLaplacian(m, sigma), true)
      expect(r.ok).toBe(true)
      if (!r.ok) return
      expect(r.inertia).toEqual({ negative: below, zero: 0, positive: m * m - below })
    }
  })

  for (const [seed, n] of [[21, 80], [22, 250]] as const) {
    it(`indefinite random matrix, seed ${seed}, n = ${n}: AMD order gives ml-matrix's inertia and the up-looking pivots`, () => {
      const rnd = seeded(seed)
      const t = randomSparse(n, 4, rnd, true)
      const ref = inertiaFromEigenvalues(new EigenvalueDecomposition(tripletsToDense(t), { assumeSymmetric: true }).realEigenvalues)
      expect(ref.negative).toBeGreaterThan(0)
      const solver = new SparseSolver({ ordering: 'amd', method: 'ldlt' })
      const r = solver.factor(t, true)
      expect(r.ok).toBe(true)
      if (!r.ok) return
      expect(r.inertia).toEqual(ref)
      const pattern = new CscPattern(t.nRows, t.nCols, t)
      const { ptr, adj } = symmetricAdjacency(pattern)
      const A = pattern.fill(t)
      const up = ldltFactor(A, new LdltSymbolic(pattern, approximateMinimumDegree(ptr, adj)))
      expect(up.ok).toBe(true)
      if (!up.ok) return
      expect(up.factor.inertia).toEqual(ref)
      expect(Math.abs(up.factor.logAbsDet - r.factor.logAbsDet)).toBeLessThan(1e-8 * n)
      const b = Float64Array.from({ length: n }, () => rnd() - 0.5)
      const x = r.factor.solve(b)
      const y = cscMultiply(A, x, new Float64Array(n))
      let res = 0
      for (let i = 0; i < n; i++) res = Math.max(res, Math.abs(y[i]! - b[i]!))
      expect(res).toBeLessThan(1e-9)
    })
  }
})
