/**
 * Ordinary, degenerate and special vertices (H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle
 * towers I", arXiv 2103.15676, 2021, Def. 4.8; H. Chen, Comm. Anal. Geom. 32, 2024, §2.3).
 * At a vertex of degree n the wing lines are the directions u_h of its half-edges (open wings
 * included) taken modulo sign; M_v is the size of the largest group of coinciding lines.
 *   degenerate: M_v = n (the unit-edge polygon is a segment);
 *   special:    n ≥ 6 and M_v = n − 2 (a parallelogram with two unit sides);
 *   ordinary:   otherwise — only then does a unique saddle tower (up to translation) sit there.
 * Lines are grouped by angle mod π with a chain tolerance (1e-9 rad); the classification is
 * repeated at 1e-6 rad and a different answer is reported as "near".
 */
import { halfEdgeDirection, type Lattice, type PatternModel } from './model'

/** Kind of tower a vertex can carry. */
export type VertexKind = 'ordinary' | 'degenerate' | 'special'

/** Verdict at one vertex. */
export interface VertexTowerVerdict {
  vertex: number
  degree: number
  kind: VertexKind
  /** Size M_v of the largest group of coinciding lines. */
  largestGroup: number
  /** The half-edges of that group (the witness when not ordinary). */
  coinciding: number[]
  /** The kind at the looser tolerance, when it differs ("near-degenerate/special" or "near ordinary"). */
  nearKind?: VertexKind
}

export const LINE_TOLERANCE = 1e-9
export const NEAR_LINE_TOLERANCE = 1e-6

/** Largest group of half-edges at v whose lines coincide within `tol` (chained, on the circle mod π). */
function largestLineGroup(angles: { h: number; a: number }[], tol: number): number[] {
  if (!angles.length) return []
  const s = [...angles].sort((x, y) => x.a - y.a || x.h - y.h)
  const groups: number[][] = [[s[0]!.h]]
  for (let i = 1; i < s.length; i++) {
    if (s[i]!.a - s[i - 1]!.a <= tol) groups[groups.length - 1]!.push(s[i]!.h)
    else groups.push([s[i]!.h])
  }
  // wrap round: the last group meets the first across π ≡ 0
  if (groups.length > 1 && s[0]!.a + Math.PI - s[s.length - 1]!.a <= tol) groups[0]!.push(...groups.pop()!)
  return groups.reduce((best, g) => (g.length > best.length ? g : best), [] as number[])
}

function kindOf(n: number, M: number): VertexKind {
  if (M === n) return 'degenerate'
  if (n >= 6 && M === n - 2) return 'special'
  return 'ordinary'
}

/** Classifies every vertex of the drawing (p, lat). */
export function classifyVertices(
  m: PatternModel, p: Float64Array = m.positions, lat: Lattice = m.lattice,
  tol = LINE_TOLERANCE, nearTol = NEAR_LINE_TOLERANCE,
): VertexTowerVerdict[] {
  const d = new Float64Array(2)
  const out: VertexTowerVerdict[] = []
  for (let v = 0; v < m.nVertices; v++) {
    const angles: { h: number; a: number }[] = []
    for (let i = m.starStart[v]!; i < m.starStart[v + 1]!; i++) {
      const h = m.starHalf[i]!
      halfEdgeDirection(m, p, lat, h, d)
      const a = ((Math.atan2(d[1]!, d[0]!) % Math.PI) + Math.PI) % Math.PI
      angles.push({ h, a: a >= Math.PI ? 0 : a })
    }
    const n = angles.length
    const group = largestLineGroup(angles, tol)
    const kind = kindOf(n, group.length)
    const loose = kindOf(n, largestLineGroup(angles, nearTol).length)
    out.push({
      vertex: v, degree: n, kind, largestGroup: group.length, coinciding: group.sort((a, b) => a - b),
      ...(loose !== kind ? { nearKind: loose } : {}),
    })
  }
  return out
}

/**
 * Event function for families: +0.5 while every vertex is ordinary, −0.5 or less once one is
 * not. A step function: the engine brackets its sign change and bisects it to the tolerance.
 */
export function ordinaryMargin(m: PatternModel, p: Float64Array, lat: Lattice): number {
  return classifyVertices(m, p, lat).filter(v => v.kind === 'ordinary').length - m.nVertices + 0.5
}
