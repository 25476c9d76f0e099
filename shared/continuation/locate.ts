/**
 * Location of special points inside one accepted step y₀ → y₁ (direction c, arclength Δs).
 * Points inside the step are parametrised by θ ∈ [0, 1]: predictor y₀ + θΔs·c, corrected by
 * Newton with cᵀ(y − y₀) = θΔs. A continuous test function is driven to zero by the Illinois
 * variant of regula falsi (M. Dowell, P. Jarratt, "A modified regula falsi method for computing
 * the root of an equation", BIT 11, 1971); an integer-valued one (the inertia) by bisection.
 * Stops when both the λ-bracket and the arclength bracket are below locateTolerance (relative).
 */
import type { BorderedSolver } from './bordered'
import { analysePoint, type PointAnalysis } from './analysis'
import { correct, type CorrectorSettings } from './corrector'
import type { ContinuationProblem } from './types'
import { axpy, dot, normInf } from '../linalg/vectors'

/** What the locator needs from the engine. */
export interface LocateContext {
  problem: ContinuationProblem
  solver: BorderedSolver
  corrector: CorrectorSettings
  sigmaIterations: number
  locateTolerance: number
  maxLocateIterations: number
}

/** One accepted step. */
export interface Segment { y0: Float64Array; c: Float64Array; ds: number; a0: PointAnalysis; a1: PointAnalysis }

/** How to recognise the crossing. */
export type Watch =
  | { type: 'continuous'; value(a: PointAnalysis): number }
  | { type: 'predicate'; before(a: PointAnalysis): boolean }

/** A located point inside a segment. */
export interface Located {
  theta: number
  a: PointAnalysis
  newtonIterations: number
  residualNorm: number
  /** |Δλ| / max(1, |λ|) of the final bracket. */
  precision: number
  located: boolean
  iterations: number
}

/** Corrected and analysed point at θ inside the segment, or undefined if Newton failed there. */
export function pointInSegment(ctx: LocateContext, seg: Segment, theta: number): { a: PointAnalysis; it: number; res: number } | undefined {
  const guess = axpy(seg.y0, theta * seg.ds, seg.c)
  const r = correct(ctx.problem, ctx.solver, guess, seg.c, dot(seg.c, seg.y0) + theta * seg.ds, ctx.corrector)
  if (!r.converged) return undefined
  const an = analysePoint(ctx.problem, ctx.solver, r.y, seg.c, ctx.sigmaIterations)
  return an.ok ? { a: an.a, it: r.iterations, res: r.residualNorm } : undefined
}

/** Find the crossing of `watch` between θ = 0 and θ = 1. */
export function locateInSegment(ctx: LocateContext, seg: Segment, watch: Watch): Located {
  const n = ctx.problem.n
  let ta = 0, tb = 1
  let pa = { a: seg.a0, it: 0, res: 0 }, pb = { a: seg.a1, it: 0, res: 0 }
  let fa = watch.type === 'continuous' ? watch.value(seg.a0) : 1
  let fb = watch.type === 'continuous' ? watch.value(seg.a1) : -1
  let side = 0
  let last = pb
  let lastTheta = 1
  const width = (): { dl: number; ds: number } => ({
    dl: Math.abs(pa.a.y[n]! - pb.a.y[n]!) / Math.max(1, Math.abs(last.a.y[n]!)),
    ds: ((tb - ta) * seg.ds) / Math.max(1, normInf(last.a.y)),
  })
  let iterations = 0
  for (; iterations < ctx.maxLocateIterations; iterations++) {
    const w = width()
    if (w.dl <= ctx.locateTolerance && w.ds <= ctx.locateTolerance) break
    let theta = watch.type === 'continuous' ? (ta * fb - tb * fa) / (fb - fa) : 0.5 * (ta + tb)
    // Keep the trial strictly inside the bracket: a trial clamped next to one end moves the other
    // end to it, so the bracket shrinks by 1000× even when the root sits at an end.
    const margin = 1e-3 * (tb - ta)
    if (!Number.isFinite(theta)) theta = 0.5 * (ta + tb)
    theta = Math.min(tb - margin, Math.max(ta + margin, theta))
    let p = pointInSegment(ctx, seg, theta)
    if (!p && theta !== 0.5 * (ta + tb)) { theta = 0.5 * (ta + tb); p = pointInSegment(ctx, seg, theta) }
    if (!p) break
    last = p
    lastTheta = theta
    if (watch.type === 'predicate') {
      if (watch.before(p.a)) { ta = theta; pa = p } else { tb = theta; pb = p }
      continue
    }
    const f = watch.value(p.a)
    if (f === 0) { ta = tb = theta; pa = pb = p; break }
    if (Math.sign(f) === Math.sign(fb)) {
      tb = theta; fb = f; pb = p
      if (side === -1) fa /= 2
      side = -1
    } else {
      ta = theta; fa = f; pa = p
      if (side === 1) fb /= 2
      side = 1
    }
  }
  const w = width()
  if (watch.type === 'continuous') {
    // Report the bracket end with the smallest test-function value.
    const best = Math.abs(watch.value(pa.a)) <= Math.abs(watch.value(pb.a)) ? pa : pb
    if (best !== last && best.a !== seg.a0 && best.a !== seg.a1) { last = best; lastTheta = best === pa ? ta : tb }
  }
  return {
    theta: lastTheta, a: last.a, newtonIterations: last.it, residualNorm: last.res,
    precision: w.dl, located: w.dl <= ctx.locateTolerance && w.ds <= ctx.locateTolerance, iterations,
  }
}
