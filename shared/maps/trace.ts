/**
 * Curve tracing in a map plane: from a point on a curve (a collapse that ended a row, or a
 * rigidity loss passed by a row or the spine), continue the defining system in two parameters
 * (pseudo-arclength, Keller 1977) both ways until it leaves the plane's window.
 * Collapse: the contracted-edge system of collapse.ts. Rigidity loss: the minimally augmented
 * system of augmented.ts (Govaerts 2000).
 */
import { runContinuation } from '../continuation/engine'
import type { ContinuationProblem } from '../continuation/types'
import { trailingBlock } from '../families/reduce'
import { balanceJacobian, balanceResidual } from '../pattern/balance'
import { compilePattern, type PatternModel } from '../pattern/model'
import { pinnedLevelJacobian } from '../pattern/phase-solve'
import { levelJacobian, levelResidual, modelLevels } from '../pattern/vertical-balance'
import { parseMapSettings, type MapCrossing, type MapResult, type MapSettings } from '../types/maps'
import type { PatternDocument } from '../types/pattern'
import { nullVectors, rigidityLossCurveProblem, type TwoParameterProblem } from './augmented'
import { collapseCurveProblem, shortestEdge } from './collapse'
import { tauLattice } from './plane'

/** A traced curve: points (a, b) in plane coordinates, in order along the curve. */
export interface TracedCurve {
  kind: string
  points: [number, number][]
  /** Max |residual| over the points (the defining system). */
  maxResidual: number
  converged: boolean
  /** Why each half ended. */
  endReasons: string[]
}

/** Window and step of a trace. */
export interface TraceWindow { aMin: number; aMax: number; bMin: number; bMax: number; maxStep?: number; maxPoints?: number }

/** Traces the curve of `problem` (λ = a, last state component = b) through y0 both ways inside the window. */
export function traceCurve(kind: string, problem: ContinuationProblem, y0: Float64Array, a0: number, w: TraceWindow): TracedCurve {
  const N = problem.n
  // a start on the window's edge (a crossing on the first or last row) must still see the bound
  // crossed: widen the window by a hair so the start lies strictly inside
  const pa = 1e-9 * (1 + w.aMax - w.aMin), pb = 1e-9 * (1 + w.bMax - w.bMin)
  const halves = (['decrease', 'increase'] as const).map(direction => runContinuation(problem, { u: y0, lambda: a0 }, {
    direction, lambdaMin: w.aMin - pa, lambdaMax: w.aMax + pa, stateBounds: [{ component: N - 1, min: w.bMin - pb, max: w.bMax + pb }],
    maxStep: w.maxStep ?? 0.05, initialStep: Math.min(0.01, w.maxStep ?? 0.05), maxPoints: w.maxPoints ?? 2000,
    detectBranchPoints: false, detectRigidityLoss: false, detectFolds: false, closedLoopTolerance: 1e-6,
  }))
  const toXY = (p: { u: number[]; lambda: number }): [number, number] => [p.lambda, p.u[N - 1]!]
  const first = halves[0]!.points.slice(1).reverse().map(toXY)
  const second = halves[1]!.points.map(toXY)
  const all = [...halves[0]!.points, ...halves[1]!.points]
  return {
    kind,
    points: [...first, ...second],
    maxResidual: all.reduce((m, p) => Math.max(m, p.residualNorm), 0),
    converged: halves.every(h => h.started),
    endReasons: halves.map(h => h.finishReason ?? ''),
  }
}

/** The map plane's F(u, a, b) with F_u, for the rigidity-loss system. */
export function planeTwoParameterProblem(m: PatternModel, s: MapSettings): TwoParameterProblem {
  const V = m.nVertices
  if (s.plane === 'tau') {
    const at = tauLattice(m.lattice, s.scaleBy)
    const full = (u: Float64Array) => { const p = new Float64Array(2 * V); p[0] = m.positions[0]!; p[1] = m.positions[1]!; p.set(u, 2); return p }
    return {
      n: 2 * V - 2,
      residual: (u, a, b, out) => out.set(balanceResidual(m, full(u), at(a, b).lattice).subarray(2)),
      jacobianU: (u, a, b) => trailingBlock(balanceJacobian(m, full(u), at(a, b).lattice), 2),
    }
  }
  // α plane: the level rows of vertical balance on cuts (the document's drawing fixes the levels)
  const psi = (u: Float64Array) => { const p = new Float64Array(V); p[0] = m.psi[0]!; p.set(u, 1); return p }
  const levels = modelLevels(m)
  const column = Int32Array.from({ length: V }, (_, v) => v - 1)
  return {
    n: V - 1,
    residual: (u, a, b, out) => { levelResidual(m, levels, psi(u), [a, b], m.weight, out) },
    jacobianU: (u, a, b) => pinnedLevelJacobian(levelJacobian(m, levels, psi(u), [a, b], m.weight), column, V - 1),
  }
}

/** Traces the curve through a crossing of a map (collapse or rigidity loss). */
export function traceMapCurve(doc: PatternDocument, settingsInput: unknown, crossing: MapCrossing, window?: Partial<TraceWindow>): TracedCurve {
  const s = parseMapSettings(settingsInput)
  const m = compilePattern(doc)
  // default window: the map's window plus one grid step all round (a crossing on the first or
  // last row, located at the collapse tolerance, may correct to a point just outside the grid)
  const hx = s.x.count > 1 ? (s.x.max - s.x.min) / (s.x.count - 1) : 0.1
  const hy = s.y.count > 1 ? (s.y.max - s.y.min) / (s.y.count - 1) : 0.1
  const bMin = s.plane === 'tau' ? Math.max(s.y.min - hy, s.y.min / 2) : s.y.min - hy
  const w: TraceWindow = { aMin: s.x.min - hx, aMax: s.x.max + hx, bMin, bMax: s.y.max + hy, ...window }
  const u = Float64Array.from(crossing.u)
  if (crossing.kind === 'collapse') {
    if (s.plane !== 'tau') throw new Error('maps: collapse curves live in the τ plane')
    const positions = new Float64Array(2 * m.nVertices)
    positions[0] = m.positions[0]!; positions[1] = m.positions[1]!; positions.set(u, 2)
    const e = shortestEdge(m, positions, crossing.x, crossing.y, s.scaleBy)
    const c = collapseCurveProblem(m, e, s.scaleBy)
    return { ...traceCurve('collapse', c.problem, c.startY(positions, crossing.x, crossing.y), crossing.x, w), kind: `collapse of edge ${m.edgeIds[e]}` }
  }
  if (crossing.kind !== 'rigidity loss' && crossing.kind !== 'branch point') throw new Error(`maps: no curve tracer for '${crossing.kind}'`)
  const p = planeTwoParameterProblem(m, s)
  const nv = nullVectors(p, u, crossing.x, crossing.y)
  const y0 = new Float64Array(p.n + 1); y0.set(u); y0[p.n] = crossing.y
  return traceCurve('rigidity loss', rigidityLossCurveProblem(p, nv.right, nv.left), y0, crossing.x, w)
}

/** The crossings a tracer can start from: collapses and rigidity losses met by the sweep. */
export function traceableCrossings(map: MapResult): MapCrossing[] {
  return [...map.spineCrossings, ...map.rows.flatMap(r => r.crossings)].filter(c => c.kind === 'collapse' || c.kind === 'rigidity loss')
}

/** Distance from (x, y) to a polyline. */
export function distanceToPolyline(pts: [number, number][], x: number, y: number): number {
  let best = Infinity
  for (let k = 1; k < pts.length; k++) {
    const [ax, ay] = pts[k - 1]!, [bx, by] = pts[k]!
    const dx = bx - ax, dy = by - ay, len2 = dx * dx + dy * dy
    const t = len2 > 0 ? Math.max(0, Math.min(1, ((x - ax) * dx + (y - ay) * dy) / len2)) : 0
    best = Math.min(best, Math.hypot(ax + t * dx - x, ay + t * dy - y))
  }
  return best
}

/** The smaller grid step of a map (at most 1). */
export function mapGridStep(map: Pick<MapResult, 'xs' | 'ys'>): number {
  const { xs, ys } = map
  return Math.min(xs.length > 1 ? xs[1]! - xs[0]! : Infinity, ys.length > 1 ? ys[1]! - ys[0]! : Infinity, 1)
}

/** True when a crossing lies on an already traced curve of its kind (within a tenth of a grid step): no need to trace it again. */
export function onTracedCurve(curves: { kind: string; points: [number, number][] }[], c: MapCrossing, step: number): boolean {
  return curves.some(k => k.kind.startsWith(c.kind) && distanceToPolyline(k.points, c.x, c.y) < 0.1 * step)
}

/** Every distinct curve through the map's crossings, in this thread (the CLI's `map --trace`). */
export function traceAllCurves(doc: PatternDocument, map: MapResult): TracedCurve[] {
  const out: TracedCurve[] = []
  const step = mapGridStep(map)
  for (const c of traceableCrossings(map)) {
    if (onTracedCurve(out, c, step)) continue
    const r = traceMapCurve(doc, map.settings, c)
    if (r.points.length > 1) out.push(r)
  }
  return out
}
