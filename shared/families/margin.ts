/**
 * The rigidity margin the family runs monitor (see shared/continuation/sigma-min.ts): the
 * problems pin the first vertex, and the trivial motions are the translations (positions) or the
 * constant shift (phases), so the margin equals the rigidity verdict's σ_min (×ℓ̄ for
 * positions, ÷K̄ for phases: shared/pattern/rigidity.ts, phase-solve.ts) at every size.
 */
import type { RigidityMargin } from '../continuation/types'

/** Margin of a problem whose u holds coordinates pinned+1 … fullSize−1 of `fullSize`, with the given per-vertex block. */
export function pinnedFirstVertexMargin(V: number, block: 1 | 2, scale: RigidityMargin['scale']): RigidityMargin {
  const fullSize = block * V
  const free = new Int32Array(fullSize - block)
  for (let i = 0; i < free.length; i++) free[i] = block + i
  const trivial: Float64Array[] = []
  for (let d = 0; d < block; d++) {
    const t = new Float64Array(fullSize)
    for (let v = 0; v < V; v++) t[block * v + d] = 1 / Math.sqrt(V)
    trivial.push(t)
  }
  return { fullSize, free, trivial, scale }
}
