/**
 * What a "wall" special point of a lattice run means for the phases: the vertical equations and
 * verdicts just before, at and just after it (shared/families/walls.ts, `describeWall`), from the
 * balanced drawings at λ ∓ δ, solved from the special point's positions (a drawing left unbalanced
 * would split ties that symmetry keeps). δ = 1e-6·max(1, |λ|) moves the lengths that cross apart
 * by far more than the equal-length tolerance (1e-9). Pure.
 */
import { describeWall, type WallDescription } from '#shared/families/walls'
import { solveBalance } from '#shared/pattern/balance-solve'
import { compilePattern } from '#shared/pattern/model'
import type { FamilySettings } from '#shared/types/family'
import type { PatternDocument } from '#shared/types/pattern'
import { documentAtPoint } from './point-doc'

/** The wall description at (λ, u) of a lattice run. */
export function wallAt(doc: PatternDocument, settings: FamilySettings, lambda: number, u: readonly number[]): WallDescription {
  const d = 1e-6 * Math.max(1, Math.abs(lambda))
  const state = (l: number) => {
    const m = compilePattern(documentAtPoint(doc, settings, l, u))
    const b = solveBalance(m, m.positions, m.lattice)
    return { p: b.converged ? b.positions : m.positions, lattice: m.lattice }
  }
  const [lo, hi] = [state(lambda - d), state(lambda + d)]
  return describeWall(compilePattern(doc), lo, state(lambda), hi)
}
