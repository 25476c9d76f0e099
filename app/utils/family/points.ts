/** Stored and live points as the diagram, the table and the inspector read them. Pure. */
import type { ContinuationPoint, SpecialPoint } from '#shared/continuation/types'
import type { StoredRunPoint } from '#shared/types/runs'
import type { DiagramPoint, DiagramSpecial } from './axes'

/** A regular point with the server's residual when known. */
export type ViewPoint = DiagramPoint & { residual?: number, tangent?: number[], nextStepSize?: number }
/** A special point with its kernel and tangent; `stoppedAt`: where a run located past its stop (a collapse at length 0) actually stopped. */
export type ViewSpecial = DiagramSpecial & { kernel?: number[], tangent?: number[], stoppedAt?: { lambda: number } }

/** A stored regular point. */
export function storedToView(p: StoredRunPoint): ViewPoint {
  const s = p.state as { u: number[], arclength?: number, sigmaMin?: number, tangent?: number[], nextStepSize?: number }
  return { index: p.index, lambda: p.lambda, u: s.u, arclength: s.arclength, sigmaMin: s.sigmaMin, diagnostics: p.diagnostics, residual: p.residual, tangent: s.tangent, nextStepSize: s.nextStepSize }
}

/** A stored special point. */
export function storedSpecialToView(p: StoredRunPoint): ViewSpecial {
  const s = p.state as { u: number[], label?: string, afterPoint?: number, precision?: number, located?: boolean, kernel?: number[], tangent?: number[], stoppedAt?: { lambda: number } }
  return { index: p.index, kind: p.specialKind ?? 'special', label: s.label ?? '', lambda: p.lambda, u: s.u, afterPoint: s.afterPoint ?? 0, precision: s.precision, located: s.located, kernel: s.kernel, tangent: s.tangent, ...(s.stoppedAt ? { stoppedAt: s.stoppedAt } : {}) }
}

/** A live engine point. */
export function liveToView(p: ContinuationPoint): ViewPoint {
  return { index: p.index, lambda: p.lambda, u: p.u, arclength: p.arclength, sigmaMin: p.sigmaMin, diagnostics: p.diagnostics ?? {}, residual: p.residualNorm, tangent: p.tangent, nextStepSize: p.nextStepSize }
}

/** A live special point. */
export function liveSpecialToView(s: SpecialPoint): ViewSpecial {
  return { index: s.index, kind: s.kind, label: s.label, lambda: s.lambda, u: s.u, afterPoint: s.afterPoint, precision: s.precision, located: s.located, kernel: s.kernel, tangent: s.tangent, ...(s.stoppedAt ? { stoppedAt: s.stoppedAt } : {}) }
}

/** Rows of the special points table for one run. */
export function specialRows(run: number, special: readonly ViewSpecial[], points: readonly ViewPoint[], runName?: string) {
  return special.map(s => ({
    run, runName, index: s.index, kind: s.kind, label: s.label, lambda: s.lambda,
    sigmaMin: points.find(p => p.index === s.afterPoint)?.sigmaMin ?? null,
    precision: s.precision ?? null, located: s.located ?? false, afterPoint: s.afterPoint,
    stoppedAt: s.stoppedAt?.lambda ?? null,
  }))
}

/**
 * Where a restart begins: a stored point continues with its own tangent and next step size; a
 * special point with its tangent; "switch branch" at a branch point along the kernel direction
 * (the other branch, orthogonal to the tangent), normalised.
 */
export function restartStart(p: ViewPoint | ViewSpecial, mode: 'restart' | 'switch' = 'restart'): { u: number[], lambda: number, tangent?: number[], stepSize?: number } {
  const base = { u: [...p.u], lambda: p.lambda }
  if (mode === 'switch') {
    const k = (p as ViewSpecial).kernel
    if (!k) throw new Error('switch branch: this point has no kernel direction')
    const n = Math.hypot(...k)
    return { ...base, tangent: k.map(x => x / n) }
  }
  return { ...base, ...(p.tangent?.length ? { tangent: p.tangent } : {}), ...('nextStepSize' in p && p.nextStepSize ? { stepSize: p.nextStepSize } : {}) }
}
