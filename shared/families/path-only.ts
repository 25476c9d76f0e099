/**
 * A family with no free unknowns (n = 0: one tower, whose position and phase are fixed up to
 * translation). F has no equations left, so every point of the path is a solution: the family is
 * the path itself, and there is nothing to continue. This run walks the path in equal steps of λ
 * (the first step size of the settings), evaluates the problem's events and diagnostics at each
 * point, locates every sign change of an event by bisection in λ (to the locate tolerance), puts a
 * point on every milestone and stops at terminal events and at the target, with the same outputs
 * as the continuation engine.
 */
import { resolveContinuationOptions, type ContinuationOptions, type ResolvedOptions } from '../continuation/options'
import { createContinuation, type Continuation } from '../continuation/engine'
import type { BranchInfo, BranchResult, ContinuationPoint, ContinuationProblem, ContinuationStart, SpecialPoint, StepOutcome } from '../continuation/types'

/** What a family says when it has no unknowns. */
export const NO_UNKNOWNS_NOTE = 'This pattern has no free unknowns (one tower: its position and phase are fixed up to translation), so there is nothing to solve: every point of the path is balanced, and the family is the path itself. Wingfold walks the path and reports its events and the numbers at each point.'

const EMPTY = new Float64Array(0)

/** Walks the path of a problem with n = 0; the subset of the engine's interface the family runner uses. */
export class PathOnlyRun {
  readonly points: ContinuationPoint[] = []
  readonly specialPoints: SpecialPoint[] = []
  readonly options: ResolvedOptions
  readonly stats = { accepted: 0, rejected: 0, fullBorderedSolves: 0 }
  readonly started = true
  readonly stalled = false
  done = false
  finishReason?: string
  private readonly dir: number

  constructor(readonly problem: ContinuationProblem, lambda0: number, options: ContinuationOptions, readonly branch: BranchInfo) {
    if (problem.n !== 0) throw new Error('families: a path-only run needs a problem without unknowns')
    this.options = resolveContinuationOptions(options)
    this.dir = this.options.direction === 'increase' ? 1 : -1
    this.push(lambda0, 0)
  }

  private events(l: number): number[] { return (this.problem.events ?? []).map(e => e.fn(EMPTY, l)) }

  private push(l: number, step: number): ContinuationPoint {
    const prev = this.points.at(-1)
    const p: ContinuationPoint = {
      index: this.points.length, lambda: l, u: [], tangent: [this.dir], stepSize: step, nextStepSize: this.options.initialStep,
      arclength: (prev?.arclength ?? 0) + step, newtonIterations: 0, residualNorm: 0,
      tests: { tangentLambda: this.dir, borderedDetSign: 0, events: this.events(l) },
    }
    if (this.problem.diagnostics) p.diagnostics = this.problem.diagnostics(EMPTY, l)
    this.points.push(p)
    return p
  }

  /** λ in [a, b] where fn changes sign, by bisection to the locate tolerance. */
  private bisect(fn: (l: number) => number, a: number, b: number): { lambda: number; precision: number } {
    const fa = fn(a)
    for (let k = 0; k < this.options.maxLocateIterations && Math.abs(b - a) > this.options.locateTolerance * Math.max(1, Math.abs(b)); k++) {
      const m = 0.5 * (a + b)
      if (Math.sign(fn(m)) === Math.sign(fa) && fn(m) !== 0) a = m; else b = m
    }
    return { lambda: b, precision: Math.abs(b - a) / Math.max(1, Math.abs(b)) }
  }

  private special(kind: string, label: string, l: number, precision: number, located: boolean): SpecialPoint {
    const sp: SpecialPoint = { index: this.specialPoints.length, kind, label, afterPoint: this.points.length - 1, lambda: l, u: [], tangent: [this.dir], precision, located, iterations: 0 }
    this.specialPoints.push(sp)
    return sp
  }

  next(): StepOutcome {
    const o = this.options
    if (this.done) return { status: 'finished', points: [], specialPoints: [], stepSize: o.initialStep, reason: this.finishReason }
    const l0 = this.points.at(-1)!.lambda
    const bound = this.dir > 0 ? o.lambdaMax : o.lambdaMin
    let l1 = l0 + this.dir * o.initialStep
    const atBound = Number.isFinite(bound) && this.dir * (l1 - bound) >= 0
    if (atBound) l1 = bound
    const ahead = o.milestones.filter(m => this.dir * (m - l0) > 0 && this.dir * (m - l1) <= 0).sort((a, b) => this.dir * (a - b))[0]
    if (ahead !== undefined) l1 = ahead
    const found: { l: number; sp: () => SpecialPoint; terminal: boolean }[] = []
    ;(this.problem.events ?? []).forEach((e, i) => {
      const f0 = this.points.at(-1)!.tests.events[i]!, f1 = e.fn(EMPTY, l1)
      if (!((f0 < 0 && f1 >= 0) || (f0 > 0 && f1 <= 0))) return
      const r = this.bisect(l => e.fn(EMPTY, l), l0, l1)
      const terminal = (e.terminal ?? true) || o.stopAtSpecialPoint
      found.push({ l: r.lambda, terminal, sp: () => this.special(e.kind, e.label, r.lambda, r.precision, r.precision <= o.locateTolerance) })
    })
    found.sort((a, b) => this.dir * (a.l - b.l))
    const newSpecial: SpecialPoint[] = []
    for (const f of found) {
      if (f.terminal) {
        const p = this.push(f.l, Math.abs(f.l - l0))
        newSpecial.push(f.sp())
        this.done = true
        this.finishReason = `stopped at ${newSpecial.at(-1)!.kind}: ${newSpecial.at(-1)!.label}`
        return { status: 'finished', points: [p], specialPoints: newSpecial, stepSize: o.initialStep, reason: this.finishReason }
      }
      newSpecial.push(f.sp())
    }
    const p = this.push(l1, Math.abs(l1 - l0))
    this.stats.accepted++
    if (ahead !== undefined) newSpecial.push(this.special('milestone', `λ = ${ahead}`, l1, 0, true))
    if (atBound && l1 === bound) {
      newSpecial.push(this.special('bound', `λ reaches its ${this.dir > 0 ? 'upper' : 'lower'} bound ${bound}`, l1, 0, true))
      this.done = true
      this.finishReason = `stopped at bound: ${newSpecial.at(-1)!.label}`
    } else if (this.points.length >= o.maxPoints) {
      this.done = true
      this.finishReason = `reached ${o.optionNames.maxPoints ?? 'maxPoints'} (${o.maxPoints})`
    }
    return { status: this.done ? 'finished' : 'accepted', points: [p], specialPoints: newSpecial, stepSize: o.initialStep, reason: this.finishReason }
  }

  result(): BranchResult {
    return { branch: this.branch, points: this.points, specialPoints: this.specialPoints, finishReason: this.finishReason, started: true, stats: { ...this.stats } }
  }
}

/** The engine's run, or a path-only run when the problem has no unknowns. */
export function createFamilyRun(problem: ContinuationProblem, start: ContinuationStart, options: ContinuationOptions, branch: BranchInfo): Continuation | PathOnlyRun {
  return problem.n === 0 ? new PathOnlyRun(problem, start.lambda, options, branch) : createContinuation(problem, start, options, branch)
}
