/**
 * Lattice paths (docs/theory.md §7): λ ↦ ω(λ) = (ω1, ω2) with its derivative dω/dλ, for shear,
 * stretch of Im τ, angle of ω2, straight interpolation and a polyline in the τ plane
 * (τ = ω2/ω1 as complex numbers, ω1 fixed, so ω2 = ω1·τ).
 */
import type { Lattice } from '../pattern/model'
import type { FamilyPath } from '../types/family'

/** A lattice path: the start value of λ, and ω(λ) with dω/dλ as (ω1x, ω1y, ω2x, ω2y). */
export interface LatticePath {
  lambda0: number
  at(lambda: number): { lattice: Lattice; derivative: Float64Array }
}

type Vec = [number, number]
const cmul = (a: Vec, b: Vec): Vec => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]]
const cdiv = (a: Vec, b: Vec): Vec => {
  const d = b[0] * b[0] + b[1] * b[1]
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d]
}

/** Lattice with ω1 fixed and ω2 = ω1·τ, derivative ω1·dτ/dλ. */
function fromTau(w1: Vec, tau: Vec, dTau: Vec): { lattice: Lattice; derivative: Float64Array } {
  const d = cmul(w1, dTau)
  return { lattice: { w1: [...w1], w2: cmul(w1, tau) }, derivative: Float64Array.of(0, 0, d[0], d[1]) }
}

/** The lattice path of a torus family, starting from the document lattice `l0`. */
export function latticePath(path: FamilyPath, l0: Lattice): LatticePath {
  const w1: Vec = [...l0.w1], w2: Vec = [...l0.w2]
  const tau0 = cdiv(w2, w1)
  switch (path.kind) {
    case 'shear':
      return { lambda0: 0, at: s => ({ lattice: { w1: [...w1], w2: [w2[0] + s * w1[0], w2[1] + s * w1[1]] }, derivative: Float64Array.of(0, 0, w1[0], w1[1]) }) }
    case 'stretch':
      return { lambda0: tau0[1], at: h => fromTau(w1, [tau0[0], h], [0, 1]) }
    case 'angle': {
      const r = Math.hypot(w2[0], w2[1])
      return { lambda0: Math.atan2(w2[1], w2[0]), at: t => ({ lattice: { w1: [...w1], w2: [r * Math.cos(t), r * Math.sin(t)] }, derivative: Float64Array.of(0, 0, -r * Math.sin(t), r * Math.cos(t)) }) }
    }
    case 'interpolate': {
      const a = [...w1, ...w2], b = [...path.target.w1, ...path.target.w2]
      const d = Float64Array.from(b, (v, i) => v - a[i]!)
      return { lambda0: 0, at: t => ({ lattice: { w1: [a[0]! + t * d[0]!, a[1]! + t * d[1]!], w2: [a[2]! + t * d[2]!, a[3]! + t * d[3]!] }, derivative: d.slice() }) }
    }
    case 'tau-polyline': {
      const pts: Vec[] = [tau0, ...path.points.map(p => [...p] as Vec)]
      const k = pts.length - 1
      return {
        lambda0: 0,
        at: (l) => {
          const i = Math.min(k - 1, Math.max(0, Math.floor(l)))
          const a = pts[i]!, b = pts[i + 1]!, f = l - i
          return fromTau(w1, [a[0] + f * (b[0] - a[0]), a[1] + f * (b[1] - a[1])], [b[0] - a[0], b[1] - a[1]])
        },
      }
    }
    default:
      throw new Error(`families: '${path.kind}' is not a lattice path`)
  }
}

/** Signed area of the lattice cell relative to |ω1||ω2| (sin of the angle between them). */
export function latticeShapeArea(l: Lattice): number {
  return (l.w1[0] * l.w2[1] - l.w1[1] * l.w2[0]) / (Math.hypot(...l.w1) * Math.hypot(...l.w2))
}

/** τ = ω2/ω1 as [Re, Im]. */
export function latticeTau(l: Lattice): [number, number] {
  return cdiv([...l.w2], [...l.w1])
}
