/**
 * Discrete mean curvature of a periodic mesh from the cotangent Laplacian:
 *   2H(x_i) n_i = (1 / 2A_i) Σ_j (cot α_ij + cot β_ij)(x_j − x_i)
 * (M. Meyer, M. Desbrun, P. Schröder, A. H. Barr, "Discrete differential-geometry operators for
 * triangulated 2-manifolds", VisMath 2002, eq. (8); Pinkall–Polthier 1993 for the weights), with
 * A_i the barycentric area (a third of the adjacent triangles' areas), and H the part of the
 * vector along the area-weighted vertex normal (the tangential part measures the mesh's
 * irregularity, not the surface's curvature). Fixed vertices (a cut
 * boundary) are left out. Values are |H| times the length scale L = (vertical period)/2π, which is
 * 1 in surface units, so they are dimensionless.
 */
import { cotanData } from './cotan'
import type { PeriodicMesh } from './mesh'
import { vertexNormals } from './normals'

/** |H|·L per vertex (NaN on fixed vertices), with its maximum and area-weighted mean. */
export interface MeanCurvature {
  perVertex: Float64Array
  max: number
  mean: number
  /** Length scale L the values are multiplied by. */
  lengthScale: number
}

export function meanCurvature(m: PeriodicMesh): MeanCurvature {
  const V = m.positions.length / 3, F = m.triangles.length / 3
  const { cot, area, points } = cotanData(m)
  const lap = new Float64Array(3 * V), bary = new Float64Array(V)
  for (let t = 0; t < F; t++) {
    for (let i = 0; i < 3; i++) {
      const j = (i + 1) % 3, k = (i + 2) % 3
      const vj = m.triangles[3 * t + j]!, vk = m.triangles[3 * t + k]!, w = cot[3 * t + i]!
      for (let d = 0; d < 3; d++) {
        const diff = points[9 * t + 3 * k + d]! - points[9 * t + 3 * j + d]!
        lap[3 * vj + d] = lap[3 * vj + d]! + w * diff
        lap[3 * vk + d] = lap[3 * vk + d]! - w * diff
      }
      const vi = m.triangles[3 * t + i]!
      bary[vi] = bary[vi]! + area[t]! / 3
    }
  }
  const nrm = vertexNormals(m, points)
  const L = m.periods[2][2] / (2 * Math.PI)
  const per = new Float64Array(V)
  let max = 0, sum = 0, weight = 0
  for (let v = 0; v < V; v++) {
    if (m.fixed[v] || !(bary[v]! > 0)) { per[v] = Number.NaN; continue }
    const along = lap[3 * v]! * nrm[3 * v]! + lap[3 * v + 1]! * nrm[3 * v + 1]! + lap[3 * v + 2]! * nrm[3 * v + 2]!
    const h = Math.abs(along) / (4 * bary[v]!) * L
    per[v] = h
    max = Math.max(max, h); sum += h * bary[v]!; weight += bary[v]!
  }
  return { perVertex: per, max, mean: weight > 0 ? sum / weight : 0, lengthScale: L }
}
