/**
 * Test functions compared between the two ends of an accepted step, and the location of every
 * sign change found:
 * - fold: the λ-component of the unit tangent changes sign (Illinois, then Newton on the
 *   minimally augmented system, fold-refine.ts);
 * - branch point: the sign of det [[F_u, F_λ], [tᵀ]] changes (Illinois on the determinant);
 * - rigidity loss: for symmetric F_u, the number of negative LDLᵀ pivots changes by k ≥ 2 —
 *   k eigenvalues cross zero together, F_u has a kernel of dimension k there (bisection on the
 *   count). Named the same for every k: for even k every determinant sign stays unchanged; for odd
 *   k the bordered determinant changes sign too and no separate branch point is reported (the
 *   label says so). A change by 1 is a fold or a branch point, reported as such;
 * - problem events, milestones, bounds on λ and u, and the return to the start (closed loop).
 * Findings come back ordered along the step.
 */
import { refineFold } from './fold-refine'
import { analysePoint, type PointAnalysis } from './analysis'
import type { BorderedSolver } from './bordered'
import { locateInSegment, type LocateContext, type Located, type Segment, type Watch } from './locate'
import type { ResolvedOptions } from './options'
import type { EventLimit } from './types'
import { axpy, dot, normInf, normalized, norm2, probeVector } from '../linalg/vectors'

/** A located special point inside a step. */
export interface Finding {
  kind: string
  label: string
  located: Located
  kernel?: Float64Array
  /** Ends the run whatever the options say (bounds, closed loop, terminal problem events). */
  terminal: boolean
  /** Ends the run when options.stopAtSpecialPoint is set. */
  stopsOnRequest: boolean
  /** Where the event really is, beyond the located crossing (ProblemEvent.limit). */
  limit?: EventLimit
}

type Ctx = LocateContext & { solverT: BorderedSolver; options: ResolvedOptions }

const changes = (a: number, b: number): boolean => (a < 0 && b >= 0) || (a > 0 && b <= 0)

/** Null vector of the bordered matrix at a located branch point, orthogonal to the tangent. */
function branchKernel(a: PointAnalysis): Float64Array | undefined {
  const n = a.y.length - 1
  let v = probeVector(n + 1)
  for (let k = 0; k < 4; k++) {
    const s = a.M.solve(v.subarray(0, n), v[n]!)
    if (!s.ok || !(norm2(s.x) > 0)) return undefined
    v = normalized(s.x)
  }
  v = axpy(v, -dot(v, a.t), a.t)
  if (!(norm2(v) > 1e-8)) return undefined
  v = normalized(v)
  // Deterministic orientation: the largest component is positive.
  let big = 0
  for (let i = 1; i <= n; i++) if (Math.abs(v[i]!) > Math.abs(v[big]!)) big = i
  return v[big]! < 0 ? v.map((x) => -x) : v
}

function foldFinding(ctx: Ctx, seg: Segment): Finding {
  const n = ctx.problem.n
  const loc = locateInSegment(ctx, seg, { type: 'continuous', value: (a) => a.tests.tangentLambda })
  let located = loc
  const a = loc.a
  const right = a.sigmaVector ?? a.t.subarray(0, n)
  const left = !ctx.problem.symmetric && a.M.fu.ok ? a.M.fu.factor.solveTranspose(right) : right
  if (norm2(right) > 0 && norm2(left) > 0 && Number.isFinite(norm2(left))) {
    const rf = refineFold(ctx.problem, ctx.solver, ctx.solverT, a.y, right, left, ctx.locateTolerance, ctx.corrector.maxNewtonIterations)
    if (rf.converged) {
      const an = analysePoint(ctx.problem, ctx.solver, rf.y, a.t, ctx.sigmaIterations)
      if (an.ok) {
        located = { ...loc, a: an.a, precision: rf.lastLambdaUpdate, located: rf.lastLambdaUpdate <= ctx.locateTolerance, iterations: loc.iterations + rf.iterations }
      }
    }
  }
  const kernel = located.a.sigmaVector ?? normalized(located.a.t.subarray(0, n))
  return { kind: 'fold', label: 'fold: λ turns back', located, kernel, terminal: false, stopsOnRequest: true }
}

/** Detect and locate everything that happens between the two ends of `seg`. */
export function detectInStep(ctx: Ctx, seg: Segment, first: { y: Float64Array; t: Float64Array }, pointCount: number): Finding[] {
  const { options: o, problem } = ctx
  const n = problem.n
  const t0 = seg.a0.tests, t1 = seg.a1.tests
  const out: Finding[] = []
  const locate = (w: Watch): Located => locateInSegment(ctx, seg, w)
  const crossing = (fn: (a: PointAnalysis) => number): boolean => changes(fn(seg.a0), fn(seg.a1))

  const neg0 = t0.negativeEigenvalues, neg1 = t1.negativeEigenvalues
  const k = problem.symmetric && neg0 !== undefined && neg1 !== undefined ? Math.abs(neg1 - neg0) : 0
  if (o.detectFolds && changes(t0.tangentLambda, t1.tangentLambda)) out.push(foldFinding(ctx, seg))
  if (o.detectBranchPoints && t0.borderedDetSign * t1.borderedDetSign < 0 && !(o.detectRigidityLoss && k >= 2)) {
    const ref = seg.a0.detLogAbs
    const located = locate({ type: 'continuous', value: (a) => a.tests.borderedDetSign * Math.exp(Math.min(600, a.detLogAbs - ref)) })
    out.push({ kind: 'branch point', label: 'branch point: two branches cross', located, kernel: branchKernel(located.a), terminal: false, stopsOnRequest: true })
  }
  if (o.detectRigidityLoss && k >= 2) {
    const located = locate({ type: 'predicate', before: (a) => a.tests.negativeEigenvalues === neg0 })
    const odd = k % 2 === 1 ? '; the bordered determinant changes sign too, so branches may cross here' : ''
    out.push({
      kind: 'rigidity loss',
      label: `rigidity loss: ${k} eigenvalues of F_u cross zero together (kernel dimension ${k}, negative eigenvalues ${neg0} → ${neg1}${odd})`,
      located, kernel: located.a.sigmaVector, terminal: false, stopsOnRequest: true,
    })
  }
  ;(problem.events ?? []).forEach((e, i) => {
    if (!crossing((a) => a.tests.events[i]!)) return
    const located = locate({ type: 'continuous', value: (a) => a.tests.events[i]! })
    const f: Finding = { kind: e.kind, label: e.label, located, terminal: e.terminal ?? true, stopsOnRequest: true }
    if (e.limit) {
      const limit = e.limit(located.a.y.subarray(0, n), located.a.y[n]!)
      // without a limit the crossing is only the stop distance: not the event's location
      if (limit) f.limit = limit
      else f.located = { ...located, located: false }
    }
    out.push(f)
  })
  for (const m of o.milestones) {
    const fn = (a: PointAnalysis): number => a.y[n]! - m
    if (crossing(fn)) out.push({ kind: 'milestone', label: `λ = ${m}`, located: locate({ type: 'continuous', value: fn }), terminal: false, stopsOnRequest: false })
  }
  const bound = (fn: (a: PointAnalysis) => number, label: string): void => {
    if (crossing(fn)) out.push({ kind: 'bound', label, located: locate({ type: 'continuous', value: fn }), terminal: true, stopsOnRequest: true })
  }
  if (Number.isFinite(o.lambdaMax)) bound((a) => a.y[n]! - o.lambdaMax, `λ reaches its upper bound ${o.lambdaMax}`)
  if (Number.isFinite(o.lambdaMin)) bound((a) => a.y[n]! - o.lambdaMin, `λ reaches its lower bound ${o.lambdaMin}`)
  for (const b of o.stateBounds) {
    if (b.max !== undefined) bound((a) => a.y[b.component]! - b.max!, `u[${b.component}] reaches its upper bound ${b.max}`)
    if (b.min !== undefined) bound((a) => a.y[b.component]! - b.min!, `u[${b.component}] reaches its lower bound ${b.min}`)
  }
  if (pointCount >= 3) {
    const fn = (a: PointAnalysis): number => dot(first.t, a.y) - dot(first.t, first.y)
    if (fn(seg.a0) < 0 && fn(seg.a1) >= 0) {
      const located = locate({ type: 'continuous', value: fn })
      const dist = normInf(axpy(located.a.y, -1, first.y))
      if (dist <= o.closedLoopTolerance * Math.max(1, normInf(first.y))) {
        out.push({ kind: 'closed loop', label: 'closed loop: the branch returned to its start', located: { ...located, precision: dist / Math.max(1, normInf(first.y)) }, terminal: true, stopsOnRequest: true })
      }
    }
  }
  return out.sort((a, b) => a.located.theta - b.located.theta)
}
