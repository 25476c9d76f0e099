/**
 * Degeneration events of a drawing along a family (docs/theory.md §7): edge collapse (shortest edge
 * below a fraction of the mean), order flip (the signed cyclic-order margin of a vertex passes
 * 0) and lattice degeneracy (the cell's area reaches 0). Each is one smooth-enough scalar whose
 * sign change the engine locates.
 */
import type { ProblemEvent } from '../continuation/types'
import { edgeLengths, orderMargins } from '../pattern/geometry'
import type { Lattice, PatternModel } from '../pattern/model'
import { collapseLimit, type ContractedResidual } from './collapse-limit'
import { latticeShapeArea } from './lattice-paths'

/** Maps the engine's (u, λ) to the full drawing (positions 2V, the lattice, and the model when the wings move). */
export type DrawingAt = (u: Float64Array, lambda: number) => { p: Float64Array; lattice: Lattice; model?: PatternModel }

/** min ℓ_e / mean ℓ − tolerance: negative once an edge is shorter than tolerance × mean. */
export function collapseMargin(m: PatternModel, p: Float64Array, lat: Lattice, tolerance: number): number {
  const l = edgeLengths(m, p, lat)
  let min = Infinity, sum = 0
  for (let e = 0; e < m.nEdges; e++) { min = Math.min(min, l[e]!); sum += l[e]! }
  return min / (sum / m.nEdges) - tolerance
}

/** Smallest order margin over the vertices (radians; negative once some order disagrees with σ). */
export function orderMargin(m: PatternModel, p: Float64Array, lat: Lattice): number {
  return Math.min(...orderMargins(m, p, lat))
}

/**
 * How to find where a collapse really is: the family's residual with the collapsing edge's
 * direction free (collapse-limit.ts), and the locate tolerance.
 */
export interface CollapseLimitOptions { contracted: ContractedResidual; locateTolerance: number }

/**
 * The drawing events of a family: collapse, optionally order flip, and lattice degeneracy when
 * the lattice moves. With `limit`, a collapse is reported where the edge reaches length 0 and
 * the tolerance only says where the run stops.
 */
export function drawingEvents(
  m: PatternModel, at: DrawingAt,
  o: { collapseTolerance: number; orderFlip: boolean; terminal: boolean; latticeMoves: boolean; limit?: CollapseLimitOptions },
): ProblemEvent[] {
  const ev: ProblemEvent[] = []
  if (m.nEdges > 0) {
    const stop = `the run stops once an edge is shorter than ${o.collapseTolerance} × the mean edge length`
    const lim = o.limit
    ev.push({
      kind: 'collapse', label: lim ? `an edge reaches length 0 (${stop}; its length 0 was not located)` : `an edge becomes shorter than ${o.collapseTolerance} × the mean edge length`, terminal: o.terminal,
      fn: (u, l) => { const d = at(u, l); return collapseMargin(d.model ?? m, d.p, d.lattice, o.collapseTolerance) },
      ...(lim ? {
        limit: (u: Float64Array, l: number) => {
          const r = collapseLimit(m, at, lim.contracted, u, l, lim.locateTolerance)
          return r && { ...r, label: `${r.label} (${stop})` }
        },
      } : {}),
    })
  }
  if (o.orderFlip) {
    ev.push({
      kind: 'order flip', label: 'two half-edges at a vertex swap their cyclic order', terminal: o.terminal,
      fn: (u, l) => { const d = at(u, l); return orderMargin(d.model ?? m, d.p, d.lattice) },
    })
  }
  if (o.latticeMoves) {
    ev.push({
      kind: 'lattice degeneracy', label: 'the lattice cell area reaches 0', terminal: o.terminal,
      fn: (u, l) => latticeShapeArea(at(u, l).lattice),
    })
  }
  return ev
}
