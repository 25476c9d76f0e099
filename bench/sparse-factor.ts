/**
 * Factorisation time vs n for 2-D grid Laplacians (5-point, Dirichlet), n ≈ 2k, 20k, 200k.
 * Prints ordering / symbolic / numeric times of the typed-array LDLᵀ and the numeric time of the
 * sparse LU, and at the small size mathjs `slu` and dense ml-matrix LU measured in the same run.
 * Run: npx tsx bench/sparse-factor.ts
 */
import { performance } from 'node:perf_hooks'
import { LuDecomposition, Matrix } from 'ml-matrix'
import { lusolve, slu, sparse } from 'mathjs'
import { CscPattern, LdltSymbolic, cscMultiply, ldltFactor, luFactor, nestedDissection, symmetricAdjacency, tripletsToDense } from '../shared/linalg'
import { TripletBuilder, type Triplets } from '../shared/linalg/triplets'

function grid(m: number): Triplets {
  const n = m * m
  const b = new TripletBuilder(n, n, 5 * n)
  for (let r = 0; r < m; r++) {
    for (let c = 0; c < m; c++) {
      const i = r * m + c
      b.add(i, i, 4)
      if (c > 0) b.add(i, i - 1, -1)
      if (c < m - 1) b.add(i, i + 1, -1)
      if (r > 0) b.add(i, i - m, -1)
      if (r < m - 1) b.add(i, i + m, -1)
    }
  }
  return b.build()
}

const ms = (t0: number): number => performance.now() - t0
const fmt = (x: number): string => x.toFixed(1).padStart(9)

function residual(A: ReturnType<CscPattern['fill']>, x: Float64Array, b: Float64Array): number {
  const r = cscMultiply(A, x, new Float64Array(b.length))
  let m = 0
  for (let i = 0; i < b.length; i++) m = Math.max(m, Math.abs(r[i]! - b[i]!))
  return m
}

console.log('grid Laplacian, nested dissection (George & Liu 1978) + LDLᵀ (up-looking, Davis 2005) + LU (Gilbert & Peierls 1988)')
console.log('      n   nnz(A)    order ms  symbolic ms  LDLᵀ num ms    nnz(L)   LU num ms   nnz(L+U)   max|Ax-b|')
let smallTimes: { ldlt: number; lu: number } | undefined
for (const m of [45, 141, 447]) {
  const t = grid(m)
  const n = m * m
  let t0 = performance.now()
  const pattern = new CscPattern(n, n, t)
  const A = pattern.fill(t)
  const { ptr, adj } = symmetricAdjacency(pattern)
  const perm = nestedDissection(ptr, adj)
  const tOrder = ms(t0)
  t0 = performance.now()
  const sym = new LdltSymbolic(pattern, perm)
  const tSym = ms(t0)
  t0 = performance.now()
  const r = ldltFactor(A, sym)
  const tNum = ms(t0)
  if (!r.ok) throw new Error(r.reason)
  const b = new Float64Array(n).fill(1)
  const x = r.factor.solve(b)
  t0 = performance.now()
  const lu = luFactor(A, perm)
  const tLu = ms(t0)
  if (!lu.ok) throw new Error(lu.reason)
  const xl = lu.factor.solve(b)
  console.log(`${String(n).padStart(7)} ${String(A.colPtr[n]).padStart(8)} ${fmt(tOrder)}   ${fmt(tSym)}    ${fmt(tNum)}  ${String(sym.nnzL).padStart(9)}  ${fmt(tLu)}  ${String(lu.factor.nnz).padStart(9)}   ${Math.max(residual(A, x, b), residual(A, xl, b)).toExponential(1)}`)
  if (m === 45) smallTimes = { ldlt: tOrder + tSym + tNum, lu: tOrder + tLu }
}

// Comparison at the small size, same run.
const m = 45, n = m * m
const t = grid(m)
const dense = tripletsToDense(t)
let t0 = performance.now()
const f = slu(sparse(dense.to2DArray()), 1, 1)
const tSlu = ms(t0)
t0 = performance.now()
lusolve(f, Array.from({ length: n }, () => 1))
const tSluSolve = ms(t0)
t0 = performance.now()
const d = new LuDecomposition(dense)
const tDense = ms(t0)
d.solve(Matrix.columnVector(Array.from({ length: n }, () => 1)))
console.log(`\nat n = ${n}:`)
console.log(`  typed-array LDLᵀ (order+symbolic+numeric) ${smallTimes!.ldlt.toFixed(1)} ms`)
console.log(`  typed-array LU   (order+numeric)          ${smallTimes!.lu.toFixed(1)} ms`)
console.log(`  mathjs slu (order 1 = AMD of A+Aᵀ)         ${tSlu.toFixed(1)} ms  (lusolve ${tSluSolve.toFixed(1)} ms)  ratio to LDLᵀ ${(tSlu / smallTimes!.ldlt).toFixed(1)}×`)
console.log(`  ml-matrix dense LU                         ${tDense.toFixed(1)} ms  ratio to LDLᵀ ${(tDense / smallTimes!.ldlt).toFixed(1)}×`)
