/**
 * Axes of the branch diagram: λ, arclength, σ_min, every recorded diagnostic, and every vertex
 * coordinate (drawing paths) or phase (phase paths). A point is read through `axisValue`. Pure.
 */
import { PHASE_PATH_KINDS } from '#shared/types/family'
import { ARCLENGTH, diagnosticQuantity, expectedDiagnostics, lambdaQuantity, sigmaMinQuantity, type Quantity } from '#shared/runs/units'

/** A point as the diagram reads it (live engine points and stored points both map to this). */
export interface DiagramPoint {
  index: number
  lambda: number
  u: readonly number[]
  arclength?: number
  sigmaMin?: number
  diagnostics: Record<string, number>
}

/** A special point on the diagram. */
export interface DiagramSpecial {
  index: number
  kind: string
  label: string
  lambda: number
  u: readonly number[]
  afterPoint: number
  precision?: number
  located?: boolean
}

/** Axis keys: 'lambda', 'arclength', 'sigmaMin', 'latticeAngle' (arg τ), 'd:<diagnostic>', 'u:<k>'. */
export type AxisKey = string

/** The axes a run offers, given its path kind, vertex ids (vertex 0 is pinned) and the diagnostic keys its points record (the kind's usual ones are always offered). */
export function availableAxes(kind: string, vertexIds: readonly string[], recorded: readonly string[]): Array<Quantity & { key: AxisKey }> {
  const diagnostics = [...new Set([...expectedDiagnostics(kind), ...recorded])]
  const phase = (PHASE_PATH_KINDS as readonly string[]).includes(kind)
  const out: Array<Quantity & { key: AxisKey }> = [
    lambdaQuantity(kind),
    ARCLENGTH,
    sigmaMinQuantity(kind),
    ...diagnostics.filter(d => d !== 'sigmaMin').map(d => ({ ...diagnosticQuantity(d, kind), key: `d:${d}` })),
  ]
  // the angle between ω1 and ω2, arg τ, from Re τ and Im τ (lattice paths)
  if (diagnostics.includes('tauRe') && diagnostics.includes('tauIm')) out.push({ ...diagnosticQuantity('latticeAngle'), key: 'latticeAngle' })
  vertexIds.slice(1).forEach((id, i) => {
    if (phase) out.push({ key: `u:${i}`, label: `phase of ${id}`, unit: 'rad' })
    else out.push({ key: `u:${2 * i}`, label: `x of ${id}`, unit: 'length' }, { key: `u:${2 * i + 1}`, label: `y of ${id}`, unit: 'length' })
  })
  return out
}

/** The value of an axis at a point (undefined when the point does not record it). */
export function axisValue(p: DiagramPoint, key: AxisKey): number | undefined {
  if (key === 'lambda') return p.lambda
  if (key === 'arclength') return p.arclength
  if (key === 'sigmaMin') return p.sigmaMin ?? p.diagnostics.sigmaMin
  if (key === 'latticeAngle') {
    const [re, im] = [p.diagnostics.tauRe, p.diagnostics.tauIm]
    return re === undefined || im === undefined ? undefined : Math.atan2(im, re)
  }
  if (key.startsWith('d:')) return p.diagnostics[key.slice(2)]
  if (key.startsWith('u:')) return p.u[Number(key.slice(2))]
  return undefined
}

/**
 * The value of an axis at a special point: λ and u directly; other quantities interpolated
 * linearly in λ between the points around it (`afterPoint` and the next one).
 */
export function specialAxisValue(s: DiagramSpecial, points: readonly DiagramPoint[], key: AxisKey): number | undefined {
  if (key === 'lambda' || key.startsWith('u:')) return axisValue({ index: -1, lambda: s.lambda, u: s.u, diagnostics: {} }, key)
  const a = points.find(p => p.index === s.afterPoint)
  const b = points.find(p => p.index === s.afterPoint + 1)
  const va = a ? axisValue(a, key) : undefined
  const vb = b ? axisValue(b, key) : undefined
  if (va === undefined) return vb
  if (vb === undefined || !a || !b || a.lambda === b.lambda) return va
  const t = (s.lambda - a.lambda) / (b.lambda - a.lambda)
  return va + t * (vb - va)
}
