/**
 * The branch point far up the upper Bratu branch (N = 40: λ ≈ 2e-13, max u ≈ 37) is a real
 * singular point of the discrete equations, not a scaling artefact of e^u (the engine keeps the
 * determinant as sign and log|det|), and a discretisation effect: it sits where the peak of u is
 * one grid step wide.
 *
 * Continuous problem (closed form, from memory: u = 2 ln(cosh(θ/4) / cosh(θ(x − ½)/2)),
 * λ = θ²/(2 cosh²(θ/4))): one fold, and λ e^{max u} = θ²/2, the curvature at the peak, whose width
 * is ~ 1/θ. So λ e^{max u} h² = (θh)²/2 compares the peak width with the grid step h (derived).
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix'
import { describe, expect, it } from 'vitest'
import { runContinuation } from '../../../shared/continuation'
import { bratu } from './problems'

/** Positive eigenvalues of F_u = D₂/h² + λ diag(e^u) by a general-purpose dense solver (ml-matrix). */
function positiveEigenvalues(N: number, p: { u: number[]; lambda: number }): number {
  const h2 = 1 / (N + 1) ** 2
  const A = Matrix.zeros(N, N)
  for (let i = 0; i < N; i++) {
    A.set(i, i, -2 / h2 + p.lambda * Math.exp(p.u[i]!))
    if (i > 0) { A.set(i, i - 1, 1 / h2); A.set(i - 1, i, 1 / h2) }
  }
  return new EigenvalueDecomposition(A).realEigenvalues.filter(v => v > 0).length
}

function upperBranchPoint(N: number) {
  const r = runContinuation(bratu(N), { u: new Array(N).fill(0), lambda: 0 }, { maxStep: 2, initialStep: 0.1, maxPoints: 400 })
  const s = r.specialPoints.find(x => x.kind === 'branch point')!
  return { r, s, umax: Math.max(...s.u), peak: s.lambda * Math.exp(Math.max(...s.u)) / (N + 1) ** 2 }
}

describe('Bratu upper branch: the branch point of the discrete equations', () => {
  const a = upperBranchPoint(40)

  it('N = 40: a second eigenvalue of F_u really crosses zero there (dense eigenvalues, ml-matrix)', () => {
    const { r, s, umax, peak } = a
    console.log(`Bratu N=40 upper branch: branch point λ = ${s.lambda.toExponential(3)}, max u = ${umax.toFixed(3)}, λe^{max u}h² = ${peak.toFixed(3)}`)
    expect(s.lambda).toBeLessThan(1e-10)
    expect(umax).toBeGreaterThan(30)
    expect(positiveEigenvalues(40, r.points[s.afterPoint]!)).toBe(1) // after the fold: one unstable direction
    expect(positiveEigenvalues(40, r.points[s.afterPoint + 1]!)).toBe(2)
  })

  it('sits where the peak is one grid step wide, and refining the grid moves it to far smaller λ', () => {
    const b = upperBranchPoint(80)
    console.log(`Bratu N=80 upper branch: branch point λ = ${b.s.lambda.toExponential(3)}, max u = ${b.umax.toFixed(3)}, λe^{max u}h² = ${b.peak.toFixed(3)}`)
    for (const x of [a, b]) {
      expect(x.peak).toBeGreaterThan(1)
      expect(x.peak).toBeLessThan(2)
    }
    expect(b.s.lambda).toBeLessThan(1e-10 * a.s.lambda)
    expect(positiveEigenvalues(80, b.r.points[b.s.afterPoint + 1]!)).toBe(2)
  })
})
