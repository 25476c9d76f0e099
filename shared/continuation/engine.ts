/**
 * Step-wise pseudo-arclength continuation (H. B. Keller, "Numerical solution of bifurcation and
 * nonlinear eigenvalue problems", Applications of Bifurcation Theory, Academic Press 1977).
 *
 * One call to `next()` makes one predictor–corrector step: predictor y₀ + Δs·t₀ (or along the
 * secant), Newton corrector on F = 0 with t₀ᵀ(y − y₀) = Δs, tangent at the new point, test
 * functions compared with the previous point, every sign change located (locate.ts, and for folds
 * fold-refine.ts), then step-size control. Between calls the object holds its whole state, so a
 * worker can post points in batches, pause, resume or drop the object to cancel.
 *
 * Step control: grow Δs by growFactor when Newton converged in ≤ fastIterations iterations;
 * shrink by shrinkFactor after a failure (no convergence, solver failure, tangent turning by more
 * than maxTurnAngle); end the run when Δs < minStep.
 */
import { BorderedSolver } from './bordered'
import { analysePoint, type PointAnalysis } from './analysis'
import { correct, jacobianAt } from './corrector'
import { detectInStep, type Finding } from './detect'
import type { LocateContext } from './locate'
import { resolveContinuationOptions, type ContinuationOptions, type ResolvedOptions } from './options'
import { estimateSigmaMin } from './sigma-min'
import type { BranchInfo, BranchResult, ContinuationPoint, ContinuationProblem, ContinuationStart, SpecialPoint, StepOutcome } from './types'
import { axpy, dot, normInf, normalized, pack, probeVector } from '../linalg/vectors'

/** Throws a clear error when the problem object is malformed. */
export function validateProblem(problem: ContinuationProblem): void {
  if (!(Number.isInteger(problem.n) && problem.n >= 1)) throw new Error('continuation: problem.n must be an integer ≥ 1')
  if (typeof problem.residual !== 'function' || typeof problem.jacobian !== 'function') throw new Error('continuation: problem needs residual() and jacobian()')
  for (const e of problem.events ?? []) {
    if (typeof e.fn !== 'function' || !e.kind || !e.label) throw new Error('continuation: each event needs kind, label and fn')
  }
}

/** A continuation run that advances one step per `next()` call. */
export class Continuation {
  readonly points: ContinuationPoint[] = []
  readonly specialPoints: SpecialPoint[] = []
  done = false
  started = false
  /** True when the run ended because the corrector kept failing (step size below minStep). */
  stalled = false
  finishReason?: string
  readonly options: ResolvedOptions
  readonly stats = { accepted: 0, rejected: 0, fullBorderedSolves: 0 }
  private readonly solver: BorderedSolver
  private readonly ctx: LocateContext & { solverT: BorderedSolver; options: ResolvedOptions }
  private cur!: PointAnalysis
  private prevY?: Float64Array
  private ds: number
  private first!: { y: Float64Array; t: Float64Array }
  private readonly fullNewton: { maxNewtonIterations: number; residualTolerance: number; stepTolerance: number; chord: false }

  constructor(readonly problem: ContinuationProblem, start: ContinuationStart, options: ContinuationOptions = {}, readonly branch: BranchInfo = { id: 'branch-1' }) {
    validateProblem(problem)
    this.options = resolveContinuationOptions(options)
    const o = this.options
    const n = problem.n
    if (start.u.length !== n) throw new Error(`continuation: start.u has length ${start.u.length}, expected ${n}`)
    if (!Array.from(start.u).every(Number.isFinite) || !Number.isFinite(start.lambda)) throw new Error('continuation: start point must be finite')
    if (start.tangent && start.tangent.length !== n + 1) throw new Error(`continuation: start.tangent must have length ${n + 1}`)
    for (const b of this.options.stateBounds) if (b.component >= n) throw new Error(`continuation: state bound on component ${b.component} but n = ${n}`)
    const symmetric = problem.symmetric === true
    this.solver = new BorderedSolver(n, symmetric, o.solver, o.borderingTolerance)
    this.ctx = {
      problem, solver: this.solver, solverT: new BorderedSolver(n, false, o.solver, o.borderingTolerance), options: o,
      corrector: { maxNewtonIterations: o.maxNewtonIterations, residualTolerance: o.residualTolerance, stepTolerance: o.stepTolerance, chord: o.chordNewton },
      sigmaIterations: o.sigmaIterations, locateTolerance: o.locateTolerance, maxLocateIterations: o.maxLocateIterations,
    }
    this.fullNewton = { ...this.ctx.corrector, chord: false }
    this.ds = Math.min(o.maxStep, Math.max(o.minStep, start.stepSize ?? o.initialStep))
    this.begin(pack(start.u, start.lambda), start.tangent)
  }

  private begin(y0: Float64Array, tangent?: ArrayLike<number>): void {
    const { problem, options: o, solver } = this
    const n = problem.n
    const J0 = jacobianAt(problem, y0)
    if (J0.Fu.nRows !== n || J0.Fu.nCols !== n || J0.Flambda.length !== n) throw new Error(`continuation: jacobian() must return an ${n}×${n} F_u and F_λ of length ${n}`)
    const eLambda = new Float64Array(n + 1); eLambda[n] = 1
    const r = correct(problem, solver, y0, eLambda, y0[n]!, this.fullNewton) // the start gets full Newton: no previous factorisation to reuse
    if (!r.converged) return this.refuse(`Newton did not converge at the start point: ${r.reason}`)
    if (!o.allowSingularStart) {
      const J = jacobianAt(problem, r.y)
      const fu = solver.factorFu(J)
      if (!fu.ok) return this.refuse(`F_u is singular at the start point (${fu.reason}); to start anyway, set ${this.optionName('allowSingularStart')} to true`)
      const sigma = estimateSigmaMin(fu.factor, problem.symmetric === true, o.sigmaIterations).sigma
      const scale = Math.max(1, normInf(J.Fu.values.subarray(0, J.Fu.count)))
      if (sigma <= o.singularTolerance * scale) return this.refuse(`F_u is nearly singular at the start point (σ_min ≈ ${sigma.toExponential(2)}); to start anyway, set ${this.optionName('allowSingularStart')} to true`)
    }
    let t: Float64Array
    if (tangent) {
      t = normalized(tangent)
    } else {
      let an = analysePoint(problem, solver, r.y, eLambda, o.sigmaIterations)
      if (!an.ok) an = analysePoint(problem, solver, r.y, probeVector(n + 1), o.sigmaIterations)
      if (!an.ok) return this.refuse(`no tangent at the start point: ${an.reason}`)
      t = an.a.t
      if (Math.sign(t[n]!) !== (o.direction === 'increase' ? 1 : -1)) t = t.map((v) => -v)
    }
    const an = analysePoint(problem, solver, r.y, t, o.sigmaIterations)
    if (!an.ok) return this.refuse(`start point analysis failed: ${an.reason}`)
    if (tangent) an.a.t = t // a restart continues with the stored tangent exactly
    this.cur = an.a
    this.first = { y: r.y.slice(), t: an.a.t.slice() }
    this.started = true
    this.pushPoint(an.a, 0, r.iterations, r.residualNorm)
  }

  /** An option as the caller's users type it (options.optionNames). */
  private optionName(k: keyof NonNullable<ContinuationOptions['optionNames']>): string {
    return this.options.optionNames[k] ?? k
  }

  private refuse(reason: string): void {
    this.done = true
    this.finishReason = `start refused: ${reason}`
  }

  private finish(reason: string): void {
    this.done = true
    this.finishReason = reason
    this.stats.fullBorderedSolves = this.solver.fullFactorisations
  }

  private pushPoint(a: PointAnalysis, stepSize: number, iterations: number, residualNorm: number): ContinuationPoint {
    const n = this.problem.n
    const prev = this.points[this.points.length - 1]
    const p: ContinuationPoint = {
      index: this.points.length,
      lambda: a.y[n]!,
      u: Array.from(a.y.subarray(0, n)),
      tangent: Array.from(a.t),
      stepSize,
      nextStepSize: this.ds,
      arclength: (prev?.arclength ?? 0) + stepSize,
      newtonIterations: iterations,
      residualNorm,
      tests: a.tests,
    }
    if (a.sigma !== undefined) p.sigmaMin = a.sigma
    if (this.problem.diagnostics) p.diagnostics = this.problem.diagnostics(a.y.subarray(0, n), a.y[n]!)
    for (const e of this.problem.events ?? []) e.accepted?.(a.y.subarray(0, n), a.y[n]!)
    this.points.push(p)
    return p
  }

  private pushSpecial(f: Finding): SpecialPoint {
    const n = this.problem.n
    const a = f.located.a
    const sp: SpecialPoint = {
      index: this.specialPoints.length,
      kind: f.kind,
      label: f.label,
      afterPoint: this.points.length - 1,
      lambda: a.y[n]!,
      u: Array.from(a.y.subarray(0, n)),
      tangent: Array.from(a.t),
      precision: f.located.precision,
      located: f.located.located,
      iterations: f.located.iterations,
    }
    if (f.kernel) sp.kernel = Array.from(f.kernel)
    if (f.limit) {
      sp.stoppedAt = { lambda: sp.lambda }
      sp.lambda = f.limit.lambda
      sp.u = f.limit.u
      sp.precision = f.limit.precision
      sp.located = f.limit.located
      if (f.limit.label) sp.label = f.limit.label
    }
    this.specialPoints.push(sp)
    return sp
  }

  private reject(reason: string): StepOutcome {
    this.stats.rejected++
    this.ds *= this.options.shrinkFactor
    if (this.ds < this.options.minStep) {
      this.stalled = true
      const l = this.cur.y[this.problem.n]!
      this.finish(`no convergence past λ = ${l.toPrecision(10)} (step size fell below ${this.optionName('minStep')} = ${this.options.minStep}; last failure: ${reason})`)
      return { status: 'finished', points: [], specialPoints: [], stepSize: this.ds, reason: this.finishReason }
    }
    return { status: 'rejected', points: [], specialPoints: [], stepSize: this.ds, reason }
  }

  /** Make one step. After the run has ended, returns `{ status: 'finished' }` with the reason. */
  next(): StepOutcome {
    if (this.done) return { status: 'finished', points: [], specialPoints: [], stepSize: this.ds, reason: this.finishReason }
    const { problem, options: o, solver } = this
    const a0 = this.cur
    const c = o.predictor === 'secant' && this.prevY ? normalized(axpy(a0.y, -1, this.prevY)) : a0.t
    const ds = this.ds
    const guess = axpy(a0.y, ds, c), target = dot(c, a0.y) + ds
    // Chord: first with F_u as factorised at the previous point (no new factorisation); where that
    // does not converge (e.g. an edge about to collapse makes F_u change fast), full Newton.
    let r = o.chordNewton && a0.M.fu.ok
      ? correct(problem, solver, guess, c, target, this.ctx.corrector, a0.M.withBorder(c))
      : undefined
    if (!r?.converged) r = correct(problem, solver, guess, c, target, r ? this.fullNewton : this.ctx.corrector)
    if (!r.converged) return this.reject(r.reason ?? 'corrector failed')
    const an = analysePoint(problem, solver, r.y, c, o.sigmaIterations, a0.marginVector ?? a0.sigmaVector)
    if (!an.ok) return this.reject(an.reason)
    const turn = Math.acos(Math.max(-1, Math.min(1, dot(a0.t, an.a.t))))
    if (turn > o.maxTurnAngle) return this.reject(`tangent turned by ${turn.toFixed(3)} rad, more than the ${o.maxTurnAngle} rad allowed in one step`)

    const findings = detectInStep(this.ctx, { y0: a0.y, c, ds, a0, a1: an.a }, this.first, this.points.length)
    const newPoints: ContinuationPoint[] = []
    const newSpecial: SpecialPoint[] = []
    let thetaPrev = 0
    this.stats.accepted++
    for (const f of findings) {
      const terminal = f.terminal || (o.stopAtSpecialPoint && f.stopsOnRequest)
      if (f.kind === 'milestone' || terminal) {
        newPoints.push(this.pushPoint(f.located.a, (f.located.theta - thetaPrev) * ds, f.located.newtonIterations, f.located.residualNorm))
        thetaPrev = f.located.theta
      }
      const sp = this.pushSpecial(f)
      newSpecial.push(sp)
      if (terminal) {
        this.cur = f.located.a
        this.finish(`stopped at ${f.kind}: ${sp.label}`)
        return { status: 'finished', points: newPoints, specialPoints: newSpecial, stepSize: this.ds, reason: this.finishReason }
      }
    }
    if (r.iterations <= o.fastIterations) this.ds = Math.min(ds * o.growFactor, o.maxStep)
    newPoints.push(this.pushPoint(an.a, (1 - thetaPrev) * ds, r.iterations, r.residualNorm))
    this.prevY = a0.y
    this.cur = an.a
    if (this.points.length >= o.maxPoints) this.finish(`reached ${this.optionName('maxPoints')} (${o.maxPoints})`)
    this.stats.fullBorderedSolves = this.solver.fullFactorisations
    return { status: this.done ? 'finished' : 'accepted', points: newPoints, specialPoints: newSpecial, stepSize: this.ds, reason: this.finishReason }
  }

  /** The branch as plain data (arrays are the live ones; copy before mutating). */
  result(): BranchResult {
    return { branch: this.branch, points: this.points, specialPoints: this.specialPoints, finishReason: this.finishReason, started: this.started, ...(this.stalled ? { stalled: true } : {}), stats: { ...this.stats } }
  }
}

/** Start a step-wise continuation run (see {@link Continuation}). A refused start gives `done = true` with the reason. */
export function createContinuation(problem: ContinuationProblem, start: ContinuationStart, options: ContinuationOptions = {}, branch?: BranchInfo): Continuation {
  return new Continuation(problem, start, options, branch)
}

/** Run to the end (tests, CLI). */
export function runContinuation(problem: ContinuationProblem, start: ContinuationStart, options: ContinuationOptions = {}, branch?: BranchInfo): BranchResult {
  const c = createContinuation(problem, start, options, branch)
  while (!c.done) c.next()
  return c.result()
}

/** Start values to restart a run from one of its stored points (same tangent and next step size). */
export function restartFrom(point: ContinuationPoint): ContinuationStart {
  return { u: point.u, lambda: point.lambda, tangent: point.tangent, stepSize: point.nextStepSize }
}
