/**
 * Relaxation to a discrete minimal surface (U. Pinkall, K. Polthier, "Computing discrete minimal
 * surfaces and their conjugates", Experimental Math. 2, 1993, §3): given the mesh M_i, the next
 * mesh M_{i+1} is the piecewise-linear map of minimal Dirichlet energy over M_i,
 *   Σ_j (cot α_ij + cot β_ij)(x_j^{i+1} − x_i^{i+1}) = 0 at every free vertex i,
 * with cotangents of M_i. Periodic version (derived): a corner's point is x_v + T(k) with T the
 * period shift, so the equation of vertex i reads Σ w (X_i − X_j) = Σ w (T(k_j) − T(k_i)), one
 * symmetric matrix for the three coordinates with the period shifts on the right. Fixed vertices
 * move to the right side; a mesh with none (closed in the quotient) has one vertex pinned in the
 * full step, which removes the translations. The normal-only step pins none: its quadratic form
 * Σ w_ij |δ_i n_i − δ_j n_j|² vanishes only when δ_i n_i is one constant vector, impossible on a
 * curved mesh, so its matrix is definite; a pinned vertex there cannot follow the slow normal
 * drift of the whole mesh and seeds a spike that grows step by step (seen on the six-wing demo
 * lattice: max |H|·L rising from 4e-3 to 1.8 in 8 steps at the pinned vertex). Solved with the project's sparse LDLᵀ (LU when a zero pivot appears).
 * Iteration stops when no vertex moves more than `tolerance` × the mean edge length in a step
 * (the area is stationary to second order, so its change is a poor stopping test), or when the
 * largest |H|·L is below `curvatureTolerance`. The glued
 * surfaces are not area minimisers in their period lattice, and on them the descent, after first
 * lowering the curvature, slowly drifts away again; so when the mean |H| has not improved for
 * `patience` steps the iteration stops and the mesh of the step with the smallest mean |H| is kept
 * (reported as not converged, with its step number).
 */
import { SparseSolver } from '../linalg/solver'
import { TripletBuilder } from '../linalg/triplets'
import { cotanData, meshArea, type CotanData } from './cotan'
import type { PeriodicMesh } from './mesh'
import { meanCurvature } from './curvature'
import { vertexNormals } from './normals'
import { parseRelaxSettings, type RelaxSettingsInput } from './options'

/** One step's report. */
export interface RelaxProgress {
  iteration: number
  area: number
  /** |area change| / area of this step. */
  change: number
  /** Largest vertex move of this step. */
  maxMove: number
  /** Area-weighted mean of |H|·L after this step (./curvature.ts). */
  meanH: number
  maxH: number
}

/** Final report of a relaxation. */
export interface RelaxResult {
  converged: boolean
  cancelled: boolean
  iterations: number
  initialArea: number
  area: number
  history: RelaxProgress[]
  /** Step whose mesh is returned (0: the start); the step with the smallest mean |H| when not converged. */
  kept: number
  meanH: number
  maxH: number
  reason?: string
}

/** Runs the relaxation step by step on `mesh` (positions change in place); yields every step, the last one included. */
export function* relaxSteps(mesh: PeriodicMesh, input: RelaxSettingsInput = {}): Generator<RelaxProgress, RelaxResult, void> {
  const o = parseRelaxSettings(input)
  const V = mesh.positions.length / 3
  const free = new Int32Array(V).fill(-1)
  let n = 0
  const anyFixed = mesh.fixed.some(x => x === 1)
  for (let v = 0; v < V; v++) if (!mesh.fixed[v] && (anyFixed || v > 0 || o.normalOnly)) free[v] = n++
  const solver = new SparseSolver()
  const [P1, P2, P3] = mesh.periods
  const T = (c: number, d: number): number => mesh.shifts[3 * c]! * P1[d]! + mesh.shifts[3 * c + 1]! * P2[d]! + mesh.shifts[3 * c + 2]! * P3[d]!
  let area = cotanData(mesh).area.reduce((s, a) => s + a, 0)
  const h = meanEdgeLength(mesh)
  const initialArea = area
  const history: RelaxProgress[] = []
  const h0 = meanCurvature(mesh)
  let best = { step: 0, meanH: h0.mean, maxH: h0.max, area, positions: mesh.positions.slice() }
  const finish = (converged: boolean, iterations: number, reason?: string): RelaxResult => {
    if (!converged) mesh.positions.set(best.positions)
    const at = converged ? history[history.length - 1]! : { meanH: best.meanH, maxH: best.maxH, area: best.area }
    return { converged, cancelled: false, iterations, initialArea, area: at.area, history, kept: converged ? iterations : best.step, meanH: at.meanH, maxH: at.maxH, ...(reason ? { reason } : {}) }
  }
  for (let it = 1; it <= o.maxIterations; it++) {
    const data = cotanData(mesh)
    const out = o.normalOnly ? normalStep(mesh, data, free, n, solver) : fullStep(mesh, data.cot, free, n, solver, T)
    if (typeof out === 'string') return finish(false, it - 1, out)
    const a = cotanData(mesh).area.reduce((s, x) => s + x, 0)
    if (!Number.isFinite(a)) return finish(false, it, 'the mesh degenerated (area not finite)')
    const H = meanCurvature(mesh)
    const step: RelaxProgress = { iteration: it, area: a, change: Math.abs(area - a) / a, maxMove: out, meanH: H.mean, maxH: H.max }
    history.push(step)
    area = a
    yield step
    if (out < o.tolerance * h || H.max < o.curvatureTolerance) return finish(true, it)
    if (H.mean < best.meanH) best = { step: it, meanH: H.mean, maxH: H.max, area: a, positions: mesh.positions.slice() }
    else if (it - best.step >= o.patience) return finish(false, it, `mean |H| smallest at step ${best.step}, not lower in the ${o.patience} steps after`)
  }
  return finish(false, o.maxIterations, `still moving after ${o.maxIterations} steps`)
}

/**
 * One Pinkall–Polthier step: the map of least Dirichlet energy over the current mesh, every
 * coordinate free. Returns the largest move, or the solver's reason for failing.
 */
function fullStep(mesh: PeriodicMesh, cot: Float64Array, free: Int32Array, n: number, solver: SparseSolver, T: (c: number, d: number) => number): number | string {
  const V = mesh.positions.length / 3, F = mesh.triangles.length / 3
  const tb = new TripletBuilder(n, n, 12 * F)
  const rhs = [new Float64Array(n), new Float64Array(n), new Float64Array(n)]
  for (let t = 0; t < F; t++) {
    for (let i = 0; i < 3; i++) {
      const cj = 3 * t + (i + 1) % 3, ck = 3 * t + (i + 2) % 3
      const w = cot[3 * t + i]! / 2
      const vj = mesh.triangles[cj]!, vk = mesh.triangles[ck]!
      const fj = free[vj]!, fk = free[vk]!
      // Row of j: w (X_j − X_k) = w (T_k − T_j) (− w X_k moved right when k is not free); row of k alike.
      for (const [fa, ca, b, fb, cb] of [[fj, cj, vk, fk, ck], [fk, ck, vj, fj, cj]] as const) {
        if (fa < 0) continue
        tb.add(fa, fa, w)
        if (fb >= 0) tb.add(fa, fb, -w)
        for (let d = 0; d < 3; d++) {
          const r = rhs[d]!
          r[fa] = r[fa]! + w * (T(cb, d) - T(ca, d)) + (fb < 0 ? w * mesh.positions[3 * b + d]! : 0)
        }
      }
    }
  }
  const out = solver.factor(tb.build(), true)
  if (!out.ok) return out.reason
  const next = [0, 1, 2].map(d => out.factor.solve(rhs[d]!))
  let maxMove = 0
  for (let v = 0; v < V; v++) {
    const f = free[v]!
    if (f < 0) continue
    let move = 0
    for (let d = 0; d < 3; d++) {
      move += (next[d]![f]! - mesh.positions[3 * v + d]!) ** 2
      mesh.positions[3 * v + d] = next[d]![f]!
    }
    maxMove = Math.max(maxMove, Math.sqrt(move))
  }
  return maxMove
}

/**
 * The same step with every vertex moving along its normal only: x_i + δ_i n_i with δ minimising
 * the Dirichlet energy ½ Σ w_ij |x_i + δ_i n_i − x_j − δ_j n_j|² (derived): the symmetric system
 *   Σ_j w_ij (δ_i − (n_i·n_j) δ_j) = −n_i · Σ_j w_ij (x_i − x_j),
 * one unknown per vertex. Its fixed points are the meshes whose cotangent Laplacian has no normal
 * part: discrete mean curvature 0. Plain steps also slide vertices along the surface, slowly and
 * without end on an irregular mesh, and the sliding can fold thin triangles.
 */
function normalStep(mesh: PeriodicMesh, data: CotanData, free: Int32Array, n: number, solver: SparseSolver): number | string {
  const V = mesh.positions.length / 3, F = mesh.triangles.length / 3
  const { cot, points } = data
  const nrm = vertexNormals(mesh, points)
  const tb = new TripletBuilder(n, n, 12 * F)
  const rhs = new Float64Array(n)
  for (let t = 0; t < F; t++) {
    for (let i = 0; i < 3; i++) {
      const j = (i + 1) % 3, k = (i + 2) % 3
      const w = cot[3 * t + i]! / 2
      const vj = mesh.triangles[3 * t + j]!, vk = mesh.triangles[3 * t + k]!
      const fj = free[vj]!, fk = free[vk]!
      const nn = nrm[3 * vj]! * nrm[3 * vk]! + nrm[3 * vj + 1]! * nrm[3 * vk + 1]! + nrm[3 * vj + 2]! * nrm[3 * vk + 2]!
      let dj = 0, dk = 0
      for (let d = 0; d < 3; d++) {
        const e = points[9 * t + 3 * j + d]! - points[9 * t + 3 * k + d]!
        dj += nrm[3 * vj + d]! * e; dk -= nrm[3 * vk + d]! * e
      }
      if (fj >= 0) { tb.add(fj, fj, w); rhs[fj] = rhs[fj]! - w * dj; if (fk >= 0) tb.add(fj, fk, -w * nn) }
      if (fk >= 0) { tb.add(fk, fk, w); rhs[fk] = rhs[fk]! - w * dk; if (fj >= 0) tb.add(fk, fj, -w * nn) }
    }
  }
  const out = solver.factor(tb.build(), true)
  if (!out.ok) return out.reason
  const delta = out.factor.solve(rhs)
  let maxMove = 0
  for (let v = 0; v < V; v++) {
    const f = free[v]!
    if (f < 0) continue
    const dv = delta[f]!
    for (let d = 0; d < 3; d++) mesh.positions[3 * v + d] = mesh.positions[3 * v + d]! + dv * nrm[3 * v + d]!
    maxMove = Math.max(maxMove, Math.abs(dv))
  }
  return maxMove
}

/** Mean length of the triangles' sides (each interior edge counted twice). */
export function meanEdgeLength(mesh: PeriodicMesh): number {
  const { points } = cotanData(mesh)
  let sum = 0
  for (let c = 0; c < points.length / 3; c++) {
    const t = Math.floor(c / 3), a = 3 * c, b = 9 * t + 3 * ((c % 3 + 1) % 3)
    sum += Math.hypot(points[b]! - points[a]!, points[b + 1]! - points[a + 1]!, points[b + 2]! - points[a + 2]!)
  }
  return points.length > 0 ? sum / (points.length / 3) : 0
}

/** Runs {@link relaxSteps} to the end; `onStep` may return false to stop (reported as cancelled). */
export function relaxMesh(mesh: PeriodicMesh, input: RelaxSettingsInput = {}, onStep?: (p: RelaxProgress) => unknown): RelaxResult {
  const initialArea = meshArea(mesh)
  const history: RelaxProgress[] = []
  const gen = relaxSteps(mesh, input)
  for (;;) {
    const r = gen.next()
    if (r.done) return r.value
    history.push(r.value)
    if (onStep && onStep(r.value) === false) return cancelledResult(initialArea, history)
  }
}

/** The result of a relaxation stopped by its caller after the steps in `history`. */
export function cancelledResult(initialArea: number, history: RelaxProgress[]): RelaxResult {
  const last = history[history.length - 1]
  return {
    converged: false, cancelled: true, iterations: last?.iteration ?? 0, initialArea, area: last?.area ?? initialArea, history,
    kept: last?.iteration ?? 0, meanH: last?.meanH ?? Number.NaN, maxH: last?.maxH ?? Number.NaN, reason: 'cancelled',
  }
}
