/**
 * Lattice helpers for the workbench: lattice points, lattice coordinates, the shape τ = ω2/ω1,
 * presets and snapping. Pure functions.
 */
import type { PatternLattice } from '#shared/types/pattern'
import type { Vec } from './view'

/** k1 ω1 + k2 ω2. */
export function latticePoint(l: PatternLattice, k: readonly [number, number]): Vec {
  return [k[0] * l.w1[0] + k[1] * l.w2[0], k[0] * l.w1[1] + k[1] * l.w2[1]]
}

/** Coordinates (a, b) with p = a ω1 + b ω2 (Cramer's rule; det > 0 for a valid lattice). */
export function latticeCoords(l: PatternLattice, p: readonly [number, number]): Vec {
  const det = l.w1[0] * l.w2[1] - l.w1[1] * l.w2[0]
  return [(p[0] * l.w2[1] - p[1] * l.w2[0]) / det, (l.w1[0] * p[1] - l.w1[1] * p[0]) / det]
}

/** The shape τ = ω2 / ω1 as a complex number [re, im] (im > 0 for a positively oriented lattice). */
export function latticeShape(l: PatternLattice): Vec {
  const [a, b] = l.w1
  const [c, d] = l.w2
  const n = a * a + b * b
  return [(c * a + d * b) / n, (d * a - c * b) / n]
}

/** Named lattice shapes (the workbench's presets). */
export const LATTICE_PRESETS = ['square', 'hexagonal', 'rectangular'] as const
export type LatticePreset = typeof LATTICE_PRESETS[number]

/**
 * A preset lattice keeping |ω1| and the direction of ω1: ω2 = |ω1|·τ rotated with ω1, where τ is
 * i (square), e^{iπ/3} (hexagonal) or i·ratio (rectangular).
 * @param ratio |ω2| / |ω1| for the rectangular preset (default 1.5; must be positive)
 */
export function presetLattice(current: PatternLattice, preset: LatticePreset, ratio = 1.5): PatternLattice {
  if (!(ratio > 0)) throw new Error('the rectangular ratio must be positive')
  const tau: Vec = preset === 'square' ? [0, 1] : preset === 'hexagonal' ? [0.5, Math.sqrt(3) / 2] : [0, ratio]
  const [a, b] = current.w1
  return { w1: [a, b], w2: [tau[0] * a - tau[1] * b, tau[0] * b + tau[1] * a] }
}

/** Snapping of dragged points: none, a grid in lattice coordinates (torus) or in world units (plane). */
export interface SnapOptions {
  /** Subdivisions per period (torus) or per world unit (plane); 0 turns snapping off. */
  divisions: number
}

/** Round a point to the snap grid (lattice coordinates when a lattice is given). */
export function snapPoint(p: Vec, snap: SnapOptions, lattice?: PatternLattice): Vec {
  const n = snap.divisions
  if (!(n > 0)) return p
  const r = (x: number) => Math.round(x * n) / n
  if (!lattice) return [r(p[0]), r(p[1])]
  const [s, t] = latticeCoords(lattice, p)
  return latticePoint(lattice, [r(s), r(t)])
}
