/**
 * Server-side re-evaluation of submitted family points: rebuilds the family's problem from the
 * document and settings with the same core and recomputes max|F(u, λ)| at each point.
 */
import { formatNumber } from '../format'
import type { FamilySettings, FamilySettingsInput } from '../types/family'
import { parseFamilySettings } from '../types/family'
import type { PatternDocument } from '../types/pattern'
import { familyProblem } from './build'

/**
 * A point as submitted: its position in the run, λ and the unknowns u; `kind` for special points
 * (a "collapse" lies where an edge has length 0 and is checked on the contracted drawing).
 */
export interface SubmittedPoint { index?: number; lambda: number; u: ArrayLike<number>; kind?: string }

/** One rejected point. */
export interface OffendingPoint { index: number; residualNorm: number; reason: string }

/** Outcome of {@link verifyFamilyPoints}. */
export interface FamilyVerification {
  verified: boolean
  checked: number
  /** Largest max|F| over the well-formed points. */
  maxResidual: number
  offending: OffendingPoint[]
}

/**
 * Recomputes the residual at each point; a point is rejected when u has the wrong length or a
 * non-finite entry, or when max|F(u, λ)| > tol (F: balance B, dimensionless, for drawings; G in
 * units of the weights for phases; for a collapse point, the contracted drawing's balance and the
 * collapsed edge's length relative to the mean).
 */
export function verifyFamilyPoints(doc: PatternDocument, settings: FamilySettings | FamilySettingsInput, points: SubmittedPoint[], tol = 1e-8): FamilyVerification {
  if (!(tol > 0)) throw new Error('verifyFamilyPoints: tol must be positive')
  const { problem, collapseResidual } = familyProblem(doc, parseFamilySettings(settings))
  const F = new Float64Array(problem.n)
  const offending: OffendingPoint[] = []
  let maxResidual = 0
  points.forEach((pt, i) => {
    const index = pt.index ?? i
    if (pt.u.length !== problem.n) return offending.push({ index, residualNorm: NaN, reason: `u has length ${pt.u.length}, expected ${problem.n}` })
    const u = Float64Array.from(pt.u)
    if (!u.every(Number.isFinite) || !Number.isFinite(pt.lambda)) return offending.push({ index, residualNorm: NaN, reason: 'non-finite value' })
    let r = 0
    if (pt.kind === 'collapse' && collapseResidual) r = collapseResidual(u, pt.lambda)
    else {
      problem.residual(u, pt.lambda, F)
      for (let k = 0; k < F.length; k++) r = Math.max(r, Math.abs(F[k]!))
    }
    maxResidual = Math.max(maxResidual, r)
    if (!(r <= tol)) offending.push({ index, residualNorm: r, reason: `max|F| = ${formatNumber(r)} > ${tol}` })
  })
  return { verified: offending.length === 0, checked: points.length, maxResidual, offending }
}
