/**
 * Switching onto the other branch at a simple branch point: predictor from the located point
 * along the kernel direction φ of the bordered Jacobian (orthogonal to the old tangent), Newton
 * with φᵀ(y − y*) = h, tangent oriented along φ; the new run is linked to its parent
 * (H. B. Keller 1977, §5; E. L. Allgower, K. Georg, Numerical Continuation Methods, 1990, §8.1).
 */
import { BorderedSolver } from './bordered'
import { analysePoint } from './analysis'
import { correct } from './corrector'
import { Continuation, validateProblem } from './engine'
import { resolveContinuationOptions, type ContinuationOptions } from './options'
import type { BranchResult, ContinuationProblem } from './types'
import { axpy, dot, pack } from '../linalg/vectors'

/**
 * New branch through the branch point `parent.specialPoints[specialPointIndex]`, leaving on the
 * `side` (+1 or −1) of its kernel direction. Invalid input throws; if no point off the branch
 * point converges, the returned run is refused (`done`, `finishReason`).
 */
export function switchBranch(problem: ContinuationProblem, parent: BranchResult, specialPointIndex: number, options: ContinuationOptions = {}, side: 1 | -1 = 1): Continuation {
  validateProblem(problem)
  const o = resolveContinuationOptions(options)
  const sp = parent.specialPoints[specialPointIndex]
  if (!sp) throw new Error(`switchBranch: no special point ${specialPointIndex} on branch ${parent.branch.id}`)
  if (sp.kind !== 'branch point' || !sp.kernel) throw new Error(`switchBranch: special point ${specialPointIndex} is a ${sp.kind}, not a branch point with a kernel direction`)
  const n = problem.n
  const ystar = pack(sp.u, sp.lambda)
  const phi = Float64Array.from(sp.kernel, (v) => side * v)
  const solver = new BorderedSolver(n, problem.symmetric === true, o.solver, o.borderingTolerance)
  const settings = { maxNewtonIterations: o.maxNewtonIterations, residualTolerance: o.residualTolerance, stepTolerance: o.stepTolerance }
  const branch = { id: `${parent.branch.id}/${specialPointIndex}${side > 0 ? '+' : '-'}`, parent: { branchId: parent.branch.id, specialPointIndex } }
  let h = o.initialStep
  for (let attempt = 0; attempt < 12; attempt++, h *= 0.5) {
    const r = correct(problem, solver, axpy(ystar, h, phi), phi, dot(phi, ystar) + h, settings)
    if (!r.converged) continue
    const an = analysePoint(problem, solver, r.y, phi, o.sigmaIterations)
    if (!an.ok) continue
    return new Continuation(problem, { u: r.y.subarray(0, n), lambda: r.y[n]!, tangent: an.a.t }, options, branch)
  }
  const c = new Continuation(problem, { u: sp.u, lambda: sp.lambda, tangent: phi }, { ...options, allowSingularStart: true }, branch)
  c.done = true
  c.finishReason = 'branch switch failed: no converged point off the branch point along its kernel direction'
  return c
}
