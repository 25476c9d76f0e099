/**
 * `npm run bench`: speed of family continuation on periodic supercells of the demo net
 * "square-pair" (V = 1k, 5k, 10k): one sparse factorisation of F_u, one continuation step, their
 * ratio; the same step with dense LU (ml-matrix) for V ≤ 2k and the speed-up; the growth exponent
 * of the step time from 1k to 10k. Targets are printed beside the figures; nothing is asserted.
 *
 * Family: α1 phase path (vertex phases, one pinned, n = V − 1; F_u a weighted graph Laplacian).
 * A balanced degree-4 vertex has two pairs of opposite edges, so balanced degree-4 nets are
 * arrangements of straight lines, and in an m×m supercell every extra line can be shifted on its
 * own (a parallel redrawing): F_u is singular for m > 1 and their lattice families cannot be
 * continued. The lattice section therefore shears supercells of the degree-6 demo net
 * "six-wing-lattice", which stay rigid (tests/unit/pattern/rigidity-sparse.test.ts).
 * Then the research-scale section (bench/scale.ts): factorisation beside SuperLU, balance solve,
 * rigidity check at V = 1k, 10k (and 20k for the factorisation).
 * Run: npm run bench   (add `--quick` to skip the dense step at V = 2k and the V = 20k factorisation)
 * Ends with the surface (bench/surface.ts), certificate (bench/certify.ts) and census
 * (bench/census.ts) sections.
 */
import { performance } from 'node:perf_hooks'
import { createContinuation } from '../shared/continuation/engine'
import { findPatternExample } from '../shared/examples'
import { familyProblem, setupFamily } from '../shared/families/build'
import { compilePattern } from '../shared/pattern/model'
import { SparseSolver } from '../shared/linalg/solver'
import { LdltFactor } from '../shared/linalg/ldlt'
import { balanceSection, factorisationSection, rigiditySection } from './scale'
import { parseFamilySettings } from '../shared/types/family'
import { supercell } from '../shared/pattern/supercell'
import type { PatternDocument } from '../shared/types/pattern'

const settings = parseFamilySettings({ path: { kind: 'alpha1' }, to: 1e6 })
const shearSettings = parseFamilySettings({ path: { kind: 'shear' }, to: 0.4, balanceFirst: false })
/** Fixed arclength step of the timed steps. */
const STEP = Number(process.argv.find(a => a.startsWith('--step='))?.slice(7) ?? 2)
const quick = process.argv.includes('--quick')

/** Seeded uniform [0, 1) generator (mulberry32, common practice). */
function mulberry32(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6D2B79F5) >>> 0
    let t = Math.imul(a ^ (a >>> 15), 1 | a)
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/**
 * The m×m supercell with the cell's phases repeated as ψ(v, i, j) = ψ(v) + i·α1 + j·α2 and period
 * phases (m·α1, m·α2): every edge keeps its phase difference, so a balanced cell stays balanced.
 */
function twistedSupercell(cell: PatternDocument, m: number): PatternDocument {
  const doc = supercell(cell, m, m)
  const [a1, a2] = cell.phases?.alpha ?? [0, 0]
  const vertexPhases: Record<string, number> = {}
  for (const v of doc.vertices) {
    const [id, i, j] = v.id.split('.')
    vertexPhases[v.id] = (cell.phases?.vertexPhases?.[id!] ?? 0) + Number(i) * a1 + Number(j) * a2
  }
  doc.phases = { alpha: [m * a1, m * a2], vertexPhases }
  return doc
}

/**
 * Counts the factorisations made inside the timed steps and their time, by wrapping
 * SparseSolver.prototype.factor (bench only): shows how much of a step is factorisation.
 */
const inStep = { calls: 0, ms: 0, solves: 0 }
const ldltSolve = LdltFactor.prototype.solve
LdltFactor.prototype.solve = function (this: LdltFactor, ...args: Parameters<typeof ldltSolve>) { inStep.solves++; return ldltSolve.apply(this, args) }
const factor = SparseSolver.prototype.factor
SparseSolver.prototype.factor = function (this: SparseSolver, ...args: Parameters<typeof factor>) {
  const t0 = performance.now()
  try { return factor.apply(this, args) } finally { inStep.calls++; inStep.ms += performance.now() - t0 }
}

/** Best of `reps` timings of f (ms). */
function best(reps: number, f: () => void): number {
  let t = Infinity
  for (let r = 0; r < reps; r++) { const t0 = performance.now(); f(); t = Math.min(t, performance.now() - t0) }
  return t
}

/** The α1 family of the m×m "square-pair" supercell (phases repeated, seeded weights). */
function phaseCase(m: number) {
  const doc = twistedSupercell(findPatternExample('square-pair')!.document, m)
  // seeded weights in [0.5, 1.5): without them the α1 branch is linear and Newton has nothing to do
  const rand = mulberry32(20261202)
  for (const e of doc.edges) e.weight = 0.5 + rand()
  const model = compilePattern(doc)
  return { model, problem: familyProblem(doc, settings, model).problem, u: model.psi.subarray(1), lambda: model.alpha[0], step: STEP }
}

/** The shear family of the m×m "six-wing-lattice" supercell (rigid; n = 2V − 2 positions). */
function shearCase(m: number) {
  const doc = supercell(findPatternExample('six-wing-lattice')!.document, m, m)
  const setup = setupFamily(doc, shearSettings)
  return { model: setup.model, problem: setup.problem, u: setup.start.u, lambda: setup.start.lambda, step: 0.02 }
}

type Case = ReturnType<typeof phaseCase>

/** Times one factorisation of F_u at the start and the median of `steps` continuation steps. */
function measure(c: Case, method: 'auto' | 'dense', steps: number, chordNewton = false) {
  const { model } = c
  // dense: plain LU (a symmetric dense factor would add an eigen-decomposition for the inertia)
  const problem = method === 'dense' ? { ...c.problem, symmetric: false } : c.problem
  const start = createContinuation(problem, { u: c.u, lambda: c.lambda }, { maxPoints: 1 })
  if (!start.started) throw new Error(`start refused: ${start.finishReason}`)
  const u0 = Float64Array.from(start.points[0]!.u), l0 = start.points[0]!.lambda
  const J = problem.jacobian(u0, l0)
  const solver = new SparseSolver({ method })
  solver.factor(J.Fu, problem.symmetric === true) // ordering and symbolic analysis, reused along a run
  const factorMs = best(method === 'dense' ? 1 : 3, () => { if (!solver.factor(J.Fu, problem.symmetric === true).ok) throw new Error('factorisation failed') })
  // fixed step size so every step does comparable work
  const run = createContinuation(problem, { u: u0, lambda: l0 }, { initialStep: c.step, maxStep: c.step, solver: { method }, chordNewton, fastIterations: chordNewton ? 6 : 3 })
  if (!run.started) throw new Error(`start refused: ${run.finishReason}`)
  const times: number[] = []
  inStep.calls = 0; inStep.ms = 0; inStep.solves = 0
  for (let s = 0; s < steps && !run.done; s++) {
    const t0 = performance.now()
    const o = run.next()
    if (o.status !== 'accepted') throw new Error(`step ${o.status}: ${o.reason}`)
    times.push(performance.now() - t0)
  }
  times.sort((a, b) => a - b)
  const stepMs = times[Math.floor(times.length / 2)]!
  const total = times.reduce((a, b) => a + b, 0)
  return { V: model.nVertices, n: problem.n, factorMs, stepMs, perStep: inStep.calls / times.length, solves: inStep.solves / times.length, share: inStep.ms / total, newton: run.points.slice(1).map(p => p.newtonIterations).join(',') }
}

const f = (x: number, w = 10) => x.toFixed(1).padStart(w)
console.log(`Wingfold family continuation bench: α1 phase path on m×m supercells of "square-pair" (replicated phases, seeded weights), arclength step ${STEP}`)
console.log('step = one accepted pseudo-arclength step (predictor, Newton corrector, tangent, σ_min estimate, test functions, diagnostics), median of 5')
console.log('factorisation = one numeric LDLᵀ of F_u (ordering and symbolic analysis done once before), best of 3\n')
const HEAD = '      V       n   factor ms    step ms   step/factor  (target ≤ 2)   factorisations/step  in factorisation   solves/step   Newton iterations'
console.log('solves/step = solves with a factor of F_u: Newton updates, F_u⁻¹F_λ, the σ_min monitor (the tangent needs none); before this version: one more F_u⁻¹F_λ and the tangent solve')
console.log(HEAD)
measure(phaseCase(22), 'auto', 5, true) // warm-up (JIT), not printed
const sparse: ReturnType<typeof measure>[] = []
for (const chord of [true, false]) {
  console.log(chord ? 'chord Newton (the families default, step.chord = true): F_u reused from the previous point' : 'full Newton (step.chord = false), for comparison:')
  for (const m of [22, 50, 71]) {
    const r = measure(phaseCase(m), 'auto', 5, chord)
    if (chord) sparse.push(r)
    const ratio = r.stepMs / r.factorMs
    console.log(`${String(r.V).padStart(7)} ${String(r.n).padStart(7)} ${f(r.factorMs, 11)} ${f(r.stepMs)} ${ratio.toFixed(2).padStart(13)}  ${ratio <= 2 ? 'met   ' : 'MISSED'}   ${r.perStep.toFixed(1).padStart(8)} ${(100 * r.share).toFixed(0).padStart(9)} %   ${r.solves.toFixed(1).padStart(11)}   ${r.newton}`)
  }
}
const first = sparse[0]!, last = sparse.at(-1)!
const exponent = Math.log(last.stepMs / first.stepMs) / Math.log(last.V / first.V)
console.log(`\ngrowth exponent of the step time (chord, the default), V = ${first.V} → ${last.V}: ${exponent.toFixed(2)}  (target ≤ 1.3: ${exponent <= 1.3 ? 'met' : 'MISSED'})`)

console.log('\ndense LU (ml-matrix, F_u treated as unsymmetric: LU, and a transpose LU for the σ_min estimate) in the same step, one run each:')
console.log('      V       n   dense factor ms   dense step ms   sparse step ms   speed-up  (target ≥ 100 at V = 2k)')
for (const m of quick ? [22] : [22, 32]) {
  const d = measure(phaseCase(m), 'dense', 1, true)
  const s = m === 22 ? first : measure(phaseCase(m), 'auto', 5, true)
  const up = d.stepMs / s.stepMs
  const target = m === 32 ? (up >= 100 ? 'met' : 'MISSED') : '(V = 1k)'
  console.log(`${String(d.V).padStart(7)} ${String(d.n).padStart(7)} ${f(d.factorMs, 17)} ${f(d.stepMs, 15)} ${f(s.stepMs, 16)} ${up.toFixed(0).padStart(10)}  ${target}`)
}

console.log('\nlattice family: shear of m×m supercells of "six-wing-lattice" (rigid for every m; n = 2V − 2 positions), arclength step 0.02, chord (default)')
console.log(HEAD)
const shear: ReturnType<typeof measure>[] = []
for (const m of [32, 71, 100]) {
  const r = measure(shearCase(m), 'auto', 5, true)
  shear.push(r)
  const ratio = r.stepMs / r.factorMs
  console.log(`${String(r.V).padStart(7)} ${String(r.n).padStart(7)} ${f(r.factorMs, 11)} ${f(r.stepMs)} ${ratio.toFixed(2).padStart(13)}  ${ratio <= 2 ? 'met   ' : 'MISSED'}   ${r.perStep.toFixed(1).padStart(8)} ${(100 * r.share).toFixed(0).padStart(9)} %   ${r.solves.toFixed(1).padStart(11)}   ${r.newton}`)
}
const shearExp = Math.log(shear[2]!.stepMs / shear[0]!.stepMs) / Math.log(shear[2]!.V / shear[0]!.V)
console.log(`growth exponent of the shear step time, V = ${shear[0]!.V} → ${shear[2]!.V}: ${shearExp.toFixed(2)}  (target ≤ 1.3: ${shearExp <= 1.3 ? 'met' : 'MISSED'})`)

console.log('\n— research scale —')
factorisationSection(quick ? [100] : [100, 141], 3)
balanceSection([32, 100], 12, 3)
rigiditySection([32, 100], [4, 6, 10], 3)

await import('./surface')

// interval certificates by size (bench/certify.ts)
await import('./certify')

// census section (bench/census.ts): patterns per second and the count by N
await import('./census')
