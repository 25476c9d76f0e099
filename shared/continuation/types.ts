/**
 * Data types of the continuation engine. Everything a run produces (points, special points,
 * outcomes) is plain JSON-serialisable data: vectors are `number[]`, never typed arrays, so a
 * Web Worker can post them and a server can store them as they are.
 */
import type { Triplets } from '../linalg/triplets'

/** A problem-specific test function; a sign change between two points is an event. */
export interface ProblemEvent {
  /** Plain-word kind shown to users, e.g. "collapse", "order flip", "lattice degeneracy". */
  kind: string
  /** Human-readable label, e.g. "edge 3 reaches length 0". */
  label: string
  /** Smooth scalar function whose zero is the event. */
  fn(u: Float64Array, lambda: number): number
  /** Stop the run when this event is found. Default true (the construction stops working there). */
  terminal?: boolean
  /**
   * Where the event really happens when `fn` only crosses zero at a stop distance before it (an
   * edge collapse: `fn` is length − tolerance, the limit is length 0). Called with the located
   * crossing; undefined = report the crossing itself, marked as not located.
   */
  limit?(u: Float64Array, lambda: number): EventLimit | undefined
  /**
   * Called with every point the engine accepts (the start, located points it keeps, step ends),
   * in order, after `fn` was evaluated there. An event whose `fn` is measured against a reference
   * that moves along the branch (the wall test: the structure at the last accepted point) updates
   * it here so that `fn` keeps the sign it had at that point.
   */
  accepted?(u: Float64Array, lambda: number): void
}

/** The limit of an event beyond the crossing of its test function (see {@link ProblemEvent.limit}). */
export interface EventLimit {
  lambda: number
  /** The state at the limit (it may lie where F itself is undefined, e.g. a zero-length edge). */
  u: number[]
  /** |Δλ| / max(1, |λ|) of the last refinement. */
  precision: number
  located: boolean
  /** Replaces the event's label (e.g. names the edge). */
  label?: string
}

/**
 * F(u, λ) = 0 with u ∈ Rⁿ and one scalar λ. Callbacks receive typed arrays they must not keep.
 */
export interface ContinuationProblem {
  /** Number of unknowns (and equations). */
  n: number
  /** out ← F(u, λ). */
  residual(u: Float64Array, lambda: number, out: Float64Array): void
  /**
   * Analytic Jacobian: F_u as triplets (keep the same triplet pattern from call to call so the
   * symbolic analysis is reused) and F_λ as a dense vector.
   */
  jacobian(u: Float64Array, lambda: number): { Fu: Triplets; Flambda: Float64Array }
  /** F_u is symmetric: enables LDLᵀ, its inertia, and the "rigidity loss" (even crossing) test. */
  symmetric?: boolean
  /** Problem-specific events, located like special points. */
  events?: ProblemEvent[]
  /** Extra numbers stored with each point (e.g. the minimum edge length). */
  diagnostics?(u: Float64Array, lambda: number): Record<string, number>
  /** Monitor σ_min(F_u) at every point (default true). */
  sigmaMin?: boolean
  /**
   * When given, the monitored σ_min is the rigidity margin of the full problem instead of
   * σ_min(F_u): see {@link RigidityMargin} and sigma-min.ts.
   */
  rigidityMargin?: RigidityMargin
  /** Without a rigidity margin: factor applied to σ_min(F_u) (e.g. ℓ̄ to make it dimensionless; default 1). */
  sigmaScale?(u: Float64Array, lambda: number): number
}

/**
 * How F_u (the full symmetric Jacobian with some coordinates pinned) relates to the rigidity
 * verdict's operator: the full Jacobian has `fullSize` coordinates, u holds those in `free` (in
 * order), its kernel contains the orthonormal `trivial` motions, and `scale(u, λ)` makes the
 * smallest |eigenvalue| on the complement of the trivial motions dimensionless (ℓ̄, or 1/K̄).
 */
export interface RigidityMargin {
  fullSize: number
  free: Int32Array
  trivial: Float64Array[]
  scale(u: Float64Array, lambda: number): number
}

/** Where a run starts: a point, optionally with a tangent (restart) and a step size. */
export interface ContinuationStart {
  u: ArrayLike<number>
  lambda: number
  /** Unit tangent (u-part then λ) from a stored point; given ⇒ the direction option is ignored. */
  tangent?: ArrayLike<number>
  /** Step size to try first (a stored point's `nextStepSize`); default options.initialStep. */
  stepSize?: number
}

/** Values of the test functions at a point. */
export interface TestValues {
  /** λ-component of the unit tangent: changes sign at a fold. */
  tangentLambda: number
  /** Sign of det [[F_u, F_λ], [tᵀ]] (bordered Jacobian): changes at a branch point. 0 if unknown. */
  borderedDetSign: number
  /** Negative eigenvalues of F_u from the LDLᵀ pivots (symmetric problems only). */
  negativeEigenvalues?: number
  /** Values of the problem's events, in order. */
  events: number[]
}

/** One accepted point of a branch. */
export interface ContinuationPoint {
  /** Position in the branch's point list. */
  index: number
  lambda: number
  u: number[]
  /** Unit tangent (u-part, then λ), oriented along the direction of travel. */
  tangent: number[]
  /** Arclength step that led to this point (0 for the first point). */
  stepSize: number
  /** Step size the engine will try next from this point (used by restarts). */
  nextStepSize: number
  /** Cumulative pseudo-arclength from the branch start (sum of the tangent-projected steps Δs; slightly below the true arc length). */
  arclength: number
  newtonIterations: number
  /** Max-norm of F at the point. */
  residualNorm: number
  tests: TestValues
  /**
   * Estimate of σ_min (see sigma-min.ts), if monitored; 0 when F_u could not be factorised. With
   * the problem's `rigidityMargin` it is the dimensionless margin of the rigidity verdict (trivial
   * motions removed, × ℓ̄ or ÷ K̄), which compares across pattern sizes; otherwise σ_min(F_u).
   */
  sigmaMin?: number
  diagnostics?: Record<string, number>
}

/** Kinds of special points the engine itself finds (problem events add their own kinds). */
export type EngineSpecialKind = 'fold' | 'branch point' | 'rigidity loss' | 'bound' | 'milestone' | 'closed loop'

/** A special point on a branch. */
export interface SpecialPoint {
  /** Position in the branch's special point list. */
  index: number
  /** "fold", "branch point", "rigidity loss", "bound", "milestone", "closed loop" or a problem event kind. */
  kind: EngineSpecialKind | string
  label: string
  /** Index of the accepted point just before it. */
  afterPoint: number
  lambda: number
  u: number[]
  /** Unit tangent at the special point. */
  tangent: number[]
  /**
   * Kernel vector: for a fold or rigidity loss the approximate null vector of F_u (length n);
   * for a branch point the null vector of the bordered Jacobian, i.e. the direction of the other
   * branch orthogonal to the tangent (length n+1).
   */
  kernel?: number[]
  /** Relative precision reached in λ: |Δλ| / max(1, |λ|) of the last refinement. */
  precision: number
  /** Whether the requested locateTolerance was reached. */
  located: boolean
  /** Refinement iterations used. */
  iterations: number
  /**
   * For an event located at its limit (a collapse): the point where the run stopped, i.e. where
   * the test function crossed zero (λ there; u and tangent of the last accepted point).
   */
  stoppedAt?: { lambda: number }
}

/** Identity of a branch and, for a branch produced by switching, where it came from. */
export interface BranchInfo {
  id: string
  parent?: { branchId: string; specialPointIndex: number }
}

/** Outcome of one call to `next()`. */
export interface StepOutcome {
  /** 'accepted': a new point; 'rejected': the step failed and will be retried smaller; 'finished': the run ended. */
  status: 'accepted' | 'rejected' | 'finished'
  /** The accepted point(s) (a milestone adds one before the step's end point). */
  points: ContinuationPoint[]
  specialPoints: SpecialPoint[]
  /** Step size that will be tried next. */
  stepSize: number
  /** Why a step was rejected or the run finished. */
  reason?: string
}

/** Everything about one branch, as plain data. */
export interface BranchResult {
  branch: BranchInfo
  points: ContinuationPoint[]
  specialPoints: SpecialPoint[]
  /** Why the run stopped (undefined while running). */
  finishReason?: string
  /** False if the start was refused. */
  started: boolean
  /** Set when the run ended because the corrector kept failing: the branch goes on, unfollowed. */
  stalled?: boolean
  /** Counts for reporting. */
  stats: { accepted: number; rejected: number; fullBorderedSolves: number }
}
