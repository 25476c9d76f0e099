/** Options of the continuation engine, their defaults, and their validation. */
import { resolveSolverOptions, type SolverOptions } from '../linalg/solver'

/** Bound on one component of the state u. */
export interface StateBound { component: number; min?: number; max?: number }

/** Options of a continuation run. Every field has a documented default. */
export interface ContinuationOptions {
  /** Initial direction of travel in λ when no tangent is given. Default 'increase'. */
  direction?: 'increase' | 'decrease'
  /** Predictor: along the tangent (default) or along the secant of the last two points. */
  predictor?: 'tangent' | 'secant'
  /** First arclength step. Default 0.05. */
  initialStep?: number
  /** Smallest step before the run gives up. Default 1e-8. */
  minStep?: number
  /** Largest step. Default 0.5. */
  maxStep?: number
  /** Step multiplier after a fast Newton convergence. Default 1.5. */
  growFactor?: number
  /** Step multiplier after a failure. Default 0.5. */
  shrinkFactor?: number
  /** Newton converged in at most this many iterations ⇒ grow the step. Default 3. */
  fastIterations?: number
  /** Newton iterations per corrector. Default 10. */
  maxNewtonIterations?: number
  /**
   * Chord Newton: reuse F_u as factorised at the previous point for every corrector iteration
   * (falling back to full Newton for that step when it does not converge) (linear instead of quadratic convergence, one factorisation
   * instead of one per iteration). Default false. With it, raise fastIterations if steps should
   * still grow (chord needs more, cheaper iterations).
   */
  chordNewton?: boolean
  /** Converged when max|F| ≤ this and the last update ≤ stepTolerance·(1+max|y|). Default 1e-10. */
  residualTolerance?: number
  /** See residualTolerance. Default 1e-10. */
  stepTolerance?: number
  /** Reject a step whose unit tangent turns by more than this angle (radians). Default 0.5 (≈ 29°). */
  maxTurnAngle?: number
  /** Stop after this many accepted points. Default 1000. */
  maxPoints?: number
  /** Bounds on λ (a "bound" special point ends the run). Default −∞, +∞. */
  lambdaMin?: number
  lambdaMax?: number
  /** Bounds on components of u. Default none. */
  stateBounds?: StateBound[]
  /** λ values where a point is forced ("milestone"). Default none. */
  milestones?: number[]
  /** Stop at the first fold, branch point, rigidity loss or problem event. Default false. */
  stopAtSpecialPoint?: boolean
  /** Which test functions to watch. Defaults true. */
  detectFolds?: boolean
  detectBranchPoints?: boolean
  detectRigidityLoss?: boolean
  /** Relative tolerance in λ when locating special points. Default 1e-9. */
  locateTolerance?: number
  /** Refinement iterations per special point. Default 60. */
  maxLocateIterations?: number
  /** Detect a closed loop when the branch returns within this relative distance of its start. Default 1e-6. */
  closedLoopTolerance?: number
  /** Start even if F_u is singular at the start point. Default false. */
  allowSingularStart?: boolean
  /** F_u counts as singular at the start when σ_min ≤ this · max(1, max|F_u|). Default 1e-10. */
  singularTolerance?: number
  /** Inverse-iteration steps of the σ_min estimate (each: one solve, two when F_u is unsymmetric). Default 5. */
  sigmaIterations?: number
  /**
   * Bordering is accepted when the bordered residual ≤ this · (|rhs| + |M|·|x|) (max norms);
   * otherwise the full bordered matrix is factorised. Default 1e-9.
   */
  borderingTolerance?: number
  /** Sparse solver options (method, ordering, …). */
  solver?: SolverOptions
  /**
   * How the caller's users spell the options that messages name (e.g. a settings file's
   * `step.min` for minStep). Default: the option names themselves.
   */
  optionNames?: OptionNames
}

/** Options the engine's messages name. */
export type OptionNames = Partial<Record<'allowSingularStart' | 'minStep' | 'maxPoints', string>>

/** Defaults of {@link ContinuationOptions}. */
export const DEFAULT_CONTINUATION_OPTIONS = {
  direction: 'increase', predictor: 'tangent', initialStep: 0.05, minStep: 1e-8, maxStep: 0.5,
  growFactor: 1.5, shrinkFactor: 0.5, fastIterations: 3, maxNewtonIterations: 10, chordNewton: false,
  residualTolerance: 1e-10, stepTolerance: 1e-10, maxTurnAngle: 0.5, maxPoints: 1000,
  lambdaMin: -Infinity, lambdaMax: Infinity, stateBounds: [] as StateBound[], milestones: [] as number[],
  stopAtSpecialPoint: false, detectFolds: true, detectBranchPoints: true, detectRigidityLoss: true,
  locateTolerance: 1e-9, maxLocateIterations: 60, closedLoopTolerance: 1e-6,
  allowSingularStart: false, singularTolerance: 1e-10, sigmaIterations: 5, borderingTolerance: 1e-9,
  solver: {} as SolverOptions, optionNames: {} as OptionNames,
} satisfies Required<ContinuationOptions>

/** Options with every default filled in. */
export type ResolvedOptions = Omit<typeof DEFAULT_CONTINUATION_OPTIONS, 'direction' | 'predictor'> & { direction: 'increase' | 'decrease'; predictor: 'tangent' | 'secant' }

/** Fill defaults and reject nonsense with a clear message. */
export function resolveContinuationOptions(o: ContinuationOptions = {}): ResolvedOptions {
  const r = { ...DEFAULT_CONTINUATION_OPTIONS, ...o } as ResolvedOptions
  const positive = ['initialStep', 'minStep', 'maxStep', 'residualTolerance', 'stepTolerance', 'maxTurnAngle', 'locateTolerance', 'closedLoopTolerance', 'singularTolerance', 'borderingTolerance'] as const
  for (const k of positive) if (!(typeof r[k] === 'number' && r[k] > 0)) throw new Error(`continuation: ${k} must be a positive number`)
  const counts = ['fastIterations', 'maxNewtonIterations', 'maxPoints', 'maxLocateIterations', 'sigmaIterations'] as const
  for (const k of counts) if (!(Number.isInteger(r[k]) && r[k] >= 1)) throw new Error(`continuation: ${k} must be an integer ≥ 1`)
  if (typeof r.chordNewton !== 'boolean') throw new Error('continuation: chordNewton must be a boolean')
  if (r.direction !== 'increase' && r.direction !== 'decrease') throw new Error("continuation: direction must be 'increase' or 'decrease'")
  if (r.predictor !== 'tangent' && r.predictor !== 'secant') throw new Error("continuation: predictor must be 'tangent' or 'secant'")
  if (!(r.minStep <= r.initialStep && r.initialStep <= r.maxStep)) throw new Error('continuation: need minStep ≤ initialStep ≤ maxStep')
  if (!(r.growFactor >= 1)) throw new Error('continuation: growFactor must be ≥ 1')
  if (!(r.shrinkFactor > 0 && r.shrinkFactor < 1)) throw new Error('continuation: shrinkFactor must be in (0, 1)')
  if (!(r.maxTurnAngle <= Math.PI)) throw new Error('continuation: maxTurnAngle must be ≤ π')
  if (!(r.lambdaMin < r.lambdaMax)) throw new Error('continuation: lambdaMin must be < lambdaMax')
  if (!r.milestones.every(Number.isFinite)) throw new Error('continuation: milestones must be finite numbers')
  for (const b of r.stateBounds) {
    if (!Number.isInteger(b.component) || b.component < 0) throw new Error('continuation: stateBounds component must be an index ≥ 0')
    if (b.min === undefined && b.max === undefined) throw new Error('continuation: a state bound needs min or max')
  }
  resolveSolverOptions(r.solver)
  return r
}
