/**
 * The default x axis of a comparison: a quantity every compared run records, so the branches
 * are drawn over the same thing. Runs of one path kind share λ. Runs of different kinds share
 * no λ (Im τ of one run is not the shear s of another): then the first of the lattice angle
 * arg τ, Re τ, Im τ, α1, α2 that every run records and that moves along every run (else along
 * some run). None: λ of each run's own path, and the page says the runs have nothing in common. Pure.
 */
import { axisValue, type AxisKey, type DiagramPoint } from './axes'

/** Shared quantities in order of preference. */
export const SHARED_AXIS_PREFERENCE: readonly AxisKey[] = ['latticeAngle', 'd:tauRe', 'd:tauIm', 'd:alpha1', 'd:alpha2']

/** How much an axis moves along a run (max − min over its points; 0 when it is missing). */
function spread(points: readonly DiagramPoint[], key: AxisKey): number {
  let lo = Infinity, hi = -Infinity
  for (const p of points) {
    const v = axisValue(p, key)
    if (v === undefined || !Number.isFinite(v)) return 0
    lo = Math.min(lo, v); hi = Math.max(hi, v)
  }
  return hi > lo ? hi - lo : 0
}

/**
 * The default x axis for runs (`kind` = path kind, `points`), among the axis keys all of them
 * offer; `shared` false when the runs have no quantity in common.
 */
export function defaultCompareAxis(runs: readonly { kind: string, points: readonly DiagramPoint[] }[], common: readonly AxisKey[]): { key: AxisKey, shared: boolean } {
  if (new Set(runs.map(r => r.kind)).size <= 1) return { key: 'lambda', shared: true }
  const offered = SHARED_AXIS_PREFERENCE.filter(k => common.includes(k) && runs.every(r => r.points.every(p => axisValue(p, k) !== undefined)))
  const everywhere = offered.find(k => runs.every(r => spread(r.points, k) > 0))
  const somewhere = offered.find(k => runs.some(r => spread(r.points, k) > 0))
  const key = everywhere ?? somewhere
  return key ? { key, shared: true } : { key: 'lambda', shared: false }
}
