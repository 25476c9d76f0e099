/**
 * Research-scale section of `npm run bench` (imported by bench/index.ts; alone: npx tsx bench/scale.ts):
 * on m×m supercells of the demo net "six-wing-lattice" (one degree-6 tower per cell, rigid for
 * every m), V = m²:
 *  1. one factorisation of the pinned balance Jacobian (n = 2V − 2): ordering + symbolic +
 *     numeric with nested dissection, AMD and the per-matrix choice (supernodal), beside the
 *     previous version (up-looking LDLᵀ, same ordering) and
 *     SuperLU (scipy splu, best column ordering) on the same matrix when python3 + scipy exist;
 *  2. balance solve from a seeded perturbation (0.05 ℓ̄) beside a plain sparse Newton (μ = 0, full
 *     steps) on the same equations, and the dense path at a small size;
 *  3. rigidity check (sparse inertia + Lanczos) beside one factorisation + 5 solves, and
 *     the dense check at small sizes (where 'auto' switches).
 * Figures are medians of several runs; targets are printed beside them, nothing is asserted.
 */
import { performance } from 'node:perf_hooks'
import { findPatternExample } from '../shared/examples'
import {
  CscPattern, LdltSymbolic, approximateMinimumDegree, chooseOrdering, ldltFactor, nestedDissection, symmetricAdjacency, SparseSolver,
  TripletBuilder,
} from '../shared/linalg'
import { SupernodalSymbolic, supernodalFactor } from '../shared/linalg/supernodal'
import { balanceJacobian, balanceResidual } from '../shared/pattern/balance'
import { solveBalance } from '../shared/pattern/balance-solve'
import { compilePattern, type PatternModel } from '../shared/pattern/model'
import { analyzeRigidity } from '../shared/pattern/rigidity'
import { supercell } from '../shared/pattern/supercell'
import type { PatternDocument } from '../shared/types/pattern'
import { spluReference } from './reference'

/** Median of `reps` timings of f (ms), and the last value. */
export function median<T>(reps: number, f: () => T): { ms: number; value: T } {
  const t: number[] = []
  let value!: T
  for (let r = 0; r < reps; r++) { const t0 = performance.now(); value = f(); t.push(performance.now() - t0) }
  t.sort((a, b) => a - b)
  return { ms: t[Math.floor(t.length / 2)]!, value }
}

/** Seeded uniform [0, 1) (mulberry32, common practice). */
function rng(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6D2B79F5) >>> 0
    let t = Math.imul(a ^ (a >>> 15), 1 | a)
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

function sixWing(m: number, perturb = 0): PatternModel {
  const doc: PatternDocument = supercell(findPatternExample('six-wing-lattice')!.document, m, m)
  const r = rng(20261202)
  if (perturb > 0) for (const v of doc.vertices) v.position = [v.position[0] + perturb * (2 * r() - 1), v.position[1] + perturb * (2 * r() - 1)]
  return compilePattern(doc)
}

/** −J with vertex 0 pinned (positive definite for a rigid drawing) as triplets. */
function pinnedJacobian(model: PatternModel) {
  const J = balanceJacobian(model, model.positions, model.lattice)
  const n = J.nRows - 2
  const b = new TripletBuilder(n, n, J.count)
  for (let k = 0; k < J.count; k++) { const r = J.rows[k]! - 2, c = J.cols[k]! - 2; if (r >= 0 && c >= 0) b.add(r, c, -J.values[k]!) }
  return b.build()
}

const pad = (s: string | number, w: number) => String(s).padStart(w)
const ms = (x: number, w = 9) => x.toFixed(x < 10 ? 1 : 0).padStart(w)
const verdict = (ok: boolean) => (ok ? 'met' : 'MISSED')

/** 1. One factorisation, side by side: nested dissection, AMD and the per-matrix choice. */
export function factorisationSection(sizes: number[], reps: number): void {
  console.log('\n1. one factorisation of the pinned balance Jacobian of the six-wing m×m supercell (n = 2V − 2); median of', reps)
  console.log('   total = ordering + symbolic + numeric (supernodal multifrontal); orderings: nested dissection (ND), approximate minimum')
  console.log('   degree (AMD), auto = both + predicted nnz(L) from the column counts, the smaller kept (the SparseSolver default)')
  console.log('   nnz(L) = exact count below the diagonal; stored = with the zeros of the relaxed supernodes; previous = up-looking LDLᵀ')
  console.log('   SuperLU = scipy splu, full factorisation with its best column ordering, same matrix (target: auto total ≤ SuperLU)')
  console.log('      V       n  ordering   order  symbolic  numeric     total     nnz(L)     stored  previous   SuperLU (ordering)     (L+U)/2  total/SuperLU')
  for (const m of sizes) {
    const t = pinnedJacobian(sixWing(m))
    const n = t.nRows
    const pattern = new CscPattern(n, n, t)
    const A = pattern.fill(t)
    const ref = spluReference(A, reps)
    const orderings = {
      ND: () => { const { ptr, adj } = symmetricAdjacency(pattern); return nestedDissection(ptr, adj) },
      AMD: () => { const { ptr, adj } = symmetricAdjacency(pattern); return approximateMinimumDegree(ptr, adj) },
      auto: () => chooseOrdering(pattern).perm,
    }
    for (const [name, run] of Object.entries(orderings)) {
      const order = median(reps, run)
      const sym = median(reps, () => new SupernodalSymbolic(pattern, order.value))
      const num = median(reps, () => supernodalFactor(A, sym.value))
      if (!num.value.ok) throw new Error(num.value.reason)
      const prevSym = median(reps, () => new LdltSymbolic(pattern, order.value))
      const prevNum = median(reps, () => ldltFactor(A, prevSym.value))
      const ours = order.ms + sym.ms + num.ms, prev = order.ms + prevSym.ms + prevNum.ms
      const label = name === 'auto' ? `auto=${chooseOrdering(pattern).chosen === 'amd' ? 'AMD' : 'ND'}` : name
      const refText = ref ? `${ms(ref.best.ms)} (${ref.best.spec})`.padEnd(22) + pad(Math.round(ref.best.fill / 2), 10) + `   ${(ours / ref.best.ms).toFixed(2).padStart(6)}  ${name === 'auto' ? verdict(ours <= ref.best.ms) : ''}` : 'reference not available (python3 + scipy)'
      console.log(`${pad(m * m, 7)} ${pad(n, 7)}  ${label.padEnd(8)} ${ms(order.ms, 7)} ${ms(sym.ms, 9)} ${ms(num.ms, 8)} ${ms(ours, 9)} ${pad(prevSym.value.nnzL, 10)} ${pad(sym.value.nnzL, 10)} ${ms(prev, 9)}   ${refText}`)
    }
  }
}

/** Plain sparse Newton on B = 0 (vertex 0 pinned, μ = 0, full steps): the reference for the balance solve. */
function plainNewton(model: PatternModel, tol = 1e-12): { iterations: number; residual: number } {
  const p = Float64Array.from(model.positions)
  const solver = new SparseSolver()
  for (let it = 0; it < 60; it++) {
    const B = balanceResidual(model, p, model.lattice)
    const r = Math.hypot(...B)
    if (r <= tol) return { iterations: it, residual: r }
    const t = pinnedJacobian({ ...model, positions: p } as PatternModel)
    const f = solver.factor(t, true)
    if (!f.ok) throw new Error(f.reason)
    const dx = f.factor.solve(B.subarray(2)) // (−J) dx = B  ⇔  J dx = −B
    for (let i = 0; i < dx.length; i++) p[i + 2]! += dx[i]!
  }
  return { iterations: 60, residual: Math.hypot(...balanceResidual(model, p, model.lattice)) }
}

/** 2. Balance solve of a perturbed supercell. */
export function balanceSection(sizes: number[], denseSize: number, reps: number): void {
  console.log('\n2. balance solve of the six-wing m×m supercell from a seeded perturbation (0.05 ℓ̄ per coordinate); median of', reps)
  console.log('   ours = regularised damped Newton, sparse LDLᵀ steps; plain = undamped Newton, μ = 0, same solver (target: ours ≤ 2× plain)')
  console.log('      V   ours ms  iterations   plain ms  iterations   ours/plain')
  for (const m of sizes) {
    const model = sixWing(m, 0.05)
    const ours = median(reps, () => solveBalance(model, model.positions, model.lattice))
    const plain = median(reps, () => plainNewton(model))
    if (!ours.value.converged) throw new Error(`balance did not converge at V = ${m * m}: ${ours.value.reason}`)
    const ratio = ours.ms / plain.ms
    console.log(`${pad(m * m, 7)} ${ms(ours.ms)} ${pad(ours.value.iterations, 11)} ${ms(plain.ms, 10)} ${pad(plain.value.iterations, 11)} ${ratio.toFixed(2).padStart(12)}  ${verdict(ratio <= 2)}`)
  }
  const model = sixWing(denseSize, 0.05)
  const dense = median(1, () => solveBalance(model, model.positions, model.lattice, { linearSolver: 'dense' }))
  const sparse = median(reps, () => solveBalance(model, model.positions, model.lattice))
  console.log(`   previous version (dense ml-matrix steps) at V = ${denseSize ** 2}: ${ms(dense.ms, 0)} ms, ${dense.value.iterations} iterations; sparse ${ms(sparse.ms, 0)} ms: ${(dense.ms / sparse.ms).toFixed(0)}× faster`)
  for (const k of [5, 7]) {
    const doc = supercell(findPatternExample('square-grid')!.document, k, k)
    const r = rng(7)
    for (const v of doc.vertices) v.position = [v.position[0] + 0.05 * (2 * r() - 1), v.position[1] + 0.05 * (2 * r() - 1)]
    const g = compilePattern(doc)
    const res = median(reps, () => solveBalance(g, g.positions, g.lattice))
    console.log(`   non-rigid ${2 * k} × ${2 * k} grid of lines (V = ${g.nVertices}), seeded 0.05 perturbation: ${res.value.converged ? 'converged' : 'NOT converged'} in ${res.value.iterations} iterations, ${ms(res.ms, 0)} ms`)
  }
}

/** 3. Rigidity check. */
export function rigiditySection(sizes: number[], denseSizes: number[], reps: number): void {
  console.log('\n3. rigidity check of the six-wing m×m supercell (sparse: pinned LDLᵀ inertia + Lanczos on the inverse); median of', reps)
  console.log('   reference = one factorisation (ordering and symbolic included) + 5 solves of the same matrix (target: check ≤ 1.5× reference)')
  console.log('      V   check ms    eigenpair test   reference ms   check/reference   σ_min·ℓ̄')
  for (const m of sizes) {
    const model = sixWing(m)
    const check = median(reps, () => analyzeRigidity(model, model.positions, model.lattice, { method: 'sparse' }))
    const t = pinnedJacobian(model)
    const ref = median(reps, () => {
      const f = new SparseSolver().factor(t, true)
      if (!f.ok) throw new Error(f.reason)
      const b = new Float64Array(t.nRows).fill(1)
      for (let k = 0; k < 5; k++) f.factor.solve(b)
    })
    const it = check.value.reason ? 'not settled' : 'settled'
    const ratio = check.ms / ref.ms
    console.log(`${pad(m * m, 7)} ${ms(check.ms, 10)} ${pad(it, 20)} ${ms(ref.ms, 14)} ${ratio.toFixed(2).padStart(17)}  ${verdict(ratio <= 1.5)}   ${check.value.sigmaMin!.toExponential(3)}`)
  }
  const line = denseSizes.map((m) => {
    const model = sixWing(m)
    const d = median(reps, () => analyzeRigidity(model, model.positions, model.lattice, { method: 'dense' }))
    const s = median(reps, () => analyzeRigidity(model, model.positions, model.lattice, { method: 'sparse' }))
    return `V = ${m * m}: dense ${ms(d.ms, 0)} ms, sparse ${ms(s.ms, 0)} ms`
  })
  console.log(`   where 'auto' switches (maxDenseVertices = 32): ${line.join('; ')}`)
}

if (process.argv[1]?.endsWith('scale.ts')) {
  factorisationSection([100, 141], 3)
  balanceSection([32, 100], 12, 3)
  rigiditySection([32, 100], [4, 6, 10], 3)
}
