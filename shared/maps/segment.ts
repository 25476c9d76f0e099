/**
 * One straight run of the sweep: from a solved state at λ0, continue (pseudo-arclength, Keller
 * 1977, via shared/continuation) in one direction, forcing a point at each grid value
 * ("milestones"), until every target is reached or the run ends. Warm starts only: each grid
 * value is reached by the engine's predictor–corrector from the previous point.
 * A fold ends the segment (beyond it the branch runs back over cells it has covered); a
 * collapse, order flip or lattice degeneracy ends it as the terminal events of the problem.
 */
import { createFamilyRun } from '../families/path-only'
import type { ContinuationPoint } from '../continuation/types'
import type { PlaneSlice } from './plane'

/** Result of {@link runSegment}: the point reached at each target (undefined when not reached). */
export interface SegmentResult {
  points: (ContinuationPoint | undefined)[]
  /** Why the segment stopped before its last target (plain words), or undefined. */
  endedBy?: string
  /** Where it stopped (λ and state) when an event or fold ended it. */
  end?: { lambda: number; u: number[] }
  /** Rigidity losses and branch points passed on the way. */
  crossings: { kind: string; lambda: number; u: number[] }[]
}

/** Options of {@link runSegment}. */
export interface SegmentOptions {
  /** Largest arclength step (default: the spacing of the targets, or 0.1). */
  maxStep?: number
  /** Accepted points before giving up (default 5000). */
  maxPoints?: number
}

const ENDING_EVENTS = new Set(['collapse', 'order flip', 'lattice degeneracy', 'fold'])
/** Events of the published conditions, recorded as crossings (walls are drawn on τ maps; shared/families/walls.ts). */
const CONDITION_EVENTS = new Set(['wall', 'vertex no longer ordinary', 'rank of M drops'])

/**
 * Continue `slice` from (u0, λ0) through `targets` (monotone, all on one side of λ0 or equal to
 * it). A target equal to λ0 takes the corrected start point.
 */
export function runSegment(slice: PlaneSlice, u0: ArrayLike<number>, lambda0: number, targets: number[], o: SegmentOptions = {}): SegmentResult {
  const points: (ContinuationPoint | undefined)[] = targets.map(() => undefined)
  const crossings: SegmentResult['crossings'] = []
  if (targets.length === 0) return { points, crossings }
  const last = targets[targets.length - 1]!
  const increase = last >= lambda0
  const spacing = targets.length > 1 ? Math.abs(targets[1]! - targets[0]!) : Math.max(Math.abs(last - lambda0), 0.1)
  const maxStep = o.maxStep ?? Math.min(0.5, spacing)
  const beyond = last + (increase ? 1 : -1) * 0.5 * spacing
  const milestones = targets.filter(t => t !== lambda0)
  // a pattern without unknowns (one tower) walks the slice instead (path-only.ts)
  const run = createFamilyRun(slice.problem, { u: u0, lambda: lambda0 }, {
    direction: increase ? 'increase' : 'decrease',
    milestones,
    ...(increase ? { lambdaMax: beyond } : { lambdaMin: beyond }),
    initialStep: Math.min(0.05, maxStep), maxStep,
    maxPoints: o.maxPoints ?? 5000,
  }, { id: 'map-segment' })
  if (!run.started) return { points, crossings, endedBy: 'no convergence' }
  let next = 0
  const first = run.result().points[0]
  while (next < targets.length && targets[next] === lambda0) { points[next] = first; next++ }
  while (!run.done && next < targets.length) {
    const out = run.next()
    for (const sp of out.specialPoints) {
      if (sp.kind === 'milestone') {
        const p = out.points.reduce((a, b) => Math.abs(b.lambda - sp.lambda) < Math.abs(a.lambda - sp.lambda) ? b : a)
        while (next < targets.length && (increase ? targets[next]! <= sp.lambda + 1e-7 : targets[next]! >= sp.lambda - 1e-7)) {
          if (Math.abs(targets[next]! - sp.lambda) <= 1e-7 * Math.max(1, Math.abs(sp.lambda))) points[next] = p
          next++
        }
      } else if (ENDING_EVENTS.has(sp.kind)) {
        return { points, crossings, endedBy: sp.kind, end: { lambda: sp.lambda, u: sp.u } }
      } else if (sp.kind === 'rigidity loss' || sp.kind === 'branch point' || CONDITION_EVENTS.has(sp.kind)) {
        crossings.push({ kind: sp.kind, lambda: sp.lambda, u: sp.u })
      }
    }
    if (out.status === 'finished' && next < targets.length) {
      const reason = out.reason ?? run.result().finishReason ?? ''
      return { points, crossings, endedBy: /maxPoints/.test(reason) ? 'too many steps' : 'no convergence' }
    }
  }
  return { points, crossings }
}
