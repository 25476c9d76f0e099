/**
 * Factorisation time vs n for 2-D grid Laplacians (5-point, Dirichlet), n ≈ 2k, 20k, 200k.
 * Prints ordering / symbolic / numeric times of the typed-array LDLᵀ and the numeric time of the
 * sparse LU, and at the small size mathjs `slu` and dense ml-matrix LU measured in the same run.
 * Run: npx tsx bench/sparse-factor.ts
 */
import { performance } from 'node:perf_hooks'
import { LuDecomposition, Matrix } from 'ml-matrix'
import * as mathjs from 'mathjs'
import { lusolve, slu } from 'mathjs'
import { CscPattern, LdltSymbolic, cscMultiply, ldltFactor, luFactor, nestedDissection, symmetricAdjacency, tripletsToDense } from '../shared/linalg'
// the same 5-point grid Laplacian the factorisation tests use
import { gridLaplacian as grid } from '../tests/unit/linalg/random'

const ms = (t0: number): number => performance.now() - t0
const fmt = (x: number): string => x.toFixed(1).padStart(9)

function residual(A: ReturnType<CscPattern['fill']>, x: Float64Array, b: Float64Array): number {
  const r = cscMultiply(A, x, new Float64Array(b.length))
  let m = 0
  for (let i = 0; i < b.length; i++) m = Math.max(m, Math.abs(r[i]! - b[i]!))
  return m
}

/** mathjs SparseMatrix straight from our CSC arrays (no dense detour). */
function toMathjs(A: ReturnType<CscPattern['fill']>): unknown {
  // mathjs exports the SparseMatrix class at run time but not in its type declarations.
  const Ctor = (mathjs as unknown as { SparseMatrix: unknown }).SparseMatrix as new (data: { values: number[]; index: number[]; ptr: number[]; size: number[] }) => unknown
  return new Ctor({ values: Array.from(A.values), index: Array.from(A.rowIdx), ptr: Array.from(A.colPtr), size: [A.nRows, A.nCols] })
}

/** Best of `reps` runs (the first run of a size also pays for JIT warm-up). */
function best<T>(reps: number, f: () => T): { ms: number; value: T } {
  let ms = Infinity, value!: T
  for (let r = 0; r < reps; r++) { const t0 = performance.now(); value = f(); ms = Math.min(ms, performance.now() - t0) }
  return { ms, value }
}

console.log('grid Laplacian, nested dissection (George & Liu 1978) + LDLᵀ (up-looking, Davis 2005) + LU (Gilbert & Peierls 1988)')
console.log('times: best of 3 runs for n ≈ 2k and 20k, one run for 200k; mathjs slu (order 1 = AMD on A+Aᵀ, threshold 1)')
console.log('      n   nnz(A)    order ms  symbolic ms  LDLᵀ num ms    nnz(L)   LU num ms   nnz(L+U)   max|Ax-b|   mathjs slu ms')
const totals = new Map<number, number>()
for (const m of [45, 141, 447]) {
  const t = grid(m)
  const n = m * m
  const reps = n > 100000 ? 1 : 3
  const pattern = new CscPattern(n, n, t)
  const A = pattern.fill(t)
  const order = best(reps, () => { const { ptr, adj } = symmetricAdjacency(pattern); return nestedDissection(ptr, adj) })
  const perm = order.value
  const sym = best(reps, () => new LdltSymbolic(pattern, perm))
  const num = best(reps, () => ldltFactor(A, sym.value))
  const r = num.value
  if (!r.ok) throw new Error(r.reason)
  const b = new Float64Array(n).fill(1)
  const x = r.factor.solve(b)
  const lu = best(reps, () => luFactor(A, perm))
  if (!lu.value.ok) throw new Error(lu.value.reason)
  const xl = lu.value.factor.solve(b)
  let mj = '        —'
  if (n < 100000) {
    const M = toMathjs(A)
    const f = best(reps, () => slu(M as Parameters<typeof slu>[0], 1, 1))
    mj = fmt(f.ms)
    const xm = (lusolve(f.value, Array.from(b)) as unknown as { toArray(): number[][] }).toArray().map((row) => row[0]!)
    const dev = Math.max(...xm.map((v, i) => Math.abs(v - x[i]!)))
    if (dev > 1e-8) throw new Error(`mathjs and LDLᵀ disagree by ${dev}`)
    totals.set(n, f.ms / (order.ms + sym.ms + num.ms))
  }
  console.log(`${String(n).padStart(7)} ${String(A.colPtr[n]).padStart(8)} ${fmt(order.ms)}   ${fmt(sym.ms)}    ${fmt(num.ms)}  ${String(sym.value.nnzL).padStart(9)}  ${fmt(lu.ms)}  ${String(lu.value.factor.nnz).padStart(9)}   ${Math.max(residual(A, x, b), residual(A, xl, b)).toExponential(1)}   ${mj}`)
}
for (const [n, ratio] of totals) console.log(`mathjs slu / typed-array LDLᵀ (order+symbolic+numeric) at n = ${n}: ${ratio.toFixed(1)}×`)

// Dense ml-matrix at the small size, same run.
const m = 45, n = m * m
const dense = tripletsToDense(grid(m))
const t0 = performance.now()
const d = new LuDecomposition(dense)
const tDense = ms(t0)
d.solve(Matrix.columnVector(Array.from({ length: n }, () => 1)))
console.log(`ml-matrix dense LU at n = ${n}: ${tDense.toFixed(1)} ms`)
